import type { Page } from "playwright-core";

export class SignInPage {
  constructor(private readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto("/sign-in");
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
