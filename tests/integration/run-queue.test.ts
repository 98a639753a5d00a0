// The run queue on the embedded database: queuing with its limits, cancelling, and the in-process
// worker running a real scene and storing it exactly as a browser-saved run (traces bit for bit).
import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as jobCancelRoute from "@/app/api/jobs/[jobId]/cancel/route";
import * as jobRoute from "@/app/api/jobs/[jobId]/route";
import * as runRoute from "@/app/api/runs/[runId]/route";
import * as runResultRoute from "@/app/api/runs/[runId]/result/route";
import * as sceneJobsRoute from "@/app/api/scenes/[sceneId]/jobs/route";
import * as sceneSweepsRoute from "@/app/api/scenes/[sceneId]/sweeps/route";
import * as studyJobsRoute from "@/app/api/studies/[studyId]/jobs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as blocksRoute from "@/app/api/studies/[studyId]/blocks/route";
import * as sweepRoute from "@/app/api/sweeps/[sweepId]/route";
import { eq } from "drizzle-orm";
import { closeDb, getDb } from "@/db/client";
import { completeRunJob, resendOrphanedJobs } from "@/db/queries/run-jobs";
import { run as runTable, runJob } from "@/db/schema";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { runScene } from "@/lib/fdtd/simulation";
import type { BlockItem, RunRecord, SceneRecord } from "@/lib/http/api-types";
import type { RunJobItem, StudyQueueResponse, SweepBatchItem } from "@/lib/http/job-types";
import { decodeRunPayload } from "@/lib/run-record/payload";
import { getBoss, stopBoss } from "@/lib/server/run-queue/boss";
import { runQueueName } from "@/lib/server/run-queue/settings";
import { startRunWorker, type RunWorker } from "@/lib/server/run-queue/worker";
import { chartContentSchema, type SweepDefinition } from "@/lib/validation/blocks";
import { callRoute } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinySceneInput } from "../run-record/fixtures";

// Short timings, so that a test sees a worker's writes within a second or two.
process.env.RAREFACT_QUEUE_POLL_SECONDS = "0.5";
process.env.RAREFACT_QUEUE_PROGRESS_SECONDS = "0.5";
process.env.RAREFACT_QUEUE_RETRY_DELAY_SECONDS = "1";
process.env.RAREFACT_WORKER_THREADS = "1";

let cookies = new Map<TeamRole, string>();
let studyId = "";
let sceneRecord: SceneRecord;
let worker: RunWorker | null = null;

async function json<T>(response: Response, status: number): Promise<T> {
  const body = (await response.json()) as T;
  if (response.status !== status) throw new Error(`expected ${status}, got ${response.status}: ${JSON.stringify(body)}`);
  return body;
}

function queueRun(role: TeamRole, body: unknown = {}): Promise<Response> {
  const sceneId = sceneRecord.id;
  return callRoute(sceneJobsRoute.POST, { path: `/api/scenes/${sceneId}/jobs`, params: { sceneId }, cookie: cookies.get(role), body });
}

function cancelJob(role: TeamRole, jobId: string): Promise<Response> {
  return callRoute(jobCancelRoute.POST, { method: "POST", path: `/api/jobs/${jobId}/cancel`, params: { jobId }, cookie: cookies.get(role) });
}

async function readJob(jobId: string): Promise<RunJobItem> {
  return (await json<{ job: RunJobItem }>(await callRoute(jobRoute.GET, { path: `/api/jobs/${jobId}`, params: { jobId }, cookie: cookies.get("viewer") }), 200)).job;
}

