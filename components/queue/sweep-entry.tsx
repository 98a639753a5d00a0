"use client";
// One server sweep in the study's queue: its cases done of all, failures, the sweep's progress and
// time left, its runs one by one on request, and the chart it wrote into the notebook when done.
import Link from "next/link";
import { Button } from "@/components/ui/button";
import { formatWhen } from "@/lib/client/format";
import type { RunJobItem, SweepBatchItem } from "@/lib/http/job-types";
import { JobFailures } from "./job-failures";
import { JobStateBadge } from "./job-state-badge";
import { isActiveState } from "./model/queue-entries";
import { jobFraction, percentOf, sweepDisplayState, sweepProgress } from "./model/queue-progress";
import { attemptWords, jobStatusWords, sweepCountWords } from "./model/queue-words";
import { QueueProgressBar } from "./queue-progress-bar";

export function SweepChartLink({ studyId, blockId }: { studyId: string; blockId: string }) {
  return (
    <Link href={`/studies/${studyId}#block-${blockId}`} className="text-sm font-medium text-tide-700 hover:underline">
      Open the sweep chart in the notebook
    </Link>
  );
}

function SweepRun({ job }: { job: RunJobItem }) {
  const attempt = attemptWords(job);
  return (
    <li className="flex flex-col gap-1 border-t border-rule py-2 first:border-t-0" data-testid="queue-sweep-run">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-[13px]">
        <JobStateBadge state={job.state} />
        <span className="text-ink">{job.kind === "sweep-reference" && !/^reference/i.test(job.label) ? `Reference: ${job.label}` : job.label}</span>
        <span className="text-muted">
          {jobStatusWords(job)}
          {attempt && job.state !== "queued" ? ` · ${attempt}` : ""}
        </span>
        {job.state === "running" ? <span className="tabular ml-auto font-mono text-[12px] text-ink">{percentOf(jobFraction(job), false)}%</span> : null}
      </div>
      <JobFailures failures={job.failures} />
    </li>
  );
}

export function SweepEntry({
  sweep,
  jobs,
  studyId,
  canCancel,
  cancelling,
  onCancel,
}: {
  sweep: SweepBatchItem;
  jobs: RunJobItem[];
  studyId: string;
  canCancel: boolean;
  cancelling: boolean;
  onCancel: (sweep: SweepBatchItem) => void;
}) {
  const progress = sweepProgress(sweep, jobs);
  const active = isActiveState(sweep.state);
  const sceneName = jobs.find((job) => job.sceneName)?.sceneName ?? null;
  return (
    <article aria-label={`Server sweep: ${sweep.label}`} data-testid="queue-sweep" data-sweep-id={sweep.id} className="flex flex-col gap-2.5">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <JobStateBadge state={sweepDisplayState(sweep, progress)} />
        <h3 className="text-[15px] font-medium text-ink">
          Sweep: {sweep.label}
          <span className="font-normal text-muted">
            {" "}
            on{" "}
            {sweep.sceneId ? (
              <Link href={`/studies/${studyId}/scenes/${sweep.sceneId}`} className="hover:underline">
                {sceneName ?? "its scene"}
              </Link>
            ) : (
              (sceneName ?? "a deleted scene")
            )}
            , version {sweep.sceneVersion}
          </span>
        </h3>
        <span className="text-[13px] text-ink-soft" data-testid="queue-sweep-counts">
          {sweepCountWords(progress)}
        </span>
        <div className="ml-auto flex items-center gap-2">
          {sweep.blockId ? <SweepChartLink studyId={studyId} blockId={sweep.blockId} /> : null}
          {active && canCancel ? (
            <Button variant="secondary" size="sm" onClick={() => onCancel(sweep)} disabled={cancelling}>
              {cancelling ? "Cancelling…" : "Cancel sweep"}
            </Button>
          ) : null}
        </div>
      </div>
      {sweep.state !== "cancelled" ? (
        <QueueProgressBar label={`Progress of the sweep ${sweep.label}`} fraction={progress.fraction} completed={sweep.state === "completed"} secondsLeft={progress.secondsLeft} showTimeLeft={active} />
      ) : null}
      {sweep.message && (sweep.state === "failed" || sweep.state === "cancelled" || sweep.state === "completed") ? <p className="text-[13px] text-ink-soft">{sweep.message}</p> : null}
      {jobs.length > 0 ? (
        <details className="text-[13px]">
          <summary className="cursor-pointer text-ink-soft">
            Its {jobs.length} runs{active ? ", spread over the workers" : ""}
          </summary>
          <ul className="mt-1 flex flex-col pl-1">
            {jobs.map((job) => (
              <SweepRun key={job.id} job={job} />
            ))}
          </ul>
        </details>
      ) : null}
      <p className="text-[12px] text-muted">
        Queued by {sweep.createdBy?.name ?? "a former member"}, {formatWhen(sweep.createdAt)}
        {sweep.finishedAt && !active ? ` · ended ${formatWhen(sweep.finishedAt)}` : ""}
      </p>
    </article>
  );
}
