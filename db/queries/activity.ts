import "server-only";
import type { ActivityItem } from "@/lib/http/api-types";
import { desc, eq } from "drizzle-orm";
import { getDb } from "../client";
import { activity, user } from "../schema";
import { newId, withDatabaseErrors } from "./wrap";

export interface ActivityInput {
  teamId: string;
  studyId?: string | null;
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId: string;
  detail?: Record<string, unknown>;
}

export async function recordActivity(input: ActivityInput): Promise<void> {
  await withDatabaseErrors("record the activity", async () => {
    const db = await getDb();
    await db.insert(activity).values({
      id: newId(),
      teamId: input.teamId,
      studyId: input.studyId ?? null,
      actorId: input.actorId,
      action: input.action,
      subjectType: input.subjectType,
      subjectId: input.subjectId,
      detail: input.detail ?? {},
    });
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
