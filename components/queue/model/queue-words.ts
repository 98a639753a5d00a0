// The queue in words: states, place in the queue, attempts, time left, the team's limit use and the
// workers seen, and the server's refusals as a sentence a person can act on.
import type { QueueLimits, RunJobItem, RunJobState, StudyQueueResponse } from "@/lib/http/job-types";
import { formatEstimate } from "@/components/sweeps/model/format-duration";
import type { SweepProgress } from "./queue-progress";

export const stateLabels: Record<RunJobState, string> = {
  queued: "Queued",
  running: "Running",
  completed: "Finished",
  failed: "Failed",
  cancelled: "Cancelled",
};

/** "about 3 min left"; while the first progress has not come in, the rate and so the time is unknown. */
export function timeLeftWords(secondsLeft: number | null): string {
  if (secondsLeft === null || !Number.isFinite(secondsLeft) || secondsLeft < 0) return "time left not known yet";
  if (secondsLeft < 1) return "finishing";
  return `${formatEstimate(secondsLeft)} left`;
}

function ordinal(n: number): string {
  const tens = n % 100;
  if (tens >= 11 && tens <= 13) return `${n}th`;
  const last = n % 10;
  return `${n}${last === 1 ? "st" : last === 2 ? "nd" : last === 3 ? "rd" : "th"}`;
}

/** Place among every team's queued jobs, in the order workers take them. */
export function positionWords(position: number | null): string {
  if (position === null || position < 1) return "waiting for a worker";
  return position === 1 ? "next in the queue" : `${ordinal(position)} in the queue`;
}

/** "attempt 2 of 3"; nothing to say about a job that has not been tried. */
export function attemptWords(job: Pick<RunJobItem, "attempt" | "maxAttempts">): string | null {
  if (job.attempt < 1) return null;
  return `attempt ${job.attempt} of ${job.maxAttempts}`;
}

/** One short line about where the job stands now. */
export function jobStatusWords(job: Pick<RunJobItem, "state" | "position" | "workerId" | "cancelRequested" | "message">): string {
  if (job.cancelRequested && (job.state === "queued" || job.state === "running")) return "cancelling…";
  switch (job.state) {
    case "queued":
      return positionWords(job.position);
    case "running":
      return job.workerId ? `on worker ${job.workerId}` : "starting on a worker";
    case "completed":
      return "result saved";
    case "failed":
      return job.message || "stopped with an error";
    case "cancelled":
      return job.message || "cancelled before it finished";
  }
}

/** "14 of 60 jobs in the queue, 12% of its work allowance", said of the whole team, since the limits are the team's. */
export function limitUseWords(limits: QueueLimits): string {
  const jobs = limits.maxActiveJobs === 1 ? "job" : "jobs";
  const share = Math.round((100 * limits.activeCellSteps) / limits.maxActiveCellSteps);
  const allowance = limits.activeCellSteps > 0 ? `, ${share < 1 ? "under 1" : share}% of its work allowance` : "";
  const full = limits.activeJobs >= limits.maxActiveJobs || limits.activeCellSteps >= limits.maxActiveCellSteps ? " — full: new runs are refused until some finish" : "";
  return `Your team has ${limits.activeJobs} of ${limits.maxActiveJobs} ${jobs} in the queue${allowance}${full}`;
}

/** Largest job a worker takes, in the words of the scene page's grid figures. */
export function cellStepsWords(cellSteps: number): string {
  if (cellSteps >= 1e12) return `${(cellSteps / 1e12).toPrecision(3)} trillion cell updates`;
  if (cellSteps >= 1e9) return `${(cellSteps / 1e9).toPrecision(3)} billion cell updates`;
  return `${(cellSteps / 1e6).toPrecision(3)} million cell updates`;
}

export function workersWords(workers: StudyQueueResponse["workers"]): string {
  if (workers.length === 0) return "No worker seen in the last minute: queued runs wait until one starts.";
  const busy = workers.reduce((sum, worker) => sum + worker.runningJobs, 0);
  const count = workers.length === 1 ? "1 worker" : `${workers.length} workers`;
  return `${count} seen in the last minute, ${busy === 0 ? "none busy" : busy === 1 ? "1 run in hand" : `${busy} runs in hand`}.`;
}

/** "3 of 12 cases done, reference done, 1 failed": what a sweep's owner looks for first. */
export function sweepCountWords(progress: SweepProgress): string {
  const parts = [`${progress.casesDone} of ${progress.caseCount} ${progress.caseCount === 1 ? "case" : "cases"} done`];
  if (progress.referenceCount > 0) {
    parts.push(
      progress.referenceCount === 1
        ? `reference ${progress.referencesDone === 1 ? "done" : "not done yet"}`
        : `${progress.referencesDone} of ${progress.referenceCount} references done`,
    );
  }
  if (progress.running > 0) parts.push(`${progress.running} running`);
  if (progress.failed > 0) parts.push(`${progress.failed} failed`);
  if (progress.cancelled > 0) parts.push(`${progress.cancelled} cancelled`);
  return parts.join(", ");
}

interface ServerRefusal {
  status: number;
  code: string;
  message: string;
  issues: readonly { path: string; message: string }[];
}

/** The server's answer to a refused queue request, for the form: its message and the fields it names. */
export function refusalWords(error: ServerRefusal): string {
  // The contract names it limit:queue; any 409 about the queue means the same to the person queueing.
  if (error.code === "limit:queue" || (error.status === 409 && error.code.endsWith(":queue"))) return `The team's queue is full. ${error.message}`;
  if (error.status === 403) return `Your role cannot send runs to the server. ${error.message}`;
  const fields = error.issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message));
  const details = fields.filter((field) => !error.message.includes(field));
  return details.length > 0 ? `${error.message} (${details.join("; ")})` : error.message;
}
