// Server-side runs: the run_job rows people see (state, position, progress, failures) beside the
// pg-boss jobs that deliver them to workers. Queuing freezes the scene and settings and enforces the
// team's limits; workers write their heartbeat and progress here, guarded by their attempt, so an
// attempt that lost its job (handed to another worker) changes nothing; a result is stored once.
import "server-only";
import { and, asc, desc, eq, gt, inArray, isNotNull, lt, or, sql, type SQL } from "drizzle-orm";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import { AppError } from "@/lib/http/app-error";
import type { QueueLimits, RunJobFailure, RunJobItem, RunJobState, StudyQueueResponse, SweepBatchItem } from "@/lib/http/job-types";
import type { PressureTrace } from "@/lib/analysis/band-levels";
import { defaultRunSettings, type RunSettings } from "@/lib/run-record/settings";
import { getBoss } from "@/lib/server/run-queue/boss";
import { queueLimits, queueTimings, runQueueName } from "@/lib/server/run-queue/settings";
import { checkRunUpload } from "@/lib/server/run-upload";
import { sweepInsertionLoss, type CaseState } from "@/lib/sweeps/sweep-insertion-loss";
import { planSweep, receiverOptions, type PlannedRun } from "@/lib/sweeps/sweep-plan";
import { unpackTraces } from "@/lib/sweeps/trace-pack";
import { chartContentSchema, type SweepDefinition } from "@/lib/validation/blocks";
import { getDb } from "../client";
import { activity, runJob, scene, studyBlock, sweepBatch, user, type RunJob, type SweepBatch } from "../schema";
import { activityRow, publishActivity, recordActivity } from "./activity";
import { publishLiveEvent } from "./live-events";
import { createRun } from "./runs";
import { getSceneVersionData } from "./scenes";
import { newId, withDatabaseErrors } from "./wrap";

const activeStates: RunJobState[] = ["queued", "running"];
const finishedStates: RunJobState[] = ["completed", "failed", "cancelled"];
/** Notebook positions are spaced so that blocks can be put between (db/queries/blocks.ts). */
const blockPositionGap = 1024;

// ---------------------------------------------------------------------------------------------
// Answers
// ---------------------------------------------------------------------------------------------

const jobColumns = {
  job: runJob,
  sceneName: scene.name,
  createdByName: user.name,
  /** Place among every team's queued jobs, in the order pg-boss hands them out (oldest first). */
  position: sql<number | null>`case when ${runJob.state} = 'queued' then (
    select count(*) from run_job q where q.state = 'queued'
      and (q.created_at < ${runJob.createdAt} or (q.created_at = ${runJob.createdAt} and q.id <= ${runJob.id}))
  ) end`.mapWith((value: unknown) => (value === null ? null : Number(value))),
};

type JobRow = { job: RunJob; sceneName: string | null; createdByName: string | null; position: number | null };

function iso(date: Date | null): string | null {
  return date ? date.toISOString() : null;
}

function toJobItem({ job, sceneName, createdByName, position }: JobRow): RunJobItem {
  const running = job.state === "running";
  const rate = job.cellUpdatesPerSecond;
  return {
    id: job.id,
    teamId: job.teamId,
    studyId: job.studyId,
    sceneId: job.sceneId,
    sceneName,
    sceneVersion: job.sceneVersion,
    kind: job.kind,
    sweepId: job.sweepId,
    label: job.label,
    state: job.state,
    position: job.state === "queued" ? position : null,
    workerId: job.workerId,
    attempt: job.attempt,
    maxAttempts: job.maxAttempts,
    progress: job.progress,
    cellUpdatesPerSecond: rate,
    secondsLeft: running && rate && rate > 0 ? Math.max(0, ((1 - job.progress) * job.cellSteps) / rate) : null,
    cellSteps: job.cellSteps,
    failures: job.failures as RunJobFailure[],
    message: job.message,
    cancelRequested: job.cancelRequestedAt !== null,
    runId: job.runId,
    createdBy: job.createdBy ? { id: job.createdBy, name: createdByName ?? "A former member" } : null,
    createdAt: job.createdAt.toISOString(),
    startedAt: iso(job.startedAt),
    finishedAt: iso(job.finishedAt),
  };
}

async function selectJobs(where: SQL | undefined, order: "plan" | "newest" = "newest"): Promise<RunJobItem[]> {
  const db = await getDb();
  const rows = await db
    .select(jobColumns)
    .from(runJob)
    .leftJoin(scene, eq(scene.id, runJob.sceneId))
    .leftJoin(user, eq(user.id, runJob.createdBy))
    .where(where)
    .orderBy(...(order === "plan" ? [asc(runJob.createdAt), asc(runJob.id)] : [desc(runJob.createdAt), desc(runJob.id)]));
  return rows.map(toJobItem);
}

function emptyCounts(): Record<RunJobState, number> {
  return { queued: 0, running: 0, completed: 0, failed: 0, cancelled: 0 };
}

function toSweepItem(sweep: SweepBatch, jobs: readonly Pick<RunJobItem, "kind" | "state">[], createdByName: string | null): SweepBatchItem {
  const counts = emptyCounts();
  for (const job of jobs) counts[job.state] += 1;
  return {
    id: sweep.id,
    studyId: sweep.studyId,
    sceneId: sweep.sceneId,
    sceneVersion: sweep.sceneVersion,
    label: sweep.label,
    state: sweep.state,
    message: sweep.message,
    caseCount: jobs.filter((job) => job.kind === "sweep-case").length,
    referenceCount: jobs.filter((job) => job.kind === "sweep-reference").length,
    counts,
    blockId: sweep.blockId,
    createdBy: sweep.createdBy ? { id: sweep.createdBy, name: createdByName ?? "A former member" } : null,
    createdAt: sweep.createdAt.toISOString(),
    finishedAt: iso(sweep.finishedAt),
  };
}

