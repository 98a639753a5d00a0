// npm run bench:queue [-- --cases N --seconds S]: sweep throughput of the run queue with one, then two
// `npm run worker` processes on a PostgreSQL server. Uses DATABASE_URL when given (a fresh database is
// made on that server and dropped afterwards), else a throwaway cluster (tests/support/postgres-cluster.mjs).
// Each sweep varies the height of a barrier in a 4 m x 2 m scene at 1 cm cells; every job steps on
// RAREFACT_WORKER_THREADS threads (1 unless set), so the figures show how the queue scales with processes.
import { spawn, type ChildProcess } from "node:child_process";
import { parseArgs } from "node:util";
import { eq } from "drizzle-orm";
import pg from "pg";
import { closeDb, getDb } from "@/db/client";
import { getSweepById, queueSweep } from "@/db/queries/run-jobs";
import { createScene, getSceneById } from "@/db/queries/scenes";
import { study, user } from "@/db/schema";
import { demoMembers, demoStudy } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { stopBoss } from "@/lib/server/run-queue/boss";
import { startPostgresCluster } from "../tests/support/postgres-cluster.mjs";

const { values: options } = parseArgs({ options: { cases: { type: "string", default: "8" }, seconds: { type: "string", default: "0.04" } } });
const cases = Math.max(1, Math.min(25, Number(options.cases)));
const simulatedSeconds = Number(options.seconds);

function barrierScene() {
  return {
    version: 1,
    name: "Queue benchmark",
    domain: { width: 4, height: 2 },
    resolution: { kind: "cellSize", cellSize: 0.01 },
    boundary: { bottom: { kind: "rigid" } },
    geometry: { walls: [{ id: "barrier", label: "Barrier", path: [{ x: 2, y: 0 }, { x: 2, y: 1 }], thickness: 0.04 }] },
    sources: [{ id: "src", label: "Source", position: { x: 0.8, y: 0.3 }, signal: { kind: "ricker", peakFrequency: 600 } }],
    receivers: [{ id: "behind", label: "Behind", position: { x: 3.2, y: 0.5 } }],
    duration: { kind: "time", seconds: simulatedSeconds },
  };
}

function startWorker(databaseUrl: string): { child: ChildProcess; ready: Promise<void> } {
  const child = spawn("npm", ["run", "--silent", "worker"], {
    detached: true,
    stdio: ["ignore", "pipe", "inherit"],
    env: { ...process.env, DATABASE_URL: databaseUrl, RAREFACT_WORKER_THREADS: process.env.RAREFACT_WORKER_THREADS ?? "1", RAREFACT_QUEUE_POLL_SECONDS: "0.5", RAREFACT_QUEUE_PROGRESS_SECONDS: "1" },
  });
  const ready = new Promise<void>((resolve, reject) => {
    let text = "";
    child.stdout!.on("data", (chunk: Buffer) => {
      text += chunk.toString();
      if (text.includes("is taking jobs")) resolve();
    });
    child.once("exit", (code) => reject(new Error(`a worker exited (${code}) before it took jobs:\n${text}`)));
  });
  return { child, ready };
}

async function stopWorkers(children: ChildProcess[]): Promise<void> {
  await Promise.all(
    children.map(
      (child) =>
        new Promise<void>((resolve) => {
          if (child.exitCode !== null) return resolve();
          child.once("exit", () => resolve());
          process.kill(-child.pid!, "SIGTERM");
        }),
    ),
  );
}

async function sweepOnce(databaseUrl: string, workerCount: number, sceneRecord: { id: string; teamId: string; studyId: string; name: string; version: number }, userId: string) {
  const workers = Array.from({ length: workerCount }, () => startWorker(databaseUrl));
  await Promise.all(workers.map((worker) => worker.ready));
  const started = performance.now();
  const { sweep, jobs } = await queueSweep({
    sceneRecord,
    userId,
    definition: {
      sceneId: sceneRecord.id,
      sceneVersion: sceneRecord.version,
      sceneName: sceneRecord.name,
      parameter: { kind: "wall-height", wallId: "barrier" },
      parameterLabel: "height of Barrier",
      unit: "m",
      range: { from: 0.25, to: 0.25 * cases, step: 0.25 },
      reference: { kind: "without", removedIds: ["barrier"] },
      bandsPerOctave: 1,
      weighting: "Z",
      receiverIds: ["behind"],
    },
  });
  for (;;) {
    const current = await getSweepById({ id: sweep.id });
    if (current && ["completed", "failed", "cancelled"].includes(current.sweep.state)) {
      if (current.sweep.state !== "completed") throw new Error(`the sweep ended ${current.sweep.state}: ${current.sweep.message}`);
      break;
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  const seconds = (performance.now() - started) / 1000;
  await stopWorkers(workers.map((worker) => worker.child));
  const cellUpdates = jobs.reduce((sum, job) => sum + job.cellSteps, 0);
  return { workerCount, runs: jobs.length, seconds, casesPerMinute: (cases / seconds) * 60, runsPerMinute: (jobs.length / seconds) * 60, cellUpdatesPerSecond: cellUpdates / seconds };
}

async function main(): Promise<void> {
  const given = process.env.DATABASE_URL?.trim();
  const cluster = given ? null : await startPostgresCluster();
  const serverUrl = given ?? cluster!.url;
  const databaseName = `rarefact_bench_${Date.now().toString(36)}`;
  const databaseUrl = (() => {
    const url = new URL(serverUrl);
    url.pathname = `/${databaseName}`;
    return url.toString();
  })();
  const admin = new pg.Client({ connectionString: serverUrl });
  await admin.connect();
  await admin.query(`create database "${databaseName}"`);
  process.env.DATABASE_URL = databaseUrl;
  try {
    await prepareDatabase({ seed: true });
    const db = await getDb();
    const [editor] = await db.select({ id: user.id }).from(user).where(eq(user.email, demoMembers.find((m) => m.role === "editor")!.email));
    const [target] = await db.select({ id: study.id, teamId: study.teamId }).from(study).where(eq(study.title, demoStudy.title));
    const sceneId = await createScene({ teamId: target!.teamId, studyId: target!.id, authorId: editor!.id, name: "Queue benchmark", description: "", isReference: false, data: parseSceneOrThrow(barrierScene()), position: 10_000 });
    const sceneRecord = (await getSceneById({ id: sceneId }))!;
    const results = [];
    for (const workerCount of [1, 2]) {
      const result = await sweepOnce(databaseUrl, workerCount, sceneRecord, editor!.id);
      results.push(result);
      console.log(
        `${workerCount} worker${workerCount === 1 ? " " : "s"}: ${result.runs} runs (${cases} cases + reference) in ${result.seconds.toFixed(1)} s = ` +
          `${result.casesPerMinute.toFixed(1)} cases/min, ${result.runsPerMinute.toFixed(1)} runs/min, ${(result.cellUpdatesPerSecond / 1e6).toFixed(0)} M cell updates/s`,
      );
    }
    const [one, two] = results;
    if (one && two) console.log(`two workers: ${(two.casesPerMinute / one.casesPerMinute).toFixed(2)} x the throughput of one`);
  } finally {
    await stopBoss({ graceful: false });
    await closeDb();
    await admin.query(`drop database if exists "${databaseName}" with (force)`);
    await admin.end();
    cluster?.stop();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
