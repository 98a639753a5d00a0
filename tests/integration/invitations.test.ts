import "../helpers/test-database";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import * as authRoute from "@/app/api/auth/[...all]/route";
import * as acceptRoute from "@/app/api/invitations/[token]/accept/route";
import * as invitationLinkRoute from "@/app/api/invitations/[token]/route";
import * as meRoute from "@/app/api/me/route";
import * as revokeRoute from "@/app/api/teams/[teamId]/invitations/[invitationId]/route";
import * as invitationsRoute from "@/app/api/teams/[teamId]/invitations/route";
import * as mailRoute from "@/app/api/teams/[teamId]/mail/route";
import { closeDb, getDb } from "@/db/client";
import { listMailMessagesByTeamId } from "@/db/queries/mail";
import { activity, invitation, membership } from "@/db/schema";
import { demoMembers, demoPassword } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import type { MeResponse } from "@/lib/http/api-types";
import type { CreatedInvitationResponse, InvitationDescriptionResponse, TeamInvitationsResponse, TeamMailResponse } from "@/lib/http/team-types";
import { callRoute, cookieFrom, signInAs, signUp, testOrigin } from "../helpers/api";

// Invitations end to end through the route handlers: the e-mail (kept, with its link), the link's
// description, accepting once, and every way a link can stop working.

let teamId = "";
let ownerCookie = "";
let accountCount = 0;

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  ownerCookie = await signInAs(demoMembers[0]!.email, demoPassword);
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: ownerCookie });
  teamId = ((await me.json()) as MeResponse).activeTeamId!;
});
afterAll(async () => {
  await closeDb();
});
afterEach(() => {
  delete process.env.RAREFACT_SMTP_URL;
});

function uniqueAddress(name: string): string {
  accountCount += 1;
  return `${name}.${accountCount}@example.org`;
}

async function newAccount(email: string): Promise<string> {
  const response = await signUp({ name: "Ada Newcomer", email, password: "a-long-enough-password" });
  expect(response.status).toBe(200);
  return cookieFrom(response);
}

async function invite(email: string, role = "editor", cookie = ownerCookie): Promise<Response> {
  return callRoute(invitationsRoute.POST, { path: `/api/teams/${teamId}/invitations`, params: { teamId }, cookie, body: { email, role } });
}

/** The link's secret, as the invitee reads it in the kept e-mail (it is nowhere else). */
async function tokenFromMailbox(address: string): Promise<string> {
  const messages = await listMailMessagesByTeamId({ teamId });
  const message = messages.find((m) => m.toAddress === address && m.kind === "invitation");
  expect(message, `an invitation e-mail to ${address}`).toBeDefined();
  const match = /\/invitations\/([A-Za-z0-9_-]{43})/.exec(message!.textBody);
  expect(match, "a link in the e-mail").not.toBeNull();
  return match![1]!;
}

async function inviteAndReadToken(email: string, role = "editor"): Promise<{ token: string; invitationId: string }> {
  const response = await invite(email, role);
  expect(response.status).toBe(201);
  const body = (await response.json()) as CreatedInvitationResponse;
  return { token: await tokenFromMailbox(email), invitationId: body.invitation.id };
}

function describeLink(token: string, cookie?: string) {
  return callRoute(invitationLinkRoute.GET, { path: `/api/invitations/${token}`, params: { token }, cookie });
}

function accept(token: string, cookie?: string) {
  return callRoute(acceptRoute.POST, { method: "POST", path: `/api/invitations/${token}/accept`, params: { token }, cookie });
}

async function me(cookie: string): Promise<MeResponse> {
  return (await (await callRoute(meRoute.GET, { path: "/api/me", cookie })).json()) as MeResponse;
}

async function activityActions(subjectId: string): Promise<string[]> {
  const db = await getDb();
  const rows = await db.select({ action: activity.action }).from(activity).where(and(eq(activity.teamId, teamId), eq(activity.subjectId, subjectId)));
  return rows.map((row) => row.action);
}

