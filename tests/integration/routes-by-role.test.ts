import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as membersRoute from "@/app/api/teams/[teamId]/members/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { demoMembers, demoPassword } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import { callRoute, signInAs, signUp, cookieFrom } from "../helpers/api";

// Every route of this issue, called by every demo role, by an outsider and by nobody.
let teamId = "";
let studyId = "";
const cookies = new Map<TeamRole | "outsider", string>();

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Person", email: "outsider@example.org", password: "outsider-password" })));
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get("owner")! });
  teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner")! });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
});
afterAll(async () => {
  await closeDb();
});

const expectations: { caller: TeamRole | "outsider" | "nobody"; listStudies: number; createStudy: number; readStudy: number; listMembers: number }[] = [
  { caller: "owner", listStudies: 200, createStudy: 201, readStudy: 200, listMembers: 200 },
  { caller: "editor", listStudies: 200, createStudy: 201, readStudy: 200, listMembers: 200 },
  { caller: "reviewer", listStudies: 200, createStudy: 403, readStudy: 200, listMembers: 200 },
  { caller: "viewer", listStudies: 200, createStudy: 403, readStudy: 200, listMembers: 200 },
  { caller: "outsider", listStudies: 404, createStudy: 404, readStudy: 404, listMembers: 404 },
  { caller: "nobody", listStudies: 401, createStudy: 401, readStudy: 401, listMembers: 401 },
];

describe("route handlers enforce the role matrix", () => {
  for (const row of expectations) {
    it(`answers ${row.caller}: list ${row.listStudies}, create ${row.createStudy}, read ${row.readStudy}, members ${row.listMembers}`, async () => {
      const cookie = row.caller === "nobody" ? undefined : cookies.get(row.caller);
      const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie });
      const create = await callRoute(teamStudiesRoute.POST, {
        path: `/api/teams/${teamId}/studies`,
        params: { teamId },
        cookie,
        body: { title: `Study by ${row.caller}`, siteReference: "X-1" },
      });
      const read = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie });
      const members = await callRoute(membersRoute.GET, { path: `/api/teams/${teamId}/members`, params: { teamId }, cookie });
      expect([list.status, create.status, read.status, members.status]).toEqual([row.listStudies, row.createStudy, row.readStudy, row.listMembers]);
      for (const response of [list, create, read, members]) expect(response.headers.get("content-type")).toContain("application/json");
    });
  }

  it("answers 400 for an id that is not an id, before looking anything up", async () => {
    const response = await callRoute(studyRoute.GET, { path: "/api/studies/not-an-id", params: { studyId: "not-an-id" }, cookie: cookies.get("owner") });
    expect(response.status).toBe(400);
  });

  it("answers 400 naming each bad field of a study", async () => {
    const response = await callRoute(teamStudiesRoute.POST, {
      path: `/api/teams/${teamId}/studies`,
      params: { teamId },
      cookie: cookies.get("owner"),
      body: { title: "x".repeat(200), siteReference: "<script>" },
    });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((issue) => issue.path).sort()).toEqual(["siteReference", "title"]);
  });

  it("refuses a body over the size limit with 413", async () => {
    const response = await callRoute(teamStudiesRoute.POST, {
      path: `/api/teams/${teamId}/studies`,
      params: { teamId },
      cookie: cookies.get("owner"),
      body: { title: "Big", description: "x".repeat(300 * 1024) },
    });
    expect(response.status).toBe(413);
  });
});
