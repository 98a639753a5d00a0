import type { Page } from "playwright-core";

export class DashboardPage {
  constructor(private readonly page: Page) {}

  async waitForStudies(): Promise<void> {
    await this.page.waitForURL("**/dashboard");
    await this.page.getByRole("list", { name: "Studies" }).waitFor();
  }

  studyTitles(): Promise<string[]> {
    return this.page.getByRole("list", { name: "Studies" }).locator("h3").allTextContents();
  }

  newStudyButton() {
    return this.page.getByRole("button", { name: "New study" });
  }

  async createStudy(input: { title: string; siteReference: string; description: string }): Promise<void> {
    await this.newStudyButton().click();
    await this.page.fill("#study-title", input.title);
    await this.page.fill("#study-site-reference", input.siteReference);
    await this.page.fill("#study-description", input.description);
    await this.page.getByRole("button", { name: "Create study" }).click();
  }

  async activeTeamId(): Promise<string> {
    const response = await this.page.request.get("/api/me");
    return ((await response.json()) as { activeTeamId: string }).activeTeamId;
  }
}
