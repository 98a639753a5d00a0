"use client";
// A sweep sent to the server, followed on the sweeps page: cases done of all, failures, progress and
// time left while the workers step it, and the chart it wrote into the notebook once the last run
// ended. The page may be closed at any time; the study's queue shows the same sweep.
import Link from "next/link";
import { SweepResultBlock } from "@/components/sweeps/sweep-result-block";
import { LiveStatusNote } from "@/components/live/live-status-note";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { useCancelSweep, useStudyJobs, type SweepAnswer } from "@/lib/client/job-queries";
import { useBlocks } from "@/lib/client/queries";
import { useStudyLiveUpdates } from "@/lib/client/use-live-updates";
import { JobStateBadge } from "./job-state-badge";
import { isActiveState } from "./model/queue-entries";
import { sweepDisplayState, sweepProgress } from "./model/queue-progress";
import { sweepCountWords } from "./model/queue-words";
import { QueueProgressBar } from "./queue-progress-bar";
import { SweepChartLink } from "./sweep-entry";
import { queuePanelAnchor } from "./study-queue-panel";

export function ServerSweepStatus({ studyId, queued, canCancel }: { studyId: string; queued: SweepAnswer; canCancel: boolean }) {
  // The study's event stream: job events refresh the queue, a finished sweep the notebook as well.
  const live = useStudyLiveUpdates(studyId);
  const queue = useStudyJobs(studyId);
  const cancel = useCancelSweep();
  const sweepId = queued.sweep.id;
  const sweep = queue.data?.sweeps.find((item) => item.id === sweepId) ?? queued.sweep;
  const jobs = queue.data ? queue.data.jobs.filter((job) => job.sweepId === sweepId) : queued.jobs;
  const progress = sweepProgress(sweep, jobs);
  const active = isActiveState(sweep.state);
  const blocks = useBlocks(studyId);
  const block = sweep.blockId ? blocks.data?.blocks.find((item) => item.id === sweep.blockId) : undefined;

  const askCancel = () => {
    if (!window.confirm(`Cancel the sweep “${sweep.label}”? Its queued and running runs stop; runs that finished are kept.`)) return;
    cancel.mutate(sweepId);
  };

  return (
    <section aria-labelledby="server-sweep-heading" className="flex flex-col gap-3" data-testid="server-sweep">
      <div className={`flex flex-col gap-3 rounded-lg border p-4 ${active ? "border-tide-300 bg-tide-50" : "border-rule bg-panel"}`}>
        <div className="flex flex-wrap items-center gap-3">
          <JobStateBadge state={sweepDisplayState(sweep, progress)} />
          <h2 id="server-sweep-heading" className="text-[15px] font-semibold text-ink">
            On the server: {sweep.label}
          </h2>
          <LiveStatusNote status={live.status} />
          {active && canCancel ? (
            <Button variant="secondary" size="sm" className="ml-auto" onClick={askCancel} disabled={cancel.isPending}>
              {cancel.isPending ? "Cancelling…" : "Cancel sweep"}
            </Button>
          ) : null}
        </div>
        <p className="text-sm text-ink-soft" data-testid="server-sweep-counts">
          {sweepCountWords(progress)}.
        </p>
        {sweep.state !== "cancelled" ? (
          <QueueProgressBar label="Progress of the server sweep" fraction={progress.fraction} completed={sweep.state === "completed"} secondsLeft={progress.secondsLeft} showTimeLeft={active} />
        ) : null}
        {active ? (
          <p className="text-[13px] text-muted">
            You may close this page or the browser: the workers carry on, and the insertion-loss chart is written into the study&apos;s notebook when the last run ends.{" "}
            <Link href={`/studies/${studyId}#${queuePanelAnchor}`} className="font-medium text-tide-700 hover:underline">
              Follow it in the study&apos;s server runs
            </Link>
          </p>
        ) : sweep.message ? (
          <p className="text-[13px] text-ink-soft">{sweep.message}</p>
        ) : null}
        {cancel.isError ? <ErrorState title="The sweep was not cancelled" message={cancel.error.message} /> : null}
        {queue.isError ? <ErrorState title="The sweep's progress could not be loaded" message={queue.error.message} onRetry={() => void queue.refetch()} /> : null}
      </div>
      {sweep.blockId ? (
        <div className="flex flex-col gap-3">
          <div className="flex flex-wrap items-baseline justify-between gap-3">
            <h2 className="text-lg font-semibold text-ink">Result</h2>
            <SweepChartLink studyId={studyId} blockId={sweep.blockId} />
          </div>
          {block ? <SweepResultBlock block={block} studyId={studyId} /> : blocks.isPending ? <p className="text-sm text-muted">Loading the chart…</p> : null}
        </div>
      ) : !active && progress.casesDone === 0 ? (
        <p className="text-sm text-muted">No case finished, so no chart was written.</p>
      ) : null}
    </section>
  );
}
