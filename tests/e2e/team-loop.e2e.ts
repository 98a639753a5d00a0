// The team's whole loop with people signed in at once, each in a browser of their own: the engineer
// saves a run and the reviewer sees it appear without reloading; the reviewer pins a comment to the
// field and asks for a revision; the colleague forks the scene; the engineer's open study page
// shows the comment and the fork in its feed; an invitation e-mail lands in the team's mailbox.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { keepScreenshot, signedInBrowser } from "./browser";
import { openDemoStudy, openSceneFromNotebook, runAndSave } from "./pages/saved-run-steps";

const engineer = demoMembers.find((m) => m.role === "owner")!;
const colleague = demoMembers.find((m) => m.role === "editor")!;
const reviewer = demoMembers.find((m) => m.role === "reviewer")!;
const sceneName = "Reference: no barrier";

type Browser = Awaited<ReturnType<typeof signedInBrowser>>;

describe("a team works a run through together", () => {
  let engineerBrowser: Browser;
  let reviewerBrowser: Browser;
  let colleagueBrowser: Browser;

  beforeAll(async () => {
    engineerBrowser = await signedInBrowser(engineer.email, demoPassword);
    reviewerBrowser = await signedInBrowser(reviewer.email, demoPassword);
    colleagueBrowser = await signedInBrowser(colleague.email, demoPassword);
  });
  afterAll(async () => {
    await Promise.all([engineerBrowser?.close(), reviewerBrowser?.close(), colleagueBrowser?.close()]);
  });

  it("saves, sees live, comments with a pin, asks for a revision, forks, shows the feed and keeps the invitation e-mail", async () => {
    const eng = engineerBrowser.page;
    const rev = reviewerBrowser.page;
    const col = colleagueBrowser.page;

    // The reviewer has the study open, and sees the engineer there too.
    const studyPath = await openDemoStudy(rev);
    await openDemoStudy(eng);
    await rev.getByTestId("presence-bar").getByText(engineer.name, { exact: true }).first().waitFor({ timeout: 60_000 });

    // The engineer runs and saves; the reviewer's open run table gains the run without a reload.
    const runPath = await runAndSave(eng, sceneName);
    const runId = runPath.split("/runs/")[1]!;
    await eng.goto(studyPath);
    await rev.locator(`a[href$="/runs/${runId}"]`).first().waitFor({ timeout: 60_000 });
    expect(new URL(rev.url()).pathname).toBe(studyPath);
    await keepScreenshot(rev, "team-loop-run-appears");

    // The reviewer pins a comment to the field and asks for a revision.
    await rev.goto(runPath);
    const field = rev.getByTestId("field-view");
    await field.waitFor({ timeout: 60_000 });
    await rev.getByRole("button", { name: "Pin to the field" }).click();
    // Pin mode puts a banner above the view and scrolls it into sight: click once both have settled.
    await rev.getByTestId("field-pin-mode").waitFor();
    await rev.waitForTimeout(1000);
    const box = (await field.boundingBox())!;
    await field.click({ position: { x: box.width * 0.5, y: box.height * 0.45 } });
    await rev.getByTestId("composer-pin").waitFor();
    const remark = "Levels behind the barrier line look high here; check the top of the domain.";
    await rev.getByLabel("New comment").fill(remark);
    await rev.getByRole("button", { name: "Post comment" }).click();
    await rev.getByRole("list", { name: "Threads" }).getByText(remark).waitFor();
    await rev.getByRole("button", { name: "Ask for a revision" }).click();
    await rev.getByLabel("What should be revised?").fill("Raise the domain top by 5 m and run again.");
    await rev.getByRole("button", { name: "Send the revision request" }).click();
    await rev.getByText("Revision asked").first().waitFor();
    await keepScreenshot(rev, "team-loop-review");

    // The colleague forks the scene into the same study.
    await col.goto(studyPath);
    await openSceneFromNotebook(col, sceneName);
    await col.getByTestId("fork-scene").click();
    const forkName = `Taller domain try ${Date.now()}`;
    await col.getByLabel("Name of the fork").fill(forkName);
    await col.getByRole("button", { name: "Fork scene" }).click();
    await col.getByTestId("forked-from").waitFor({ timeout: 60_000 });
    expect(await col.getByTestId("forked-from").textContent()).toContain(sceneName);

    // The engineer's study page, open all along, shows both in its feed.
    const feed = eng.getByTestId("activity-feed");
    await feed.getByText(forkName).waitFor({ timeout: 60_000 });
    await feed.getByText(/asked for a revision/).first().waitFor({ timeout: 60_000 });
    await feed.getByText(/comment/).first().waitFor({ timeout: 60_000 });
    expect(new URL(eng.url()).pathname).toBe(studyPath);
    await keepScreenshot(eng, "team-loop-feed");

    // The engineer (an owner) invites someone; the e-mail is kept in the team's mailbox.
    await eng.getByRole("link", { name: "Team", exact: true }).click();
    await eng.waitForURL(/\/teams\/[^/]+$/);
    const invitee = `site.planner.${Date.now()}@example.org`;
    await eng.getByLabel("E-mail").fill(invitee);
    await eng.locator('input[type=radio][value="viewer"]').check();
    await eng.getByRole("button", { name: "Send invitation" }).click();
    await eng.getByRole("link", { name: "Open the mailbox" }).click();
    await eng.getByRole("heading", { name: "Mailbox" }).waitFor();
    await eng.getByText(invitee).first().click();
    await eng.getByText(/\/invitations\//).first().waitFor();
    await keepScreenshot(eng, "team-loop-mailbox");
  });
});
