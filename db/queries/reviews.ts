// Review decisions on saved runs: the history in run_review, the run's current state in
// run.review_state, and the sign-off in force that run records carry.
import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import { AppError } from "@/lib/http/app-error";
import type { RunReviewItem, RunSignOff } from "@/lib/http/review-types";
import type { ReviewStateName } from "@/lib/review/review-states";
import { getDb } from "../client";
import { run, runReview, user } from "../schema";
import { newId, withDatabaseErrors } from "./wrap";

const reviewColumns = {
  id: runReview.id,
  fromState: runReview.fromState,
  toState: runReview.toState,
  actorId: runReview.actorId,
  actorName: user.name,
  note: runReview.note,
  runInputHash: runReview.runInputHash,
  sceneVersion: runReview.sceneVersion,
  createdAt: runReview.createdAt,
};

function toItem(row: Omit<RunReviewItem, "createdAt"> & { createdAt: Date }): RunReviewItem {
  return { ...row, createdAt: row.createdAt.toISOString() };
}

/** A run's review history, newest first. */
export async function listReviewsByRunId({ runId }: { runId: string }): Promise<RunReviewItem[]> {
  return withDatabaseErrors("read the review history", async () => {
    const db = await getDb();
    const rows = await db.select(reviewColumns).from(runReview).leftJoin(user, eq(user.id, runReview.actorId)).where(eq(runReview.runId, runId)).orderBy(desc(runReview.createdAt));
    return rows.map(toItem);
  });
}

/** Who asked for the latest review of a run (null when nobody did, or their account is gone). */
export async function getReviewRequesterIdByRunId({ runId }: { runId: string }): Promise<string | null> {
  return withDatabaseErrors("read the review history", async () => {
    const db = await getDb();
    const [row] = await db
      .select({ actorId: runReview.actorId })
      .from(runReview)
      .where(and(eq(runReview.runId, runId), eq(runReview.toState, "awaiting_review")))
      .orderBy(desc(runReview.createdAt))
      .limit(1);
    return row?.actorId ?? null;
  });
}

/**
 * Adds to each run the sign-off in force: the latest decision that signed it off, for runs whose
 * state is "signed_off" now. One query for the whole list.
 */
export async function attachSignOffs<Row extends { id: string; reviewState: ReviewStateName }>(rows: Row[]): Promise<(Row & { signOff: RunSignOff | null })[]> {
  const signedIds = rows.filter((row) => row.reviewState === "signed_off").map((row) => row.id);
  const latest = new Map<string, RunSignOff>();
  if (signedIds.length > 0) {
    const db = await getDb();
    const signOffs = await db
      .select({ runId: runReview.runId, ...reviewColumns })
      .from(runReview)
      .leftJoin(user, eq(user.id, runReview.actorId))
      .where(and(inArray(runReview.runId, signedIds), eq(runReview.toState, "signed_off")))
      .orderBy(desc(runReview.createdAt));
    for (const row of signOffs) {
      if (latest.has(row.runId)) continue;
      latest.set(row.runId, {
        signedOffById: row.actorId,
        signedOffByName: row.actorName,
        signedOffAt: row.createdAt.toISOString(),
        runInputHash: row.runInputHash,
        sceneVersion: row.sceneVersion,
        note: row.note,
      });
    }
  }
  return rows.map((row) => ({ ...row, signOff: latest.get(row.id) ?? null }));
}

export interface ReviewDecisionRecord {
  runId: string;
  fromState: ReviewStateName;
  toState: ReviewStateName;
  actorId: string;
  note: string;
  /** The run's input hash and the scene version it was run from, kept with the decision. */
  runInputHash: string;
  sceneVersion: number;
}

/**
 * Moves the run to its new state and keeps the decision, in one transaction. The update only
 * matches while the run is still in `fromState`, so of two people deciding at once, the second is
 * told to reload instead of overwriting the first.
 */
export async function applyReviewDecision(input: ReviewDecisionRecord): Promise<RunReviewItem> {
  const id = await withDatabaseErrors("record the review decision", async () => {
    const db = await getDb();
    const reviewId = newId();
    await db.transaction(async (tx) => {
      const moved = await tx
        .update(run)
        .set({ reviewState: input.toState })
        .where(and(eq(run.id, input.runId), eq(run.reviewState, input.fromState)))
        .returning({ id: run.id });
      if (moved.length === 0) throw new AppError("conflict:review", "The review state changed meanwhile; reload the run to see the latest decision.");
      await tx.insert(runReview).values({
        id: reviewId,
        runId: input.runId,
        fromState: input.fromState,
        toState: input.toState,
        actorId: input.actorId,
        note: input.note,
        runInputHash: input.runInputHash,
        sceneVersion: input.sceneVersion,
      });
    });
    return reviewId;
  });
  return withDatabaseErrors("read the review decision", async () => {
    const db = await getDb();
    const [row] = await db.select(reviewColumns).from(runReview).leftJoin(user, eq(user.id, runReview.actorId)).where(eq(runReview.id, id)).limit(1);
    if (!row) throw new Error(`review ${id} vanished after it was recorded`);
    return toItem(row);
  });
}
