// How far along a job or a server sweep is, from the queue's answer alone: counts by state, the
// fraction done, and the time left while workers step it.
import type { RunJobItem, RunJobState, SweepBatchItem } from "@/lib/http/job-types";

export const jobStates: readonly RunJobState[] = ["queued", "running", "completed", "failed", "cancelled"];

export function countByState(jobs: readonly Pick<RunJobItem, "state">[]): Record<RunJobState, number> {
  const counts: Record<RunJobState, number> = { queued: 0, running: 0, completed: 0, failed: 0, cancelled: 0 };
  for (const job of jobs) counts[job.state] += 1;
  return counts;
}

/** 0..1 of one job: a finished job counts whole, a running one by its current attempt's progress. */
export function jobFraction(job: Pick<RunJobItem, "state" | "progress">): number {
  if (job.state === "completed") return 1;
  if (job.state === "running") return Math.min(1, Math.max(0, Number.isFinite(job.progress) ? job.progress : 0));
  return 0;
}

/** Whole percent for the bar's label, never 100 before the job is actually completed. */
export function percentOf(fraction: number, completed: boolean): number {
  if (completed) return 100;
  const percent = Math.floor(Math.min(1, Math.max(0, fraction)) * 100);
  return Math.min(99, percent);
}

export interface SweepProgress {
  caseCount: number;
  casesDone: number;
  referenceCount: number;
  referencesDone: number;
  failed: number;
  cancelled: number;
  running: number;
  queued: number;
  /** 0..1 over every run of the sweep, weighted by its size (cells x steps). */
  fraction: number;
  /** Remaining cell updates over the rate of the runs stepping now; null while nothing steps. */
  secondsLeft: number | null;
}

type ProgressJob = Pick<RunJobItem, "kind" | "state" | "progress" | "cellSteps" | "cellUpdatesPerSecond">;

export function sweepProgress(sweep: Pick<SweepBatchItem, "caseCount" | "referenceCount" | "counts" | "state">, jobs: readonly ProgressJob[]): SweepProgress {
  const counts = jobs.length > 0 ? countByState(jobs) : sweep.counts;
  const cases = jobs.filter((job) => job.kind === "sweep-case");
  const references = jobs.filter((job) => job.kind === "sweep-reference");
  // Without the jobs (left out of the answer) the sweep's own counts are all there is.
  const casesDone = jobs.length > 0 ? cases.filter((job) => job.state === "completed").length : Math.max(0, sweep.counts.completed - sweep.referenceCount);
  const referencesDone = jobs.length > 0 ? references.filter((job) => job.state === "completed").length : Math.min(sweep.referenceCount, sweep.counts.completed);

  let total = 0;
  let done = 0;
  let remaining = 0;
  let rate = 0;
  for (const job of jobs) {
    const size = job.cellSteps > 0 ? job.cellSteps : 1;
    const fraction = jobFraction(job);
    total += size;
    done += size * fraction;
    if (job.state === "queued" || job.state === "running") remaining += size * (1 - fraction);
    if (job.state === "running" && job.cellUpdatesPerSecond && job.cellUpdatesPerSecond > 0) rate += job.cellUpdatesPerSecond;
  }
  const planned = sweep.caseCount + sweep.referenceCount;
  const fraction = sweep.state === "completed" ? 1 : total > 0 ? done / total : planned > 0 ? counts.completed / planned : 0;
  return {
    caseCount: sweep.caseCount,
    casesDone,
    referenceCount: sweep.referenceCount,
    referencesDone,
    failed: counts.failed,
    cancelled: counts.cancelled,
    running: counts.running,
    queued: counts.queued,
    fraction,
    // Runs stepping side by side on several workers add their rates; queued ones will join later,
    // so this is what the sweep takes if no more workers pick it up: an upper estimate.
    secondsLeft: rate > 0 && remaining > 0 ? remaining / rate : null,
  };
}

/** The sweep's own state can trail its runs' (it is set when the first run is taken): running once any run steps. */
export function sweepDisplayState(sweep: Pick<SweepBatchItem, "state">, progress: Pick<SweepProgress, "running">): RunJobState {
  return sweep.state === "queued" && progress.running > 0 ? "running" : sweep.state;
}
