import type { Page } from "playwright-core";

/** The scene page's editing tab: the drawing canvas, the Monaco code view and the save bar. */
export class SceneEditorPage {
  constructor(private readonly page: Page) {}

  async open(studyId: string, sceneId: string): Promise<void> {
    await this.page.goto(`/studies/${studyId}/scenes/${sceneId}`);
    await this.page.getByRole("tab", { name: "Edit scene" }).click();
    await this.page.getByTestId("scene-canvas").waitFor();
    // The derived figures come last: once the run-time estimate shows, the editor has settled.
    await this.page.getByTestId("figure-run-time").filter({ hasText: "≈" }).waitFor({ timeout: 60_000 });
  }

  /** Page position of a scene point (metres), from the view the canvas publishes on its element. */
  async toScreen(x: number, y: number): Promise<{ x: number; y: number }> {
    const canvas = this.page.getByTestId("scene-canvas");
    const box = (await canvas.boundingBox())!;
    const view = await canvas.evaluate((element) => ({
      pixelsPerMetre: Number((element as HTMLElement).dataset.pixelsPerMetre),
      originX: Number((element as HTMLElement).dataset.originX),
      originY: Number((element as HTMLElement).dataset.originY),
    }));
    return { x: box.x + view.originX + x * view.pixelsPerMetre, y: box.y + view.originY - y * view.pixelsPerMetre };
  }

  async clickAt(x: number, y: number): Promise<void> {
    const point = await this.toScreen(x, y);
    await this.page.mouse.click(point.x, point.y);
  }

  /** Draws a thin wall through the given points with the wall tool. */
  async drawWall(points: [number, number][]): Promise<void> {
    await this.page.getByTestId("tool-wall").click();
    for (const [x, y] of points) await this.clickAt(x, y);
    await this.page.keyboard.press("Enter");
  }

  async showCode(): Promise<void> {
    await this.page.getByTestId("view-split").click();
    await this.page.locator(".monaco-editor").first().waitFor();
    await this.page.getByTestId("code-status-text").filter({ hasText: "in step" }).waitFor();
  }

  /** How many times `text` occurs in the code view, by Monaco's find widget (its lines are virtualised). */
  async countInCode(text: string): Promise<number> {
    await this.selectInCode(text);
    const counter = (await this.page.locator(".find-widget .matchesCount").textContent()) ?? "";
    await this.page.keyboard.press("Escape");
    const match = /of (\d+)/.exec(counter);
    return match ? Number(match[1]) : 0;
  }

  /** Selects the first `text` in the code view with the find widget, leaving the widget open. */
  async selectInCode(text: string): Promise<void> {
    await this.page.mouse.move(5, 5);
    // Into the text (the editor is narrower in the split view), below the sticky headers.
    const editor = this.page.locator(".monaco-editor").first();
    const box = (await editor.boundingBox())!;
    await editor.click({ position: { x: box.width * 0.6, y: Math.min(200, box.height / 2) } });
    await this.page.keyboard.press("Control+F");
    await this.page.locator(".find-widget textarea, .find-widget input").first().fill(text);
    await this.page.keyboard.press("Enter");
  }

  /** Replaces the first `text` in the code view by `replacement`, typed as a user would. */
  async replaceInCode(text: string, replacement: string): Promise<void> {
    await this.selectInCode(text);
    await this.page.keyboard.press("Escape");
    await this.page.keyboard.press("Delete");
    await this.page.keyboard.insertText(replacement);
  }

  errorMarker() {
    return this.page.locator(".squiggly-error").filter({ visible: true }).first();
  }

  async importFile(path: string): Promise<void> {
    await this.page.getByTestId("import-open").click();
    await this.page.getByTestId("import-file").setInputFiles(path);
  }

  async save(note: string): Promise<void> {
    await this.page.getByLabel("Change note").fill(note);
    await this.page.getByRole("button", { name: "Save new version" }).click();
  }

  editStatus() {
    return this.page.getByTestId("edit-status");
  }
}