export async function getRunJobById({ id }: { id: string }): Promise<RunJobItem | null> {
  return withDatabaseErrors("read the job", async () => (await selectJobs(eq(runJob.id, id)))[0] ?? null);
}

export async function getSweepById({ id }: { id: string }): Promise<{ sweep: SweepBatchItem; jobs: RunJobItem[]; teamId: string } | null> {
  return withDatabaseErrors("read the sweep", async () => {
    const db = await getDb();
    const rows = await db.select({ sweep: sweepBatch, createdByName: user.name }).from(sweepBatch).leftJoin(user, eq(user.id, sweepBatch.createdBy)).where(eq(sweepBatch.id, id)).limit(1);
    const row = rows[0];
    if (!row) return null;
    const jobs = await selectJobs(eq(runJob.sweepId, id), "plan");
    return { sweep: toSweepItem(row.sweep, jobs, row.createdByName), jobs, teamId: row.sweep.teamId };
  });
}

/** The team's queued and running jobs: how many, and their cells x steps together. */
async function activeQueueUse(teamId: string): Promise<{ jobs: number; cellSteps: number }> {
  const db = await getDb();
  const rows = await db
    .select({ count: sql<number>`count(*)`.mapWith(Number), cellSteps: sql<number>`coalesce(sum(${runJob.cellSteps}), 0)`.mapWith(Number) })
    .from(runJob)
    .where(and(eq(runJob.teamId, teamId), inArray(runJob.state, activeStates)));
  return { jobs: rows[0]?.count ?? 0, cellSteps: rows[0]?.cellSteps ?? 0 };
}

/** The study's queue view: active jobs and those finished in the last `days` days, its sweeps, the team's limits, the workers seen. */
export async function listStudyQueue({ studyId, teamId, days }: { studyId: string; teamId: string; days: number }): Promise<StudyQueueResponse> {
  return withDatabaseErrors("list the queue", async () => {
    const db = await getDb();
    const since = new Date(Date.now() - days * 86_400_000);
    const jobs = await selectJobs(and(eq(runJob.studyId, studyId), or(inArray(runJob.state, activeStates), gt(runJob.createdAt, since))));
    const sweepRows = await db
      .select({ sweep: sweepBatch, createdByName: user.name })
      .from(sweepBatch)
      .leftJoin(user, eq(user.id, sweepBatch.createdBy))
      .where(and(eq(sweepBatch.studyId, studyId), or(inArray(sweepBatch.state, activeStates), gt(sweepBatch.createdAt, since))))
      .orderBy(desc(sweepBatch.createdAt));
    const sweepIds = sweepRows.map((row) => row.sweep.id);
    const sweepJobs = sweepIds.length > 0 ? await db.select({ sweepId: runJob.sweepId, kind: runJob.kind, state: runJob.state }).from(runJob).where(inArray(runJob.sweepId, sweepIds)) : [];
    const sweeps = sweepRows.map((row) => toSweepItem(row.sweep, sweepJobs.filter((job) => job.sweepId === row.sweep.id), row.createdByName));
    const limits = queueLimits();
    const use = await activeQueueUse(teamId);
    const queueLimitsInUse: QueueLimits = {
      maxActiveJobs: limits.maxActiveJobs,
      maxCellStepsPerJob: limits.maxCellStepsPerJob,
      maxActiveCellSteps: limits.maxActiveCellSteps,
      activeJobs: use.jobs,
      activeCellSteps: use.cellSteps,
    };
    return { jobs, sweeps, limits: queueLimitsInUse, workers: await listRecentWorkers() };
  });
}

/**
 * Worker processes keep no table of their own: a worker is seen through the jobs it writes (heartbeat
 * while running, the finish time after). An idle worker that has taken nothing for a minute is not listed.
 */
async function listRecentWorkers(): Promise<StudyQueueResponse["workers"]> {
  const db = await getDb();
  const since = new Date(Date.now() - 60_000);
  const seen = sql<Date>`max(greatest(coalesce(${runJob.progressAt}, ${runJob.startedAt}), coalesce(${runJob.finishedAt}, ${runJob.startedAt})))`;
  const rows = await db
    .select({ id: runJob.workerId, lastSeenAt: seen, runningJobs: sql<number>`count(*) filter (where ${runJob.state} = 'running')`.mapWith(Number) })
    .from(runJob)
    .where(and(isNotNull(runJob.workerId), or(gt(runJob.progressAt, since), gt(runJob.finishedAt, since))))
    .groupBy(runJob.workerId);
  return rows.flatMap((row) => (row.id ? [{ id: row.id, lastSeenAt: new Date(row.lastSeenAt).toISOString(), runningJobs: row.runningJobs }] : []));
}

// ---------------------------------------------------------------------------------------------
// Queuing
// ---------------------------------------------------------------------------------------------

export interface QueueingScene {
  id: string;
  teamId: string;
  studyId: string;
  name: string;
  /** The scene's latest saved version. */
  version: number;
}

