// A worker: takes one job at a time from pg-boss, marks it running under its own id and attempt,
// steps it in an executor thread while this thread writes the heartbeat and progress (every ~2 s,
// each a live event), stops it when someone cancels or another worker has taken the job over, and
// stores the result once. Failures go back to pg-boss, which retries with backoff up to maxAttempts.
// Every worker also looks for running jobs whose worker stopped answering and hands them back.
import "server-only";
import { randomBytes } from "node:crypto";
import os from "node:os";
import type PgBoss from "pg-boss";
import {
  claimRunJob,
  completeRunJob,
  completeSweepJob,
  failJobAttempt,
  getSweepReceiverIds,
  markJobCancelledWhileRunning,
  rescueStaleJobs,
  resendOrphanedJobs,
  writeJobProgress,
  type AttemptKey,
} from "@/db/queries/run-jobs";
import { AppError } from "@/lib/http/app-error";
import { runSettingsSchema } from "@/lib/run-record/settings";
import { getBoss } from "./boss";
import { executeInThread, type ExecutionHandle } from "./executor";
import { queueTimings, runQueueName, workerThreads } from "./settings";

export interface RunWorker {
  id: string;
  /** Stops taking jobs; a job in hand may finish for `graceMs`, then is cancelled and handed back. */
  stop(options?: { graceMs?: number }): Promise<void>;
}

export interface RunWorkerOptions {
  /** Lines about what the worker takes and how it ends (the command line prints them). */
  log?: (line: string) => void;
  threads?: number;
}

interface InHand {
  key: AttemptKey;
  handle: ExecutionHandle;
  /** Why this worker stopped the thread itself, if it did. */
  stopReason: "cancel" | "superseded" | "shutdown" | null;
  done: Promise<void>;
}

