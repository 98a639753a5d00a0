"use client";
// One plain server run in the study's queue: the scene version it runs, where it stands (place in
// the queue, worker, progress and time left, attempts, failures), who queued it, and the saved run
// once it is done.
import Link from "next/link";
import { Button } from "@/components/ui/button";
import { formatWhen } from "@/lib/client/format";
import type { RunJobItem } from "@/lib/http/job-types";
import { JobFailures } from "./job-failures";
import { JobStateBadge } from "./job-state-badge";
import { isActiveState } from "./model/queue-entries";
import { jobFraction } from "./model/queue-progress";
import { attemptWords, jobStatusWords } from "./model/queue-words";
import { QueueProgressBar } from "./queue-progress-bar";

export function sceneVersionWords(job: Pick<RunJobItem, "sceneName" | "sceneVersion">): string {
  return `${job.sceneName ?? "A deleted scene"}, version ${job.sceneVersion}`;
}

export function JobEntry({ job, studyId, canCancel, cancelling, onCancel }: { job: RunJobItem; studyId: string; canCancel: boolean; cancelling: boolean; onCancel: (job: RunJobItem) => void }) {
  const active = isActiveState(job.state);
  const attempt = attemptWords(job);
  return (
    <article aria-label={`Server run of ${sceneVersionWords(job)}`} data-testid="queue-job" data-job-id={job.id} className="flex flex-col gap-2.5">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <JobStateBadge state={job.state} />
        <h3 className="text-[15px] font-medium text-ink">
          {job.sceneId ? (
            <Link href={`/studies/${studyId}/scenes/${job.sceneId}`} className="hover:underline">
              {job.sceneName ?? "Scene"}
            </Link>
          ) : (
            (job.sceneName ?? "A deleted scene")
          )}
          <span className="font-normal text-muted">, version {job.sceneVersion}</span>
        </h3>
        <span className="text-[13px] text-ink-soft" data-testid="queue-job-status">
          {jobStatusWords(job)}
          {attempt && job.state !== "queued" ? ` · ${attempt}` : ""}
        </span>
        <div className="ml-auto flex items-center gap-2">
          {job.state === "completed" && job.runId ? (
            <Link href={`/studies/${studyId}/runs/${job.runId}`} className="text-sm font-medium text-tide-700 hover:underline">
              Open the saved run
            </Link>
          ) : null}
          {active && canCancel && !job.cancelRequested ? (
            <Button variant="secondary" size="sm" onClick={() => onCancel(job)} disabled={cancelling}>
              {cancelling ? "Cancelling…" : "Cancel"}
            </Button>
          ) : null}
        </div>
      </div>
      {job.state === "running" ? <QueueProgressBar label={`Progress of ${sceneVersionWords(job)}`} fraction={jobFraction(job)} completed={false} secondsLeft={job.secondsLeft} showTimeLeft /> : null}
      <JobFailures failures={job.failures} />
      <p className="text-[12px] text-muted">
        Queued by {job.createdBy?.name ?? "a former member"}, {formatWhen(job.createdAt)}
        {job.finishedAt && !active ? ` · ended ${formatWhen(job.finishedAt)}` : ""}
      </p>
    </article>
  );
}
