import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as acceptRoute from "@/app/api/invitations/[token]/accept/route";
import * as invitationLinkRoute from "@/app/api/invitations/[token]/route";
import * as meRoute from "@/app/api/me/route";
import * as revokeRoute from "@/app/api/teams/[teamId]/invitations/[invitationId]/route";
import * as invitationsRoute from "@/app/api/teams/[teamId]/invitations/route";
import * as mailRoute from "@/app/api/teams/[teamId]/mail/route";
import * as memberRoute from "@/app/api/teams/[teamId]/members/[memberId]/route";
import * as membersRoute from "@/app/api/teams/[teamId]/members/route";
import { closeDb } from "@/db/client";
import { createInvitation } from "@/db/queries/invitations";
import { addMembership } from "@/db/queries/teams";
import { demoMembers, demoPassword } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import type { MeResponse } from "@/lib/http/api-types";
import { callRoute, cookieFrom, signInAs, signUp } from "../helpers/api";

// Every team route of issue #7 (members, invitations, kept e-mail, invitation links), called by
// every demo role, by someone outside the team and by nobody. Each call that changes something
// gets a target of its own, so the rows do not depend on one another.

type Caller = TeamRole | "outsider" | "nobody";
let teamId = "";
let ownerId = "";
let created = 0;
const cookies = new Map<Exclude<Caller, "nobody">, string>();

async function newUser(label: string): Promise<{ userId: string; email: string; cookie: string }> {
  created += 1;
  const email = `${label}.${created}@example.org`;
  const response = await signUp({ name: `Person ${created}`, email, password: "a-long-enough-password" });
  const cookie = cookieFrom(response);
  const me = (await (await callRoute(meRoute.GET, { path: "/api/me", cookie })).json()) as MeResponse;
  return { userId: me.user.id, email, cookie };
}

/** Someone on the demo team for a call to act on. */
async function newTeamMember(role: TeamRole = "viewer"): Promise<{ userId: string; cookie: string }> {
  const user = await newUser("member");
  await addMembership({ teamId, userId: user.userId, role });
  return user;
}

async function newInvitation(): Promise<{ id: string; token: string }> {
  created += 1;
  const { invitation, token } = await createInvitation({
    teamId,
    email: `invitee.${created}@example.org`,
    role: "viewer",
    inviterId: ownerId,
    expiresAt: new Date(Date.now() + 86_400_000),
  });
  return { id: invitation.id, token };
}

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", (await newUser("outsider")).cookie);
  const me = (await (await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get("owner")! })).json()) as MeResponse;
  teamId = me.activeTeamId!;
  ownerId = me.user.id;
});
afterAll(async () => {
  await closeDb();
});

interface Expected {
  listMembers: number;
  changeRole: number;
  removeMember: number;
  leave: number;
  listInvitations: number;
  invite: number;
  revoke: number;
  readMail: number;
  describeLink: number;
  acceptOthersLink: number;
}

const member = { listMembers: 200, changeRole: 403, removeMember: 403, leave: 200, listInvitations: 403, invite: 403, revoke: 403, readMail: 403, describeLink: 200, acceptOthersLink: 403 };
const expectations: Record<Caller, Expected> = {
  owner: { listMembers: 200, changeRole: 200, removeMember: 200, leave: 200, listInvitations: 200, invite: 201, revoke: 200, readMail: 200, describeLink: 200, acceptOthersLink: 403 },
  editor: member,
  reviewer: member,
  viewer: member,
  outsider: { listMembers: 404, changeRole: 404, removeMember: 404, leave: 404, listInvitations: 404, invite: 404, revoke: 404, readMail: 404, describeLink: 200, acceptOthersLink: 403 },
  nobody: { listMembers: 401, changeRole: 401, removeMember: 401, leave: 401, listInvitations: 401, invite: 401, revoke: 401, readMail: 401, describeLink: 200, acceptOthersLink: 401 },
};

