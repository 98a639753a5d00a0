// The study's queue as the panel lists it: plain runs and server sweeps, newest first, each sweep
// holding its own jobs (a twelve-case sweep is one entry, not thirteen).
import type { RunJobItem, StudyQueueResponse, SweepBatchItem } from "@/lib/http/job-types";

export type QueueEntry = { kind: "job"; id: string; job: RunJobItem } | { kind: "sweep"; id: string; sweep: SweepBatchItem; jobs: RunJobItem[] };

const time = (iso: string) => {
  const value = Date.parse(iso);
  return Number.isNaN(value) ? 0 : value;
};

/** Newest first; on equal times the larger id first, so the order never flickers between refetches. */
function newestFirst(a: { createdAt: string; id: string }, b: { createdAt: string; id: string }): number {
  return time(b.createdAt) - time(a.createdAt) || (a.id < b.id ? 1 : a.id > b.id ? -1 : 0);
}

const entryKey = (entry: QueueEntry) => ({ id: entry.id, createdAt: entry.kind === "job" ? entry.job.createdAt : entry.sweep.createdAt });

export function queueEntries(queue: Pick<StudyQueueResponse, "jobs" | "sweeps">): QueueEntry[] {
  const sweepIds = new Set(queue.sweeps.map((sweep) => sweep.id));
  const jobsBySweep = new Map<string, RunJobItem[]>();
  const loose: RunJobItem[] = [];
  for (const job of queue.jobs) {
    if (job.sweepId && sweepIds.has(job.sweepId)) {
      const list = jobsBySweep.get(job.sweepId) ?? [];
      list.push(job);
      jobsBySweep.set(job.sweepId, list);
    } else {
      // A sweep job whose sweep is not in the answer still shows, alone, rather than vanish.
      loose.push(job);
    }
  }
  const entries: QueueEntry[] = [
    ...loose.map((job): QueueEntry => ({ kind: "job", id: job.id, job })),
    // A sweep's own runs keep the server's order (references before the cases that need them).
    ...queue.sweeps.map((sweep): QueueEntry => ({ kind: "sweep", id: sweep.id, sweep, jobs: jobsBySweep.get(sweep.id) ?? [] })),
  ];
  return entries.sort((a, b) => newestFirst(entryKey(a), entryKey(b)));
}

/** Queued or running: what a worker still has to do, and what may be cancelled. */
export function isActiveState(state: RunJobItem["state"]): boolean {
  return state === "queued" || state === "running";
}