describe("making an invitation", () => {
  it("keeps the e-mail with a working link, and answers without the link", async () => {
    const email = uniqueAddress("kept");
    const response = await invite(email, "reviewer");
    expect(response.status).toBe(201);
    const text = await response.text();
    const body = JSON.parse(text) as CreatedInvitationResponse;
    expect(body.invitation).toMatchObject({ email, role: "reviewer", state: "pending", inviterName: demoMembers[0]!.name });
    expect(body.mail.status).toBe("kept");

    const token = await tokenFromMailbox(email);
    expect(text).not.toContain(token);
    const [message] = (await listMailMessagesByTeamId({ teamId })).filter((m) => m.toAddress === email);
    expect(message!.textBody).toContain(`${testOrigin}/invitations/${token}`);
    expect(message!.subject).toContain("Fernhill Acoustics");
    expect(message!.status).toBe("kept");

    // Only the hash is stored.
    const db = await getDb();
    const [row] = await db.select().from(invitation).where(eq(invitation.id, body.invitation.id));
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(token);
    expect(await activityActions(body.invitation.id)).toEqual(["member.invited"]);
  });

  it("expires after 7 days, or after RAREFACT_INVITATION_DAYS", async () => {
    const before = Date.now();
    const week = (await (await invite(uniqueAddress("week"))).json()) as CreatedInvitationResponse;
    expect(new Date(week.invitation.expiresAt).getTime() - before).toBeGreaterThanOrEqual(7 * 86_400_000 - 1000);
    expect(new Date(week.invitation.expiresAt).getTime() - before).toBeLessThan(7 * 86_400_000 + 60_000);
    process.env.RAREFACT_INVITATION_DAYS = "2";
    try {
      const short = (await (await invite(uniqueAddress("short"))).json()) as CreatedInvitationResponse;
      expect(new Date(short.invitation.expiresAt).getTime() - before).toBeLessThan(2 * 86_400_000 + 60_000);
    } finally {
      delete process.env.RAREFACT_INVITATION_DAYS;
    }
  });

  it("answers 409 for someone already on the team and for a second pending invitation, whatever the case", async () => {
    const member = await invite("Tomas@Fernhill.test");
    expect(member.status).toBe(409);
    expect(((await member.json()) as { error: { message: string } }).error.message).toMatch(/already on this team/);

    const email = uniqueAddress("twice");
    expect((await invite(email)).status).toBe(201);
    const again = await invite(email.toUpperCase(), "viewer");
    expect(again.status).toBe(409);
    const body = (await again.json()) as { error: { message: string; issues: { path: string }[] } };
    expect(body.error.message).toMatch(/pending invitation/);
    expect(body.error.issues[0]!.path).toBe("email");
  });

  it("answers 400 naming the field for a bad address or role", async () => {
    const response = await callRoute(invitationsRoute.POST, { path: `/api/teams/${teamId}/invitations`, params: { teamId }, cookie: ownerCookie, body: { email: "not-an-address", role: "boss" } });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((issue) => issue.path).sort()).toEqual(["email", "role"]);
  });

  it("keeps the invitation when the e-mail cannot be sent, and records the failure", async () => {
    process.env.RAREFACT_SMTP_URL = "smtp://127.0.0.1:9";
    const email = uniqueAddress("unsent");
    const response = await invite(email, "viewer");
    expect(response.status).toBe(201);
    const body = (await response.json()) as CreatedInvitationResponse;
    expect(body.mail.status).toBe("failed");
    expect(body.mail.error).toBeTruthy();

    const list = (await (await callRoute(invitationsRoute.GET, { path: `/api/teams/${teamId}/invitations`, params: { teamId }, cookie: ownerCookie })).json()) as TeamInvitationsResponse;
    expect(list.invitations.find((item) => item.email === email)?.state).toBe("pending");

    const mailbox = (await (await callRoute(mailRoute.GET, { path: `/api/teams/${teamId}/mail`, params: { teamId }, cookie: ownerCookie })).json()) as TeamMailResponse;
    expect(mailbox.mode).toBe("smtp");
    const message = mailbox.messages.find((m) => m.toAddress === email);
    expect(message).toMatchObject({ kind: "invitation", status: "failed" });
    expect(message!.error).not.toBe("");
    expect(message!.textBody).toMatch(/\/invitations\/[A-Za-z0-9_-]{43}/);

    // The kept link still works once SMTP is fixed or the owner reads the mailbox.
    delete process.env.RAREFACT_SMTP_URL;
    const token = await tokenFromMailbox(email);
    const joined = await accept(token, await newAccount(email));
    expect(joined.status).toBe(200);
  });
});

