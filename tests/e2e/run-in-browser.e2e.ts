import { PNG } from "pngjs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword, demoStudy } from "@/db/seed/demo-accounts";
import { keepScreenshot, openBrowser } from "./browser";
import { SignInPage } from "./pages/sign-in-page";

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
  await page.getByRole("link", { name: sceneName }).click();
  await page.getByRole("button", { name: "Run in this browser" }).waitFor();
}

describe("running a scene in the browser", () => {
  let page: Page;
  let close: () => Promise<void>;

  beforeAll(async () => {
    ({ page, close } = await openBrowser());
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(engineer.email, demoPassword);
    await page.waitForURL("**/dashboard");
  });
  afterAll(async () => {
    await close();
  });

  it("runs the reference variant: progress advances, the field is drawn and changes, and the result can be scrubbed", async () => {
    await openScene(page, "Reference: no barrier");
    await page.getByRole("button", { name: "Run in this browser" }).click();
    const steps = page.getByTestId("run-steps");
    await page.waitForFunction(() => /^[1-9]/.test(document.querySelector("[data-testid=run-steps]")?.textContent ?? ""));
    const first = await fieldPicture(page);
    await page.waitForFunction((before) => document.querySelector("[data-testid=run-steps]")?.textContent !== before, await steps.textContent());
    await page.waitForTimeout(400);
    const second = await fieldPicture(page);
    expect(second.colours).toBeGreaterThan(20);
    expect(second.png.equals(first.png)).toBe(false);

    await page.getByTestId("run-phase").filter({ hasText: "Finished" }).waitFor({ timeout: 240_000 });
    await keepScreenshot(page, "run-finished");
    const scrubber = page.getByRole("slider", { name: "Time" });
    await scrubber.fill("3");
    await page.waitForTimeout(200);
    const early = await fieldPicture(page);
    expect(early.png.equals((await fieldPicture(page)).png)).toBe(true);
    await scrubber.fill("20");
    await page.waitForTimeout(200);
    expect((await fieldPicture(page)).png.equals(early.png)).toBe(false);

    await page.getByRole("button", { name: "Peak level" }).click();
    await page.waitForTimeout(200);
    expect((await fieldPicture(page)).colours).toBeGreaterThan(20);
    await keepScreenshot(page, "run-peak-level");
  });

  it("cancels another run, which stops and frees its worker", async () => {
    await openScene(page, "Design B: 4 m barrier, absorptive road face");
    await page.getByRole("button", { name: "Run in this browser" }).click();
    await page.waitForFunction(() => /^[1-9]/.test(document.querySelector("[data-testid=run-steps]")?.textContent ?? ""));
    await page.getByRole("button", { name: "Pause" }).click();
    await page.getByTestId("run-phase").filter({ hasText: "Paused" }).waitFor();
    const pausedAt = await page.getByTestId("run-steps").textContent();
    await page.waitForTimeout(700);
    expect(await page.getByTestId("run-steps").textContent()).toBe(pausedAt);
    await page.getByRole("button", { name: "Resume" }).click();
    await page.getByRole("button", { name: "Cancel" }).click();
    await page.getByTestId("run-phase").filter({ hasText: "Cancelled" }).waitFor({ timeout: 60_000 });
    expect(await page.getByRole("button", { name: "Run again" }).isEnabled()).toBe(true);
  });
});
