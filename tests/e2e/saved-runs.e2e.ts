// Saved runs and the numbers an engineer reports, in a browser: run the demo's reference and design A,
// save both, open design A's saved run, read its band table, pair it with the reference for the
// insertion loss, make a reference on request, export a CSV, and open the printable report.
import fs from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { keepScreenshot, signedInBrowser } from "./browser";
import { runAndSave } from "./pages/saved-run-steps";

const engineer = demoMembers.find((m) => m.role === "owner")!;

describe("saved runs and their analysis", () => {
  let page: Page;
  let close: () => Promise<void>;

  beforeAll(async () => {
    ({ page, close } = await signedInBrowser(engineer.email, demoPassword));
  });
  afterAll(async () => {
    await close();
  });

  it("saves the reference and a barrier run, shows band levels and insertion loss, exports a CSV and prints a report", async () => {
    const referencePath = await runAndSave(page, "Reference: no barrier");
    const barrierPath = await runAndSave(page, "Design A: 3 m reflective timber barrier");
    const referenceRunId = referencePath.split("/runs/")[1]!;

    // The saved run opens from storage: no run button, the analysis appears.
    await page.goto(barrierPath);
    await page.getByTestId("run-analysis").waitFor({ timeout: 60_000 });
    const bandRows = page.getByTestId("band-level-table").locator("tbody tr");
    await bandRows.first().waitFor();
    expect(await bandRows.count()).toBeGreaterThan(0);
    expect(await page.getByTestId("band-level-table").textContent()).toMatch(/\d+(\.\d)? ?/);
    await keepScreenshot(page, "saved-run-bands");

    // Insertion loss against the saved reference.
    await page.getByTestId("reference-select").selectOption(referenceRunId);
    const lossTable = page.getByTestId("insertion-loss-table");
    await lossTable.waitFor({ timeout: 60_000 });
    expect(await lossTable.locator("tbody tr").count()).toBeGreaterThan(0);
    await lossTable.scrollIntoViewIfNeeded();
    await keepScreenshot(page, "saved-run-insertion-loss");

    // A reference made on request: design A without its barrier, saved as a scene, run here, saved, chosen.
    await page.getByTestId("reference-maker").getByRole("button", { name: "Make the reference and run it" }).click();
    await page.getByTestId("reference-maker").getByText("Saved and chosen as the reference.").waitFor({ timeout: 240_000 });
    await lossTable.waitFor();
    expect(await lossTable.locator("tbody tr").count()).toBeGreaterThan(0);
    expect(await page.getByTestId("reference-select").inputValue()).not.toBe(referenceRunId);

    // The band table as CSV: a header with units, then numbers.
    const bandPanel = page.getByTestId("band-level-table").locator("xpath=ancestor::section[1]");
    const [download] = await Promise.all([page.waitForEvent("download"), bandPanel.getByRole("button", { name: "CSV" }).first().click()]);
    const csv = fs.readFileSync((await download.path())!, "utf8");
    const [header, firstRow] = csv.split(/\r?\n/);
    expect(header).toMatch(/Hz/);
    expect(header).toMatch(/dB/);
    expect(firstRow!.split(",").some((cell) => Number.isFinite(Number(cell)) && cell.trim() !== "")).toBe(true);

    // The printable report, with the reference's insertion loss and the cautions.
    await page.goto(`${barrierPath}/report?reference=${referenceRunId}`);
    await page.getByRole("button", { name: /Print/ }).waitFor({ timeout: 60_000 });
    const text = (await page.locator("main").textContent()) ?? "";
    expect(text).toMatch(/statutory/);
    expect(text).toMatch(/Insertion loss/i);
    await page.emulateMedia({ media: "print" });
    await keepScreenshot(page, "run-report-print");
  });
});