describe("following a link", () => {
  it("describes the invitation to a signed-out visitor", async () => {
    const email = uniqueAddress("visitor");
    const { token } = await inviteAndReadToken(email, "reviewer");
    const response = await describeLink(token);
    expect(response.status).toBe(200);
    const { invitation: described } = (await response.json()) as InvitationDescriptionResponse;
    expect(described).toMatchObject({ teamId, teamName: "Fernhill Acoustics (demo)", inviterName: demoMembers[0]!.name, email, role: "reviewer", signedInEmail: null, emailMatches: false });
  });

  it("accepts for the invited address: member with the role, on the new team, able to switch back", async () => {
    const email = uniqueAddress("joiner");
    const { token, invitationId } = await inviteAndReadToken(email, "reviewer");
    // A different case of the same address is the same person.
    const cookie = await newAccount(email.toUpperCase());
    const personalTeamId = (await me(cookie)).activeTeamId!;
    expect(personalTeamId).not.toBe(teamId);

    const described = (await (await describeLink(token, cookie)).json()) as InvitationDescriptionResponse;
    expect(described.invitation).toMatchObject({ emailMatches: true, alreadyMember: false });

    const response = await accept(token, cookie);
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ teamId, role: "reviewer" });

    const after = await me(cookie);
    expect(after.activeTeamId).toBe(teamId);
    expect(after.memberships.find((m) => m.teamId === teamId)?.role).toBe("reviewer");

    // Switching teams goes through better-auth's set-active, which stays open.
    const switched = await authRoute.POST(
      new Request(`${testOrigin}/api/auth/organization/set-active`, {
        method: "POST",
        headers: { origin: testOrigin, cookie, "content-type": "application/json" },
        body: JSON.stringify({ organizationId: personalTeamId }),
      }),
    );
    expect(switched.status).toBe(200);
    expect((await me(cookie)).activeTeamId).toBe(personalTeamId);

    const list = (await (await callRoute(invitationsRoute.GET, { path: `/api/teams/${teamId}/invitations`, params: { teamId }, cookie: ownerCookie })).json()) as TeamInvitationsResponse;
    expect(list.invitations.find((item) => item.id === invitationId)).toMatchObject({ state: "accepted", acceptedByName: "Ada Newcomer" });
    expect(await activityActions(after.user.id)).toContain("member.joined");
  });

  it("works once: a second accept answers 409, and the link then answers 404", async () => {
    const email = uniqueAddress("once");
    const { token } = await inviteAndReadToken(email);
    const cookie = await newAccount(email);
    expect((await accept(token, cookie)).status).toBe(200);
    const second = await accept(token, cookie);
    expect(second.status).toBe(409);
    expect(((await second.json()) as { error: { message: string } }).error.message).toMatch(/already been used/);
    const described = await describeLink(token, cookie);
    expect(described.status).toBe(404);
    expect(((await described.json()) as { error: { message: string } }).error.message).toMatch(/already been used/);
  });

  it("works once even when two requests accept at the same moment", async () => {
    const email = uniqueAddress("race");
    const { token } = await inviteAndReadToken(email);
    const cookie = await newAccount(email);
    const statuses = (await Promise.all([accept(token, cookie), accept(token, cookie), accept(token, cookie)])).map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409]);
    const db = await getDb();
    const userId = (await me(cookie)).user.id;
    const rows = await db.select().from(membership).where(and(eq(membership.teamId, teamId), eq(membership.userId, userId)));
    expect(rows).toHaveLength(1);
  });

  it("refuses another account (403) and leaves the invitation for the right one", async () => {
    const email = uniqueAddress("rightful");
    const { token } = await inviteAndReadToken(email, "viewer");
    const stranger = await newAccount(uniqueAddress("someone-else"));
    const described = (await (await describeLink(token, stranger)).json()) as InvitationDescriptionResponse;
    expect(described.invitation.emailMatches).toBe(false);
    const refused = await accept(token, stranger);
    expect(refused.status).toBe(403);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toContain(email);
    // A demo member of the team is just as wrong an account.
    expect((await accept(token, ownerCookie)).status).toBe(403);
    expect((await accept(token, await newAccount(email))).status).toBe(200);
  });

  it("asks for a session before accepting (401)", async () => {
    const { token } = await inviteAndReadToken(uniqueAddress("anonymous"));
    expect((await accept(token)).status).toBe(401);
  });

  it("answers 410 once the invitation has expired, and lets the owner invite the address again", async () => {
    const email = uniqueAddress("late");
    const { token, invitationId } = await inviteAndReadToken(email);
    const db = await getDb();
    await db.update(invitation).set({ expiresAt: new Date(Date.now() - 60_000) }).where(eq(invitation.id, invitationId));

    const described = await describeLink(token);
    expect(described.status).toBe(410);
    expect(((await described.json()) as { error: { message: string } }).error.message).toMatch(/expired/);
    const refused = await accept(token, await newAccount(email));
    expect(refused.status).toBe(410);

    const list = (await (await callRoute(invitationsRoute.GET, { path: `/api/teams/${teamId}/invitations`, params: { teamId }, cookie: ownerCookie })).json()) as TeamInvitationsResponse;
    expect(list.invitations.find((item) => item.id === invitationId)?.state).toBe("expired");
    expect((await invite(email)).status).toBe(201);
  });

  it("stops working when withdrawn (404), and a second withdrawal answers 409", async () => {
    const email = uniqueAddress("withdrawn");
    const { token, invitationId } = await inviteAndReadToken(email);
    const revoke = () => callRoute(revokeRoute.DELETE, { method: "DELETE", path: `/api/teams/${teamId}/invitations/${invitationId}`, params: { teamId, invitationId }, cookie: ownerCookie });
    const first = await revoke();
    expect(first.status).toBe(200);
    expect(await first.json()).toMatchObject({ invitation: { id: invitationId, state: "revoked" } });
    expect((await revoke()).status).toBe(409);

    const described = await describeLink(token);
    expect(described.status).toBe(404);
    expect(((await described.json()) as { error: { message: string } }).error.message).toMatch(/withdrawn/);
    expect((await accept(token, await newAccount(email))).status).toBe(404);
    expect(await activityActions(invitationId)).toEqual(expect.arrayContaining(["member.invited", "invitation.revoked"]));
  });

  it("answers 404 for an unknown link and 400 for something that is not a link", async () => {
    const unknown = "A".repeat(43);
    expect((await describeLink(unknown)).status).toBe(404);
    expect((await accept(unknown, ownerCookie)).status).toBe(404);
    expect((await describeLink("short")).status).toBe(400);
  });
});

