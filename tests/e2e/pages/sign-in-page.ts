import type { Page } from "playwright-core";

export class SignInPage {
  constructor(private readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto("/sign-in");
    // The form's button is enabled once React has hydrated it; fields typed before that are reset
    // when the form library registers them.
    await this.page.locator("button[type=submit]:enabled").waitFor();
  }

  async signIn(email: string, password: string): Promise<void> {
    await this.page.fill("#email", email);
    await this.page.fill("#password", password);
    await this.page.click("button[type=submit]");
  }

  messageFor(field: "email" | "password" | "name"): Promise<string | null> {
    return this.page.locator(`#${field}-message`).textContent();
  }
}
