// Issue #8's promise, as an engineer lives it: queue a twelve-case barrier-height sweep on the server
// from the study, close the browser while it runs, sign in again later and find the finished
// insertion-loss chart in the notebook. The server here is `next start` on the embedded database,
// so the app's own in-process worker takes the jobs.
import type { Locator } from "playwright-core";
import { afterAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { keepScreenshot, signedInBrowser } from "./browser";
import { openDemoStudy } from "./pages/saved-run-steps";

const engineer = demoMembers.find((m) => m.role === "owner")!;
const sceneName = "Design A: 3 m reflective timber barrier";

type Browser = Awaited<ReturnType<typeof signedInBrowser>>;

/** Options carry version numbers and current values; pick by the words they start with. */
async function selectOptionStartingWith(select: Locator, start: string): Promise<void> {
  const values = await select.locator("option").evaluateAll((options, prefix) => options.filter((o) => (o.textContent ?? "").startsWith(prefix as string)).map((o) => (o as HTMLOptionElement).value), start);
  expect(values, `an option starting with "${start}"`).not.toHaveLength(0);
  await select.selectOption(values[0]!);
}

describe("a sweep on the server", () => {
  const browsers: Browser[] = [];
  afterAll(async () => {
    await Promise.all(browsers.map((b) => b.close()));
  });

  it("queues twelve barrier heights, survives the browser closing, and ends in an insertion-loss chart", async () => {
    // First visit: define the sweep and send it to the server.
    const first = await signedInBrowser(engineer.email, demoPassword);
    browsers.push(first);
    const page = first.page;
    const studyPath = await openDemoStudy(page);
    await page.getByRole("link", { name: "Sweep a parameter" }).click();
    await page.waitForURL(/\/sweeps/);
    await selectOptionStartingWith(page.getByLabel("Scene (its latest saved version)"), sceneName);
    const definition = page.getByRole("form", { name: "Sweep definition" });
    await selectOptionStartingWith(definition.getByLabel("Parameter"), "Height of Timber barrier");
    const range = definition.getByRole("group", { name: /Range/ });
    await range.getByLabel("From").fill("1.5");
    await range.getByLabel("To").fill("4.25");
    await range.getByLabel("Step").fill("0.25");
    await definition.getByText(/^12 values:/).waitFor();
    await page.getByLabel(/On the server/).check();
    const answer = page.waitForResponse((r) => r.request().method() === "POST" && /\/api\/scenes\/[^/]+\/sweeps$/.test(r.url()));
    await page.getByRole("button", { name: "Send the sweep to the server" }).click();
    const response = await answer;
    expect(response.status()).toBe(202);
    const queued = (await response.json()) as { sweep: { id: string; caseCount: number } };
    expect(queued.sweep.caseCount).toBe(12);
    await page.getByTestId("server-sweep").waitFor();
    // The address names the sweep, so that coming back to it follows the same sweep.
    await page.waitForURL(new RegExp(`sweep=${queued.sweep.id}`));
    const sweepPagePath = new URL(page.url()).pathname + new URL(page.url()).search;
    await keepScreenshot(page, "server-sweep-sent");
    // The engineer closes the browser while the sweep runs.
    await first.close();
    browsers.pop();

    // Later: a new browser session, the study's queue shows the sweep and, once it ends, its chart.
    const later = await signedInBrowser(engineer.email, demoPassword);
    browsers.push(later);
    const again = later.page;
    await again.goto(studyPath);
    const entry = again.getByTestId("queue-panel").locator(`[data-sweep-id="${queued.sweep.id}"]`);
    await entry.waitFor({ timeout: 60_000 });
    await entry.locator('[data-job-state="completed"]').first().waitFor({ timeout: 10 * 60_000 });
    await keepScreenshot(again, "server-sweep-finished-queue");
    await entry.getByRole("link", { name: "Open the sweep chart in the notebook" }).click();
    await again.waitForURL(/#block-/);
    const blockId = new URL(again.url()).hash.slice("#block-".length);
    const block = again.locator(`[id="block-${blockId}"]`);
    await block.getByText(/insertion loss/i).first().waitFor({ timeout: 60_000 });
    // Twelve values, each computed: no case is reported as failed or not run.
    const text = (await block.textContent()) ?? "";
    expect(text).not.toMatch(/failed|not run/i);
    await block.scrollIntoViewIfNeeded();
    await keepScreenshot(again, "server-sweep-chart");

    // The sweeps page's address from the first visit shows the finished sweep and its chart too.
    await again.goto(sweepPagePath);
    const followed = again.getByTestId("server-sweep");
    await followed.locator('[data-job-state="completed"]').first().waitFor({ timeout: 60_000 });
    await followed.getByText(/insertion loss/i).first().waitFor({ timeout: 60_000 });
  });
});
