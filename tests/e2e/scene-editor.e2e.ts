// The scene editor in a browser: draw a barrier and see it in the code view, type a bad value and see
// it marked, undo it, import a DXF drawing, save, reload and find the scene as saved; then a stale save
// (someone else saved meanwhile) keeps the user's copy as a new variant.
import path from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import type { Scene } from "@/lib/fdtd/scene";
import { keepScreenshot, signedInBrowser } from "./browser";
import { DashboardPage } from "./pages/dashboard-page";
import { SceneEditorPage } from "./pages/scene-editor-page";

const engineer = demoMembers.find((m) => m.role === "owner")!;
const fixture = (name: string) => path.resolve("tests/fixtures/import", name);

interface SceneResponse {
  scene: { id: string; studyId: string; version: number; name: string; data: Scene };
}

async function fetchScene(page: Page, sceneId: string): Promise<SceneResponse["scene"]> {
  const response = await page.request.get(`/api/scenes/${sceneId}`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as SceneResponse).scene;
}

describe("editing a scene in the browser", () => {
  let page: Page;
  let close: () => Promise<void>;
  let studyId: string;
  let sceneId: string;

  beforeAll(async () => {
    ({ page, close } = await signedInBrowser(engineer.email, demoPassword));
    const teamId = await new DashboardPage(page).activeTeamId();
    const study = await page.request.post(`/api/teams/${teamId}/studies`, { data: { title: "Editor check (browser test)" } });
    studyId = ((await study.json()) as { study: { id: string } }).study.id;
    const created = await page.request.post(`/api/studies/${studyId}/scenes`, { data: { name: "Verge barrier", templateId: "roadside-barrier" } });
    expect(created.status()).toBe(201);
    sceneId = ((await created.json()) as SceneResponse).scene.id;
  });
  afterAll(async () => {
    await close();
  });

  it("draws, shows in code, marks a bad value, undoes, imports a DXF, saves and reloads unchanged", async () => {
    const editor = new SceneEditorPage(page);
    await editor.open(studyId, sceneId);
    expect(await editor.editStatus().textContent()).toMatch(/Version 1 saved/);

    // A second barrier from (30, 0) to (30, 2) m, drawn with the mouse; the grid snaps the clicks.
    await editor.drawWall([
      [30, 0],
      [30, 2],
    ]);
    await editor.editStatus().filter({ hasText: "Unsaved changes" }).waitFor();
    await editor.showCode();
    expect(await editor.countInCode('"x": 30, "y": 2')).toBe(1);
    await keepScreenshot(page, "editor-barrier-drawn");

    // A bad value typed in the code view is marked on its line and reported; the drawing keeps the last valid scene.
    await editor.replaceInCode('"thickness": 0.15', '"thickness": "thick"');
    await editor.errorMarker().waitFor();
    expect(await page.getByTestId("code-status-text").textContent()).toMatch(/problem/);
    await keepScreenshot(page, "editor-bad-value-marked");
    // Typing a valid value again clears the marker and reaches the drawing.
    await editor.replaceInCode('"thickness": "thick"', '"thickness": 0.15');
    await page.getByTestId("code-status-text").filter({ hasText: "in step" }).waitFor();
    // Monaco redraws its markers a moment after the text validates.
    await page.waitForFunction(() => document.querySelectorAll(".monaco-editor .squiggly-error").length === 0);

    // Undo takes the drawn barrier away in both views; redo brings it back.
    await page.getByTestId("undo").click();
    await page.getByTestId("code-status-text").filter({ hasText: "in step" }).waitFor();
    expect(await editor.countInCode('"x": 30, "y": 2')).toBe(0);
    await page.getByTestId("redo").click();
    expect(await editor.countInCode('"x": 30, "y": 2')).toBe(1);

    // A DXF site plan in millimetres: its BARRIERS layer becomes one more barrier.
    await editor.importFile(fixture("site-plan-mm.dxf"));
    await page.getByLabel("Layer BARRIERS as barriers").check();
    await page.getByTestId("import-preview").waitFor();
    await keepScreenshot(page, "editor-dxf-import");
    await page.getByTestId("import-apply").click();
    await page.getByTestId("import-dialog").waitFor({ state: "detached" });

    await editor.save("Second barrier drawn, site plan barrier imported");
    await editor.editStatus().filter({ hasText: "Version 2 saved" }).waitFor();
    const saved = await fetchScene(page, sceneId);
    expect(saved.version).toBe(2);
    const walls = saved.data.geometry.walls;
    expect(walls).toHaveLength(3);
    expect(walls[0]!.thickness).toBe(0.15);
    expect(walls.some((wall) => wall.path.length === 2 && wall.path[0]!.x === 30 && wall.path[1]!.y === 2)).toBe(true);
    // The imported polyline: 1 m to 14 m across at 6 to 7 m (millimetres converted).
    expect(walls.some((wall) => wall.path.length === 3 && wall.path[0]!.x === 1 && wall.path[2]!.y === 7)).toBe(true);

    await page.reload();
    await editor.open(studyId, sceneId);
    expect(await editor.editStatus().textContent()).toMatch(/Version 2 saved/);
    await editor.showCode();
    expect(await editor.countInCode('"x": 30, "y": 2')).toBe(1);
    expect((await fetchScene(page, sceneId)).data).toEqual(saved.data);
  });

  it("answers a stale save with a choice, and keeps the user's copy as a new variant", async () => {
    const editor = new SceneEditorPage(page);
    await editor.open(studyId, sceneId);
    const before = await fetchScene(page, sceneId);
    // The user moves the garden receiver in the code view ...
    await editor.showCode();
    await editor.replaceInCode('"x": 25, "y": 1.5', '"x": 26, "y": 1.5');
    await editor.editStatus().filter({ hasText: "Unsaved changes" }).waitFor();
    // ... while a colleague saves another version.
    const colleague = await page.request.put(`/api/scenes/${sceneId}`, {
      data: { baseVersion: before.version, name: before.name, data: { ...before.data, name: "Changed by a colleague" }, note: "colleague" },
    });
    expect(colleague.status()).toBe(200);

    await editor.save("Garden receiver moved");
    const conflict = page.getByRole("alert").filter({ hasText: "Someone saved a newer version" });
    await conflict.waitFor();
    await keepScreenshot(page, "editor-conflict");
    await page.getByRole("button", { name: "Keep mine as a new variant" }).click();
    await page.waitForURL((url) => url.pathname.includes("/scenes/") && !url.pathname.endsWith(sceneId));
    const variantId = page.url().split("/scenes/")[1]!.split(/[?#]/)[0]!;
    const variant = await fetchScene(page, variantId);
    expect(variant.data.receivers.find((r) => r.id === "garden")!.position).toEqual({ x: 26, y: 1.5 });
    // The colleague's version stands as it was saved.
    const original = await fetchScene(page, sceneId);
    expect(original.version).toBe(before.version + 1);
    expect(original.data.name).toBe("Changed by a colleague");
    expect(original.data.receivers.find((r) => r.id === "garden")!.position).toEqual({ x: 25, y: 1.5 });
  });
});
