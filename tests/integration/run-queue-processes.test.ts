// The run queue on a real PostgreSQL server with real worker processes (`npm run worker`): two workers
// share a six-case sweep, one is killed with SIGKILL in the middle of a job and the sweep still
// completes with every job done once and its chart written once; cancel stops a running job; a server
// run's traces equal those of the same scene run by `npm run simulate`, bit for bit.
// Needs RAREFACT_TEST_POSTGRES_URL (tests/run-unit.mjs and .ci/run start a throwaway cluster); each run
// makes a fresh database on that cluster and drops it afterwards.
import "../helpers/test-database";
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { and, eq, sql } from "drizzle-orm";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as jobCancelRoute from "@/app/api/jobs/[jobId]/cancel/route";
import * as jobRoute from "@/app/api/jobs/[jobId]/route";
import * as runResultRoute from "@/app/api/runs/[runId]/result/route";
import * as sceneJobsRoute from "@/app/api/scenes/[sceneId]/jobs/route";
import * as sceneSweepsRoute from "@/app/api/scenes/[sceneId]/sweeps/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as sweepRoute from "@/app/api/sweeps/[sweepId]/route";
import { closeDb, getDb } from "@/db/client";
import { activity, run, runJob, studyBlock } from "@/db/schema";
import type { TeamRole } from "@/lib/access/roles";
import type { SceneRecord } from "@/lib/http/api-types";
import type { RunJobItem, SweepBatchItem } from "@/lib/http/job-types";
import { decodeRunPayload } from "@/lib/run-record/payload";
import { stopBoss } from "@/lib/server/run-queue/boss";
import { callRoute, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";

const postgresUrl = process.env.RAREFACT_TEST_POSTGRES_URL;
const repo = resolve(__dirname, "../..");

/** Timings short enough for a test: a silent worker's job is handed back after 5 s, retried after 1-2 s. */
const queueEnv = {
  RAREFACT_QUEUE_STALE_SECONDS: "5",
  RAREFACT_QUEUE_RETRY_DELAY_SECONDS: "1",
  RAREFACT_QUEUE_POLL_SECONDS: "0.5",
  RAREFACT_QUEUE_PROGRESS_SECONDS: "0.5",
  RAREFACT_WORKER_THREADS: "1",
  RAREFACT_WORKER_STOP_GRACE_SECONDS: "2",
};

/**
 * A barrier scene of 440 x 220 cells (1 cm, PML included): about 2 s per run on one thread of a
 * shared CI machine, long enough to kill a worker in the middle of one.
 */
function barrierScene(seconds: number) {
  return {
    version: 1,
    name: "Queue process scene",
    domain: { width: 4, height: 2 },
    resolution: { kind: "cellSize", cellSize: 0.01 },
    boundary: { bottom: { kind: "rigid" } },
    geometry: { walls: [{ id: "barrier", label: "Barrier", path: [{ x: 2, y: 0 }, { x: 2, y: 1 }], thickness: 0.04 }] },
    sources: [{ id: "src", label: "Source", position: { x: 0.8, y: 0.3 }, signal: { kind: "ricker", peakFrequency: 600 } }],
    receivers: [{ id: "behind", label: "Behind", position: { x: 3.2, y: 0.5 } }],
    duration: { kind: "time", seconds },
  };
}

interface WorkerProcess {
  child: ChildProcess;
  /** The id the worker writes into the jobs it takes (host:pid:random). */
  id: Promise<string>;
  output: string[];
}

/** `npm run worker` in a process group of its own, so that SIGKILL reaches npm, tsx and node alike. */
function startWorker(databaseUrl: string, name: string): WorkerProcess {
  const child = spawn("npm", ["run", "--silent", "worker"], { cwd: repo, detached: true, env: { ...process.env, ...queueEnv, DATABASE_URL: databaseUrl }, stdio: ["ignore", "pipe", "pipe"] });
  const output: string[] = [];
  const id = new Promise<string>((resolveId, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker ${name} did not start: ${output.join("")}`)), 60_000);
    const read = (chunk: Buffer) => {
      const text = chunk.toString();
      output.push(text);
      const found = /worker (\S+) is taking jobs/.exec(output.join(""));
      if (found) {
        clearTimeout(timer);
        resolveId(found[1]!);
      }
    };
    child.stdout!.on("data", read);
    child.stderr!.on("data", read);
    child.once("exit", (code) => reject(new Error(`worker ${name} exited (${code}): ${output.join("")}`)));
  });
  id.catch(() => undefined);
  return { child, id, output };
}

function signalGroup(worker: WorkerProcess, signal: NodeJS.Signals): void {
  try {
    process.kill(-worker.child.pid!, signal);
  } catch {
    // Already gone.
  }
}

function exited(worker: WorkerProcess): Promise<void> {
  return new Promise((done) => (worker.child.exitCode !== null || worker.child.signalCode !== null ? done() : worker.child.once("exit", () => done())));
}

async function until<T>(what: string, read: () => Promise<T>, done: (value: T) => boolean, timeoutMs: number): Promise<T> {
  const start = Date.now();
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (Date.now() - start > timeoutMs) throw new Error(`timed out waiting for ${what}: ${JSON.stringify(value).slice(0, 2000)}`);
    await new Promise((wait) => setTimeout(wait, 200));
  }
}

const finished = (state: string) => state === "completed" || state === "failed" || state === "cancelled";

describe("worker processes on a PostgreSQL server", () => {
  if (!postgresUrl) {
    it.skipIf(process.env.CI !== "true")("needs RAREFACT_TEST_POSTGRES_URL (set by tests/run-unit.mjs and .ci/run)", () => {
      throw new Error("CI must provide RAREFACT_TEST_POSTGRES_URL: tests/run-unit.mjs starts a PostgreSQL cluster for this test");
    });
    return;
  }

  const databaseName = `rarefact_queue_${Date.now().toString(36)}`;
  const databaseUrl = (() => {
    const url = new URL(postgresUrl);
    url.pathname = `/${databaseName}`;
    return url.toString();
  })();
  const work = mkdtempSync(join(tmpdir(), "rarefact-queue-"));
  const workers: WorkerProcess[] = [];
  let cookies = new Map<TeamRole, string>();
  let studyId = "";
  let shortScene: SceneRecord;
  let longScene: SceneRecord;

  const readJob = async (jobId: string) =>
    ((await (await callRoute(jobRoute.GET, { path: `/api/jobs/${jobId}`, params: { jobId }, cookie: cookies.get("viewer") })).json()) as { job: RunJobItem }).job;

  async function createScene(name: string, data: unknown): Promise<SceneRecord> {
    const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie: cookies.get("editor"), body: { name, data } });
    expect(created.status).toBe(201);
    return ((await created.json()) as { scene: SceneRecord }).scene;
  }

  async function queueRun(sceneId: string): Promise<RunJobItem> {
    const response = await callRoute(sceneJobsRoute.POST, { path: `/api/scenes/${sceneId}/jobs`, params: { sceneId }, cookie: cookies.get("editor"), body: {} });
    expect(response.status).toBe(202);
    return ((await response.json()) as { job: RunJobItem }).job;
  }

  beforeAll(async () => {
    const admin = new pg.Client({ connectionString: postgresUrl });
    await admin.connect();
    await admin.query(`create database "${databaseName}"`);
    await admin.end();
    Object.assign(process.env, queueEnv, { DATABASE_URL: databaseUrl });
    ({ cookies, studyId } = await openDemoStudy());
    shortScene = await createScene("Short barrier run", barrierScene(0.2));
    longScene = await createScene("Long barrier run", barrierScene(1.5));
    workers.push(startWorker(databaseUrl, "A"), startWorker(databaseUrl, "B"));
    await Promise.all(workers.map((worker) => worker.id));
  });

  afterAll(async () => {
    workers.forEach((worker) => signalGroup(worker, "SIGTERM"));
    await Promise.race([Promise.all(workers.map(exited)), new Promise((wait) => setTimeout(wait, 10_000))]);
    workers.forEach((worker) => signalGroup(worker, "SIGKILL"));
    await stopBoss({ graceful: false });
    await closeDb();
    delete process.env.DATABASE_URL;
    const admin = new pg.Client({ connectionString: postgresUrl });
    await admin.connect();
    await admin.query(`drop database if exists "${databaseName}" with (force)`);
    await admin.end();
    rmSync(work, { recursive: true, force: true });
  });

  it("completes a six-case sweep over two workers exactly once although one is killed mid-job", async () => {
    const sceneId = shortScene.id;
    const definition = {
      sceneId,
      sceneVersion: shortScene.version,
      sceneName: shortScene.name,
      parameter: { kind: "wall-height", wallId: "barrier" },
      parameterLabel: "height of Barrier",
      unit: "m",
      range: { from: 0.5, to: 1.75, step: 0.25 },
      reference: { kind: "without", removedIds: ["barrier"] },
      bandsPerOctave: 1,
      weighting: "Z",
      receiverIds: ["behind"],
    };
    const response = await callRoute(sceneSweepsRoute.POST, { path: `/api/scenes/${sceneId}/sweeps`, params: { sceneId }, cookie: cookies.get("editor"), body: { definition } });
    expect(response.status).toBe(202);
    const queued = (await response.json()) as { sweep: SweepBatchItem; jobs: RunJobItem[] };
    // Six heights, one shared reference (the barrier is what the reference leaves out).
    expect(queued.sweep).toMatchObject({ caseCount: 6, referenceCount: 1 });
    const sweepId = queued.sweep.id;
    const readSweep = async () => (await (await callRoute(sweepRoute.GET, { path: `/api/sweeps/${sweepId}`, params: { sweepId }, cookie: cookies.get("viewer") })).json()) as { sweep: SweepBatchItem; jobs: RunJobItem[] };

    // Kill worker A in the middle of a job: the job is running on it and part-way through.
    const victim = workers[0]!;
    const victimId = await victim.id;
    const caught = await until(
      "worker A to be part-way through a job",
      readSweep,
      (s) => s.jobs.some((job) => job.state === "running" && job.workerId === victimId && job.progress >= 0.05 && job.progress <= 0.9),
      90_000,
    );
    const killedJob = caught.jobs.find((job) => job.state === "running" && job.workerId === victimId)!;
    signalGroup(victim, "SIGKILL");
    await exited(victim);

    const done = await until("the sweep to finish", readSweep, (s) => finished(s.sweep.state), 150_000);
    expect(done.sweep.state).toBe("completed");
    expect(done.sweep.counts).toMatchObject({ completed: 7, failed: 0, cancelled: 0 });
    const survivorId = await workers[1]!.id;
    const retried = done.jobs.find((job) => job.id === killedJob.id)!;
    // The killed attempt is on record; the next attempt, by the survivor, finished it.
    expect(retried.attempt).toBe(2);
    expect(retried.workerId).toBe(survivorId);
    expect(retried.failures).toHaveLength(1);
    expect(retried.failures[0]).toMatchObject({ attempt: 1, workerId: victimId });
    expect(retried.failures[0]!.message).toMatch(/stopped answering/);

    const db = await getDb();
    const rows = await db.select({ id: runJob.id, traces: runJob.resultTraces, runId: runJob.runId }).from(runJob).where(eq(runJob.sweepId, sweepId));
    expect(rows.every((row) => row.traces !== null && row.runId === null)).toBe(true);
    // One chart block and one announcement for the sweep.
    const blocks = await db.select({ id: studyBlock.id }).from(studyBlock).where(and(eq(studyBlock.studyId, studyId), sql`${studyBlock.content} -> 'sweep' -> 'definition' ->> 'sceneId' = ${sceneId}`));
    expect(blocks.map((block) => block.id)).toEqual([done.sweep.blockId]);
    const announced = await db.select({ id: activity.id }).from(activity).where(and(eq(activity.action, "sweep.completed"), eq(activity.subjectId, sweepId)));
    expect(announced).toHaveLength(1);
  }, 200_000);

  it("stops a running job when it is cancelled, and stores nothing for it", async () => {
    const job = await queueRun(longScene.id);
    await until("the long job to run", () => readJob(job.id), (j) => j.state === "running" && j.progress > 0.02, 60_000);
    const cancel = await callRoute(jobCancelRoute.POST, { method: "POST", path: `/api/jobs/${job.id}/cancel`, params: { jobId: job.id }, cookie: cookies.get("owner") });
    expect(cancel.status).toBe(200);
    expect(((await cancel.json()) as { job: RunJobItem }).job.cancelRequested).toBe(true);
    const stopped = await until("the job to stop", () => readJob(job.id), (j) => finished(j.state), 30_000);
    expect(stopped).toMatchObject({ state: "cancelled", runId: null });
    expect(stopped.progress).toBeLessThan(0.9);
    expect(stopped.message).toMatch(/Cancelled while running/);
    const db = await getDb();
    expect(await db.select({ id: run.id }).from(run).where(eq(run.sceneId, longScene.id))).toHaveLength(0);
  });

  it("stores a server run whose traces equal those of npm run simulate on the same scene, bit for bit", async () => {
    const job = await queueRun(shortScene.id);
    const done = await until("the run to complete", () => readJob(job.id), (j) => finished(j.state), 90_000);
    expect(done.state).toBe("completed");
    const result = await runResultRoute.GET(new Request(`${testOrigin}/api/runs/${done.runId}/result`, { headers: { origin: testOrigin, cookie: cookies.get("viewer")! } }), {
      params: Promise.resolve({ runId: done.runId! }),
    });
    const decoded = decodeRunPayload(new Uint8Array(await result.arrayBuffer()));
    if (!decoded.ok) throw new Error(decoded.message);

    const scenePath = join(work, "scene.json");
    writeFileSync(scenePath, JSON.stringify(shortScene.data));
    const cli = spawnSync("npm", ["run", "--silent", "simulate", "--", scenePath, "--out", join(work, "cli"), "--quiet"], { cwd: repo, encoding: "utf8" });
    expect(cli.status, cli.stderr).toBe(0);
    const traces = JSON.parse(readFileSync(join(work, "cli", "traces.json"), "utf8")) as { receivers: { id: string; pressure: number[]; velocityX: number[]; velocityY: number[] }[] };
    expect(decoded.run.receivers.map((r) => r.id)).toEqual(traces.receivers.map((r) => r.id));
    const bits = (values: ArrayLike<number>) => Buffer.from(Float32Array.from(values).buffer).toString("base64");
    decoded.run.receivers.forEach((trace, r) => {
      const cliTrace = traces.receivers[r]!;
      expect(bits(trace.pressure)).toBe(bits(cliTrace.pressure));
      expect(bits(trace.velocityX)).toBe(bits(cliTrace.velocityX));
      expect(bits(trace.velocityY)).toBe(bits(cliTrace.velocityY));
    });
  });
});
