// Looks at the analysis harness in headless chromium: waits for the three demo runs, takes screenshots to
// /tmp/analysis-shots/, chooses the no-barrier run as the reference, draws design B over the traces, and
// checks that the tables fill, the PNG and CSV exports download, and the sound controls wait for the
// hearing caution. Exits non-zero when a check fails. Run from the repository root:
//   node tests/harness/analysis/shoot.mjs
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

import { chromium } from "playwright-core";
import { createServer } from "vite";

const here = path.dirname(fileURLToPath(import.meta.url));
const outDir = "/tmp/analysis-shots";
fs.mkdirSync(outDir, { recursive: true });
const failures = [];
const check = (condition, message) => {
  console.log(`${condition ? "ok  " : "FAIL"} ${message}`);
  if (!condition) failures.push(message);
};

const port = await new Promise((resolve, reject) => {
  const server = net.createServer();
  server.once("error", reject);
  server.listen(0, "127.0.0.1", () => {
    const { port: free } = server.address();
    server.close(() => resolve(free));
  });
});
const server = await createServer({ configFile: path.join(here, "vite.config.ts"), server: { port, hmr: false, watch: null } });
await server.listen();
const profile = fs.mkdtempSync(path.join(os.tmpdir(), "analysis-harness-"));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: "/usr/bin/chromium",
  args: ["--use-angle=swiftshader", "--enable-unsafe-swiftshader", "--disable-quic", "--no-first-run"],
  viewport: { width: 1280, height: 900 },
  acceptDownloads: true,
});
try {
  const page = await context.newPage();
  const errors = [];
  page.on("pageerror", (error) => errors.push(error.message));
  page.on("console", (message) => message.type() === "error" && errors.push(message.text()));
  await page.goto(`http://127.0.0.1:${port}/`, { waitUntil: "commit", timeout: 120_000 });
  await page.waitForFunction(() => window.analysisHarness?.ready === true || window.analysisHarness?.error, null, { timeout: 300_000 });
  const startError = await page.evaluate(() => window.analysisHarness?.error);
  check(!startError, `harness starts${startError ? `: ${startError}` : ""}`);
  await page.waitForSelector("[data-testid=traces] .uplot canvas");
  await page.evaluate(() => document.fonts.ready);
  await page.screenshot({ path: path.join(outDir, "1-overview.png"), fullPage: true });

  const bandRows = await page.locator("[data-testid=band-level-table] tbody tr").count();
  check(bandRows === 3, `band table has a row per chosen receiver (${bandRows})`);
  const legend = await page.locator("[data-testid=traces] .u-legend").innerText();
  check(/Time/.test(legend) && /Garden/.test(legend), "trace legend reads time and receivers");

  // Overlay design B.
  await page.getByTestId("overlay-runs").getByRole("checkbox", { name: /Design B/ }).check();
  await page.waitForFunction(() => document.querySelectorAll("[data-testid=traces] .u-legend .u-series").length >= 7, null, { timeout: 30_000 });
  check(true, "design B drawn over the traces (7 series with time)");
  // Hover the trace chart for a read-out.
  const plotBox = await page.locator("[data-testid=traces] .u-over").boundingBox();
  await page.mouse.move(plotBox.x + plotBox.width * 0.4, plotBox.y + plotBox.height * 0.5);
  const readout = await page.locator("[data-testid=traces] .u-legend").innerText();
  check(/ms/.test(readout) && /Pa/.test(readout), "cursor read-out in ms and Pa");
  // Drag to zoom.
  await page.mouse.down();
  await page.mouse.move(plotBox.x + plotBox.width * 0.6, plotBox.y + plotBox.height * 0.5, { steps: 5 });
  await page.mouse.up();
  await page.locator("[data-testid=traces]").screenshot({ path: path.join(outDir, "2-traces-zoomed.png") });
  await page.locator("[data-testid=spectra]").screenshot({ path: path.join(outDir, "3-spectra.png") });

  // One-third octaves, A-weighted, with air absorption.
  const bands = page.locator("[data-testid=band-levels]");
  await bands.getByRole("radio", { name: "1/3 octave" }).click();
  await bands.getByRole("radio", { name: "A-weighted" }).click();
  await bands.getByLabel("Subtract air absorption").check();
  await bands.screenshot({ path: path.join(outDir, "4-band-levels.png") });
  const airRows = await page.locator("[data-testid=band-level-table] tbody tr").count();
  check(airRows === 6, `air absorption adds a row per receiver (${airRows})`);

  const csvDownload = page.waitForEvent("download");
  await bands.getByRole("button", { name: "CSV" }).click();
  const csv = await csvDownload;
  const csvText = fs.readFileSync(await csv.path(), "utf8");
  check(/dB\(A\) re 20 uPa/.test(csvText.split("\r\n")[0]), `band CSV header has units (${csv.suggestedFilename()})`);
  const pngDownload = page.waitForEvent("download");
  await bands.getByRole("button", { name: "PNG" }).click();
  const png = await pngDownload;
  fs.copyFileSync(await png.path(), path.join(outDir, "5-band-levels-export.png"));
  check(fs.statSync(await png.path()).size > 5000, "band chart PNG export");
  const tracePng = page.waitForEvent("download");
  await page.locator("[data-testid=traces]").getByRole("button", { name: "PNG" }).click();
  fs.copyFileSync(await (await tracePng).path(), path.join(outDir, "6-traces-export.png"));

  // Insertion loss against the no-barrier reference.
  const il = page.locator("[data-testid=insertion-loss]");
  await il.getByTestId("reference-select").selectOption({ index: 1 });
  await page.waitForSelector("[data-testid=insertion-loss-table] tbody tr", { timeout: 60_000 });
  await page.waitForTimeout(500);
  await il.screenshot({ path: path.join(outDir, "7-insertion-loss.png") });
  const ilText = await page.locator("[data-testid=insertion-loss-table]").innerText();
  check(/Garden/.test(ilText), "insertion-loss table lists the receivers");
  check((await page.locator("[data-testid=barrier-comparison] table").count()) >= 1, "barrier estimates shown beside the IL");
  // Refused scene creation reads as an error.
  await il.getByRole("button", { name: "Make the reference and run it" }).click();
  await page.waitForSelector("[data-testid=reference-maker] [role=alert]", { timeout: 30_000 });
  check(/cannot add scenes/.test(await page.locator("[data-testid=reference-maker]").innerText()), "a refused scene creation shows the server's message");

  // Sound: disabled until the caution is acknowledged.
  const sound = page.locator("[data-testid=receiver-sound]");
  check(await sound.getByRole("button", { name: /Play/ }).isDisabled(), "play waits for the hearing caution");
  await sound.getByTestId("hearing-acknowledge").check();
  const wavDownload = page.waitForEvent("download");
  await sound.getByRole("button", { name: "Download WAV" }).click();
  const wav = await wavDownload;
  check(/_48kHz-float32_peak-1dBFS_fullscale-.*Pa\.wav$/.test(wav.suggestedFilename()), `WAV named with its scale (${wav.suggestedFilename()})`);
  await sound.screenshot({ path: path.join(outDir, "8-sound.png") });
  await page.screenshot({ path: path.join(outDir, "9-full.png"), fullPage: true });
  check(errors.length === 0, `no page errors${errors.length ? `: ${errors.join(" | ")}` : ""}`);
} finally {
  await context.close();
  await server.close();
  fs.rmSync(profile, { recursive: true, force: true });
}
if (failures.length > 0) {
  console.log(`${failures.length} check(s) failed`);
  process.exit(1);
}
