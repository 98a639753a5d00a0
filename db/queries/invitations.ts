// Invitations to a team. The table is better-auth's (its own invitation endpoints are closed in
// app/api/auth/[...all]/route.ts); Rarefact keeps only the SHA-256 of each link's secret, and
// accepting uses the row's status as a single-use latch inside the transaction that adds the member.
import "server-only";
import { alias } from "drizzle-orm/pg-core";
import { and, desc, eq, gt, sql, type SQL } from "drizzle-orm";
import { isTeamRole, type TeamRole } from "@/lib/access/roles";
import { invitationState, invitationUnavailableMessage, normaliseEmail, type InvitationState } from "@/lib/collaboration/membership-rules";
import { AppError } from "@/lib/http/app-error";
import type { TeamInvitationItem } from "@/lib/http/team-types";
import { getDb } from "../client";
import { invitation, membership, team, user } from "../schema";
import { hashSecret, newSecret } from "./secrets";
import { newId, withDatabaseErrors } from "./wrap";


const inviter = alias(user, "inviter");
const accepter = alias(user, "accepter");

const invitationColumns = {
  id: invitation.id,
  teamId: invitation.teamId,
  email: invitation.email,
  role: invitation.role,
  status: invitation.status,
  createdAt: invitation.createdAt,
  expiresAt: invitation.expiresAt,
  acceptedAt: invitation.acceptedAt,
  inviterName: inviter.name,
  acceptedByName: accepter.name,
};

type InvitationRow = {
  id: string;
  email: string;
  role: string | null;
  status: string;
  createdAt: Date;
  expiresAt: Date;
  acceptedAt: Date | null;
  inviterName: string | null;
  acceptedByName: string | null;
};

/** Invitations made by better-auth's plugin before Rarefact took over may lack a role: read them as viewer. */
function roleOf(value: string | null): TeamRole {
  return isTeamRole(value) ? value : "viewer";
}

function toInvitationItem(row: InvitationRow, now: Date): TeamInvitationItem {
  return {
    id: row.id,
    email: row.email,
    role: roleOf(row.role),
    state: invitationState(row, now),
    inviterName: row.inviterName,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    acceptedByName: row.acceptedByName,
  };
}

async function selectInvitationRows(where: SQL | undefined): Promise<InvitationRow[]> {
  const db = await getDb();
  return db
    .select(invitationColumns)
    .from(invitation)
    .leftJoin(inviter, eq(inviter.id, invitation.inviterId))
    .leftJoin(accepter, eq(accepter.id, invitation.acceptedBy))
    .where(where)
    .orderBy(desc(invitation.createdAt));
}

export async function listInvitationsByTeamId({ teamId, now = new Date() }: { teamId: string; now?: Date }): Promise<TeamInvitationItem[]> {
  return withDatabaseErrors("read the invitations", async () => {
    const rows = await selectInvitationRows(eq(invitation.teamId, teamId));
    return rows.map((row) => toInvitationItem(row, now));
  });
}

export async function getInvitationById({ teamId, id, now = new Date() }: { teamId: string; id: string; now?: Date }): Promise<TeamInvitationItem | null> {
  return withDatabaseErrors("read the invitation", async () => {
    const [row] = await selectInvitationRows(and(eq(invitation.teamId, teamId), eq(invitation.id, id)));
    return row ? toInvitationItem(row, now) : null;
  });
}

/**
 * Makes an invitation unless the address is on the team already or has a live one (409 either way).
 * The team's row is locked for the check, so two owners inviting the same address at once make one.
 */
export async function createInvitation({
  teamId,
  email,
  role,
  inviterId,
  expiresAt,
  now = new Date(),
}: {
  teamId: string;
  email: string;
  role: TeamRole;
  inviterId: string;
  expiresAt: Date;
  now?: Date;
}): Promise<{ invitation: TeamInvitationItem; token: string }> {
  const address = normaliseEmail(email);
  // The secret goes into the e-mail's link and nowhere else.
  const token = newSecret();
  const tokenHash = hashSecret(token);
  const id = await withDatabaseErrors("make the invitation", async () => {
    const db = await getDb();
    return db.transaction(async (tx) => {
      await tx.select({ id: team.id }).from(team).where(eq(team.id, teamId)).for("update");
      const [member] = await tx
        .select({ id: membership.id })
        .from(membership)
        .innerJoin(user, eq(user.id, membership.userId))
        .where(and(eq(membership.teamId, teamId), sql`lower(${user.email}) = ${address}`))
        .limit(1);
      if (member) throw new AppError("conflict:invitation", `${address} is already on this team.`, [{ path: "email", message: "Already on this team." }]);
      const [live] = await tx
        .select({ id: invitation.id })
        .from(invitation)
        .where(and(eq(invitation.teamId, teamId), sql`lower(${invitation.email}) = ${address}`, eq(invitation.status, "pending"), gt(invitation.expiresAt, now)))
        .limit(1);
      if (live) {
        throw new AppError("conflict:invitation", `${address} already has a pending invitation. Withdraw it first to send a new one.`, [
          { path: "email", message: "Already invited; the invitation is still pending." },
        ]);
      }
      const invitationId = newId();
      await tx.insert(invitation).values({ id: invitationId, teamId, email: address, role, status: "pending", expiresAt, createdAt: now, inviterId, tokenHash });
      return invitationId;
    });
  });
  const created = await getInvitationById({ teamId, id, now });
  if (!created) throw new AppError("internal:invitation", "The invitation was made but could not be read back.");
  return { invitation: created, token };
}