describe("better-auth's own team endpoints", () => {
  async function callAuthPath(path: string, body: unknown): Promise<Response> {
    return authRoute.POST(
      new Request(`${testOrigin}/api/auth${path}`, { method: "POST", headers: { origin: testOrigin, cookie: ownerCookie, "content-type": "application/json" }, body: JSON.stringify(body) }),
    );
  }

  it("are closed where they would bypass the team's rules", async () => {
    const paths = [
      "/organization/invite-member",
      "/organization/accept-invitation",
      "/organization/reject-invitation",
      "/organization/cancel-invitation",
      "/organization/update-member-role",
      "/organization/remove-member",
      "/organization/add-member",
      "/organization/create",
      "/organization/update",
      "/organization/delete",
      "/organization/leave",
      "/organization/list-invitations",
      "/organization/get-full-organization",
      "/Organization/Invite-Member",
      "/organization//invite-member",
      "/organization/invite%2Dmember",
    ];
    for (const path of paths) {
      const response = await callAuthPath(path, { email: "x@example.org", role: "owner", organizationId: teamId, memberIdOrEmail: demoMembers[1]!.email });
      expect(response.status, path).toBe(404);
    }
    const db = await getDb();
    const stray = await db.select().from(invitation).where(eq(invitation.email, "x@example.org"));
    expect(stray).toHaveLength(0);
  });

  it("still switch the active team and sign in", async () => {
    expect((await callAuthPath("/organization/set-active", { organizationId: teamId })).status).toBe(200);
    expect(await signInAs(demoMembers[1]!.email, demoPassword)).toContain("=");
  });
});
