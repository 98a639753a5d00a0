import { PNG } from "pngjs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword, demoStudy } from "@/db/seed/demo-accounts";
import { sceneTemplates } from "@/lib/scene-templates";
import { keepScreenshot, signedInBrowser } from "./browser";
import { DashboardPage } from "./pages/dashboard-page";
import { openSceneFromNotebook } from "./pages/saved-run-steps";

const engineer = demoMembers.find((m) => m.role === "owner")!;

/** Distinct colours in a screenshot of the field canvas: a blank canvas has one or two. */
async function fieldPicture(page: Page): Promise<{ png: Buffer; colours: number }> {
  const png = await page.locator("[data-testid=field-view] canvas").first().screenshot();
  const image = PNG.sync.read(png);
  const colours = new Set<number>();
  for (let k = 0; k < image.data.length; k += 4 * 7) colours.add((image.data[k]! << 16) | (image.data[k + 1]! << 8) | image.data[k + 2]!);
  return { png, colours: colours.size };
}

async function openScene(page: Page, sceneName: string): Promise<void> {
  await page.goto("/dashboard");
  await page.getByRole("link", { name: new RegExp(demoStudy.title) }).click();
  await openSceneFromNotebook(page, sceneName);
  await page.getByRole("button", { name: "Run in this browser" }).waitFor();
}

describe("running a scene in the browser", () => {
  let page: Page;
  let close: () => Promise<void>;

  beforeAll(async () => {
    ({ page, close } = await signedInBrowser(engineer.email, demoPassword));
  });
  afterAll(async () => {
    await close();
  });

  it("runs the reference variant: progress advances, the field is drawn and changes, and the result can be scrubbed", async () => {
    await openScene(page, "Reference: no barrier");
    // Record every step count the panel shows: the demo run is short, so watch rather than sample.
    await page.evaluate(() => {
      const seen: string[] = [];
      (window as unknown as { stepsSeen: string[] }).stepsSeen = seen;
      new MutationObserver(() => {
        const text = document.querySelector("[data-testid=run-steps]")?.textContent;
        if (text && seen.at(-1) !== text) seen.push(text);
      }).observe(document.body, { subtree: true, childList: true, characterData: true });
    });
    await page.getByRole("button", { name: "Run in this browser" }).click();
    await page.getByTestId("run-phase").filter({ hasText: "Finished" }).waitFor({ timeout: 240_000 });
    const stepsSeen = await page.evaluate(() => (window as unknown as { stepsSeen: string[] }).stepsSeen);
    const counts = stepsSeen.map((text) => Number(text.split("/")[0]!.replace(/[^\d]/g, "")));
    expect(counts.length).toBeGreaterThanOrEqual(3);
    expect(counts.every((count, k) => k === 0 || count > counts[k - 1]!)).toBe(true);
    expect(await page.getByRole("progressbar", { name: "Run progress" }).getAttribute("aria-valuenow")).toBe("100");

    await page.waitForTimeout(300);
    expect((await fieldPicture(page)).colours).toBeGreaterThan(20);
    await keepScreenshot(page, "run-finished");

    // Two frames of the replay differ: the wave has moved between them.
    const scrubber = page.getByRole("slider", { name: "Time" });
    await scrubber.fill("10");
    await page.waitForTimeout(300);
    const early = await fieldPicture(page);
    await scrubber.fill("30");
    await page.waitForTimeout(300);
    const later = await fieldPicture(page);
    expect(early.colours).toBeGreaterThan(20);
    expect(later.png.equals(early.png)).toBe(false);

    await page.getByRole("radio", { name: "Peak level" }).click();
    await page.waitForTimeout(300);
    expect((await fieldPicture(page)).colours).toBeGreaterThan(20);
    await keepScreenshot(page, "run-peak-level");
  });

  it("pauses and cancels a longer run, which stops and frees its workers", async () => {
    // A finer version of the barrier template: long enough to pause, large enough for two threads.
    // In a study of its own, so the seeded demo study stays as the other browser tests expect it.
    const teamId = await new DashboardPage(page).activeTeamId();
    const study = await page.request.post(`/api/teams/${teamId}/studies`, { data: { title: "Fine barrier check (browser test)" } });
    expect(study.status()).toBe(201);
    const studyId = ((await study.json()) as { study: { id: string } }).study.id;
    const template = sceneTemplates.find((t) => t.id === "roadside-barrier")!;
    const created = await page.request.post(`/api/studies/${studyId}/scenes`, {
      data: { name: "Fine barrier check", data: { ...template.scene, name: "Fine barrier check", resolution: { kind: "frequency", maxFrequency: 1000, pointsPerWavelength: 10 }, duration: { kind: "time", seconds: 0.4 } } },
    });
    expect(created.status()).toBe(201);
    const sceneId = ((await created.json()) as { scene: { id: string } }).scene.id;
    await page.goto(`/studies/${studyId}/scenes/${sceneId}`);
    await page.getByRole("button", { name: "Run in this browser" }).click();
    await page.waitForFunction(() => /^[1-9]/.test(document.querySelector("[data-testid=run-steps]")?.textContent ?? ""), undefined, { timeout: 120_000 });
    await page.getByRole("button", { name: "Pause" }).click();
    await page.getByTestId("run-phase").filter({ hasText: "Paused" }).waitFor();
    await page.waitForTimeout(500);
    const pausedAt = await page.getByTestId("run-steps").textContent();
    await page.waitForTimeout(700);
    expect(await page.getByTestId("run-steps").textContent()).toBe(pausedAt);
    await page.getByRole("button", { name: "Cancel" }).click();
    await page.getByTestId("run-phase").filter({ hasText: "Cancelled" }).waitFor({ timeout: 60_000 });
    expect(await page.getByRole("button", { name: "Run again" }).isEnabled()).toBe(true);
    await keepScreenshot(page, "run-cancelled");
  });
});
