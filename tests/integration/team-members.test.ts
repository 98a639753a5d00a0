import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import * as meRoute from "@/app/api/me/route";
import * as memberRoute from "@/app/api/teams/[teamId]/members/[memberId]/route";
import * as membersRoute from "@/app/api/teams/[teamId]/members/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb, getDb } from "@/db/client";
import { addMembership } from "@/db/queries/teams";
import { activity } from "@/db/schema";
import { demoMembers, demoPassword } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import type { MeResponse } from "@/lib/http/api-types";
import type { TeamMembersResponse } from "@/lib/http/team-types";
import { callRoute, cookieFrom, signInAs, signUp } from "../helpers/api";

// Changing roles, removing members and leaving, with the one rule that matters most: a team
// always keeps an owner.

let teamId = "";
let ownerId = "";
let ownerCookie = "";
let created = 0;

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  ownerCookie = await signInAs(demoMembers[0]!.email, demoPassword);
  const me = (await (await callRoute(meRoute.GET, { path: "/api/me", cookie: ownerCookie })).json()) as MeResponse;
  teamId = me.activeTeamId!;
  ownerId = me.user.id;
});
afterAll(async () => {
  await closeDb();
});

async function newTeamMember(role: TeamRole): Promise<{ userId: string; cookie: string; name: string }> {
  created += 1;
  const name = `Member ${created}`;
  const cookie = cookieFrom(await signUp({ name, email: `member.${created}@example.org`, password: "a-long-enough-password" }));
  const me = (await (await callRoute(meRoute.GET, { path: "/api/me", cookie })).json()) as MeResponse;
  await addMembership({ teamId, userId: me.user.id, role });
  return { userId: me.user.id, cookie, name };
}

function changeRole(memberId: string, role: string, cookie = ownerCookie) {
  return callRoute(memberRoute.PATCH, { method: "PATCH", path: `/api/teams/${teamId}/members/${memberId}`, params: { teamId, memberId }, cookie, body: { role } });
}

function remove(memberId: string, cookie = ownerCookie) {
  return callRoute(memberRoute.DELETE, { method: "DELETE", path: `/api/teams/${teamId}/members/${memberId}`, params: { teamId, memberId }, cookie });
}

async function members(): Promise<TeamMembersResponse> {
  return (await (await callRoute(membersRoute.GET, { path: `/api/teams/${teamId}/members`, params: { teamId }, cookie: ownerCookie })).json()) as TeamMembersResponse;
}

async function actionsAbout(subjectId: string): Promise<{ action: string; detail: unknown }[]> {
  const db = await getDb();
  return db.select({ action: activity.action, detail: activity.detail }).from(activity).where(and(eq(activity.teamId, teamId), eq(activity.subjectId, subjectId)));
}

async function message(response: Response): Promise<string> {
  return ((await response.json()) as { error: { message: string } }).error.message;
}

describe("the member list", () => {
  it("names the team and gives each member's e-mail, role and joining date", async () => {
    const list = await members();
    expect(list.team.name).toBe("Fernhill Acoustics (demo)");
    const ines = list.members.find((m) => m.userId === ownerId);
    expect(ines).toMatchObject({ email: demoMembers[0]!.email, role: "owner", name: demoMembers[0]!.name });
    expect(Number.isNaN(Date.parse(ines!.joinedAt))).toBe(false);
    expect(ines!.membershipId).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe("roles", () => {
  it("an owner changes a role; the change is recorded", async () => {
    const person = await newTeamMember("viewer");
    const response = await changeRole(person.userId, "editor");
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ member: { userId: person.userId, role: "editor" } });
    expect((await members()).members.find((m) => m.userId === person.userId)?.role).toBe("editor");
    expect(await actionsAbout(person.userId)).toEqual([{ action: "member.role_changed", detail: expect.objectContaining({ fromRole: "viewer", toRole: "editor", memberName: person.name }) }]);
    // The new role takes effect at once: an editor may create studies.
    const study = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: person.cookie, body: { title: "Plant room louvre" } });
    expect(study.status).toBe(201);
  });

  it("refuses (409) to demote the team's only owner, with a reason", async () => {
    const response = await changeRole(ownerId, "editor");
    expect(response.status).toBe(409);
    expect(await message(response)).toMatch(/only owner/);
    expect((await members()).members.find((m) => m.userId === ownerId)?.role).toBe("owner");
  });

  it("lets an owner step down once there is a second owner", async () => {
    const second = await newTeamMember("owner");
    expect((await changeRole(second.userId, "reviewer", second.cookie)).status).toBe(200);
    expect((await changeRole(second.userId, "owner")).status).toBe(200);
    expect((await changeRole(ownerId, "editor", second.cookie)).status).toBe(200);
    // Now `second` is the only owner.
    expect((await changeRole(second.userId, "viewer", second.cookie)).status).toBe(409);
    expect((await changeRole(ownerId, "owner", second.cookie)).status).toBe(200);
    // Back to one owner for the tests that follow.
    expect((await changeRole(second.userId, "viewer")).status).toBe(200);
  });

  it("answers 400 for an unknown role and 404 for someone not on the team", async () => {
    const person = await newTeamMember("viewer");
    const bad = await changeRole(person.userId, "chief");
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("role");
    expect((await changeRole("00000000-0000-4000-8000-000000000000", "viewer")).status).toBe(404);
  });
});

describe("removing and leaving", () => {
  it("an owner removes a member, who then no longer sees the team", async () => {
    const person = await newTeamMember("editor");
    const response = await remove(person.userId);
    expect(response.status).toBe(200);
    expect((await members()).members.some((m) => m.userId === person.userId)).toBe(false);
    expect((await callRoute(membersRoute.GET, { path: `/api/teams/${teamId}/members`, params: { teamId }, cookie: person.cookie })).status).toBe(404);
    expect((await actionsAbout(person.userId)).map((a) => a.action)).toEqual(["member.removed"]);
  });

  it("a member leaves on their own", async () => {
    const person = await newTeamMember("reviewer");
    expect((await remove(person.userId, person.cookie)).status).toBe(200);
    const [entry] = await actionsAbout(person.userId);
    expect(entry).toMatchObject({ action: "member.removed", detail: expect.objectContaining({ left: true }) });
  });

  it("a member cannot remove someone else (403)", async () => {
    const editor = await newTeamMember("editor");
    const other = await newTeamMember("viewer");
    expect((await remove(other.userId, editor.cookie)).status).toBe(403);
    expect((await members()).members.some((m) => m.userId === other.userId)).toBe(true);
  });

  it("the only owner can neither leave nor be removed (409)", async () => {
    const leave = await remove(ownerId);
    expect(leave.status).toBe(409);
    expect(await message(leave)).toMatch(/only owner/);
    expect((await members()).members.some((m) => m.userId === ownerId)).toBe(true);
  });

  it("one of two owners may leave", async () => {
    const second = await newTeamMember("owner");
    expect((await remove(second.userId, second.cookie)).status).toBe(200);
    expect((await remove(ownerId)).status).toBe(409);
  });

  it("answers 404 for removing someone who is not on the team", async () => {
    expect((await remove("00000000-0000-4000-8000-000000000000")).status).toBe(404);
  });
});
