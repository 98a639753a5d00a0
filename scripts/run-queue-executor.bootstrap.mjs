// Node worker_threads entry of a server run: registers tsx in this thread, then loads the executor.
// Started by path from process.cwd() (lib/server/run-queue/executor.ts), so Next's bundler never sees it.
import { register } from "tsx/esm/api";

register();
await import("./run-queue-executor.thread.ts");