async function until<T>(what: string, read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 90_000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (Date.now() - start > timeoutMs) throw new Error(`timed out waiting for ${what}: ${JSON.stringify(value)}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

function withEnv<T>(name: string, value: string, work: () => Promise<T>): Promise<T> {
  process.env[name] = value;
  return work().finally(() => delete process.env[name]);
}

beforeAll(async () => {
  ({ cookies, studyId } = await openDemoStudy());
  const created = await callRoute(studyScenesRoute.POST, {
    path: `/api/studies/${studyId}/scenes`,
    params: { studyId },
    cookie: cookies.get("editor"),
    body: { name: "Queue check", data: tinySceneInput() },
  });
  sceneRecord = (await json<{ scene: SceneRecord }>(created, 201)).scene;
});
afterAll(async () => {
  await worker?.stop({ graceMs: 1000 });
  await stopBoss({ graceful: false });
  await closeDb();
});

describe("queuing server runs", () => {
  it("queues a run of the latest saved version with its size, place and creator, and lists it in the study's queue", async () => {
    const { job } = await json<{ job: RunJobItem }>(await queueRun("editor"), 202);
    expect(job).toMatchObject({ state: "queued", kind: "run", sceneId: sceneRecord.id, sceneVersion: sceneRecord.version, attempt: 0, runId: null, label: `Queue check v${sceneRecord.version}` });
    expect(job.position).toBeGreaterThanOrEqual(1);
    // 2 cm cells over 1.2 m x 0.6 m plus 8 PML cells on three sides; 0.004 s of steps.
    expect(job.cellSteps).toBeGreaterThan(1000);
    const queue = await json<StudyQueueResponse>(await callRoute(studyJobsRoute.GET, { path: `/api/studies/${studyId}/jobs`, params: { studyId }, cookie: cookies.get("viewer") }), 200);
    expect(queue.jobs.map((j) => j.id)).toContain(job.id);
    expect(queue.limits).toMatchObject({ maxActiveJobs: 60, maxCellStepsPerJob: 2e11, maxActiveCellSteps: 2e12 });
    expect(queue.limits.activeCellSteps).toBeGreaterThanOrEqual(job.cellSteps);
    expect(queue.limits.activeJobs).toBeGreaterThanOrEqual(1);
    // pg-boss holds the job that will deliver it to a worker; cancelling withdraws it there too.
    expect((await queueJobOf(job.id))?.state).toBe("created");
    await json(await cancelJob("owner", job.id), 200);
    expect((await queueJobOf(job.id))?.state).toBe("cancelled");
  });

  it("cancels a queued job at once, withdraws it from pg-boss, and answers 409 to a second cancel", async () => {
    const { job } = await json<{ job: RunJobItem }>(await queueRun("owner"), 202);
    const cancelled = (await json<{ job: RunJobItem }>(await cancelJob("editor", job.id), 200)).job;
    expect(cancelled).toMatchObject({ state: "cancelled", cancelRequested: true, position: null });
    const again = await cancelJob("editor", job.id);
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: { code: string } }).error.code).toBe("conflict:job");
  });

  it("refuses a job larger than the per-job limit with 400 naming sceneVersion and the figures", async () => {
    const response = await withEnv("RAREFACT_QUEUE_MAX_CELL_STEPS", "1000", () => queueRun("editor"));
    const body = await json<{ error: { code: string; message: string; issues: { path: string }[] } }>(response, 400);
    expect(body.error.code).toBe("bad_request:job");
    expect(body.error.issues[0]!.path).toBe("sceneVersion");
    expect(body.error.message).toMatch(/limit per job is 1\.00e3/);
  });

  it("refuses more active jobs than the team may have with 409 limit:queue, saying the limit", async () => {
    const first = (await json<{ job: RunJobItem }>(await queueRun("editor"), 202)).job;
    const response = await withEnv("RAREFACT_QUEUE_MAX_ACTIVE_JOBS", "1", () => queueRun("editor"));
    const body = await json<{ error: { code: string; message: string } }>(response, 409);
    expect(body.error.code).toBe("limit:queue");
    expect(body.error.message).toMatch(/the limit is 1/);
    await json(await cancelJob("editor", first.id), 200);
  });

  it("refuses more work in the queue than the team may have with 409 limit:queue, saying the figures", async () => {
    const first = (await json<{ job: RunJobItem }>(await queueRun("editor"), 202)).job;
    // Room for the first job and a bit more, not for a second of the same size.
    const allowance = String(Math.round(first.cellSteps * 1.5));
    const response = await withEnv("RAREFACT_QUEUE_MAX_TEAM_CELL_STEPS", allowance, () => queueRun("editor"));
    const body = await json<{ error: { code: string; message: string } }>(response, 409);
    expect(body.error.code).toBe("limit:queue");
    expect(body.error.message).toMatch(/the limit for a team is/);
    await json(await cancelJob("editor", first.id), 200);
  });

  it("refuses a version that was never saved and a sweep of another scene, naming the field", async () => {
    const missing = await json<{ error: { issues: { path: string }[] } }>(await queueRun("editor", { sceneVersion: 99 }), 400);
    expect(missing.error.issues[0]!.path).toBe("sceneVersion");
    const sceneId = sceneRecord.id;
    const other = { ...sweepDefinition(), sceneId: "7d1e2f3a-4b5c-4d6e-8f70-8192a3b4c5d6" };
    const response = await callRoute(sceneSweepsRoute.POST, { path: `/api/scenes/${sceneId}/sweeps`, params: { sceneId }, cookie: cookies.get("editor"), body: { definition: other } });
    const body = await json<{ error: { issues: { path: string }[] } }>(response, 400);
    expect(body.error.issues[0]!.path).toBe("definition.sceneId");
  });

  it("sends a queued job that pg-boss lost again, under its own id", async () => {
    const { job } = await json<{ job: RunJobItem }>(await queueRun("editor"), 202);
    const [row] = await (await getDb()).select({ queueJobId: runJob.queueJobId }).from(runJob).where(eq(runJob.id, job.id));
    await (await getBoss()).deleteJob(runQueueName, row!.queueJobId!);
    expect(await queueJobOf(job.id)).toBeNull();
    // Younger than a minute: it may still be on its way to pg-boss, so it is left alone.
    expect(await resendOrphanedJobs()).not.toContain(job.id);
    await (await getDb()).update(runJob).set({ createdAt: new Date(Date.now() - 120_000) }).where(eq(runJob.id, job.id));
    expect(await resendOrphanedJobs()).toContain(job.id);
    expect((await queueJobOf(job.id))?.state).toBe("created");
    await json(await cancelJob("editor", job.id), 200);
  });

  it("refuses viewers and reviewers (403)", async () => {
    expect((await queueRun("viewer")).status).toBe(403);
    expect((await queueRun("reviewer")).status).toBe(403);
  });
});

function fetchResult(runId: string): Promise<Response> {
  return runResultRoute.GET(new Request(`http://localhost:3000/api/runs/${runId}/result`, { headers: { origin: "http://localhost:3000", cookie: cookies.get("viewer")! } }), {
    params: Promise.resolve({ runId }),
  });
}

