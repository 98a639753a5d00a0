// Issue #9's promise, as a reviewer lives it: open a saved run and read which bands to trust and
// why, open the verification page, run a case in this browser, save the results and attach them to
// the run's report as quality evidence.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { keepScreenshot, signedInBrowser } from "./browser";
import { runAndSave } from "./pages/saved-run-steps";

const reviewer = demoMembers.find((m) => m.role === "reviewer")!;
const engineer = demoMembers.find((m) => m.role === "owner")!;

type Browser = Awaited<ReturnType<typeof signedInBrowser>>;

describe("how far to trust a run", () => {
  let browser: Browser;
  let engineerBrowser: Browser;
  let engineerPage: Browser["page"];
  beforeAll(async () => {
    engineerBrowser = await signedInBrowser(engineer.email, demoPassword);
    engineerPage = engineerBrowser.page;
    browser = await signedInBrowser(reviewer.email, demoPassword);
  });
  afterAll(async () => {
    await Promise.all([browser?.close(), engineerBrowser?.close()]);
  });

  it("shows the accuracy of a saved run, runs a verification case and attaches the saved results to the report", async () => {
    const page = browser.page;
    // The engineer has saved a run of the reference scene; the reviewer opens it.
    const runPath = await runAndSave(engineerPage, "Reference: no barrier");
    await page.goto(runPath);
    const accuracy = page.getByRole("heading", { name: "Accuracy of this run" });
    await accuracy.waitFor({ timeout: 120_000 });
    const panel = page.locator("section", { has: accuracy }).first();
    // Every band has a rating and a reason; at least one band is trusted.
    await expect.poll(async () => panel.getByText("reliable", { exact: true }).count()).toBeGreaterThan(0);
    await accuracy.scrollIntoViewIfNeeded();
    await keepScreenshot(page, "run-accuracy");

    // The verification page, from the main navigation: run the PML case here and save it.
    await page.getByRole("navigation").getByRole("link", { name: "Verification" }).first().click();
    await page.waitForURL(/\/verification/);
    const card = page.getByTestId("verification-case-pml");
    await card.getByRole("button", { name: /^Run / }).click();
    await card.getByText(/checks within tolerance/).waitFor({ timeout: 300_000 });
    const summary = (await card.getByText(/checks within tolerance/).first().textContent()) ?? "";
    const [, passed, total] = /(\d+) of (\d+) checks within tolerance/.exec(summary) ?? [];
    expect(Number(passed)).toBeGreaterThan(0);
    expect(passed).toBe(total);
    await keepScreenshot(page, "verification-pml");
    const saved = page.waitForResponse((r) => r.request().method() === "POST" && /\/verifications$/.test(r.url()));
    await page.getByRole("button", { name: "Save these results" }).click();
    expect((await saved).status()).toBe(201);

    // The run's report: attach the saved results, and the report prints them.
    await page.goto(`${runPath}/report`);
    const choice = page.getByLabel("Attach saved verification results");
    await choice.waitFor({ timeout: 120_000 });
    const values = await choice.locator("option").evaluateAll((options) => options.map((o) => (o as HTMLOptionElement).value).filter(Boolean));
    await choice.selectOption(values[0]!);
    await page.getByRole("button", { name: "Attach", exact: true }).click();
    await page.getByTestId("quality-evidence-record").first().waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("quality-evidence-record").first().textContent()).toMatch(/PML/i);
    await keepScreenshot(page, "report-quality-evidence");
  });
});
