"use client";
// The study page's "Server runs" section: the runs and sweeps sent to the server's workers, newest
// first, live through the study's event stream, with the team's limit use and the workers seen.
import { useEffect, useRef } from "react";
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { useCancelJob, useCancelSweep, useStudyJobs } from "@/lib/client/job-queries";
import type { RunJobItem, SweepBatchItem } from "@/lib/http/job-types";
import { JobEntry, sceneVersionWords } from "./job-entry";
import { queueEntries } from "./model/queue-entries";
import { cellStepsWords, limitUseWords, workersWords } from "./model/queue-words";
import { SweepEntry } from "./sweep-entry";

/** The panel's anchor: the scene page's "queued" notice links here. */
export const queuePanelAnchor = "server-runs";

export function StudyQueuePanel({ studyId, role }: { studyId: string; role: TeamRole }) {
  const query = useStudyJobs(studyId);
  const cancelJob = useCancelJob();
  const cancelSweep = useCancelSweep();
  const canCancel = roleAllows(role, "run:create");
  const section = useRef<HTMLElement>(null);

  // The study loads after navigation, so the browser's own jump to #server-runs finds nothing yet.
  const loaded = query.isSuccess;
  useEffect(() => {
    if (loaded && window.location.hash === `#${queuePanelAnchor}`) section.current?.scrollIntoView({ block: "start" });
  }, [loaded]);

  const askCancelJob = (job: RunJobItem) => {
    const what = job.state === "running" ? "The worker stops it shortly and nothing is saved." : "It leaves the queue without running.";
    if (!window.confirm(`Cancel the server run of ${sceneVersionWords(job)}? ${what}`)) return;
    cancelJob.mutate(job.id);
  };
  const askCancelSweep = (sweep: SweepBatchItem) => {
    if (!window.confirm(`Cancel the sweep “${sweep.label}”? Its queued and running runs stop; runs that finished are kept, and no chart is written if none did.`)) return;
    cancelSweep.mutate(sweep.id);
  };

  return (
    <section ref={section} id={queuePanelAnchor} aria-labelledby="server-runs-heading" className="flex scroll-mt-6 flex-col gap-4" data-testid="queue-panel">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2 id="server-runs-heading" className="text-lg font-semibold text-ink">
          Server runs
        </h2>
        {query.data ? (
          <p className="text-[13px] text-muted" data-testid="queue-limits" title={`Largest run a worker takes: ${cellStepsWords(query.data.limits.maxCellStepsPerJob)}`}>
            {limitUseWords(query.data.limits)}
          </p>
        ) : null}
      </div>
      {query.isPending ? (
        <LoadingRows rows={1} label="Loading the server queue" />
      ) : query.isError ? (
        <ErrorState title="The server queue could not be loaded" message={query.error.message} onRetry={() => void query.refetch()} />
      ) : (
        <>
          <p className="text-[13px] text-ink-soft" data-testid="queue-workers">
            {workersWords(query.data.workers)}
          </p>
          {cancelJob.isError ? <ErrorState title="The run was not cancelled" message={cancelJob.error.message} /> : null}
          {cancelSweep.isError ? <ErrorState title="The sweep was not cancelled" message={cancelSweep.error.message} /> : null}
          {query.data.jobs.length === 0 && query.data.sweeps.length === 0 ? (
            <EmptyState title="Nothing sent to the server in the last two weeks">
              On a scene&apos;s page, choose <span className="font-medium text-ink">Run on the server</span> to run its saved version on the team&apos;s workers; on the sweeps page, choose to run a sweep on the server. You may close the browser meanwhile: the result is saved to this study.
            </EmptyState>
          ) : (
            <ol className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-panel">
              {queueEntries(query.data).map((entry) => (
                <li key={entry.id} className="px-4 py-3">
                  {entry.kind === "job" ? (
                    <JobEntry job={entry.job} studyId={studyId} canCancel={canCancel} cancelling={cancelJob.isPending && cancelJob.variables === entry.job.id} onCancel={askCancelJob} />
                  ) : (
                    <SweepEntry sweep={entry.sweep} jobs={entry.jobs} studyId={studyId} canCancel={canCancel} cancelling={cancelSweep.isPending && cancelSweep.variables === entry.sweep.id} onCancel={askCancelSweep} />
                  )}
                </li>
              ))}
            </ol>
          )}
        </>
      )}
    </section>
  );
}
