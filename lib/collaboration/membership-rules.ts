// The rules of team membership and invitations, as pure functions: the queries apply them inside
// their transactions, the pages read them to hide what would be refused, and the unit tests pin them.
import type { TeamRole } from "@/lib/access/roles";

export interface MemberRole {
  userId: string;
  role: TeamRole;
}

/** Why a change of membership is refused; "last_owner" answers 409, "not_allowed" 403, "not_member" 404. */
export type MembershipRefusal = "last_owner" | "not_allowed" | "not_member";

export type MembershipDecision = { ok: true } | { ok: false; refusal: MembershipRefusal; message: string };

const allowed: MembershipDecision = { ok: true };

function refuse(refusal: MembershipRefusal, message: string): MembershipDecision {
  return { ok: false, refusal, message };
}

export function countOwners(members: readonly MemberRole[]): number {
  return members.filter((member) => member.role === "owner").length;
}

/** A team always keeps one owner: someone must be able to invite, change roles and read the mailbox. */
function isLastOwner(members: readonly MemberRole[], userId: string): boolean {
  const target = members.find((member) => member.userId === userId);
  return target?.role === "owner" && countOwners(members) === 1;
}

/** An owner changes anyone's role (their own too), as long as the team keeps an owner. */
export function decideRoleChange({
  members,
  callerRole,
  targetUserId,
  newRole,
}: {
  members: readonly MemberRole[];
  callerRole: TeamRole | null;
  targetUserId: string;
  newRole: TeamRole;
}): MembershipDecision {
  if (callerRole !== "owner") return refuse("not_allowed", "Only an owner of the team can change roles.");
  if (!members.some((member) => member.userId === targetUserId)) return refuse("not_member", "This person is not on the team.");
  if (newRole !== "owner" && isLastOwner(members, targetUserId)) {
    return refuse("last_owner", "This is the team's only owner. Make someone else an owner first, then change this role.");
  }
  return allowed;
}

/** An owner removes anyone; anyone may leave on their own; nobody removes the last owner. */
export function decideRemoval({
  members,
  callerUserId,
  callerRole,
  targetUserId,
}: {
  members: readonly MemberRole[];
  callerUserId: string;
  callerRole: TeamRole | null;
  targetUserId: string;
}): MembershipDecision {
  const leaving = callerUserId === targetUserId;
  if (!leaving && callerRole !== "owner") return refuse("not_allowed", "Only an owner of the team can remove members.");
  if (!members.some((member) => member.userId === targetUserId)) return refuse("not_member", "This person is not on the team.");
  if (isLastOwner(members, targetUserId)) {
    return refuse(
      "last_owner",
      leaving
        ? "You are the team's only owner. Make someone else an owner before you leave."
        : "This is the team's only owner. Make someone else an owner first.",
    );
  }
  return allowed;
}

// ---------------------------------------------------------------------------------------------
// Invitations
// ---------------------------------------------------------------------------------------------

/** Stored states; "expired" is never stored, it is a pending invitation past its expiry. */
export const storedInvitationStatuses = ["pending", "accepted", "revoked"] as const;
export type StoredInvitationStatus = (typeof storedInvitationStatuses)[number];
export type InvitationState = StoredInvitationStatus | "expired";

export function invitationState({ status, expiresAt }: { status: string; expiresAt: Date }, now: Date): InvitationState {
  if (status === "accepted" || status === "revoked") return status;
  // Anything else the plugin might have written ("rejected", "canceled") is as good as revoked.
  if (status !== "pending") return "revoked";
  return expiresAt.getTime() > now.getTime() ? "pending" : "expired";
}

export const defaultInvitationDays = 7;
const maximumInvitationDays = 90;

/** Days an invitation link stays valid: RAREFACT_INVITATION_DAYS when it is a whole number 1–90, else 7. */
export function invitationDays(configured: string | undefined): number {
  if (configured === undefined || !/^\s*\d+\s*$/.test(configured)) return defaultInvitationDays;
  const days = Number(configured);
  return days >= 1 && days <= maximumInvitationDays ? days : defaultInvitationDays;
}

export function invitationExpiry(now: Date, days: number): Date {
  return new Date(now.getTime() + days * 86_400_000);
}

/** E-mail addresses compare without case or surrounding spaces (Name@Example.org is name@example.org). */
export function normaliseEmail(address: string): string {
  return address.trim().toLowerCase();
}

export function sameEmail(a: string, b: string): boolean {
  return normaliseEmail(a) === normaliseEmail(b);
}

/** What the invitation page and the accept route say when a link no longer works. */
export function invitationUnavailableMessage(state: Exclude<InvitationState, "pending">): string {
  switch (state) {
    case "expired":
      return "This invitation has expired. Ask the team's owner to send a new one.";
    case "accepted":
      return "This invitation has already been used. If it was you, the team is in your team list.";
    case "revoked":
      return "This invitation was withdrawn by the team's owner.";
  }
}
