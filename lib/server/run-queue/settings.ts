// The run queue's settings, read from the environment in one place (defaults suit a small team on
// one machine; the process tests shorten the timings).
import "server-only";
import os from "node:os";

/** pg-boss's queue of server runs: one job per run_job row, data { runJobId }. */
export const runQueueName = "rarefact-run";

function positiveNumber(name: string, fallback: number, { integer = false, max = Infinity } = {}): number {
  const raw = process.env[name]?.trim();
  if (!raw) return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value <= 0 || (integer && !Number.isInteger(value))) {
    console.warn(`[queue] ${name}=${raw} is not a ${integer ? "whole " : ""}number above 0; using ${fallback}`);
    return fallback;
  }
  return Math.min(value, max);
}

export interface QueueLimitsSettings {
  /** Queued or running jobs one team may have at once. */
  maxActiveJobs: number;
  /** Grid cells x time steps of one job at most. */
  maxCellStepsPerJob: number;
  /** Grid cells x time steps of all of one team's queued and running jobs together at most. */
  maxActiveCellSteps: number;
}

export function queueLimits(): QueueLimitsSettings {
  return {
    maxActiveJobs: positiveNumber("RAREFACT_QUEUE_MAX_ACTIVE_JOBS", 60, { integer: true }),
    maxCellStepsPerJob: positiveNumber("RAREFACT_QUEUE_MAX_CELL_STEPS", 2e11),
    maxActiveCellSteps: positiveNumber("RAREFACT_QUEUE_MAX_TEAM_CELL_STEPS", 2e12),
  };
}

export interface QueueTimings {
  /** Attempts a job gets before it is marked failed (pg-boss retryLimit = attempts - 1). */
  maxAttempts: number;
  /** First pause before a retry; pg-boss doubles it (with jitter) for each further one. */
  retryDelaySeconds: number;
  /**
   * pg-boss fails an active job after this long whatever happens: the backstop for a job whose worker
   * vanished before its first heartbeat. Generous, since a large run may take hours (pg-boss caps it below 24 h).
   */
  expireSeconds: number;
  /** A running job whose worker has not written its heartbeat for this long is handed to another worker. */
  staleSeconds: number;
  /** Heartbeat and progress writes, at most one per job per this many seconds. */
  progressSeconds: number;
  /** How often an idle worker asks for a job. */
  pollSeconds: number;
}

export function queueTimings(): QueueTimings {
  return {
    maxAttempts: positiveNumber("RAREFACT_QUEUE_MAX_ATTEMPTS", 3, { integer: true, max: 20 }),
    retryDelaySeconds: positiveNumber("RAREFACT_QUEUE_RETRY_DELAY_SECONDS", 10, { integer: true }),
    expireSeconds: positiveNumber("RAREFACT_QUEUE_EXPIRE_SECONDS", 12 * 3600, { integer: true, max: 23 * 3600 }),
    staleSeconds: positiveNumber("RAREFACT_QUEUE_STALE_SECONDS", 60),
    progressSeconds: positiveNumber("RAREFACT_QUEUE_PROGRESS_SECONDS", 2),
    pollSeconds: positiveNumber("RAREFACT_QUEUE_POLL_SECONDS", 2),
  };
}

/** Threads one job steps on: RAREFACT_WORKER_THREADS, else the machine's parallelism up to 8. */
export function workerThreads(): number {
  return positiveNumber("RAREFACT_WORKER_THREADS", Math.min(8, Math.max(1, os.availableParallelism())), { integer: true, max: 64 });
}
