// One headless chromium per test file, with the flags that work on this machine (see README).
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { SignInPage } from "./pages/sign-in-page";

export const baseUrl = process.env.RAREFACT_E2E_BASE_URL ?? "http://127.0.0.1:3000";

export const chromiumFlags = [
  "--use-angle=swiftshader",
  "--enable-unsafe-swiftshader",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export function chromiumPath(): string {
  const candidates = [process.env.CHROMIUM_PATH, "/usr/bin/chromium", "/usr/bin/chromium-browser"].filter(Boolean) as string[];
  const found = candidates.find((candidate) => fs.existsSync(candidate));
  if (!found) {
    throw new Error("No chromium found. Install Debian's browser with `apt-get install -y chromium`, or set CHROMIUM_PATH to a Chromium binary.");
  }
  return found;
}

export async function openBrowser(): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), "rarefact-e2e-profile-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath(),
    args: chromiumFlags,
    viewport: { width: 1360, height: 900 },
    baseURL: baseUrl,
  });
  context.setDefaultTimeout(30_000);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** The sign-in form's answer when better-auth's rate limit (3 sign-ins per 10 s from one address) is hit. */
const rateLimitedMessage = "Too many attempts";

type SignInOutcome = "signed-in" | "rate-limited" | "no-answer";

/** Polls rather than racing two waits, so no losing wait is left to reject later. */
async function awaitSignInOutcome(page: Page, timeoutMs: number): Promise<SignInOutcome> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (new URL(page.url()).pathname === "/dashboard") {
      await page.waitForURL("**/dashboard");
      return "signed-in";
    }
    if (await page.getByText(rateLimitedMessage).isVisible().catch(() => false)) return "rate-limited";
    await page.waitForTimeout(250);
  }
  return "no-answer";
}

/**
 * A fresh browser signed in through the sign-in form, waiting on the dashboard it lands on.
 * The test files sign in many times from one address, so a sign-in may meet the production rate
 * limit; then it waits out the limit's window and signs in again on a fresh form, as a person would.
 */
export async function signedInBrowser(email: string, password: string): Promise<Awaited<ReturnType<typeof openBrowser>>> {
  const browser = await openBrowser();
  const signIn = new SignInPage(browser.page);
  let outcome: SignInOutcome = "no-answer";
  for (let attempt = 1; attempt <= 3; attempt += 1) {
    await signIn.open();
    await signIn.signIn(email, password);
    // The first sign-in after the server starts pays for its cold start (auth set-up, first renders).
    outcome = await awaitSignInOutcome(browser.page, 90_000);
    if (outcome !== "rate-limited") break;
    await browser.page.waitForTimeout(11_000);
  }
  if (outcome === "signed-in") return browser;
  const url = browser.page.url();
  await keepScreenshot(browser.page, "sign-in-failed").catch(() => undefined);
  const shown = await browser.page.locator("form").first().textContent().catch(() => "");
  await browser.close();
  throw new Error(`Signing in as ${email} did not reach the dashboard (${outcome}; still at ${url}; the form shows: ${shown}).`);
}

/** Saves a screenshot for people to look at (tests/e2e/artifacts, git-ignored). */
export async function keepScreenshot(page: Page, name: string): Promise<void> {
  const dir = path.join(process.cwd(), "tests", "e2e", "artifacts");
  fs.mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}