async function loadSavedVersion(sceneRecord: QueueingScene, version: number, path: string): Promise<Scene> {
  const data = await getSceneVersionData({ sceneId: sceneRecord.id, version });
  if (data === null) throw new AppError("bad_request:job", `${path}: this scene has no saved version ${version} (the latest is ${sceneRecord.version}).`, [{ path, message: `No saved version ${version}.` }]);
  const parsed = parseScene(data);
  if (!parsed.ok) throw new AppError("bad_request:job", `${path}: version ${version} is not a scene that can be run: ${parsed.problems[0]?.message ?? "it does not parse"}.`, [{ path, message: "This version cannot be run." }]);
  return parsed.scene;
}

function formatCount(value: number): string {
  return value.toExponential(2).replace("e+", "e");
}

/** Refuses a job larger than the per-job limit, naming the field that chose it. */
function checkJobSize(cellSteps: number, path: string, what: string): void {
  const { maxCellStepsPerJob } = queueLimits();
  if (cellSteps > maxCellStepsPerJob) {
    const message = `${what} is ${formatCount(cellSteps)} cell updates (grid cells x time steps); the limit per job is ${formatCount(maxCellStepsPerJob)}. Use a coarser resolution, a smaller domain or a shorter duration.`;
    throw new AppError("bad_request:job", `${path}: ${message}`, [{ path, message }]);
  }
}

/** Refuses more queued or running jobs, or more work in them, than the team may have. */
async function checkActiveJobs(teamId: string, adding: number, addingCellSteps: number): Promise<void> {
  const { maxActiveJobs, maxActiveCellSteps } = queueLimits();
  const active = await activeQueueUse(teamId);
  if (active.jobs + adding > maxActiveJobs) {
    throw new AppError(
      "limit:queue",
      `Your team has ${active.jobs} job${active.jobs === 1 ? "" : "s"} queued or running; the limit is ${maxActiveJobs}${adding > 1 ? `, and this would add ${adding}` : ""}. Wait for some to finish or cancel some.`,
    );
  }
  if (active.cellSteps + addingCellSteps > maxActiveCellSteps) {
    throw new AppError(
      "limit:queue",
      `Your team's queued and running jobs hold ${formatCount(active.cellSteps)} cell updates and this would add ${formatCount(addingCellSteps)}; the limit for a team is ${formatCount(maxActiveCellSteps)}. Wait for some to finish or cancel some.`,
    );
  }
}

interface NewJob {
  row: typeof runJob.$inferInsert;
}

/** Hands each inserted row to pg-boss, in order; if pg-boss refuses, the rows are marked failed and those sent withdrawn. */
async function sendToQueue(rows: { id: string; queueJobId: string; maxAttempts: number }[]): Promise<void> {
  const timings = queueTimings();
  const sent: string[] = [];
  let boss: Awaited<ReturnType<typeof getBoss>> | null = null;
  try {
    boss = await getBoss();
    for (const row of rows) {
      await boss.send(runQueueName, { runJobId: row.id }, { id: row.queueJobId, retryLimit: row.maxAttempts - 1, retryDelay: timings.retryDelaySeconds, retryBackoff: true, expireInSeconds: timings.expireSeconds });
      sent.push(row.queueJobId);
    }
  } catch (error) {
    console.error("[queue] could not send jobs:", error);
    if (boss && sent.length > 0) await boss.cancel(runQueueName, sent).catch(() => undefined);
    const db = await getDb();
    await db
      .update(runJob)
      .set({ state: "failed", message: "The run queue did not accept the job.", finishedAt: new Date() })
      .where(inArray(runJob.id, rows.map((row) => row.id)));
    throw new AppError("unavailable:queue", "The run queue did not accept the job. Try again; if it persists, tell your administrator.");
  }
}

function jobEvent(job: Pick<RunJob, "id" | "teamId" | "studyId" | "sweepId" | "state">): Promise<void> {
  return publishLiveEvent({ kind: "job", teamId: job.teamId, studyId: job.studyId, jobId: job.id, sweepId: job.sweepId, state: job.state, at: new Date().toISOString() });
}

export async function queueRun({
  sceneRecord,
  userId,
  sceneVersion,
  settings,
}: {
  sceneRecord: QueueingScene;
  userId: string;
  sceneVersion?: number;
  settings?: RunSettings;
}): Promise<RunJobItem> {
  const version = sceneVersion ?? sceneRecord.version;
  const frozen = await loadSavedVersion(sceneRecord, version, "sceneVersion");
  const cellSteps = deriveGrid(frozen).cellUpdates;
  checkJobSize(cellSteps, "sceneVersion", `${sceneRecord.name} version ${version}`);
  await checkActiveJobs(sceneRecord.teamId, 1, cellSteps);
  const { maxAttempts } = queueTimings();
  const row: NewJob["row"] = {
    id: newId(),
    teamId: sceneRecord.teamId,
    studyId: sceneRecord.studyId,
    sceneId: sceneRecord.id,
    sceneVersion: version,
    kind: "run",
    label: `${sceneRecord.name} v${version}`,
    scene: frozen,
    settings: settings ?? defaultRunSettings,
    cellSteps,
    queueJobId: newId(),
    maxAttempts,
    createdBy: userId,
  };
  await withDatabaseErrors("queue the run", async () => {
    const db = await getDb();
    await db.insert(runJob).values(row);
  });
  await sendToQueue([{ id: row.id, queueJobId: row.queueJobId!, maxAttempts }]);
  await recordActivity({
    teamId: row.teamId,
    studyId: row.studyId,
    actorId: userId,
    action: "job.queued",
    subjectType: "job",
    subjectId: row.id,
    detail: { sceneName: sceneRecord.name, sceneVersion: version, label: row.label },
  });
  await jobEvent({ id: row.id, teamId: row.teamId, studyId: row.studyId, sweepId: null, state: "queued" });
  return (await getRunJobById({ id: row.id }))!;
}

