// Benchmark of the field view at 512 x 512 (the goal: playback at 60 frames per second): opens the
// field-view harness page in Debian's chromium and prints the per-frame cost of uploading a new field and
// drawing it, and the frame rate of a requestAnimationFrame loop beside the loop that only clears the
// canvas (what this browser's compositor allows at all). Software WebGL here; a GPU is far faster.
// Usage: npm run bench:view
import fs from "node:fs";

import { launch, softwareWebGlFlags, startHarnessServer } from "../tests/harness/field-view/browser.mjs";

if (!fs.existsSync("/usr/bin/chromium")) {
  console.log("field view benchmark skipped: /usr/bin/chromium is not installed (apt-get install -y chromium)");
  process.exit(0);
}

const { server, base } = await startHarnessServer();
try {
  const { page, close } = await launch(softwareWebGlFlags);
  try {
    await page.goto(`${base}/?bench=1`);
    await page.waitForFunction(() => window.fieldViewHarness?.bench !== undefined, null, { timeout: 180_000 });
    const bench = await page.evaluate(() => window.fieldViewHarness.bench);
    const budget = 1000 / 60;
    console.log(`field view, ${bench.grid} grid on a ${bench.canvasPixels} canvas (${bench.renderer})`);
    console.log(`  upload + draw, GPU waited for     ${bench.meanSynchronisedMilliseconds.toFixed(2)} ms per frame (60 fps budget ${budget.toFixed(1)} ms)`);
    console.log(`  main-thread submit                ${bench.meanSubmitMilliseconds.toFixed(2)} ms per frame`);
    console.log(`  animation loop, new field a frame ${bench.framesPerSecond.toFixed(1)} fps`);
    console.log(`  animation loop, clear only        ${bench.clearOnlyFramesPerSecond.toFixed(1)} fps (this browser's ceiling)`);
    const headroom = budget / bench.meanSynchronisedMilliseconds;
    console.log(`  a new 512 x 512 field fits the 60 fps budget ${headroom.toFixed(1)} times over`);
  } finally {
    await close();
  }
} finally {
  await server.close();
}
