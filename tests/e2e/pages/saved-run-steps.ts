import type { Page } from "playwright-core";
import { demoStudy } from "@/db/seed/demo-accounts";

/** Opens the demo study from the dashboard and returns its path. */
export async function openDemoStudy(page: Page): Promise<string> {
  await page.goto("/dashboard");
  await page.getByRole("link", { name: new RegExp(demoStudy.title) }).click();
  await page.waitForURL(/\/studies\/[^/]+$/);
  return new URL(page.url()).pathname;
}

/** Opens a scene of the open study from its notebook (the activity feed may link the same scene). */
export async function openSceneFromNotebook(page: Page, sceneName: string): Promise<void> {
  await page.getByRole("list", { name: "Notebook blocks" }).getByRole("link", { name: sceneName, exact: true }).click();
}

/** Runs a demo scene in the page, saves the run, and returns the saved run's page path. */
export async function runAndSave(page: Page, sceneName: string): Promise<string> {
  await openDemoStudy(page);
  await openSceneFromNotebook(page, sceneName);
  await page.getByRole("button", { name: "Run in this browser" }).click();
  await page.getByTestId("run-phase").filter({ hasText: "Finished" }).waitFor({ timeout: 240_000 });
  const saved = page.getByRole("link", { name: "Open the saved run" });
  // Saving may be automatic (a remembered preference); otherwise press the button.
  if (!(await saved.isVisible())) await page.getByTestId("run-save").getByRole("button", { name: "Save run" }).click();
  await saved.waitFor({ timeout: 60_000 });
  return (await saved.getAttribute("href"))!;
}