/** Withdraws a pending invitation (expired ones too, so they leave the list of open ones). */
export async function revokeInvitation({ teamId, id, now = new Date() }: { teamId: string; id: string; now?: Date }): Promise<TeamInvitationItem> {
  const revoked = await withDatabaseErrors("withdraw the invitation", async () => {
    const db = await getDb();
    return db
      .update(invitation)
      .set({ status: "revoked" })
      .where(and(eq(invitation.teamId, teamId), eq(invitation.id, id), eq(invitation.status, "pending")))
      .returning({ id: invitation.id });
  });
  const current = await getInvitationById({ teamId, id, now });
  if (!current) throw new AppError("not_found:invitation", "No such invitation.");
  if (revoked.length === 0) {
    throw new AppError("conflict:invitation", current.state === "accepted" ? "This invitation has already been used; remove the member instead." : "This invitation was already withdrawn.");
  }
  return current;
}

export interface InvitationByToken {
  id: string;
  teamId: string;
  teamName: string;
  email: string;
  role: TeamRole;
  state: InvitationState;
  inviterName: string | null;
  expiresAt: Date;
}

/** The invitation a link's secret belongs to (looked up by its hash), or null. */
export async function getInvitationByToken({ token, now = new Date() }: { token: string; now?: Date }): Promise<InvitationByToken | null> {
  const tokenHash = hashSecret(token);
  return withDatabaseErrors("read the invitation", async () => {
    const db = await getDb();
    const [row] = await db
      .select({
        id: invitation.id,
        teamId: invitation.teamId,
        teamName: team.name,
        email: invitation.email,
        role: invitation.role,
        status: invitation.status,
        expiresAt: invitation.expiresAt,
        inviterName: inviter.name,
      })
      .from(invitation)
      .innerJoin(team, eq(team.id, invitation.teamId))
      .leftJoin(inviter, eq(inviter.id, invitation.inviterId))
      .where(eq(invitation.tokenHash, tokenHash))
      .limit(1);
    if (!row) return null;
    return { ...row, role: roleOf(row.role), state: invitationState(row, now) };
  });
}

/** Why a link cannot be used now: "expired" answers 410, which AppError has no kind for. */
export type AcceptOutcome =
  | { outcome: "accepted"; invitationId: string; teamId: string; teamName: string; role: TeamRole }
  | { outcome: "expired"; message: string };

function refuseUnavailable(state: Exclude<InvitationState, "pending" | "expired">): never {
  if (state === "accepted") throw new AppError("conflict:invitation", "This invitation has already been used.");
  throw new AppError("not_found:invitation", invitationUnavailableMessage(state));
}

/**
 * Accepts an invitation for the signed-in user: the invitation turns from pending to accepted
 * (only if it is still pending and unexpired) and the membership is added, in one transaction, so
 * a link works exactly once even when two tabs accept at the same moment.
 */
export async function acceptInvitation({
  token,
  userId,
  userEmail,
  now = new Date(),
}: {
  token: string;
  userId: string;
  userEmail: string;
  now?: Date;
}): Promise<AcceptOutcome> {
  const tokenHash = hashSecret(token);
  const found = await getInvitationByToken({ token, now });
  if (!found) throw new AppError("not_found:invitation", "This invitation link is not known. Check that the whole link was copied.");
  if (found.state === "expired") return { outcome: "expired", message: invitationUnavailableMessage("expired") };
  if (found.state !== "pending") refuseUnavailable(found.state);
  if (normaliseEmail(found.email) !== normaliseEmail(userEmail)) {
    throw new AppError("forbidden:invitation", `This invitation is for ${found.email}, but you are signed in as ${userEmail}. Sign in with the invited address to join.`);
  }
  const accepted = await withDatabaseErrors("accept the invitation", async () => {
    const db = await getDb();
    return db.transaction(async (tx) => {
      const [latched] = await tx
        .update(invitation)
        .set({ status: "accepted", acceptedAt: now, acceptedBy: userId })
        .where(and(eq(invitation.tokenHash, tokenHash), eq(invitation.status, "pending"), gt(invitation.expiresAt, now)))
        .returning({ id: invitation.id, teamId: invitation.teamId, role: invitation.role });
      if (!latched) return null;
      const [existing] = await tx
        .select({ id: membership.id })
        .from(membership)
        .where(and(eq(membership.teamId, latched.teamId), eq(membership.userId, userId)))
        .limit(1);
      // Rolls the latch back too: the invitation stays pending for the owner to withdraw.
      if (existing) throw new AppError("conflict:invitation", "You are already on this team.");
      await tx.insert(membership).values({ id: newId(), teamId: latched.teamId, userId, role: roleOf(latched.role), createdAt: now });
      return latched;
    });
  });
  if (!accepted) {
    // Someone else's request got there first (or the clock passed the expiry in between).
    const current = await getInvitationByToken({ token, now });
    const state = current?.state ?? "revoked";
    if (state === "expired") return { outcome: "expired", message: invitationUnavailableMessage("expired") };
    refuseUnavailable(state === "pending" ? "revoked" : state);
  }
  return { outcome: "accepted", invitationId: accepted.id, teamId: accepted.teamId, teamName: found.teamName, role: roleOf(accepted.role) };
}
