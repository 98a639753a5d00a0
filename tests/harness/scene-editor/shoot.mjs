// Drives the scene editor harness in headless chromium and keeps screenshots for people to look at
// (/tmp/scene-editor-shots). Each step checks what it did through the parent's copy of the scene, so a
// broken interaction fails loudly instead of producing a pretty but wrong picture.
//
//   node tests/harness/scene-editor/shoot.mjs
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

import { chromium } from "playwright-core";
import { createServer } from "vite";

const here = path.dirname(fileURLToPath(import.meta.url));
const shots = process.env.SCENE_EDITOR_SHOTS ?? "/tmp/scene-editor-shots";
const flags = ["--use-angle=swiftshader", "--enable-unsafe-swiftshader", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

function check(condition, message) {
  if (!condition) throw new Error(`check failed: ${message}`);
  console.log(`  ok  ${message}`);
}

fs.rmSync(shots, { recursive: true, force: true });
fs.mkdirSync(shots, { recursive: true });

const port = await freePort();
// No file watching: other work in the repository (a rebuilt kernel) must not reload the page mid-run.
const server = await createServer({ configFile: path.join(here, "vite.config.ts"), server: { port, strictPort: true, hmr: false, watch: null }, ...(process.env.SHOOT_DEBUG ? { logLevel: "info" } : {}) });
await server.listen();
const base = `http://127.0.0.1:${port}/`;
console.log(`harness at ${base}`);

const profile = fs.mkdtempSync(path.join(os.tmpdir(), "scene-editor-shots-"));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  args: flags,
  viewport: { width: 1440, height: 900 },
  deviceScaleFactor: 1,
});
context.setDefaultTimeout(90_000);
const page = context.pages()[0] ?? (await context.newPage());

const problems = [];
page.on("console", (message) => {
  if (message.type() === "error") problems.push(`console: ${message.text()}`);
});
page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
page.on("request", (request) => {
  const url = new URL(request.url());
  if (!["127.0.0.1", "localhost"].includes(url.hostname) && !["data:", "blob:"].includes(url.protocol)) problems.push(`request left the machine: ${request.url()}`);
});

let shotNumber = 0;
async function shoot(name) {
  shotNumber++;
  const file = path.join(shots, `${String(shotNumber).padStart(2, "0")}-${name}.png`);
  await page.screenshot({ path: file });
  console.log(`shot ${file}`);
}

const scene = () => page.evaluate(() => window.harness.scene());

/** Waits (up to 5 s) until the parent's copy of the scene satisfies `predicate`, then checks it. */
async function expectScene(predicate, message) {
  const deadline = Date.now() + 5000;
  let current = await scene();
  while (!predicate(current) && Date.now() < deadline) {
    await page.waitForTimeout(50);
    current = await scene();
  }
  check(predicate(current), message);
  return current;
}

/** Screen position (page px) of a scene point, from the view the canvas publishes. */
async function toScreen(x, y) {
  const canvas = page.getByTestId("scene-canvas");
  const box = await canvas.boundingBox();
  const view = await canvas.evaluate((element) => ({
    pixelsPerMetre: Number(element.dataset.pixelsPerMetre),
    originX: Number(element.dataset.originX),
    originY: Number(element.dataset.originY),
  }));
  return { x: box.x + view.originX + x * view.pixelsPerMetre, y: box.y + view.originY - y * view.pixelsPerMetre };
}

/** Rests the mouse on the middle of an element (Monaco's text layer lies over its decorations). */
async function hoverOver(locator) {
  await locator.waitFor({ state: "visible" });
  // Monaco may re-render its lines (scrolling into view): ask again until the element settles.
  let box = await locator.boundingBox();
  for (let k = 0; !box && k < 20; k++) {
    await page.waitForTimeout(100);
    box = await locator.boundingBox();
  }
  await page.mouse.move(box.x + box.width / 2 - 3, box.y + box.height / 2 - 2);
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2, { steps: 3 });
}

async function clickAt(x, y, options = {}) {
  const p = await toScreen(x, y);
  await page.mouse.click(p.x, p.y, options);
}

/**
 * Finds `text` in the Monaco editor with its find widget and deletes it, so that what is inserted next
 * replaces it. (Deleted first: a quote typed over a selection would wrap the selection in quotes.)
 */
async function replaceInCode(text) {
  await findInCode(text);
  await page.keyboard.press("Delete");
}

/** Selects the first `text` in the Monaco editor with its find widget. */
async function findInCode(text) {
  const editor = page.locator(".monaco-editor").first();
  // Away from any hover first, then into the text below the sticky headers.
  await page.mouse.move(5, 5);
  await page.waitForTimeout(150);
  await editor.click({ position: { x: 320, y: 260 } });
  await page.keyboard.press("Control+F");
  const find = page.locator(".find-widget textarea, .find-widget input").first();
  await find.fill(text);
  await page.keyboard.press("Enter");
  await page.keyboard.press("Escape");
}

