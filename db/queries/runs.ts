// Saved runs: the frozen input, the summary figures and the binary payload in one row. A run is
// written once and never changed; it is only read or deleted.
import "server-only";
import { desc, eq, sql } from "drizzle-orm";
import type { RunListFigures, RunListItem, RunRecord } from "@/lib/http/api-types";
import type { RunSummary } from "@/lib/run-record/summary";
import { getDb, type Database } from "../client";
import { activity, run, scene, study, user, type RunStatus } from "../schema";
import { attachSignOffs } from "./reviews";
import { activityRow, publishActivity } from "./activity";
import { newId, withDatabaseErrors } from "./wrap";

/** Columns every answer about a run carries; never the payload, which can be tens of MB. */
const listColumns = {
  id: run.id,
  studyId: run.studyId,
  sceneId: run.sceneId,
  sceneName: scene.name,
  sceneVersion: run.sceneVersion,
  status: run.status,
  statusMessage: run.statusMessage,
  createdById: run.createdBy,
  createdByName: user.name,
  createdAt: run.createdAt,
  inputHash: run.inputHash,
  solverVersion: run.solverVersion,
  resultBytes: run.resultBytes,
  reviewState: run.reviewState,
  sceneCurrentVersion: scene.version,
};

export interface NewRun {
  teamId: string;
  studyId: string;
  sceneId: string;
  sceneVersion: number;
  /** The scene as run, after parseScene. */
  sceneSnapshot: unknown;
  settings: unknown;
  inputHash: string;
  solverVersion: string;
  status: RunStatus;
  statusMessage: string;
  summary: RunSummary;
  resultData: Uint8Array;
  createdBy: string;
  /** Shown in the study's activity feed. */
  sceneName: string;
}

export type DatabaseTransaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

/**
 * Stores a checked run and its activity entry in one transaction: if either fails, neither is kept.
 * `inTransaction` runs last in that transaction, after the run's row is in (a server run locks its job
 * there and links the run to it); whatever it throws leaves nothing stored.
 */
export async function createRun(input: NewRun, options: { inTransaction?: (tx: DatabaseTransaction, runId: string) => Promise<void> } = {}): Promise<RunRecord> {
  const runId = newId();
  const saved = activityRow({
    teamId: input.teamId,
    studyId: input.studyId,
    actorId: input.createdBy,
    action: "run.saved",
    subjectType: "run",
    subjectId: runId,
    detail: { sceneName: input.sceneName, sceneVersion: input.sceneVersion, status: input.status },
  });
  const id = await withDatabaseErrors("save the run", async () => {
    const db = await getDb();
    await db.transaction(async (tx) => {
      await tx.insert(run).values({
        id: runId,
        studyId: input.studyId,
        sceneId: input.sceneId,
        sceneVersion: input.sceneVersion,
        sceneSnapshot: input.sceneSnapshot,
        settings: input.settings,
        inputHash: input.inputHash,
        solverVersion: input.solverVersion,
        status: input.status,
        statusMessage: input.statusMessage,
        summary: input.summary,
        resultData: input.resultData,
        resultBytes: input.resultData.byteLength,
        createdBy: input.createdBy,
      });
      await tx.insert(activity).values(saved);
      await options.inTransaction?.(tx, runId);
    });
    return runId;
  });
  // After the commit: open pages hear of the run only once they can read it.
  await publishActivity(saved);
  const created = await getRunById({ id });
  if (!created) throw new Error(`run ${id} vanished after it was saved`);
  return created;
}

export async function listRunsByStudyId({ studyId }: { studyId: string }): Promise<RunListItem[]> {
  return withDatabaseErrors("list the runs", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        ...listColumns,
        // The summary without its longest parts, so a long list stays small.
        figures: sql<Omit<RunListFigures, "warningCount"> | null>`${run.summary} - 'receivers' - 'warnings'`,
        warningCount: sql<number>`coalesce(jsonb_array_length(${run.summary} -> 'warnings'), 0)`.mapWith(Number),
      })
      .from(run)
      .leftJoin(scene, eq(scene.id, run.sceneId))
      .leftJoin(user, eq(user.id, run.createdBy))
      .where(eq(run.studyId, studyId))
      .orderBy(desc(run.createdAt));
    return attachSignOffs(
      rows.map(({ figures, warningCount, createdAt, ...row }) => ({
        ...row,
        createdAt: createdAt.toISOString(),
        figures: figures ? { ...figures, warningCount } : null,
      })),
    );
  });
}

/** A run's metadata and summary, with the team that owns it (for the access check). */
export async function getRunById({ id }: { id: string }): Promise<RunRecord | null> {
  return withDatabaseErrors("read the run", async () => {
    const db = await getDb();
    const rows = await db
      .select({ ...listColumns, teamId: study.teamId, settings: run.settings, summary: run.summary })
      .from(run)
      .innerJoin(study, eq(study.id, run.studyId))
      .leftJoin(scene, eq(scene.id, run.sceneId))
      .leftJoin(user, eq(user.id, run.createdBy))
      .where(eq(run.id, id))
      .limit(1);
    const row = rows[0];
    if (!row) return null;
    const [withSignOff] = await attachSignOffs([{ ...row, summary: row.summary as RunSummary | null, createdAt: row.createdAt.toISOString() }]);
    return withSignOff ?? null;
  });
}

/** The stored payload bytes, or null when the run has none (or does not exist). */
export async function getRunResultById({ id }: { id: string }): Promise<Uint8Array | null> {
  return withDatabaseErrors("read the run's result", async () => {
    const db = await getDb();
    const rows = await db.select({ resultData: run.resultData }).from(run).where(eq(run.id, id)).limit(1);
    return rows[0]?.resultData ?? null;
  });
}

/** Deletes a run (its comments go with it) and notes who did so in the study's activity. */
export async function deleteRunById({ id, teamId, studyId, actorId, sceneName }: { id: string; teamId: string; studyId: string; actorId: string; sceneName: string | null }): Promise<void> {
  const deleted = activityRow({ teamId, studyId, actorId, action: "run.deleted", subjectType: "run", subjectId: id, detail: { sceneName } });
  await withDatabaseErrors("delete the run", async () => {
    const db = await getDb();
    await db.transaction(async (tx) => {
      await tx.delete(run).where(eq(run.id, id));
      await tx.insert(activity).values(deleted);
    });
  });
  await publishActivity(deleted);
}