function plannedLabel(run: PlannedRun, definition: SweepDefinition, referenceCount: number): string {
  if (run.kind === "reference") {
    const n = Number(run.id.split(":")[1] ?? 0) + 1;
    const what = definition.reference.kind === "free-field" ? "free field" : "without the chosen elements";
    return referenceCount > 1 ? `Reference ${n} (${what})` : `Reference (${what})`;
  }
  const value = Number(run.value!.toPrecision(6));
  return `${definition.parameterLabel} = ${value}${definition.unit ? ` ${definition.unit}` : ""}`;
}

export async function queueSweep({ sceneRecord, userId, definition }: { sceneRecord: QueueingScene; userId: string; definition: SweepDefinition }): Promise<{ sweep: SweepBatchItem; jobs: RunJobItem[] }> {
  const base = await loadSavedVersion(sceneRecord, definition.sceneVersion, "definition.sceneVersion");
  const known = new Set(receiverOptions(base).map((receiver) => receiver.id));
  const unknown = definition.receiverIds.findIndex((id) => !known.has(id));
  if (unknown >= 0) {
    const path = `definition.receiverIds[${unknown}]`;
    throw new AppError("bad_request:job", `${path}: version ${definition.sceneVersion} has no receiver "${definition.receiverIds[unknown]}".`, [{ path, message: "No such receiver in this version." }]);
  }
  const planned = planSweep(base, definition.parameter, definition.range, definition.reference);
  if (!planned.ok) {
    const path = `definition.${planned.field}`;
    throw new AppError("bad_request:job", `${path}: ${planned.message}`, [{ path, message: planned.message }]);
  }
  const { plan } = planned;
  const cellSteps = plan.runs.map((run) => deriveGrid(run.scene).cellUpdates);
  checkJobSize(Math.max(...cellSteps), "definition.sceneVersion", `One run of this sweep of ${sceneRecord.name} version ${definition.sceneVersion}`);
  await checkActiveJobs(sceneRecord.teamId, plan.runs.length, cellSteps.reduce((sum, value) => sum + value, 0));

  const { maxAttempts } = queueTimings();
  const sweepId = newId();
  const now = Date.now();
  const label = `${plan.label[0]?.toUpperCase() ?? ""}${plan.label.slice(1)}, ${plan.caseCount} value${plan.caseCount === 1 ? "" : "s"}`;
  const sweepRow: typeof sweepBatch.$inferInsert = {
    id: sweepId,
    teamId: sceneRecord.teamId,
    studyId: sceneRecord.studyId,
    sceneId: sceneRecord.id,
    sceneVersion: definition.sceneVersion,
    definition: { ...definition, sceneName: definition.sceneName || sceneRecord.name },
    label,
    createdBy: userId,
    createdAt: new Date(now),
  };
  const rows: NewJob["row"][] = plan.runs.map((run, index) => ({
    id: newId(),
    teamId: sceneRecord.teamId,
    studyId: sceneRecord.studyId,
    sceneId: sceneRecord.id,
    sceneVersion: definition.sceneVersion,
    kind: run.kind === "reference" ? "sweep-reference" : "sweep-case",
    sweepId,
    sweepRunId: run.id,
    caseIndex: run.caseIndex ?? null,
    label: plannedLabel(run, definition, plan.referenceCount),
    scene: run.scene,
    settings: defaultRunSettings,
    cellSteps: cellSteps[index]!,
    queueJobId: newId(),
    maxAttempts,
    createdBy: userId,
    // One millisecond apart, so the queue's order is the plan's (each reference before its cases).
    createdAt: new Date(now + index),
  }));
  await withDatabaseErrors("queue the sweep", async () => {
    const db = await getDb();
    await db.transaction(async (tx) => {
      await tx.insert(sweepBatch).values(sweepRow);
      await tx.insert(runJob).values(rows);
    });
  });
  await sendToQueue(rows.map((row) => ({ id: row.id, queueJobId: row.queueJobId!, maxAttempts })));
  await recordActivity({
    teamId: sceneRecord.teamId,
    studyId: sceneRecord.studyId,
    actorId: userId,
    action: "sweep.queued",
    subjectType: "sweep",
    subjectId: sweepId,
    detail: { sceneName: sceneRecord.name, sceneVersion: definition.sceneVersion, label, caseCount: plan.caseCount, runCount: plan.runs.length },
  });
  await jobEvent({ id: rows[0]!.id, teamId: sceneRecord.teamId, studyId: sceneRecord.studyId, sweepId, state: "queued" });
  const found = await getSweepById({ id: sweepId });
  return { sweep: found!.sweep, jobs: found!.jobs };
}

// ---------------------------------------------------------------------------------------------
// Cancelling
// ---------------------------------------------------------------------------------------------

/**
 * A queued job is withdrawn from pg-boss and marked cancelled at once; a running one gets
 * cancelRequestedAt, which its worker reads at its next progress write. Returns the rows it touched.
 */
