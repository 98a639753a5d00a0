import "server-only";
import type { TeamMember, TeamMembershipSummary } from "@/lib/http/api-types";
import { and, asc, eq } from "drizzle-orm";
import { isTeamRole, type TeamRole } from "@/lib/access/roles";
import { decideRemoval, decideRoleChange, type MemberRole, type MembershipDecision } from "@/lib/collaboration/membership-rules";
import { AppError } from "@/lib/http/app-error";
import type { TeamMemberDetail } from "@/lib/http/team-types";
import { getDb, type Database } from "../client";
import { membership, session, team, user } from "../schema";
import { newId, withDatabaseErrors } from "./wrap";

function slugify(text: string): string {
  const base = text
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40);
  return `${base || "team"}-${newId().slice(0, 8)}`;
}

export async function createTeam({ name, slug }: { name: string; slug?: string }): Promise<{ id: string; slug: string }> {
  return withDatabaseErrors("create the team", async () => {
    const db = await getDb();
    const id = newId();
    const teamSlug = slug ?? slugify(name);
    await db.insert(team).values({ id, name, slug: teamSlug, createdAt: new Date() });
    return { id, slug: teamSlug };
  });
}

export async function addMembership({ teamId, userId, role }: { teamId: string; userId: string; role: TeamRole }): Promise<void> {
  await withDatabaseErrors("add the member", async () => {
    const db = await getDb();
    await db.insert(membership).values({ id: newId(), teamId, userId, role, createdAt: new Date() });
  });
}

/** Every new account gets a team of its own, with its user as owner. */
export async function createPersonalTeam({ userId, userName }: { userId: string; userName: string }): Promise<string> {
  const firstName = userName.trim().split(/\s+/)[0] || "My";
  const { id } = await createTeam({ name: `${firstName}'s team` });
  await addMembership({ teamId: id, userId, role: "owner" });
  return id;
}

export async function findFirstTeamIdByUserId({ userId }: { userId: string }): Promise<string | null> {
  return withDatabaseErrors("read memberships", async () => {
    const db = await getDb();
    const rows = await db
      .select({ teamId: membership.teamId })
      .from(membership)
      .where(eq(membership.userId, userId))
      .orderBy(asc(membership.createdAt))
      .limit(1);
    return rows[0]?.teamId ?? null;
  });
}

export async function listMembershipsByUserId({ userId }: { userId: string }): Promise<TeamMembershipSummary[]> {
  return withDatabaseErrors("read memberships", async () => {
    const db = await getDb();
    const rows = await db
      .select({ teamId: team.id, teamName: team.name, teamSlug: team.slug, role: membership.role })
      .from(membership)
      .innerJoin(team, eq(team.id, membership.teamId))
      .where(eq(membership.userId, userId))
      .orderBy(asc(team.name));
    return rows.filter((row) => isTeamRole(row.role)).map((row) => ({ ...row, role: row.role as TeamRole }));
  });
}

export async function getMembershipRole({ teamId, userId }: { teamId: string; userId: string }): Promise<TeamRole | null> {
  return withDatabaseErrors("read the membership", async () => {
    const db = await getDb();
    const rows = await db
      .select({ role: membership.role })
      .from(membership)
      .where(and(eq(membership.teamId, teamId), eq(membership.userId, userId)))
      .limit(1);
    const role = rows[0]?.role;
    return isTeamRole(role) ? role : null;
  });
}

export async function listMembersByTeamId({ teamId }: { teamId: string }): Promise<TeamMember[]> {
  return withDatabaseErrors("read the team's members", async () => {
    const db = await getDb();
    const rows = await db
      .select({ userId: user.id, name: user.name, email: user.email, role: membership.role })
      .from(membership)
      .innerJoin(user, eq(user.id, membership.userId))
      .where(eq(membership.teamId, teamId))
      .orderBy(asc(user.name));
    return rows.filter((row) => isTeamRole(row.role)).map((row) => ({ ...row, role: row.role as TeamRole }));
  });
}

export async function getTeamBySlug({ slug }: { slug: string }): Promise<{ id: string; name: string } | null> {
  return withDatabaseErrors("read the team", async () => {
    const db = await getDb();
    const rows = await db.select({ id: team.id, name: team.name }).from(team).where(eq(team.slug, slug)).limit(1);
    return rows[0] ?? null;
  });
}

// ---------------------------------------------------------------------------------------------
// Membership management (issue #7): the team page's member list, role changes and removals.
// The rules are in lib/collaboration/membership-rules.ts; they are applied here inside one
// transaction with the team's membership rows locked, so two owners demoting each other at the
// same moment cannot leave a team without an owner.
// ---------------------------------------------------------------------------------------------

