import "server-only";
import type { TeamMember, TeamMembershipSummary } from "@/lib/http/api-types";
import { and, asc, eq } from "drizzle-orm";
import { isTeamRole, type TeamRole } from "@/lib/access/roles";
import { getDb } from "../client";
import { membership, team, user } from "../schema";
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