async function cancelJobs(ids: string[], userId: string): Promise<{ withdrawn: RunJob[]; requested: RunJob[] }> {
  const db = await getDb();
  const now = new Date();
  const withdrawn = await db
    .update(runJob)
    .set({ state: "cancelled", cancelRequestedAt: now, cancelledBy: userId, finishedAt: now, message: "Cancelled before it started." })
    .where(and(inArray(runJob.id, ids), eq(runJob.state, "queued")))
    .returning();
  const requested = await db
    .update(runJob)
    .set({ cancelRequestedAt: now, cancelledBy: userId })
    .where(and(inArray(runJob.id, ids), eq(runJob.state, "running"), sql`${runJob.cancelRequestedAt} is null`))
    .returning();
  const queueIds = withdrawn.flatMap((job) => (job.queueJobId ? [job.queueJobId] : []));
  if (queueIds.length > 0) {
    // The row's state is what counts (a worker never runs a cancelled row); pg-boss only saves a fetch.
    await getBoss()
      .then((boss) => boss.cancel(runQueueName, queueIds))
      .catch((error: unknown) => console.error("[queue] could not withdraw cancelled jobs from pg-boss:", error));
  }
  for (const job of [...withdrawn, ...requested]) await jobEvent(job);
  return { withdrawn, requested };
}

export async function cancelRunJob({ id, userId }: { id: string; userId: string }): Promise<RunJobItem> {
  const before = await getRunJobById({ id });
  if (!before) throw new AppError("not_found:job", "No such job.");
  if (finishedStates.includes(before.state)) throw new AppError("conflict:job", `This job has already ${before.state === "completed" ? "completed" : before.state === "failed" ? "failed" : "been cancelled"}; there is nothing to cancel.`);
  const { withdrawn, requested } = await withDatabaseErrors("cancel the job", () => cancelJobs([id], userId));
  if (withdrawn.length + requested.length === 0) {
    const now = await getRunJobById({ id });
    if (now && finishedStates.includes(now.state)) throw new AppError("conflict:job", `This job ${now.state === "completed" ? "completed" : now.state === "failed" ? "failed" : "was cancelled"} just before; there is nothing to cancel.`);
  } else if (before.kind === "run") {
    await recordActivity({
      teamId: before.teamId,
      studyId: before.studyId,
      actorId: userId,
      action: "job.cancelled",
      subjectType: "job",
      subjectId: id,
      detail: { sceneName: before.sceneName, sceneVersion: before.sceneVersion, label: before.label, whileRunning: requested.length > 0 },
    });
  }
  return (await getRunJobById({ id }))!;
}

export async function cancelSweep({ id, userId }: { id: string; userId: string }): Promise<{ sweep: SweepBatchItem; jobs: RunJobItem[] }> {
  const before = await getSweepById({ id });
  if (!before) throw new AppError("not_found:sweep", "No such sweep.");
  if (finishedStates.includes(before.sweep.state)) throw new AppError("conflict:sweep", "This sweep has already finished; there is nothing to cancel.");
  const active = before.jobs.filter((job) => activeStates.includes(job.state)).map((job) => job.id);
  if (active.length > 0) await withDatabaseErrors("cancel the sweep", () => cancelJobs(active, userId));
  await finishSweepIfDone({ sweepId: id });
  const after = await getSweepById({ id });
  return { sweep: after!.sweep, jobs: after!.jobs };
}

// ---------------------------------------------------------------------------------------------
// What workers write
// ---------------------------------------------------------------------------------------------

/** Who is working on an attempt: every write of the attempt is guarded by both. */
export interface AttemptKey {
  jobId: string;
  workerId: string;
  attempt: number;
}

function attemptMatches(key: AttemptKey): SQL {
  return and(eq(runJob.id, key.jobId), eq(runJob.workerId, key.workerId), eq(runJob.attempt, key.attempt), eq(runJob.state, "running"))!;
}

export type ClaimOutcome = { kind: "run"; job: RunJob } | { kind: "skip"; reason: string };

/**
 * Takes a job for an attempt. A job already finished (a late retry of one that completed) or cancelled
 * is not run again; a job whose cancel was asked for while it was handed back is cancelled now.
 */
export async function claimRunJob({ jobId, workerId, attempt }: AttemptKey): Promise<ClaimOutcome> {
  const db = await getDb();
  const now = new Date();
  const [claimed] = await db
    .update(runJob)
    .set({ state: "running", workerId, attempt, startedAt: now, progress: 0, progressAt: now, cellUpdatesPerSecond: null, message: "" })
    .where(and(eq(runJob.id, jobId), inArray(runJob.state, activeStates), sql`${runJob.cancelRequestedAt} is null`))
    .returning();
  if (claimed) {
    // A sweep is running from the moment its first run is.
    if (claimed.sweepId) await db.update(sweepBatch).set({ state: "running" }).where(and(eq(sweepBatch.id, claimed.sweepId), eq(sweepBatch.state, "queued")));
    await jobEvent(claimed);
    return { kind: "run", job: claimed };
  }
  const [current] = await db.select().from(runJob).where(eq(runJob.id, jobId)).limit(1);
  if (!current) return { kind: "skip", reason: "the job no longer exists" };
  if (current.cancelRequestedAt && activeStates.includes(current.state)) {
    await markCancelled({ jobId, message: "Cancelled before it started again." });
    return { kind: "skip", reason: "it was cancelled" };
  }
  return { kind: "skip", reason: `it is already ${current.state}` };
}

/** The receivers a sweep's runs keep: those its definition names, in its order. */
export async function getSweepReceiverIds({ sweepId }: { sweepId: string }): Promise<string[]> {
  const db = await getDb();
  const [row] = await db.select({ definition: sweepBatch.definition }).from(sweepBatch).where(eq(sweepBatch.id, sweepId)).limit(1);
  return row ? (row.definition as SweepDefinition).receiverIds : [];
}

export type ProgressOutcome = "continue" | "cancel" | "superseded";