export async function getTeamById({ id }: { id: string }): Promise<{ id: string; name: string } | null> {
  return withDatabaseErrors("read the team", async () => {
    const db = await getDb();
    const rows = await db.select({ id: team.id, name: team.name }).from(team).where(eq(team.id, id)).limit(1);
    return rows[0] ?? null;
  });
}

type MemberDetailRow = { userId: string; membershipId: string; name: string; email: string; role: string; joinedAt: Date };

function toMemberDetail(row: MemberDetailRow): TeamMemberDetail | null {
  if (!isTeamRole(row.role)) return null;
  return { ...row, role: row.role, joinedAt: row.joinedAt.toISOString() };
}

const memberDetailColumns = {
  userId: user.id,
  membershipId: membership.id,
  name: user.name,
  email: user.email,
  role: membership.role,
  joinedAt: membership.createdAt,
};

/** The team page's member list: name, e-mail, role and when they joined. */
export async function listMemberDetailsByTeamId({ teamId }: { teamId: string }): Promise<TeamMemberDetail[]> {
  return withDatabaseErrors("read the team's members", async () => {
    const db = await getDb();
    const rows = await db
      .select(memberDetailColumns)
      .from(membership)
      .innerJoin(user, eq(user.id, membership.userId))
      .where(eq(membership.teamId, teamId))
      .orderBy(asc(user.name));
    return rows.map(toMemberDetail).filter((row): row is TeamMemberDetail => row !== null);
  });
}

type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

/** The team's members and roles, locked until the transaction ends. */
async function lockTeamMembers(tx: Transaction, teamId: string): Promise<MemberRole[]> {
  const rows = await tx.select({ userId: membership.userId, role: membership.role }).from(membership).where(eq(membership.teamId, teamId)).for("update");
  return rows.filter((row): row is MemberRole => isTeamRole(row.role));
}

function refusalError(decision: Extract<MembershipDecision, { ok: false }>): AppError {
  const kind = decision.refusal === "last_owner" ? "conflict" : decision.refusal === "not_member" ? "not_found" : "forbidden";
  return new AppError(`${kind}:member`, decision.message);
}

async function getMemberDetail(tx: Transaction, teamId: string, userId: string): Promise<TeamMemberDetail | null> {
  const [row] = await tx
    .select(memberDetailColumns)
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.teamId, teamId), eq(membership.userId, userId)))
    .limit(1);
  return row ? toMemberDetail(row) : null;
}

/** Changes a member's role; refuses (409) to leave the team without an owner. */
export async function changeMemberRole({
  teamId,
  userId,
  role,
  callerRole,
}: {
  teamId: string;
  userId: string;
  role: TeamRole;
  callerRole: TeamRole;
}): Promise<{ member: TeamMemberDetail; fromRole: TeamRole }> {
  const result = await withDatabaseErrors("change the member's role", async () => {
    const db = await getDb();
    return db.transaction(async (tx) => {
      const members = await lockTeamMembers(tx, teamId);
      const decision = decideRoleChange({ members, callerRole, targetUserId: userId, newRole: role });
      if (!decision.ok) throw refusalError(decision);
      const fromRole = members.find((member) => member.userId === userId)!.role;
      if (fromRole !== role) await tx.update(membership).set({ role }).where(and(eq(membership.teamId, teamId), eq(membership.userId, userId)));
      const member = await getMemberDetail(tx, teamId, userId);
      return member ? { member, fromRole } : null;
    });
  });
  if (!result) throw new AppError("not_found:member", "This person is not on the team.");
  return result;
}

/** Removes a member (or lets them leave); refuses (409) to remove the last owner. */
export async function removeMember({
  teamId,
  userId,
  callerUserId,
  callerRole,
}: {
  teamId: string;
  userId: string;
  callerUserId: string;
  callerRole: TeamRole;
}): Promise<TeamMemberDetail> {
  const removed = await withDatabaseErrors("remove the member", async () => {
    const db = await getDb();
    return db.transaction(async (tx) => {
      const members = await lockTeamMembers(tx, teamId);
      const decision = decideRemoval({ members, callerUserId, callerRole, targetUserId: userId });
      if (!decision.ok) throw refusalError(decision);
      const member = await getMemberDetail(tx, teamId, userId);
      await tx.delete(membership).where(and(eq(membership.teamId, teamId), eq(membership.userId, userId)));
      return member;
    });
  });
  if (!removed) throw new AppError("not_found:member", "This person is not on the team.");
  return removed;
}

/**
 * Makes a team the active one of one session (what better-auth's set-active does), for the
 * session that has just joined the team through an invitation.
 */
export async function setSessionActiveTeam({ sessionId, userId, teamId }: { sessionId: string; userId: string; teamId: string }): Promise<void> {
  await withDatabaseErrors("open the team", async () => {
    const db = await getDb();
    await db.update(session).set({ activeTeamId: teamId, updatedAt: new Date() }).where(and(eq(session.id, sessionId), eq(session.userId, userId)));
  });
}
