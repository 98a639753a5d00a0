// The activity log: who did what to which thing. It feeds the study and team feeds, and every
// entry is also announced as a live event so that open pages refresh.
import "server-only";
import { and, desc, eq, isNull, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { ActivityItem } from "@/lib/http/api-types";
import type { FeedItem, FeedPage } from "@/lib/http/activity-types";
import { getDb } from "../client";
import { activity, run, scene, study, user, type Activity } from "../schema";
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

/**
 * The row to insert for an activity. Queries that write an activity inside their own transaction
 * insert this row there and call `publishActivity` after the commit, so pages never hear of a
 * change that was rolled back.
 */
export function activityRow(input: ActivityInput): Activity {
  return {
    id: newId(),
    teamId: input.teamId,
    studyId: input.studyId ?? null,
    actorId: input.actorId,
    action: input.action,
    subjectType: input.subjectType,
    subjectId: input.subjectId,
    detail: { ...(input.detail ?? {}), ...(input.runId ? { runId: input.runId } : {}) },
    createdAt: new Date(),
  };
}

/** Tells open pages about a committed activity row. Never throws (see publishLiveEvent). */
export async function publishActivity(row: Activity): Promise<void> {
  const detail = (row.detail ?? {}) as { runId?: unknown };
  const runId = typeof detail.runId === "string" ? detail.runId : row.subjectType === "run" ? row.subjectId : null;
  await publishLiveEvent({
    kind: "activity",
    id: row.id,
    teamId: row.teamId,
    studyId: row.studyId,
    actorId: row.actorId,
    action: row.action,
    subjectType: row.subjectType,
    subjectId: row.subjectId,
    runId,
    at: row.createdAt.toISOString(),
  });
}

/** Records an activity and tells open pages about it (live updates are fed from the same record). */
export async function recordActivity(input: ActivityInput): Promise<void> {
  const row = activityRow(input);
  await withDatabaseErrors("record the activity", async () => {
    const db = await getDb();
    await db.insert(activity).values(row);
  });
  await publishActivity(row);
}

/** The short list on the study record (the study page's feed reads pages of `listActivityPageByStudyId`). */
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

const runScene = alias(scene, "run_scene");
const subjectScene = alias(scene, "subject_scene");
/** The run an entry concerns: named in its detail (comments, reviews) or its subject (a saved run). */
const concernedRunId = sql<string | null>`coalesce(${activity.detail} ->> 'runId', case when ${activity.subjectType} = 'run' then ${activity.subjectId} end)`;

async function selectFeed(where: SQL | undefined, limit: number): Promise<FeedItem[]> {
  const db = await getDb();
  const rows = await db
    .select({
      id: activity.id,
      teamId: activity.teamId,
      studyId: activity.studyId,
      studyTitle: study.title,
      actorId: activity.actorId,
      actorName: user.name,
      action: activity.action,
      subjectType: activity.subjectType,
      subjectId: activity.subjectId,
      detail: activity.detail,
      runId: concernedRunId,
      // Non-null only when the run still exists in the same team: a deleted run is named, not linked.
      existingRunId: run.id,
      runSceneName: runScene.name,
      runSceneVersion: run.sceneVersion,
      runStudyId: run.studyId,
      sceneName: subjectScene.name,
      createdAt: activity.createdAt,
    })
    .from(activity)
    .leftJoin(user, eq(user.id, activity.actorId))
    .leftJoin(study, eq(study.id, activity.studyId))
    .leftJoin(run, eq(run.id, concernedRunId))
    .leftJoin(runScene, eq(runScene.id, run.sceneId))
    .leftJoin(subjectScene, and(eq(activity.subjectType, "scene"), eq(subjectScene.id, activity.subjectId)))
    .where(where)
    .orderBy(desc(activity.createdAt), desc(activity.id))
    .limit(limit);
  return rows.map(({ existingRunId, runSceneName, runSceneVersion, runStudyId, detail, createdAt, ...row }) => ({
    ...row,
    detail: detail && typeof detail === "object" && !Array.isArray(detail) ? (detail as Record<string, unknown>) : {},
    runLabel: existingRunId && runStudyId && runSceneVersion !== null ? { studyId: runStudyId, sceneName: runSceneName, sceneVersion: runSceneVersion } : null,
    createdAt: createdAt.toISOString(),
  }));
}

/** Entries strictly older than the entry `before` (same ordering as the feed: time, then id). */
function olderThan(before: string | undefined, scope: SQL): SQL | undefined {
  if (!before) return undefined;
  return sql`(${activity.createdAt}, ${activity.id}) < (select earlier.created_at, earlier.id from ${activity} earlier where earlier.id = ${before} and ${scope})`;
}

async function page(where: SQL | undefined, limit: number): Promise<FeedPage> {
  const rows = await selectFeed(where, limit + 1);
  const items = rows.slice(0, limit);
  return { items, nextBefore: rows.length > limit ? (items.at(-1)?.id ?? null) : null };
}

/**
 * A study's feed, newest first: its own entries and those about its runs that carry no study
 * (a comment recorded against a run only).
 */
export async function listActivityPageByStudyId({ studyId, before, limit = 30 }: { studyId: string; before?: string; limit?: number }): Promise<FeedPage> {
  return withDatabaseErrors("read the study's activity", async () => {
    const inStudy = or(eq(activity.studyId, studyId), and(isNull(activity.studyId), eq(run.studyId, studyId)));
    return page(and(inStudy, olderThan(before, sql`earlier.team_id = ${activity.teamId}`)), limit);
  });
}

/** A team's feed across all its studies (and team-wide entries such as members joining), newest first. */
export async function listActivityPageByTeamId({ teamId, before, limit = 30 }: { teamId: string; before?: string; limit?: number }): Promise<FeedPage> {
  return withDatabaseErrors("read the team's activity", async () => {
    return page(and(eq(activity.teamId, teamId), olderThan(before, sql`earlier.team_id = ${teamId}`)), limit);
  });
}

/** One entry as a feed shows it (for live notices); null when it no longer exists. */
export async function getFeedItemById({ id }: { id: string }): Promise<FeedItem | null> {
  return withDatabaseErrors("read the activity", async () => {
    const rows = await selectFeed(eq(activity.id, id), 1);
    return rows[0] ?? null;
  });
}