/** The heartbeat with the attempt's progress. "superseded": another attempt holds the job now, so this one stops. */
export async function writeJobProgress(key: AttemptKey & { progress: number; cellUpdatesPerSecond: number | null }): Promise<ProgressOutcome> {
  const db = await getDb();
  const [row] = await db
    .update(runJob)
    .set({ progress: Math.min(1, Math.max(0, key.progress)), cellUpdatesPerSecond: key.cellUpdatesPerSecond, progressAt: new Date() })
    .where(attemptMatches(key))
    .returning();
  if (!row) return "superseded";
  await jobEvent(row);
  return row.cancelRequestedAt ? "cancel" : "continue";
}

async function markCancelled({ jobId, message }: { jobId: string; message: string }): Promise<void> {
  const db = await getDb();
  const [row] = await db
    .update(runJob)
    .set({ state: "cancelled", finishedAt: new Date(), message })
    .where(and(eq(runJob.id, jobId), inArray(runJob.state, activeStates)))
    .returning();
  if (!row) return;
  await jobEvent(row);
  if (row.sweepId) await finishSweepIfDone({ sweepId: row.sweepId });
}

/** The running attempt stopped on a cancel request. */
export async function markJobCancelledWhileRunning(key: AttemptKey & { progress: number }): Promise<void> {
  await markCancelled({ jobId: key.jobId, message: `Cancelled while running, at ${Math.round(key.progress * 100)}%.` });
}

export type FailureOutcome = "retry" | "failed" | "superseded";

/**
 * Notes a failed attempt. The job goes back to the queue (pg-boss retries it after its backoff) unless
 * this was its last attempt or the failure would repeat (`final`); then it is marked failed.
 */
export async function failJobAttempt(key: AttemptKey & { message: string; final?: boolean }): Promise<FailureOutcome> {
  const db = await getDb();
  const failure: RunJobFailure = { attempt: key.attempt, workerId: key.workerId, message: key.message, at: new Date().toISOString() };
  const [current] = await db.select().from(runJob).where(attemptMatches(key)).limit(1);
  if (!current) return "superseded";
  const last = key.final === true || key.attempt >= current.maxAttempts;
  const [row] = await db
    .update(runJob)
    .set({
      state: last ? "failed" : "queued",
      failures: sql`${runJob.failures} || ${JSON.stringify([failure])}::jsonb`,
      message: last ? key.message : `Attempt ${key.attempt} of ${current.maxAttempts} failed; it will be tried again.`,
      progress: 0,
      cellUpdatesPerSecond: null,
      ...(last ? { finishedAt: new Date() } : {}),
    })
    .where(attemptMatches(key))
    .returning();
  if (!row) return "superseded";
  await jobEvent(row);
  if (last) await announceFailure(row);
  return last ? "failed" : "retry";
}

async function announceFailure(job: RunJob): Promise<void> {
  if (job.kind === "run") {
    const [named] = await (await getDb()).select({ name: scene.name }).from(scene).where(eq(scene.id, job.sceneId ?? "")).limit(1);
    await recordActivity({
      teamId: job.teamId,
      studyId: job.studyId,
      actorId: job.createdBy,
      action: "job.failed",
      subjectType: "job",
      subjectId: job.id,
      detail: { sceneName: named?.name ?? null, sceneVersion: job.sceneVersion, label: job.label, message: job.message.slice(0, 500), attempts: job.attempt },
    });
  }
  if (job.sweepId) await finishSweepIfDone({ sweepId: job.sweepId });
}

/**
 * Running jobs whose worker has not written its heartbeat for `staleSeconds` (killed, frozen, cut off)
 * are handed back to pg-boss as a failed attempt, to be retried by any worker. Returns the jobs rescued.
 */
export async function rescueStaleJobs({ staleSeconds }: { staleSeconds: number }): Promise<string[]> {
  const db = await getDb();
  const threshold = new Date(Date.now() - staleSeconds * 1000);
  const stale = await db
    .select()
    .from(runJob)
    .where(and(eq(runJob.state, "running"), or(lt(runJob.progressAt, threshold), and(sql`${runJob.progressAt} is null`, lt(runJob.startedAt, threshold)))));
  const rescued: string[] = [];
  for (const job of stale) {
    if (!job.workerId) continue;
    const key = { jobId: job.id, workerId: job.workerId, attempt: job.attempt };
    let outcome: FailureOutcome | "cancelled";
    if (job.cancelRequestedAt) {
      await markCancelled({ jobId: job.id, message: "Cancelled; its worker had stopped answering." });
      outcome = "cancelled";
    } else {
      outcome = await failJobAttempt({ ...key, message: `Worker ${job.workerId} stopped answering (no heartbeat for ${Math.round(staleSeconds)} s).` });
    }
    if (outcome === "superseded" || !job.queueJobId) continue;
    const boss = await getBoss();
    // pg-boss puts the job back for a retry (or fails it for good on its last attempt).
    if (outcome === "cancelled") await boss.cancel(runQueueName, job.queueJobId);
    else await boss.fail(runQueueName, job.queueJobId, { message: "worker stopped answering" });
    rescued.push(job.id);
  }
  return rescued;
}

/**
 * Queued rows that pg-boss will never deliver are sent again once they are a minute old: rows it does not
 * know (the process died between storing the row and sending it) under their own id, rows whose pg-boss
 * job has already ended (an attempt handed back after its job was closed) under a new one.
 */
