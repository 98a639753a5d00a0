// Node worker_threads entry: registers tsx in this thread, then loads the TypeScript helper.
import { register } from "tsx/esm/api";

register();
await import("./fdtd-strip-helper.worker.ts");
