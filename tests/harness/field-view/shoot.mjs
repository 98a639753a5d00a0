// Visual harness run: starts the harness page with Vite on a free port, opens Debian's chromium with the
// software-WebGL flags, checks that the WebGL field layer is not blank and changes between two times, that
// the byte-texture path draws the same picture as the float path, that PNG export composes both layers,
// and that a browser without WebGL shows the fallback message and a 2D-canvas image; screenshots every
// mode to /tmp/field-view-shots/ and measures the 512 x 512 frame rate.
// Run from the repository root: node tests/harness/field-view/shoot.mjs
import fs from "node:fs";
import path from "node:path";

import { PNG } from "pngjs";

import { launch, softwareWebGlFlags, startHarnessServer } from "./browser.mjs";

const outDir = "/tmp/field-view-shots";
fs.mkdirSync(outDir, { recursive: true });

const noWebGlFlags = [...softwareWebGlFlags.slice(2), "--disable-webgl", "--disable-3d-apis"];

const failures = [];
function check(condition, message) {
  console.log(`${condition ? "ok  " : "FAIL"} ${message}`);
  if (!condition) failures.push(message);
}

async function openHarness(page, base, query) {
  await page.goto(`${base}/?${query}`);
  await page.waitForFunction(() => window.fieldViewHarness?.ready === true, null, { timeout: 120_000 });
  // Two animation frames: the draw effects have run and the compositor has the picture.
  await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
  await page.evaluate(() => document.fonts.ready);
}

