// Who has a study open: one row per open live connection, refreshed by the connection's ping and
// removed when it closes. A process that dies leaves its rows behind; they stop counting once
// their lastSeenAt is older than `presenceWindowSeconds` and are deleted after an hour.
import "server-only";
import { and, asc, eq, gt, lt } from "drizzle-orm";
import type { PresentUser } from "@/lib/http/activity-types";
import { getDb } from "../client";
import { studyPresence, user } from "../schema";
import { withDatabaseErrors } from "./wrap";

/** A connection counts as present while it was seen this recently (its ping comes every 20 s). */
export const presenceWindowSeconds = 60;
const staleAfterMs = 60 * 60 * 1000;

/**
 * A connection id that carries the moment it opened: the table keeps no join time (lastSeenAt
 * moves with every ping), and "since" is read back from the id.
 */
export function newPresenceId(now: Date = new Date()): string {
  return `${now.getTime()}-${crypto.randomUUID()}`;
}

function openedAt(presenceId: string, fallback: Date): Date {
  const millis = Number(presenceId.split("-", 1)[0]);
  return Number.isFinite(millis) && millis > 0 ? new Date(millis) : fallback;
}

export function initialsOf(name: string): string {
  const letters = name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((part) => part[0]!.toUpperCase())
    .join("");
  return letters || "?";
}

/** Notes an open connection, and clears rows that dead processes left more than an hour ago. */
export async function joinStudyPresence({ id, studyId, userId }: { id: string; studyId: string; userId: string }): Promise<void> {
  await withDatabaseErrors("note who has the study open", async () => {
    const db = await getDb();
    await db.delete(studyPresence).where(lt(studyPresence.lastSeenAt, new Date(Date.now() - staleAfterMs)));
    await db.insert(studyPresence).values({ id, studyId, userId, lastSeenAt: new Date() });
  });
}

export async function touchStudyPresence({ id }: { id: string }): Promise<void> {
  await withDatabaseErrors("note who has the study open", async () => {
    const db = await getDb();
    await db.update(studyPresence).set({ lastSeenAt: new Date() }).where(eq(studyPresence.id, id));
  });
}

export async function leaveStudyPresence({ id }: { id: string }): Promise<void> {
  await withDatabaseErrors("note who left the study", async () => {
    const db = await getDb();
    await db.delete(studyPresence).where(eq(studyPresence.id, id));
  });
}

/** Everyone with the study open now, once each, in the order they arrived. */
export async function listPresentUsersByStudyId({ studyId }: { studyId: string }): Promise<PresentUser[]> {
  return withDatabaseErrors("read who has the study open", async () => {
    const db = await getDb();
    const rows = await db
      .select({ id: studyPresence.id, userId: studyPresence.userId, name: user.name, lastSeenAt: studyPresence.lastSeenAt })
      .from(studyPresence)
      .innerJoin(user, eq(user.id, studyPresence.userId))
      .where(and(eq(studyPresence.studyId, studyId), gt(studyPresence.lastSeenAt, new Date(Date.now() - presenceWindowSeconds * 1000))))
      .orderBy(asc(studyPresence.lastSeenAt));
    const byUser = new Map<string, PresentUser>();
    for (const row of rows) {
      const since = openedAt(row.id, row.lastSeenAt);
      const known = byUser.get(row.userId);
      if (!known) byUser.set(row.userId, { userId: row.userId, name: row.name, initials: initialsOf(row.name), since: since.toISOString() });
      else if (since.toISOString() < known.since) known.since = since.toISOString();
    }
    return [...byUser.values()].sort((a, b) => a.since.localeCompare(b.since));
  });
}
