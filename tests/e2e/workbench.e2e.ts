import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { demoMembers, demoPassword, demoStudy } from "@/db/seed/demo-accounts";
import { keepScreenshot, openBrowser } from "./browser";
import { DashboardPage } from "./pages/dashboard-page";
import { SignInPage } from "./pages/sign-in-page";

const engineer = demoMembers.find((m) => m.role === "owner")!;
const viewer = demoMembers.find((m) => m.role === "viewer")!;

describe("the workbench in a browser", () => {
  let page: Page;
  let context: BrowserContext;
  let close: () => Promise<void>;

  beforeAll(async () => {
    ({ page, context, close } = await openBrowser());
  });
  // Each test starts signed out, whatever the one before it left behind.
  beforeEach(async () => {
    await context.clearCookies();
  });
  afterAll(async () => {
    await close();
  });

  it("signs in as the demo engineer, shows the demo study, creates a study and signs out", async () => {
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(engineer.email, demoPassword);
    const dashboard = new DashboardPage(page);
    await dashboard.waitForStudies();
    expect(await dashboard.studyTitles()).toContain(demoStudy.title);
    expect(await page.getByTestId("signed-in-user").textContent()).toBe(engineer.name);
    expect(await page.evaluate(() => globalThis.crossOriginIsolated)).toBe(true);
    await keepScreenshot(page, "dashboard-engineer");

    await page.getByRole("link", { name: new RegExp(demoStudy.title) }).click();
    await page.getByRole("list", { name: "Notebook blocks" }).waitFor();
    // The three seeded scenes (other browser tests may add scenes to the demo study, e.g. a reference made on request).
    const sceneBlocks = await page.locator("[data-block-kind=scene]").allTextContents();
    for (const name of ["Reference: no barrier", "Design A: 3 m reflective timber barrier", "Design B: 4 m barrier, absorptive road face"]) {
      expect(sceneBlocks.some((text) => text.includes(name))).toBe(true);
    }
    expect(await page.locator("[data-block-kind=notes]").count()).toBeGreaterThanOrEqual(1);
    await keepScreenshot(page, "study-demo");

    await page.goto("/dashboard");
    await dashboard.waitForStudies();
    await dashboard.createStudy({ title: "Louvre to the car park", siteReference: "FH-E2E-1", description: "Made by the browser test." });
    await page.waitForURL("**/studies/**");
    await page.getByRole("heading", { name: "Louvre to the car park" }).waitFor();

    await page.goto("/sign-out");
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL("**/sign-in**");
    expect((await page.request.get("/api/me")).status()).toBe(401);
  });

  it("gives a viewer no create button, and the API answers 403 to a viewer's create", async () => {
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(viewer.email, demoPassword);
    const dashboard = new DashboardPage(page);
    await dashboard.waitForStudies();
    expect(await dashboard.newStudyButton().count()).toBe(0);
    await keepScreenshot(page, "dashboard-viewer");
    const teamId = await dashboard.activeTeamId();
    const response = await page.request.post(`/api/teams/${teamId}/studies`, { data: { title: "Viewer's study" } });
    expect(response.status()).toBe(403);
    expect(await response.json()).toMatchObject({ error: { code: "forbidden:team" } });
    await page.goto("/sign-out");
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL("**/sign-in**");
  });

  it("shows each sign-in and sign-up problem beside its field", async () => {
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn("not-an-email", "whatever");
    expect(await signIn.messageFor("email")).toMatch(/valid e-mail/);
    await signIn.signIn(engineer.email, "wrong-password-123");
    await page.locator("#password-message").waitFor();
    expect(await signIn.messageFor("password")).toMatch(/do not match/);

    await page.goto("/sign-up");
    await page.locator("button[type=submit]:enabled").waitFor();
    await page.fill("#name", "New Person");
    await page.fill("#email", engineer.email);
    await page.fill("#password", "short");
    await page.click("button[type=submit]");
    expect(await signIn.messageFor("password")).toMatch(/at least 10 characters/);
    await page.fill("#password", "a-long-enough-password");
    await page.click("button[type=submit]");
    await page.locator("#email-message[role=alert]").waitFor();
    expect(await signIn.messageFor("email")).toMatch(/already exists/);
    await keepScreenshot(page, "sign-up-taken-email");
  });

  it("redirects a signed-out visitor from the dashboard to sign-in", async () => {
    await page.goto("/dashboard");
    await page.waitForURL("**/sign-in?next=**");
  });
});
