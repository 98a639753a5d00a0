import { describe, expect, it } from "vitest";
import {
  countOwners,
  decideRemoval,
  decideRoleChange,
  defaultInvitationDays,
  invitationDays,
  invitationExpiry,
  invitationState,
  invitationUnavailableMessage,
  sameEmail,
  type MemberRole,
} from "@/lib/collaboration/membership-rules";

const ines: MemberRole = { userId: "ines", role: "owner" };
const tomas: MemberRole = { userId: "tomas", role: "editor" };
const priya: MemberRole = { userId: "priya", role: "reviewer" };
const team = [ines, tomas, priya];
const twoOwners = [ines, { userId: "tomas", role: "owner" } as MemberRole, priya];

describe("role changes", () => {
  it("an owner changes an editor to a reviewer", () => {
    expect(decideRoleChange({ members: team, callerRole: "owner", targetUserId: "tomas", newRole: "reviewer" })).toEqual({ ok: true });
  });

  it("refuses to demote the team's only owner, even by themselves", () => {
    const decision = decideRoleChange({ members: team, callerRole: "owner", targetUserId: "ines", newRole: "editor" });
    expect(decision).toMatchObject({ ok: false, refusal: "last_owner" });
  });

  it("lets one of two owners step down", () => {
    expect(decideRoleChange({ members: twoOwners, callerRole: "owner", targetUserId: "ines", newRole: "viewer" })).toEqual({ ok: true });
  });

  it("keeping the last owner an owner is no change and is allowed", () => {
    expect(decideRoleChange({ members: team, callerRole: "owner", targetUserId: "ines", newRole: "owner" })).toEqual({ ok: true });
  });

  it("only owners change roles", () => {
    for (const role of ["editor", "reviewer", "viewer", null] as const) {
      expect(decideRoleChange({ members: team, callerRole: role, targetUserId: "priya", newRole: "viewer" })).toMatchObject({ ok: false, refusal: "not_allowed" });
    }
  });

  it("refuses a role change for someone who is not on the team", () => {
    expect(decideRoleChange({ members: team, callerRole: "owner", targetUserId: "stranger", newRole: "viewer" })).toMatchObject({ ok: false, refusal: "not_member" });
  });
});

describe("removals and leaving", () => {
  it("an owner removes an editor", () => {
    expect(decideRemoval({ members: team, callerUserId: "ines", callerRole: "owner", targetUserId: "tomas" })).toEqual({ ok: true });
  });

  it("a reviewer leaves on their own", () => {
    expect(decideRemoval({ members: team, callerUserId: "priya", callerRole: "reviewer", targetUserId: "priya" })).toEqual({ ok: true });
  });

  it("an editor cannot remove someone else", () => {
    expect(decideRemoval({ members: team, callerUserId: "tomas", callerRole: "editor", targetUserId: "priya" })).toMatchObject({ ok: false, refusal: "not_allowed" });
  });

  it("the only owner can neither leave nor be removed", () => {
    const leave = decideRemoval({ members: team, callerUserId: "ines", callerRole: "owner", targetUserId: "ines" });
    expect(leave).toMatchObject({ ok: false, refusal: "last_owner" });
    expect(leave.ok ? "" : leave.message).toMatch(/only owner/);
  });

  it("one of two owners may leave or remove the other", () => {
    expect(decideRemoval({ members: twoOwners, callerUserId: "ines", callerRole: "owner", targetUserId: "ines" })).toEqual({ ok: true });
    expect(decideRemoval({ members: twoOwners, callerUserId: "ines", callerRole: "owner", targetUserId: "tomas" })).toEqual({ ok: true });
  });

  it("refuses to remove someone who is not on the team", () => {
    expect(decideRemoval({ members: team, callerUserId: "ines", callerRole: "owner", targetUserId: "stranger" })).toMatchObject({ ok: false, refusal: "not_member" });
  });

  it("counts owners", () => {
    expect(countOwners(team)).toBe(1);
    expect(countOwners(twoOwners)).toBe(2);
    expect(countOwners([])).toBe(0);
  });
});

describe("invitation states", () => {
  const now = new Date("2026-05-01T12:00:00Z");
  const later = new Date("2026-05-02T12:00:00Z");
  const earlier = new Date("2026-04-30T12:00:00Z");

  it("a pending invitation before its expiry is pending, after it expired", () => {
    expect(invitationState({ status: "pending", expiresAt: later }, now)).toBe("pending");
    expect(invitationState({ status: "pending", expiresAt: earlier }, now)).toBe("expired");
    expect(invitationState({ status: "pending", expiresAt: now }, now)).toBe("expired");
  });

  it("accepted and withdrawn invitations keep their state whatever the clock says", () => {
    expect(invitationState({ status: "accepted", expiresAt: earlier }, now)).toBe("accepted");
    expect(invitationState({ status: "revoked", expiresAt: later }, now)).toBe("revoked");
  });

  it("reads any other stored status (from the auth plugin) as withdrawn", () => {
    expect(invitationState({ status: "rejected", expiresAt: later }, now)).toBe("revoked");
    expect(invitationState({ status: "canceled", expiresAt: later }, now)).toBe("revoked");
  });

  it("explains each unusable state differently", () => {
    const messages = new Set((["expired", "accepted", "revoked"] as const).map(invitationUnavailableMessage));
    expect(messages.size).toBe(3);
    expect(invitationUnavailableMessage("expired")).toMatch(/expired/);
  });
});

describe("invitation expiry", () => {
  it("is 7 days unless RAREFACT_INVITATION_DAYS says otherwise", () => {
    expect(defaultInvitationDays).toBe(7);
    expect(invitationDays(undefined)).toBe(7);
    expect(invitationDays("3")).toBe(3);
    expect(invitationDays(" 14 ")).toBe(14);
  });

  it("ignores values that are not a whole number of days from 1 to 90", () => {
    for (const value of ["", "0", "-2", "1.5", "abc", "91", "1e3"]) expect(invitationDays(value)).toBe(7);
  });

  it("adds whole days to the clock", () => {
    expect(invitationExpiry(new Date("2026-05-01T12:00:00Z"), 7).toISOString()).toBe("2026-05-08T12:00:00.000Z");
  });
});

describe("e-mail comparison", () => {
  it("ignores case and surrounding spaces", () => {
    expect(sameEmail("Owen.Marsh@Example.org ", "owen.marsh@example.org")).toBe(true);
    expect(sameEmail("owen@example.org", "owen@example.com")).toBe(false);
  });
});