try {
  await page.goto(base);
  await page.getByTestId("scene-canvas").waitFor();
  await page.waitForFunction(() => document.fonts.status === "loaded");
  await page.getByTestId("figure-run-time").filter({ hasText: "≈" }).waitFor();
  await page.waitForTimeout(300);
  await shoot("design-a-opened");

  console.log("draw a barrier");
  await page.getByTestId("tool-wall").click();
  await clickAt(30, 0);
  await clickAt(30, 3);
  await page.mouse.move((await toScreen(32.2, 4.1)).x, (await toScreen(32.2, 4.1)).y);
  await shoot("barrier-being-drawn");
  await page.keyboard.press("Enter");
  let current = await expectScene((s) => s.geometry.walls.length === 2, "a second barrier exists");
  const drawn = current.geometry.walls.at(-1);
  check(drawn.path.length === 2 && drawn.path[0].x === 30 && drawn.path[1].y === 3, `the new barrier runs from (30, 0) to (30, 3) m: ${JSON.stringify(drawn.path)}`);
  await shoot("barrier-drawn");

  console.log("draw a solid");
  await page.keyboard.press("b");
  for (const [x, y] of [[20, 8], [26, 8], [26, 11], [22, 12]]) await clickAt(x, y);
  await page.mouse.move((await toScreen(20.1, 8.1)).x, (await toScreen(20.1, 8.1)).y);
  await shoot("solid-closing");
  await clickAt(20, 8);
  await expectScene((s) => s.geometry.solids.length === 3 && s.geometry.solids[2].polygon.length === 4, "a click on the first corner closes a four-cornered solid");
  await shoot("solid-drawn");
  await page.keyboard.press("Control+z");
  await expectScene((s) => s.geometry.solids.length === 2, "undo removes it again");

  console.log("move a receiver");
  await page.keyboard.press("m");
  const from = await toScreen(28, 1.5);
  const to = await toScreen(34, 3);
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  await page.mouse.move((from.x + to.x) / 2, (from.y + to.y) / 2, { steps: 4 });
  await page.mouse.move(to.x, to.y, { steps: 4 });
  await shoot("receiver-dragging");
  await page.mouse.up();
  await expectScene((s) => {
    const garden = s.receivers.find((r) => r.id === "garden");
    return garden.position.x === 34 && garden.position.y === 3;
  }, "the garden receiver moved to (34, 3) m, on the 1 m grid");
  await shoot("receiver-moved");

  console.log("undo");
  await page.keyboard.press("Control+z");
  await expectScene((s) => {
    const back = s.receivers.find((r) => r.id === "garden");
    return back.position.x === 28 && back.position.y === 1.5;
  }, "undo puts the receiver back at (28, 1.5) m");
  await shoot("after-undo");

  console.log("edit a number in the inspector");
  await clickAt(12.5, 2);
  await page.getByTestId("wall-thickness").fill("0.25");
  await page.getByTestId("wall-thickness").press("Enter");
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier").thickness === 0.25, "the barrier is 0.25 m thick");
  await shoot("inspector-thickness");

  console.log("keyboard: nudge, delete, undo, redo");
  await clickAt(30, 2.5);
  const selected = await page.getByTestId("inspector").textContent();
  check(/Barrier 1/.test(selected), "a click selects the new barrier");
  await page.keyboard.press("ArrowRight");
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier-1")?.path[0].x === 31, "the arrow key nudges it one grid step (1 m) to the right");
  await page.keyboard.press("Delete");
  await expectScene((s) => !s.geometry.walls.some((w) => w.id === "barrier-1"), "Delete removes it");
  await page.keyboard.press("Control+z");
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier-1")?.path[0].x === 31, "undo brings it back");
  await page.keyboard.press("Control+z");
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier-1")?.path[0].x === 30, "a second undo takes back the nudge");
  await page.keyboard.press("Control+Shift+z");
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier-1")?.path[0].x === 31, "redo nudges it again");

  console.log("reshape: drag a corner, add one on an edge");
  await clickAt(12.5 - 0.06, 1);
  await page.waitForTimeout(100);
  const top = await toScreen(12.5, 3.4);
  await page.mouse.move(top.x, top.y);
  await page.mouse.down();
  const newTop = await toScreen(14, 4);
  await page.mouse.move(newTop.x, newTop.y, { steps: 5 });
  await page.mouse.up();
  await expectScene((s) => {
    const path = s.geometry.walls.find((w) => w.id === "barrier").path;
    return path.length === 2 && path[1].x === 14 && path[1].y === 4;
  }, "dragging the barrier's top handle moves that end to (14, 4) m");
  const middle = await toScreen(13.25, 2.2);
  await page.mouse.dblclick(middle.x, middle.y);
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier").path.length === 3, "a double-click on the barrier's line adds a corner");
  await shoot("barrier-reshaped");
  await page.keyboard.press("Control+z");
  await page.keyboard.press("Control+z");
  await expectScene((s) => {
    const path = s.geometry.walls.find((w) => w.id === "barrier").path;
    return path.length === 2 && path[1].x === 12.5 && path[1].y === 3.4;
  }, "two undos restore the barrier");

  console.log("pan with the space bar held");
  const before = await toScreen(0, 0);
  await page.mouse.move(before.x + 300, before.y - 200);
  await page.keyboard.down("Space");
  await page.mouse.down();
  await page.mouse.move(before.x + 360, before.y - 160, { steps: 4 });
  await page.mouse.up();
  await page.keyboard.up("Space");
  const moved = await toScreen(0, 0);
  check(Math.abs(moved.x - before.x - 60) < 0.5 && Math.abs(moved.y - before.y - 40) < 0.5, "space and drag pan the view by the drag (60, 40) px");
  await page.keyboard.press("f");

  console.log("a source in the inspector");
  await clickAt(4.5, 0.9);
  await page.getByTestId("signal-kind").waitFor();
  await shoot("source-inspector");

  console.log("zoom about the cursor");
  // Whole pixels: the browser rounds the pointer position, and zooming would magnify that rounding.
  const near = await toScreen(12.5, 3.4);
  const detail = { x: Math.round(near.x), y: Math.round(near.y) };
  await page.mouse.move(detail.x, detail.y);
  const anchor = await page.getByTestId("scene-canvas").evaluate((element, at) => {
    const box = element.getBoundingClientRect();
    const ppm = Number(element.dataset.pixelsPerMetre);
    return { x: (at.x - box.left - Number(element.dataset.originX)) / ppm, y: (Number(element.dataset.originY) - (at.y - box.top)) / ppm };
  }, detail);
  for (let k = 0; k < 8; k++) await page.mouse.wheel(0, -120);
  await page.waitForTimeout(300);
  const after = await toScreen(anchor.x, anchor.y);
  const drift = Math.hypot(after.x - detail.x, after.y - detail.y);
  check(drift < 0.5, `the point under the cursor stays there while zooming (drift ${drift.toFixed(2)} px)`);
  await shoot("zoomed-detail");
  await page.keyboard.press("f");

  console.log("type a change in the code view");
  await page.getByTestId("view-split").click();
  await page.locator(".monaco-editor").first().waitFor();
  await page.waitForTimeout(800);
  await replaceInCode('"x": 43, "y": 4.5');
  await page.keyboard.insertText('"x": 36, "y": 6');
  await expectScene((s) => {
    const upper = s.receivers.find((r) => r.id === "window-first");
    return upper.position.x === 36 && upper.position.y === 6;
  }, "the first-floor receiver moved to (36, 6) m from the code view");
  await page.mouse.move(10, 10);
  await shoot("code-edit-on-canvas");

  console.log("introduce a schema error");
  await replaceInCode('"thickness": 0.25');
  await page.keyboard.insertText('"thickness": "thick"');
  await page.locator(".squiggly-error").filter({ visible: true }).first().waitFor();
  await page.waitForTimeout(600);
  current = await scene();
  check(current.geometry.walls.find((w) => w.id === "barrier").thickness === 0.25, "the drawing keeps the last valid scene");
  const status = await page.getByTestId("code-status-text").textContent();
  check(/problem/.test(status), `the code view reports the problem: "${status}"`);
  await hoverOver(page.locator(".squiggly-error").filter({ visible: true }).first());
  await page.locator(".monaco-hover").first().waitFor();
  await page.waitForTimeout(400);
  await shoot("schema-error-marked");

  console.log("a cross-field problem placed by its JSON path");
  await replaceInCode('"thickness": "thick"');
  await page.keyboard.insertText('"thickness": 0.3');
  // The barrier's id (the first "barrier" in the text) takes the garden receiver's id.
  await replaceInCode('"id": "barrier"');
  await page.keyboard.insertText('"id": "garden"');
  await page.waitForTimeout(900);
  const problemsText = await page.getByTestId("code-problems").textContent();
  check(/already used/.test(problemsText), `the duplicate id is listed: "${problemsText}"`);
  // A click on the listed problem brings its line into view.
  await page.getByTestId("code-problems").locator("button").first().click();
  await page.waitForTimeout(300);
  await hoverOver(page.locator(".squiggly-error").filter({ visible: true }).first());
  await page.waitForTimeout(600);
  await shoot("duplicate-id-marked");
  await replaceInCode('"id": "garden"');
  await page.keyboard.insertText('"id": "barrier"');
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier")?.thickness === 0.3 && s.receivers.some((r) => r.id === "garden"), "once fixed, the text reaches the drawing (thickness 0.3 m, ids as before)");

  console.log("an inspector edit reaches the code view");
  await page.getByTestId("code-status-text").filter({ hasText: "in step" }).waitFor();
  await clickAt(12.5, 2);
  await page.getByTestId("wall-thickness").fill("0.35");
  await page.getByTestId("wall-thickness").press("Enter");
  await findInCode('"thickness": 0.35');
  const matches = await page.locator(".find-widget .matchesCount").textContent();
  check(/1 of 1/.test(matches), `the code view shows the new thickness (find: "${matches}")`);
  await page.keyboard.press("Escape");

  console.log("hover explains a field");
  await findInCode('"peakFrequency"');
  const key = page.locator(".monaco-editor .view-lines span span").filter({ hasText: /^"peakFrequency"$/ }).first();
  await hoverOver(key);
  await page.locator(".monaco-hover").first().waitFor();
  await page.waitForTimeout(400);
  await shoot("hover-describes-field");

  console.log("unfinished text is kept when the drawing changes");
  await replaceInCode('"count": 10');
  await page.keyboard.insertText('"count": 1');
  await page.getByTestId("code-status-text").filter({ hasText: "problem" }).waitFor();
  await clickAt(12.5, 2);
  await page.getByTestId("wall-thickness").fill("0.4");
  await page.getByTestId("wall-thickness").press("Enter");
  await expectScene((s) => s.geometry.walls.find((w) => w.id === "barrier").thickness === 0.4, "the inspector still edits the drawing");
  const discard = page.getByRole("button", { name: /Discard my text/ });
  await discard.waitFor();
  await shoot("code-behind-the-drawing");
  await discard.click();
  await page.getByTestId("code-status-text").filter({ hasText: "in step" }).waitFor();
  await findInCode('"thickness": 0.4');
  check(/1 of 1/.test(await page.locator(".find-widget .matchesCount").textContent()), "after discarding, the code view shows the drawing's scene");
  await page.keyboard.press("Escape");

  console.log("keyboard help");
  await page.getByTestId("view-canvas").click();
  await page.getByTestId("scene-canvas").focus();
  await page.keyboard.press("?");
  await page.getByTestId("keyboard-help").waitFor();
  await shoot("keyboard-help");
  await page.keyboard.press("Escape");

  console.log("a scene too large for the browser");
  await page.getByTestId("scene-canvas").focus();
  await page.keyboard.press("Escape");
  await page.getByTestId("max-frequency").fill("8000");
  await page.getByTestId("max-frequency").press("Enter");
  await page.getByTestId("concerns").waitFor();
  const concerns = await page.getByTestId("concerns").textContent();
  check(/Server limit/.test(concerns) && /Too big for a browser/.test(concerns), "the derived numbers show the server limit and the browser warning");
  await page.locator("aside").evaluate((element) => element.scrollTo(0, element.scrollHeight));
  await shoot("limits-exceeded");

  console.log("viewer");
  await page.goto(`${base}?readonly=1`);
  await page.getByTestId("scene-canvas").waitFor();
  await page.waitForTimeout(500);
  await clickAt(4.5, 0.9);
  await page.waitForTimeout(200);
  check((await page.locator('[data-testid^="tool-"]').count()) === 0, "a viewer sees no drawing tools");
  await shoot("read-only-viewer");

  if (problems.length) throw new Error(`the page reported:\n${problems.join("\n")}`);
  console.log("all steps passed");
} catch (error) {
  if (process.env.SHOOT_DEBUG) {
    const session = await context.newCDPSession(page);
    const alive = await Promise.race([page.evaluate(() => "main thread answers"), new Promise((resolve) => setTimeout(() => resolve("main thread busy"), 5000))]);
    console.error(alive);
    if (alive === "main thread busy") {
      await session.send("Debugger.enable");
      session.on("Debugger.paused", (event) => {
        console.error(event.callFrames.slice(0, 12).map((f) => `${f.functionName} ${f.url.split("/").slice(-2).join("/")}:${f.location.lineNumber}`).join("\n"));
      });
      await session.send("Debugger.pause");
      await new Promise((resolve) => setTimeout(resolve, 3000));
    }
  }
  await shoot("failure").catch(() => {});
  if (problems.length) console.error(`the page reported:\n${problems.join("\n")}`);
  throw error;
} finally {
  await context.close();
  await server.close();
  fs.rmSync(profile, { recursive: true, force: true });
}
