// The body of a helper thread: build a kernel over the shared state and step its strip on every
// phase until the coordinator says quit. Blocking (Atomics.wait): run it only in a worker.
import { createStripKernel, type StripHelperInit } from "./parallel-kernel";
import { serveStrip } from "./strip-sync";

export function runStripHelper(init: StripHelperInit): void {
  const kernel = createStripKernel(init);
  const [y0, y1] = init.strip;
  serveStrip(init.sync, {
    sweep: () => kernel.sweepStrip(y0, y1),
    flush: () => kernel.flushStrip(y0, y1),
  });
}