export async function resendOrphanedJobs(): Promise<string[]> {
  const db = await getDb();
  const rows = await db
    .select({ id: runJob.id, queueJobId: runJob.queueJobId, maxAttempts: runJob.maxAttempts })
    .from(runJob)
    .where(and(eq(runJob.state, "queued"), lt(runJob.createdAt, new Date(Date.now() - 60_000))));
  const boss = await getBoss();
  const orphans: { id: string; queueJobId: string; maxAttempts: number }[] = [];
  for (const row of rows) {
    const known = row.queueJobId ? await boss.getJobById(runQueueName, row.queueJobId) : null;
    if (known && !["completed", "failed", "cancelled"].includes(known.state)) continue;
    const queueJobId = row.queueJobId && !known ? row.queueJobId : newId();
    if (queueJobId !== row.queueJobId) await db.update(runJob).set({ queueJobId }).where(eq(runJob.id, row.id));
    orphans.push({ id: row.id, queueJobId, maxAttempts: row.maxAttempts });
  }
  if (orphans.length > 0) await sendToQueue(orphans);
  return orphans.map((orphan) => orphan.id);
}

/**
 * Stores a plain run's result as a browser-saved run (the same checks, then createRun) and links it to
 * the job in the same transaction. The job's row is locked first: a second attempt that finishes too
 * (two workers raced after a rescue) finds the run already linked and stores nothing.
 */
export async function completeRunJob(key: AttemptKey & { bytes: Uint8Array; cellUpdatesPerSecond: number | null }): Promise<{ stored: true; runId: string } | { stored: false; reason: string }> {
  const db = await getDb();
  const [job] = await db.select().from(runJob).where(eq(runJob.id, key.jobId)).limit(1);
  if (!job) return { stored: false, reason: "the job no longer exists" };
  if (!job.sceneId) return { stored: false, reason: "its scene was deleted" };
  if (!job.createdBy) return { stored: false, reason: "the person who queued it has left" };
  const checked = await checkRunUpload({ sceneId: job.sceneId, bytes: key.bytes });
  const { header } = checked.run;
  const [named] = await db.select({ name: scene.name }).from(scene).where(eq(scene.id, job.sceneId)).limit(1);
  const sceneName = named?.name ?? job.label;
  let saved: string;
  try {
    const record = await createRun(
      {
        teamId: job.teamId,
        studyId: job.studyId,
        sceneId: job.sceneId,
        sceneVersion: header.sceneVersion,
        sceneSnapshot: checked.scene,
        settings: header.settings,
        inputHash: header.inputHash,
        solverVersion: header.solverVersion,
        status: "completed",
        statusMessage: "",
        summary: checked.summary,
        resultData: key.bytes,
        createdBy: job.createdBy,
        sceneName,
      },
      {
        inTransaction: async (tx, runId) => {
          // Whichever attempt takes this lock second waits for the first to commit, then sees its run.
          const [locked] = await tx.select().from(runJob).where(eq(runJob.id, key.jobId)).for("update");
          if (!locked || locked.runId !== null || locked.state === "completed") throw new AlreadyDone("already completed");
          if (locked.state === "cancelled" || locked.state === "failed") throw new AlreadyDone(`it was ${locked.state} meanwhile`);
          const now = new Date();
          await tx
            .update(runJob)
            .set({ state: "completed", runId, progress: 1, progressAt: now, finishedAt: now, message: "", ...(key.cellUpdatesPerSecond ? { cellUpdatesPerSecond: key.cellUpdatesPerSecond } : {}) })
            .where(eq(runJob.id, key.jobId));
        },
      },
    );
    saved = record.id;
  } catch (error) {
    if (error instanceof AlreadyDone) return { stored: false, reason: error.message };
    throw error;
  }
  await recordActivity({
    teamId: job.teamId,
    studyId: job.studyId,
    actorId: job.createdBy,
    action: "job.completed",
    subjectType: "job",
    subjectId: job.id,
    runId: saved,
    detail: { sceneName, sceneVersion: job.sceneVersion, label: job.label, workerId: key.workerId, attempt: key.attempt },
  });
  await jobEvent({ ...job, state: "completed" });
  return { stored: true, runId: saved };
}

/**
 * Thrown inside the storing transaction when the job already has its run: the transaction rolls back.
 * An AppError, so that createRun's error wrapping passes it through unchanged.
 */
class AlreadyDone extends AppError {
  constructor(reason: string) {
    super("conflict:job", reason);
  }
}

/** A sweep run's traces; the sweep's chart is written when its last job ends. */
export async function completeSweepJob(key: AttemptKey & { traces: Uint8Array; cellUpdatesPerSecond: number | null }): Promise<{ stored: boolean; reason?: string }> {
  const db = await getDb();
  const [row] = await db
    .update(runJob)
    .set({ state: "completed", resultTraces: key.traces, progress: 1, progressAt: new Date(), cellUpdatesPerSecond: key.cellUpdatesPerSecond, finishedAt: new Date(), message: "" })
    .where(and(eq(runJob.id, key.jobId), inArray(runJob.state, activeStates), sql`${runJob.cancelRequestedAt} is null`))
    .returning();
  if (!row) return { stored: false, reason: "already completed or cancelled" };
  await jobEvent(row);
  if (row.sweepId) await finishSweepIfDone({ sweepId: row.sweepId });
  return { stored: true };
}

// ---------------------------------------------------------------------------------------------
// Finishing a sweep
// ---------------------------------------------------------------------------------------------

