// Verification records: a team's saved results of the verification cases (solver version, browser,
// kernel, per-case checks and thinned curves), and their attachment to runs as quality evidence.
// A record never changes once saved; an attachment is made or removed.
import "server-only";
import { and, asc, desc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { EvidenceCaseOutcome, RunEvidenceItem, VerificationRecordDetail, VerificationRecordSummary } from "@/lib/http/verification-types";
import type { SavedCaseOutcome, VerificationRecordInput } from "@/lib/validation/verification";
import { casePassed, recordCounts } from "@/lib/verification/saved-record";
import { getDb } from "../client";
import { runVerification, user, verificationRecord } from "../schema";
import { newId, withDatabaseErrors } from "./wrap";

const summaryColumns = {
  id: verificationRecord.id,
  teamId: verificationRecord.teamId,
  solverVersion: verificationRecord.solverVersion,
  browser: verificationRecord.browser,
  kernel: verificationRecord.kernel,
  passedCount: verificationRecord.passedCount,
  failedCount: verificationRecord.failedCount,
  createdById: verificationRecord.createdBy,
  createdByName: user.name,
  createdAt: verificationRecord.createdAt,
};

type SummaryRow = Omit<VerificationRecordSummary, "createdAt"> & { createdAt: Date };

function toSummary(row: SummaryRow): VerificationRecordSummary {
  return { ...row, createdAt: row.createdAt.toISOString() };
}

/** Stored outcomes are written only by createVerificationRecord, after validation. */
function storedOutcomes(value: unknown): SavedCaseOutcome[] {
  return Array.isArray(value) ? (value as SavedCaseOutcome[]) : [];
}

/** Saves a record; each case's verdict and the counts are judged again from its checks. */
export async function createVerificationRecord({ teamId, createdBy, input }: { teamId: string; createdBy: string; input: VerificationRecordInput }): Promise<VerificationRecordDetail> {
  return withDatabaseErrors("save the verification results", async () => {
    const db = await getDb();
    const id = newId();
    const outcomes = input.outcomes.map((outcome) => ({ ...outcome, pass: casePassed(outcome.checks) }));
    const counts = recordCounts(outcomes);
    await db.insert(verificationRecord).values({ id, teamId, solverVersion: input.solverVersion, browser: input.browser, kernel: input.kernel, outcomes, ...counts, createdBy });
    const record = await getVerificationRecordById({ id });
    if (!record) throw new Error("insert returned no row");
    return record;
  });
}

/** The team's records, newest first, without their outcomes. */
export async function listVerificationRecordsByTeamId({ teamId, limit = 100 }: { teamId: string; limit?: number }): Promise<VerificationRecordSummary[]> {
  return withDatabaseErrors("list the verification results", async () => {
    const db = await getDb();
    const rows = await db
      .select(summaryColumns)
      .from(verificationRecord)
      .leftJoin(user, eq(user.id, verificationRecord.createdBy))
      .where(eq(verificationRecord.teamId, teamId))
      .orderBy(desc(verificationRecord.createdAt), desc(verificationRecord.id))
      .limit(limit);
    return rows.map(toSummary);
  });
}

/** One record with its outcomes (checks and curves), or null. */
export async function getVerificationRecordById({ id }: { id: string }): Promise<VerificationRecordDetail | null> {
  return withDatabaseErrors("read the verification results", async () => {
    const db = await getDb();
    const rows = await db
      .select({ ...summaryColumns, outcomes: verificationRecord.outcomes })
      .from(verificationRecord)
      .leftJoin(user, eq(user.id, verificationRecord.createdBy))
      .where(eq(verificationRecord.id, id))
      .limit(1);
    const row = rows[0];
    if (!row) return null;
    const { outcomes, ...summary } = row;
    return { ...toSummary(summary), outcomes: storedOutcomes(outcomes) };
  });
}

const attacher = alias(user, "attacher");

/** The records attached to a run, oldest attachment first, each case with its checks but not its curves. */
export async function listRunEvidenceByRunId({ runId }: { runId: string }): Promise<RunEvidenceItem[]> {
  return withDatabaseErrors("list the run's quality evidence", async () => {
    const db = await getDb();
    const rows = await db
      .select({ ...summaryColumns, outcomes: verificationRecord.outcomes, attachedAt: runVerification.attachedAt, attachedByName: attacher.name })
      .from(runVerification)
      .innerJoin(verificationRecord, eq(verificationRecord.id, runVerification.verificationId))
      .leftJoin(user, eq(user.id, verificationRecord.createdBy))
      .leftJoin(attacher, eq(attacher.id, runVerification.attachedBy))
      .where(eq(runVerification.runId, runId))
      .orderBy(asc(runVerification.attachedAt), asc(verificationRecord.id));
    return rows.map(({ outcomes, attachedAt, attachedByName, ...summary }) => ({
      record: { ...toSummary(summary), outcomes: storedOutcomes(outcomes).map(({ curves: _curves, ...rest }): EvidenceCaseOutcome => rest) },
      attachedAt: attachedAt.toISOString(),
      attachedByName,
    }));
  });
}

/** Attaches a record to a run; `changed` is false when it was attached already. */
export async function attachVerificationToRun({ runId, verificationId, attachedBy }: { runId: string; verificationId: string; attachedBy: string }): Promise<{ changed: boolean }> {
  return withDatabaseErrors("attach the verification results", async () => {
    const db = await getDb();
    const inserted = await db.insert(runVerification).values({ runId, verificationId, attachedBy }).onConflictDoNothing().returning({ runId: runVerification.runId });
    return { changed: inserted.length > 0 };
  });
}

/** Detaches a record from a run; `changed` is false when it was not attached. */
export async function detachVerificationFromRun({ runId, verificationId }: { runId: string; verificationId: string }): Promise<{ changed: boolean }> {
  return withDatabaseErrors("detach the verification results", async () => {
    const db = await getDb();
    const deleted = await db
      .delete(runVerification)
      .where(and(eq(runVerification.runId, runId), eq(runVerification.verificationId, verificationId)))
      .returning({ runId: runVerification.runId });
    return { changed: deleted.length > 0 };
  });
}
