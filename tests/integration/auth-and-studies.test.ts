import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { prepareDatabase } from "@/db/startup";
import { demoMembers, demoPassword, demoStudy } from "@/db/seed/demo";
import { callRoute, cookieFrom, signIn, signInAs, signOut, signUp } from "../helpers/api";

async function activeTeamOf(cookie: string): Promise<string> {
  const response = await callRoute(meRoute.GET, { path: "/api/me", cookie });
  const body = (await response.json()) as { activeTeamId: string };
  return body.activeTeamId;
}

describe("sign-up, sign-in and the first data flow through the route handlers", () => {
  beforeAll(async () => {
    await prepareDatabase({ seed: true });
  });
  afterAll(async () => {
    await closeDb();
  });

  it("signs up a new user, who gets a team of their own as owner", async () => {
    const response = await signUp({ name: "Aroha Wilson", email: "aroha@example.org", password: "long-enough-password" });
    expect(response.status).toBe(200);
    const cookie = cookieFrom(response);
    const me = await callRoute(meRoute.GET, { path: "/api/me", cookie });
    const body = (await me.json()) as { user: { email: string }; memberships: { role: string; teamName: string }[] };
    expect(body.user.email).toBe("aroha@example.org");
    expect(body.memberships).toEqual([expect.objectContaining({ role: "owner", teamName: "Aroha's team" })]);
  });

  it("refuses a taken e-mail, a short password and a wrong password", async () => {
    const taken = await signUp({ name: "Someone Else", email: "aroha@example.org", password: "another-long-password" });
    expect(taken.status).toBe(422);
    const short = await signUp({ name: "Short Pass", email: "short@example.org", password: "abc" });
    expect(short.status).toBe(400);
    const wrong = await signIn({ email: "aroha@example.org", password: "not-the-password" });
    expect(wrong.status).toBe(401);
  });

  it("answers 401 JSON to a caller without a session", async () => {
    const response = await callRoute(meRoute.GET, { path: "/api/me" });
    expect(response.status).toBe(401);
    expect(await response.json()).toMatchObject({ error: { code: "unauthorized:session" } });
  });

  it("signs out: the old cookie no longer opens the API", async () => {
    const cookie = await signInAs("aroha@example.org", "long-enough-password");
    expect((await callRoute(meRoute.GET, { path: "/api/me", cookie })).status).toBe(200);
    expect((await signOut(cookie)).status).toBe(200);
    expect((await callRoute(meRoute.GET, { path: "/api/me", cookie })).status).toBe(401);
  });

  it("lists the seeded demo study to the demo engineer and lets them create a study", async () => {
    const engineer = demoMembers.find((m) => m.role === "owner")!;
    const cookie = await signInAs(engineer.email, demoPassword);
    const teamId = await activeTeamOf(cookie);
    const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie });
    expect(list.status).toBe(200);
    const { studies } = (await list.json()) as { studies: { id: string; title: string; sceneCount: number }[] };
    const demo = studies.find((s) => s.title === demoStudy.title);
    expect(demo?.sceneCount).toBe(3);

    const created = await callRoute(teamStudiesRoute.POST, {
      path: `/api/teams/${teamId}/studies`,
      params: { teamId },
      cookie,
      body: { title: "Plant room louvre", description: "Chiller noise through the louvre", siteReference: "FH-2026-020" },
    });
    expect(created.status).toBe(201);

    const detail = await callRoute(studyRoute.GET, { path: `/api/studies/${demo!.id}`, params: { studyId: demo!.id }, cookie });
    const body = (await detail.json()) as { scenes: { name: string; isReference: boolean }[] };
    expect(body.scenes.map((s) => s.isReference)).toEqual([true, false, false]);
  });

  it("answers 400 naming the field when a study has no title", async () => {
    const engineer = demoMembers.find((m) => m.role === "owner")!;
    const cookie = await signInAs(engineer.email, demoPassword);
    const teamId = await activeTeamOf(cookie);
    const response = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie, body: { title: "  " } });
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ error: { code: "bad_request:study", issues: [{ path: "title" }] } });
    const notJson = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie, rawBody: "{title:" });
    expect(notJson.status).toBe(400);
  });

  it("hides another team's study (404) and refuses a viewer's create (403)", async () => {
    const outsider = await signInAs("aroha@example.org", "long-enough-password");
    const engineerCookie = await signInAs(demoMembers[0]!.email, demoPassword);
    const demoTeamId = await activeTeamOf(engineerCookie);
    const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${demoTeamId}/studies`, params: { teamId: demoTeamId }, cookie: engineerCookie });
    const studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;

    const hidden = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie: outsider });
    expect(hidden.status).toBe(404);
    const otherTeamList = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${demoTeamId}/studies`, params: { teamId: demoTeamId }, cookie: outsider });
    expect(otherTeamList.status).toBe(404);

    const viewer = demoMembers.find((m) => m.role === "viewer")!;
    const viewerCookie = await signInAs(viewer.email, demoPassword);
    const refused = await callRoute(teamStudiesRoute.POST, {
      path: `/api/teams/${demoTeamId}/studies`,
      params: { teamId: demoTeamId },
      cookie: viewerCookie,
      body: { title: "Viewer's attempt" },
    });
    expect(refused.status).toBe(403);
    expect(await refused.json()).toMatchObject({ error: { code: "forbidden:team" } });
  });

  it("seeding twice adds nothing", async () => {
    const { seedDemo } = await import("@/db/seed/demo");
    expect(await seedDemo()).toBe(false);
  });
});