function sweepResultsOf(sweep: SweepBatch, base: Scene, jobs: RunJob[]): { content: unknown; done: number } | { error: string } {
  const definition = sweep.definition as SweepDefinition;
  const planned = planSweep(base, definition.parameter, definition.range, definition.reference);
  if (!planned.ok) return { error: planned.message };
  const byRunId = new Map(jobs.map((job) => [job.sweepRunId, job]));
  const references = new Map<string, PressureTrace[]>();
  const failedReferences = new Map<string, string>();
  const tracesOf = (job: RunJob | undefined): PressureTrace[] | string => {
    if (!job) return "it was not queued";
    if (job.state === "failed") return job.message || "it failed";
    if (job.state !== "completed" || !job.resultTraces) return "";
    const unpacked = unpackTraces(job.resultTraces);
    return unpacked.ok ? unpacked.traces : unpacked.message;
  };
  for (const run of planned.plan.runs.filter((r) => r.kind === "reference")) {
    const traces = tracesOf(byRunId.get(run.id));
    if (typeof traces === "string") {
      if (traces) failedReferences.set(run.id, traces);
    } else references.set(run.id, traces);
  }
  const cases: CaseState[] = [];
  const values: number[] = [];
  for (const run of planned.plan.runs.filter((r) => r.kind === "case")) {
    values.push(run.value!);
    const referenceProblem = run.referenceId ? failedReferences.get(run.referenceId) : undefined;
    const traces = tracesOf(byRunId.get(run.id));
    if (referenceProblem !== undefined) cases.push({ status: "failed", message: `its reference run failed: ${referenceProblem}` });
    else if (typeof traces === "string") cases.push(traces ? { status: "failed", message: traces } : { status: "not-run" });
    else cases.push({ status: "done", referenceId: run.referenceId!, traces });
  }
  const receivers = receiverOptions(base).filter((receiver) => definition.receiverIds.includes(receiver.id));
  const results = sweepInsertionLoss({
    values,
    cases,
    references,
    receivers,
    bandsPerOctave: definition.bandsPerOctave,
    weighting: definition.weighting,
    highestResolvedFrequency: deriveGrid(base).maxResolvedFrequency,
    completedAt: new Date().toISOString(),
  });
  const checked = chartContentSchema.safeParse({ runIds: [], quantity: "sweep", sweep: { definition, results } });
  if (!checked.success) return { error: `the result cannot be kept: ${checked.error.issues[0]?.message ?? "it is not valid"}` };
  return { content: checked.data, done: results.outcomes.filter((outcome) => outcome.status === "done").length };
}

/**
 * When no job of the sweep is queued or running any more: its result becomes a sweep chart block at the
 * end of the notebook (the same content as a sweep run in the browser and saved), once. The sweep's row
 * is locked while this is decided, so two jobs ending together write one block.
 */
export async function finishSweepIfDone({ sweepId }: { sweepId: string }): Promise<void> {
  const db = await getDb();
  const [first] = await db.select().from(sweepBatch).where(eq(sweepBatch.id, sweepId)).limit(1);
  if (!first || finishedStates.includes(first.state)) return;
  // Read outside the transaction: on PGlite a read through getDb() inside it would wait for it forever.
  const data = first.sceneId ? await getSceneVersionData({ sceneId: first.sceneId, version: first.sceneVersion }) : null;
  const base = data === null ? null : parseScene(data);
  let written: { activityRow: ReturnType<typeof activityRow> } | null = null;
  await db.transaction(async (tx) => {
    const [sweep] = await tx.select().from(sweepBatch).where(eq(sweepBatch.id, sweepId)).for("update");
    if (!sweep || finishedStates.includes(sweep.state) || sweep.blockId) return;
    const jobs = await tx.select().from(runJob).where(eq(runJob.sweepId, sweepId));
    if (jobs.some((job) => activeStates.includes(job.state))) return;
    const cancelled = jobs.some((job) => job.state === "cancelled");
    const outcome = !base || !base.ok ? { error: "its scene version was deleted" } : sweepResultsOf(sweep, base.scene, jobs);
    let blockId: string | null = null;
    let state: RunJobState;
    let message = "";
    if ("error" in outcome) {
      state = cancelled ? "cancelled" : "failed";
      message = `No result was written: ${outcome.error}.`;
    } else if (outcome.done === 0) {
      state = cancelled ? "cancelled" : "failed";
      message = cancelled ? "Cancelled before any case finished." : "No case of the sweep could be computed.";
    } else {
      blockId = newId();
      const [last] = await tx.select({ position: sql<number>`coalesce(max(${studyBlock.position}), 0)`.mapWith(Number) }).from(studyBlock).where(eq(studyBlock.studyId, sweep.studyId));
      await tx.insert(studyBlock).values({ id: blockId, studyId: sweep.studyId, kind: "chart", position: (last?.position ?? 0) + blockPositionGap, content: outcome.content, createdBy: sweep.createdBy, updatedBy: sweep.createdBy });
      state = cancelled ? "cancelled" : "completed";
      const caseCount = jobs.filter((job) => job.kind === "sweep-case").length;
      message = outcome.done === caseCount ? "" : `${outcome.done} of ${caseCount} cases finished.`;
    }
    await tx.update(sweepBatch).set({ state, message, blockId, finishedAt: new Date() }).where(eq(sweepBatch.id, sweepId));
    const row = activityRow({
      teamId: sweep.teamId,
      studyId: sweep.studyId,
      actorId: sweep.createdBy,
      action: "sweep.completed",
      subjectType: "sweep",
      subjectId: sweepId,
      detail: { label: sweep.label, state, message, blockId, sceneName: (sweep.definition as SweepDefinition).sceneName },
    });
    await tx.insert(activity).values(row);
    written = { activityRow: row };
  });
  const done = written as { activityRow: ReturnType<typeof activityRow> } | null;
  if (done) await publishActivity(done.activityRow);
}