/** pg-boss's job behind a run_job row. */
async function queueJobOf(jobId: string) {
  const [row] = await (await getDb()).select({ queueJobId: runJob.queueJobId }).from(runJob).where(eq(runJob.id, jobId));
  return (await getBoss()).getJobById(runQueueName, row!.queueJobId!);
}

function sweepDefinition(): SweepDefinition {
  return {
    sceneId: sceneRecord.id,
    sceneVersion: sceneRecord.version,
    sceneName: sceneRecord.name,
    parameter: { kind: "receiver-height", receiverId: "rx" },
    parameterLabel: "height of Behind the block",
    unit: "m",
    range: { from: 0.1, to: 0.2, step: 0.1 },
    reference: { kind: "free-field" },
    bandsPerOctave: 1,
    weighting: "Z",
    receiverIds: ["rx"],
  };
}

describe("the in-process worker", () => {
  it("runs a queued run and stores it as a browser-saved run whose traces equal a direct run bit for bit", async () => {
    worker = await startRunWorker({ log: () => undefined, threads: 1 });
    const { job } = await json<{ job: RunJobItem }>(await queueRun("editor"), 202);
    const done = await until("the job to finish", () => readJob(job.id), (j) => j.state !== "queued" && j.state !== "running");
    expect(done).toMatchObject({ state: "completed", attempt: 1, progress: 1, workerId: worker.id, failures: [] });
    expect(done.runId).not.toBeNull();

    const run = (await json<{ run: RunRecord }>(await callRoute(runRoute.GET, { path: `/api/runs/${done.runId}`, params: { runId: done.runId! }, cookie: cookies.get("viewer") }), 200)).run;
    expect(run).toMatchObject({ status: "completed", sceneId: sceneRecord.id, sceneVersion: sceneRecord.version, createdById: done.createdBy!.id });
    const result = await fetchResult(run.id);
    expect(result.status).toBe(200);
    const decoded = decodeRunPayload(new Uint8Array(await result.arrayBuffer()));
    if (!decoded.ok) throw new Error(decoded.message);
    const direct = runScene(parseSceneOrThrow(sceneRecord.data));
    expect(decoded.run.receivers.map((r) => r.id)).toEqual(direct.receivers.map((r) => r.id));
    decoded.run.receivers.forEach((trace, r) => {
      expect(Buffer.from(trace.pressure.buffer, trace.pressure.byteOffset, trace.pressure.byteLength).equals(Buffer.from(direct.receivers[r]!.pressure.buffer, direct.receivers[r]!.pressure.byteOffset, direct.receivers[r]!.pressure.byteLength))).toBe(true);
    });
    expect(decoded.run.header.run.stepsRun).toBe(direct.stepsRun);

    // A second attempt that finished too (two workers raced after a hand-back) stores nothing.
    const before = await (await getDb()).select({ id: runTable.id }).from(runTable).where(eq(runTable.sceneId, sceneRecord.id));
    const raced = await completeRunJob({ jobId: job.id, workerId: "other-host:1:abcdef", attempt: 2, bytes: new Uint8Array(await (await fetchResult(run.id)).arrayBuffer()), cellUpdatesPerSecond: null });
    expect(raced).toEqual({ stored: false, reason: "already completed" });
    const after = await (await getDb()).select({ id: runTable.id }).from(runTable).where(eq(runTable.sceneId, sceneRecord.id));
    expect(after).toHaveLength(before.length);
    expect((await readJob(job.id)).runId).toBe(done.runId);
  });

  it("runs a server sweep and writes its insertion-loss chart into the notebook once", async () => {
    const sceneId = sceneRecord.id;
    const response = await callRoute(sceneSweepsRoute.POST, { path: `/api/scenes/${sceneId}/sweeps`, params: { sceneId }, cookie: cookies.get("editor"), body: { definition: sweepDefinition() } });
    const queued = await json<{ sweep: SweepBatchItem; jobs: RunJobItem[] }>(response, 202);
    // A moved receiver is in every reference: one reference per case.
    expect(queued.sweep).toMatchObject({ caseCount: 2, referenceCount: 2, state: "queued" });
    expect(queued.jobs.map((j) => j.kind)).toEqual(["sweep-reference", "sweep-case", "sweep-reference", "sweep-case"]);
    const sweepId = queued.sweep.id;
    const read = async () => json<{ sweep: SweepBatchItem; jobs: RunJobItem[] }>(await callRoute(sweepRoute.GET, { path: `/api/sweeps/${sweepId}`, params: { sweepId }, cookie: cookies.get("viewer") }), 200);
    const done = await until("the sweep to finish", read, (s) => s.sweep.state !== "queued" && s.sweep.state !== "running" && s.sweep.blockId !== null, 120_000);
    expect(done.sweep).toMatchObject({ state: "completed", counts: { completed: 4 } });
    const blocks = (await json<{ blocks: BlockItem[] }>(await callRoute(blocksRoute.GET, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookies.get("viewer") }), 200)).blocks;
    const sweepBlocks = blocks.filter((b) => b.kind === "chart" && (b.content as { sweep?: { definition?: { sceneId?: string } } }).sweep?.definition?.sceneId === sceneId);
    expect(sweepBlocks.map((b) => b.id)).toEqual([done.sweep.blockId]);
    const content = chartContentSchema.parse(sweepBlocks[0]!.content);
    expect(content.sweep!.results.values).toEqual([0.1, 0.2]);
    expect(content.sweep!.results.outcomes.map((o) => o.status)).toEqual(["done", "done"]);
    expect(content.sweep!.results.overall.flat().every((value) => value !== null)).toBe(true);
  });
});
