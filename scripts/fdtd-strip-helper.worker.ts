// Node worker_threads adapter: receives a strip and steps it until the coordinator says quit.
import { parentPort } from "node:worker_threads";
import type { StripHelperInit } from "@/lib/fdtd/parallel/parallel-kernel";
import { runStripHelper } from "@/lib/fdtd/parallel/strip-helper";

parentPort!.once("message", (init: StripHelperInit) => {
  runStripHelper(init);
  parentPort!.close();
});