export function newWorkerId(): string {
  return `${os.hostname()}:${process.pid}:${randomBytes(3).toString("hex")}`;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

export async function startRunWorker(options: RunWorkerOptions = {}): Promise<RunWorker> {
  const id = newWorkerId();
  const log = options.log ?? ((line: string) => console.log(`[worker] ${line}`));
  const timings = queueTimings();
  const threads = options.threads ?? workerThreads();
  const boss = await getBoss();
  let inHand: InHand | null = null;
  let stopping = false;

  async function runJob(job: PgBoss.JobWithMetadata<{ runJobId: string }>): Promise<unknown> {
    const key: AttemptKey = { jobId: job.data.runJobId, workerId: id, attempt: job.retryCount + 1 };
    const claim = await claimRunJob(key);
    if (claim.kind === "skip") {
      log(`job ${key.jobId}: not run, ${claim.reason}`);
      return { skipped: claim.reason };
    }
    const row = claim.job;
    log(`took ${row.label} (job ${row.id}, attempt ${key.attempt} of ${row.maxAttempts}, ${row.cellSteps.toExponential(2)} cell updates)`);
    const settings = runSettingsSchema.parse(row.settings);
    const receiverIds = row.sweepId ? await getSweepReceiverIds({ sweepId: row.sweepId }) : [];
    let latest = { fraction: 0, cellUpdatesPerSecond: null as number | null };
    const started = Date.now();
    const handle = executeInThread(
      { scene: row.scene, sceneVersion: row.sceneVersion, settings, mode: row.kind === "run" ? "run" : "sweep", receiverIds, threads },
      {
        onStart: (info) => log(`  stepping with the ${info.kernel} kernel on ${info.threads} thread${info.threads === 1 ? "" : "s"}`),
        onProgress: (progress) => (latest = { fraction: progress.fraction, cellUpdatesPerSecond: progress.cellUpdatesPerSecond || latest.cellUpdatesPerSecond }),
      },
    );
    const current: InHand = { key, handle, stopReason: null, done: handle.outcome.then(() => undefined) };
    inHand = current;
    const stopThread = (reason: NonNullable<InHand["stopReason"]>) => {
      current.stopReason ??= reason;
      handle.cancel();
    };
    // The heartbeat: progress written every few seconds whatever the thread is doing (setting up, encoding).
    let writing = false;
    const heartbeat = setInterval(() => {
      if (writing) return;
      writing = true;
      writeJobProgress({ ...key, progress: latest.fraction, cellUpdatesPerSecond: latest.cellUpdatesPerSecond })
        .then((outcome) => {
          if (outcome === "cancel") stopThread("cancel");
          else if (outcome === "superseded") stopThread("superseded");
        })
        .catch((error: unknown) => log(`  could not write progress: ${messageOf(error)}`))
        .finally(() => (writing = false));
    }, timings.progressSeconds * 1000);

    try {
      const outcome = await handle.outcome;
      clearInterval(heartbeat);
      const seconds = ((Date.now() - started) / 1000).toFixed(1);
      if (outcome.kind === "payload" || outcome.kind === "traces") {
        try {
          const stored =
            outcome.kind === "payload"
              ? await completeRunJob({ ...key, bytes: outcome.bytes, cellUpdatesPerSecond: outcome.cellUpdatesPerSecond })
              : await completeSweepJob({ ...key, traces: outcome.bytes, cellUpdatesPerSecond: outcome.cellUpdatesPerSecond });
          const rate = `${(outcome.cellUpdatesPerSecond / 1e6).toFixed(0)} M cell updates/s`;
          log(stored.stored ? `completed ${row.label} in ${seconds} s (${rate})` : `finished ${row.label} in ${seconds} s but stored nothing: ${stored.reason}`);
          return { stored: stored.stored };
        } catch (error) {
          // A result the server's checks refuse would be refused again: no retry.
          const final = error instanceof AppError && error.kind === "bad_request";
          return await failed(key, row.label, `the result could not be stored: ${messageOf(error)}`, final);
        }
      }
      if (outcome.kind === "cancelled") {
        if (current.stopReason === "superseded") {
          log(`stopped ${row.label}: another worker holds the job now`);
          return { superseded: true };
        }
        if (current.stopReason === "shutdown") return await failed(key, row.label, `worker ${id} was stopped while running the job`, false);
        await markJobCancelledWhileRunning({ ...key, progress: latest.fraction });
        log(`cancelled ${row.label} at ${Math.round(latest.fraction * 100)}%`);
        return { cancelled: true };
      }
      return await failed(key, row.label, outcome.message, !outcome.retryable);
    } finally {
      clearInterval(heartbeat);
      inHand = null;
    }
  }

  /** Notes the failure; throws when pg-boss should retry the job, so that it does. */
  async function failed(key: AttemptKey, label: string, message: string, final: boolean): Promise<unknown> {
    const outcome = await failJobAttempt({ ...key, message, final });
    log(`${label} failed (attempt ${key.attempt}): ${message}${outcome === "retry" ? "; it will be retried" : outcome === "failed" ? "; no attempts left" : ""}`);
    if (outcome === "retry") throw new Error(message);
    return { failed: message };
  }

  await boss.work<{ runJobId: string }>(runQueueName, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: timings.pollSeconds }, async ([job]) => {
    if (!job) return null;
    return runJob(job);
  });

  // Any worker may hand back a job whose worker died: the queue recovers with one survivor.
  let rescuing = false;
  const supervisor = setInterval(
    () => {
      if (rescuing || stopping) return;
      rescuing = true;
      rescueStaleJobs({ staleSeconds: timings.staleSeconds })
        .then((ids) => {
          if (ids.length > 0) log(`handed back ${ids.length} job${ids.length === 1 ? "" : "s"} whose worker stopped answering: ${ids.join(", ")}`);
        })
        .catch((error: unknown) => log(`could not look for stale jobs: ${messageOf(error)}`))
        .finally(() => (rescuing = false));
    },
    Math.max(1000, (timings.staleSeconds * 1000) / 3),
  );

  const resendLost = () =>
    resendOrphanedJobs()
      .then((ids) => {
        if (ids.length > 0) log(`sent ${ids.length} queued job${ids.length === 1 ? "" : "s"} that the queue had lost again: ${ids.join(", ")}`);
      })
      .catch((error: unknown) => log(`could not look for lost jobs: ${messageOf(error)}`));
  await resendLost();
  // Once a minute is plenty: a lost job is rare, and each check reads every old queued row.
  const lostJobs = setInterval(() => void (stopping ? undefined : resendLost()), 60_000);
  log(`worker ${id} is taking jobs from "${runQueueName}" (${threads} thread${threads === 1 ? "" : "s"} per job at most)`);
  return {
    id,
    stop: async ({ graceMs = 25_000 } = {}) => {
      if (stopping) return;
      stopping = true;
      clearInterval(supervisor);
      clearInterval(lostJobs);
      await boss.offWork(runQueueName);
      const current = inHand as InHand | null;
      if (current) {
        const finished = await Promise.race([current.done.then(() => true), new Promise<boolean>((resolve) => setTimeout(() => resolve(false), graceMs))]);
        if (!finished) {
          log(`stopping: handing ${current.key.jobId} back`);
          current.stopReason ??= "shutdown";
          current.handle.cancel();
          await current.done;
        }
        // Lets the handler write its outcome before the caller closes the database.
        while (inHand) await new Promise((resolve) => setTimeout(resolve, 50));
      }
      log(`worker ${id} stopped`);
    },
  };
}
