import "server-only";
import type { ActivityItem } from "@/lib/http/api-types";
import { desc, eq } from "drizzle-orm";
import { getDb } from "../client";
import { activity, user } from "../schema";
import { publishLiveEvent } from "./live-events";
import { newId, withDatabaseErrors } from "./wrap";

export interface ActivityInput {
  teamId: string;
  studyId?: string | null;
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId: string;
  detail?: Record<string, unknown>;
  /** The run a comment or review concerns, so that the run's open page refreshes. */
  runId?: string | null;
}

/** Records an activity and tells open pages about it (live updates are fed from the same record). */
export async function recordActivity(input: ActivityInput): Promise<void> {
  const id = newId();
  const createdAt = new Date();
  await withDatabaseErrors("record the activity", async () => {
    const db = await getDb();
    await db.insert(activity).values({
      id,
      teamId: input.teamId,
      studyId: input.studyId ?? null,
      actorId: input.actorId,
      action: input.action,
      subjectType: input.subjectType,
      subjectId: input.subjectId,
      detail: { ...(input.detail ?? {}), ...(input.runId ? { runId: input.runId } : {}) },
      createdAt,
    });
  });
  await publishLiveEvent({
    kind: "activity",
    id,
    teamId: input.teamId,
    studyId: input.studyId ?? null,
    actorId: input.actorId,
    action: input.action,
    subjectType: input.subjectType,
    subjectId: input.subjectId,
    runId: input.runId ?? null,
    at: createdAt.toISOString(),
  });
}

export async function listActivityByStudyId({ studyId, limit = 50 }: { studyId: string; limit?: number }): Promise<ActivityItem[]> {
  return withDatabaseErrors("read the activity", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        id: activity.id,
        action: activity.action,
        subjectType: activity.subjectType,
        subjectId: activity.subjectId,
        actorName: user.name,
        detail: activity.detail,
        createdAt: activity.createdAt,
      })
      .from(activity)
      .leftJoin(user, eq(user.id, activity.actorId))
      .where(eq(activity.studyId, studyId))
      .orderBy(desc(activity.createdAt))
      .limit(limit);
    return rows.map((row) => ({ ...row, createdAt: row.createdAt.toISOString() }));
  });
}