/** Statistics of a PNG: distinct colours (quantised), and the share of pixels that differ from the most common one. */
function pictureStats(buffer) {
  const png = PNG.sync.read(buffer);
  const counts = new Map();
  for (let k = 0; k < png.data.length; k += 4) {
    const key = ((png.data[k] >> 3) << 10) | ((png.data[k + 1] >> 3) << 5) | (png.data[k + 2] >> 3);
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  const pixels = png.width * png.height;
  const commonest = Math.max(...counts.values());
  return { png, distinctColours: counts.size, variedShare: 1 - commonest / pixels };
}

function meanAbsoluteDifference(a, b) {
  if (a.width !== b.width || a.height !== b.height) return Infinity;
  let sum = 0;
  for (let k = 0; k < a.data.length; k += 4) {
    for (let c = 0; c < 3; c++) sum += Math.abs(a.data[k + c] - b.data[k + c]);
  }
  return sum / ((a.data.length / 4) * 3);
}

async function fieldLayerShot(page, name) {
  await page.addStyleTag({ content: "[data-layer=overlay]{visibility:hidden}" });
  await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
  const buffer = await page.locator("[data-layer=field]").screenshot({ path: path.join(outDir, `${name}.png`) });
  return buffer;
}

const { server, base } = await startHarnessServer();
console.log(`harness at ${base}`);

try {
  // --- WebGL (software, SwiftShader) -----------------------------------------------------------------
  const browser = await launch(softwareWebGlFlags);
  try {
    const { page } = browser;
    for (const mode of ["pressure", "peak-level", "rms-level", "level-difference"]) {
      await openHarness(page, base, `mode=${mode}&t=0.045`);
      await page.screenshot({ path: path.join(outDir, `${mode}.png`), fullPage: true });
      const renderer = await page.locator("[data-layer=field]").getAttribute("data-renderer");
      check(renderer === "webgl", `${mode}: drawn with WebGL (data-renderer=${renderer})`);
    }

    // The real solver on the page: pictures of real diffraction to look at (its numbers are checked in tests/fdtd).
    try {
      for (const [mode, t] of [
        ["pressure", "0.045"],
        ["pressure", "0.075"],
        ["rms-level", "0.045"],
        ["level-difference", "0.045"],
      ]) {
        await openHarness(page, base, `source=solver&mode=${mode}&t=${t}`);
        await page.screenshot({ path: path.join(outDir, `solver-${mode}-${t}.png`), fullPage: true });
      }
      console.log("     solver screenshots written");
    } catch (error) {
      check(false, `the solver runs on the harness page (${error.message.split("\n")[0]})`);
    }

    // The field layer alone, at two times: not blank, and different.
    await openHarness(page, base, "mode=pressure&t=0.03");
    const early = pictureStats(await fieldLayerShot(page, "field-layer-t030"));
    await page.evaluate(() => window.fieldViewHarness.setTime(0.06));
    await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
    const late = pictureStats(await page.locator("[data-layer=field]").screenshot({ path: path.join(outDir, "field-layer-t060.png") }));
    check(early.distinctColours > 50 && early.variedShare > 0.05, `WebGL field layer not blank at 30 ms (${early.distinctColours} colours, ${(early.variedShare * 100).toFixed(1)}% off the commonest)`);
    const change = meanAbsoluteDifference(early.png, late.png);
    check(change > 1, `WebGL field layer changes between 30 ms and 60 ms (mean |difference| ${change.toFixed(2)} of 255)`);

    // The byte-texture path (WebGL1 without float textures) draws the same picture as the float path.
    await openHarness(page, base, "mode=pressure&t=0.03&renderer=webgl-bytes");
    const bytes = pictureStats(await fieldLayerShot(page, "field-layer-bytes-t030"));
    const renderer = await page.locator("[data-layer=field]").getAttribute("data-renderer");
    const bytesDifference = meanAbsoluteDifference(early.png, bytes.png);
    check(renderer === "webgl-bytes" && bytesDifference < 1.5, `byte-texture path matches the float path (mean |difference| ${bytesDifference.toFixed(3)} of 255)`);

    // The forced 2D fallback draws the same picture too.
    await openHarness(page, base, "mode=pressure&t=0.03&renderer=canvas-2d");
    const canvas2d = pictureStats(await fieldLayerShot(page, "field-layer-canvas2d-t030"));
    const canvasDifference = meanAbsoluteDifference(early.png, canvas2d.png);
    check(canvasDifference < 3, `2D-canvas path matches the WebGL path (mean |difference| ${canvasDifference.toFixed(3)} of 255)`);

    // PNG export: both layers in one image.
    await openHarness(page, base, "mode=rms-level&t=0.045");
    const exported = Buffer.from(await page.evaluate(() => window.fieldViewHarness.exportPng()), "base64");
    fs.writeFileSync(path.join(outDir, "export-rms-level.png"), exported);
    const exportedStats = pictureStats(exported);
    check(exportedStats.distinctColours > 50, `exported PNG holds the field and overlay (${exportedStats.png.width} x ${exportedStats.png.height}, ${exportedStats.distinctColours} colours)`);

    // Toolbar: "Fixed" starts from the range drawn now; typing a new one redraws with it.
    await openHarness(page, base, "mode=pressure&t=0.045");
    await page.getByRole("radio", { name: "Fixed" }).click();
    const maxAbsInput = page.getByRole("textbox", { name: /Largest magnitude shown/ });
    const frozen = Number(await maxAbsInput.inputValue());
    check(frozen > 0, `"Fixed" starts from the automatic range drawn (${frozen} Pa)`);
    await maxAbsInput.fill("0.05");
    await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
    await page.screenshot({ path: path.join(outDir, "pressure-fixed-range.png"), fullPage: true });
    const drawn = await page.evaluate(() => window.fieldViewHarness.currentRange());
    check(drawn && Math.abs(drawn.high - 0.05) < 1e-12 && Math.abs(drawn.low + 0.05) < 1e-12, `a typed fixed range is drawn (\u00b1${drawn?.high} Pa)`);
    await page.getByRole("radio", { name: "Peak level" }).click();
    await page.getByRole("radio", { name: "Fixed" }).click();
    const span = [await page.getByRole("textbox", { name: /Lowest level/ }).inputValue(), await page.getByRole("textbox", { name: /Highest level/ }).inputValue()];
    check(span.every((v) => Number.isFinite(Number(v))) && Number(span[1]) > Number(span[0]), `level modes take a fixed span in dB (${span.join(" to ")})`);

    // Play and pause over the snapshots.
    await openHarness(page, base, "mode=pressure&t=0.03");
    const slider = page.getByRole("slider", { name: "Snapshot" });
    const before = Number(await slider.inputValue());
    await page.getByRole("button", { name: "Play" }).click();
    await page.waitForTimeout(1200);
    await page.getByRole("button", { name: "Pause" }).click();
    const after = Number(await slider.inputValue());
    check(after !== before, `play advances the snapshots (from ${before} to ${after}) and pause stops them`);

    // Hover read-out.
    await openHarness(page, base, "mode=pressure&t=0.045");
    const box = await page.locator("[data-layer=overlay]").boundingBox();
    await page.mouse.move(box.x + box.width * 0.35, box.y + box.height * 0.6);
    const readout = await page.locator("[data-readout]").innerText();
    check(/x\s+[\d.]+ m/.test(readout) && /dB/.test(readout), `hover read-out shows position and level ("${readout.replace(/\s+/g, " ")}")`);
    await page.screenshot({ path: path.join(outDir, "hover.png"), fullPage: true });

  } finally {
    await browser.close();
  }

  // --- 512 x 512 timing, in a fresh browser: with the flags above, and with software compositing (the
  // SwiftShader compositor, not the field renderer, limits the frame rate of the first) ---------------
  const benches = {};
  // FIELD_VIEW_SKIP_BENCH=1 skips the timing (for quick looks at the screenshots).
  for (const [name, args] of process.env.FIELD_VIEW_SKIP_BENCH ? [] : [
    ["software-webgl", softwareWebGlFlags],
    ["software-webgl, --disable-gpu-compositing", [...softwareWebGlFlags, "--disable-gpu-compositing"]],
  ]) {
    const timing = await launch(args);
    try {
      await timing.page.goto(`${base}/?bench=1`);
      await timing.page.waitForFunction(() => window.fieldViewHarness?.bench !== undefined, null, { timeout: 120_000 });
      benches[name] = await timing.page.evaluate(() => window.fieldViewHarness.bench);
      console.log(`512 x 512 timing (${name}):`, JSON.stringify(benches[name]));
    } finally {
      await timing.close();
    }
  }
  if (Object.keys(benches).length > 0) fs.writeFileSync(path.join(outDir, "bench.json"), JSON.stringify(benches, null, 2));

  // --- A high-density screen: field and overlay must stay aligned and crisp --------------------------
  const dense = await launch(softwareWebGlFlags, 2);
  try {
    await openHarness(dense.page, base, "mode=rms-level&t=0.045");
    await dense.page.screenshot({ path: path.join(outDir, "rms-level@2x.png"), fullPage: true });
    const size = await dense.page.locator("[data-layer=field]").evaluate((canvas) => [canvas.width, canvas.height, canvas.clientWidth, canvas.clientHeight]);
    check(size[0] === 2 * size[2] && size[1] === 2 * size[3], `at device pixel ratio 2 the canvases have twice the CSS size in pixels (${size.join(" x ")})`);
  } finally {
    await dense.close();
  }

  // --- No WebGL: fallback message and 2D-canvas image -------------------------------------------------
  const plain = await launch(noWebGlFlags);
  try {
    const { page } = plain;
    await openHarness(page, base, "mode=pressure&t=0.045");
    const message = page.getByText("WebGL is not available in this browser: showing a static image");
    check(await message.isVisible(), "without WebGL the fallback message is shown");
    const renderer = await page.locator("[data-layer=field]").getAttribute("data-renderer");
    await page.screenshot({ path: path.join(outDir, "fallback-pressure.png"), fullPage: true });
    const fallback = pictureStats(await fieldLayerShot(page, "fallback-field-layer"));
    check(renderer === "canvas-2d" && fallback.distinctColours > 50, `without WebGL the 2D canvas draws the field (${renderer}, ${fallback.distinctColours} colours)`);
  } finally {
    await plain.close();
  }
} finally {
  await server.close();
}

console.log(failures.length === 0 ? "all harness checks passed" : `${failures.length} harness check(s) failed`);
process.exit(failures.length === 0 ? 0 : 1);