async function callEveryRoute(caller: Caller): Promise<Expected> {
  const cookie = caller === "nobody" ? undefined : cookies.get(caller);
  const base = `/api/teams/${teamId}`;
  const target = await newTeamMember();
  const removable = await newTeamMember();
  const invitation = await newInvitation();
  const linkToDescribe = await newInvitation();
  const linkToAccept = await newInvitation();

  // Leaving: a member of the caller's role (a second owner for "owner") leaves on their own;
  // an outsider "leaves" a team they are not on; nobody has no session.
  let leaveCookie = cookie;
  let leaveId = "00000000-0000-4000-8000-000000000000";
  if (caller === "outsider") {
    leaveId = ((await (await callRoute(meRoute.GET, { path: "/api/me", cookie })).json()) as MeResponse).user.id;
  } else if (caller !== "nobody") {
    const leaver = await newTeamMember(caller);
    leaveCookie = leaver.cookie;
    leaveId = leaver.userId;
  }

  const statuses = {
    listMembers: (await callRoute(membersRoute.GET, { path: `${base}/members`, params: { teamId }, cookie })).status,
    changeRole: (
      await callRoute(memberRoute.PATCH, { method: "PATCH", path: `${base}/members/${target.userId}`, params: { teamId, memberId: target.userId }, cookie, body: { role: "reviewer" } })
    ).status,
    removeMember: (await callRoute(memberRoute.DELETE, { method: "DELETE", path: `${base}/members/${removable.userId}`, params: { teamId, memberId: removable.userId }, cookie })).status,
    leave: (await callRoute(memberRoute.DELETE, { method: "DELETE", path: `${base}/members/${leaveId}`, params: { teamId, memberId: leaveId }, cookie: leaveCookie })).status,
    listInvitations: (await callRoute(invitationsRoute.GET, { path: `${base}/invitations`, params: { teamId }, cookie })).status,
    invite: (await callRoute(invitationsRoute.POST, { path: `${base}/invitations`, params: { teamId }, cookie, body: { email: `by-${caller}@example.org`, role: "viewer" } })).status,
    revoke: (
      await callRoute(revokeRoute.DELETE, { method: "DELETE", path: `${base}/invitations/${invitation.id}`, params: { teamId, invitationId: invitation.id }, cookie })
    ).status,
    readMail: (await callRoute(mailRoute.GET, { path: `${base}/mail`, params: { teamId }, cookie })).status,
    describeLink: (await callRoute(invitationLinkRoute.GET, { path: `/api/invitations/${linkToDescribe.token}`, params: { token: linkToDescribe.token }, cookie })).status,
    acceptOthersLink: (
      await callRoute(acceptRoute.POST, { method: "POST", path: `/api/invitations/${linkToAccept.token}/accept`, params: { token: linkToAccept.token }, cookie })
    ).status,
  };
  return statuses;
}

describe("team routes enforce the role matrix", () => {
  for (const caller of Object.keys(expectations) as Caller[]) {
    it(`answers ${caller} as the matrix says`, async () => {
      expect(await callEveryRoute(caller)).toEqual(expectations[caller]);
    });
  }

  it("answers JSON with 400 for ids that are not ids", async () => {
    const cookie = cookies.get("owner");
    const responses = [
      await callRoute(membersRoute.GET, { path: "/api/teams/x/members", params: { teamId: "x" }, cookie }),
      await callRoute(memberRoute.PATCH, { method: "PATCH", path: `/api/teams/${teamId}/members/x`, params: { teamId, memberId: "x" }, cookie, body: { role: "viewer" } }),
      await callRoute(revokeRoute.DELETE, { method: "DELETE", path: `/api/teams/${teamId}/invitations/x`, params: { teamId, invitationId: "x" }, cookie }),
      await callRoute(mailRoute.GET, { path: "/api/teams/x/mail", params: { teamId: "x" }, cookie }),
    ];
    for (const response of responses) {
      expect(response.status).toBe(400);
      expect(response.headers.get("content-type")).toContain("application/json");
    }
  });
});
