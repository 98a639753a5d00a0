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

/** A fresh browser signed in through the sign-in form, waiting on the dashboard it lands on. */
export async function signedInBrowser(email: string, password: string): Promise<Awaited<ReturnType<typeof openBrowser>>> {
  const browser = await openBrowser();
  const signIn = new SignInPage(browser.page);
  await signIn.open();
  await signIn.signIn(email, password);
  try {
    // The first sign-in after the server starts pays for its cold start (auth set-up, first renders).
    await browser.page.waitForURL("**/dashboard", { timeout: 120_000 });
  } catch (error) {
    await keepScreenshot(browser.page, "sign-in-failed");
    const shown = await browser.page.locator("form").first().textContent().catch(() => "");
    await browser.close();
    throw new Error(`Signing in as ${email} did not reach the dashboard (still at ${browser.page.url()}; the form shows: ${shown}).`, { cause: error });
  }
  return browser;
}

/** Saves a screenshot for people to look at (tests/e2e/artifacts, git-ignored). */
export async function keepScreenshot(page: Page, name: string): Promise<void> {
  const dir = path.join(process.cwd(), "tests", "e2e", "artifacts");
  fs.mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}
