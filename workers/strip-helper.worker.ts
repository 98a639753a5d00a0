// A thin adapter: steps one strip of a simulation whose state another worker owns.
import type { StripHelperInit } from "@/lib/fdtd/parallel/parallel-kernel";
import { runStripHelper } from "@/lib/fdtd/parallel/strip-helper";

self.onmessage = (event: MessageEvent<StripHelperInit>) => {
  // Say so before blocking: the coordinator waits for this message on its event loop, which also
  // lets the browser finish starting this worker.
  self.postMessage("ready");
  runStripHelper(event.data);
  self.close();
};
