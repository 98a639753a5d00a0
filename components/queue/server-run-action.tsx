"use client";
// "Run on the server" beside "Run in this browser" on the scene page: queues the saved version shown
// for the team's workers, then follows that job in a short notice linking to the study's queue.
// A server runs saved versions only, so a scene with unsaved edits is refused with the reason.
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/client/api";
import { useQueueRun, useStudyJobs } from "@/lib/client/job-queries";
import { jobFraction, percentOf } from "./model/queue-progress";
import { jobStatusWords, refusalWords, stateLabels } from "./model/queue-words";
import { queuePanelAnchor } from "./study-queue-panel";

export function ServerRunAction({ studyId, sceneId, sceneVersion, unsavedEdits, canRun }: { studyId: string; sceneId: string; sceneVersion: number; unsavedEdits: boolean; canRun: boolean }) {
  const queue = useQueueRun(sceneId);
  const [refusal, setRefusal] = useState<string | null>(null);
  const queuedJob = queue.data?.job ?? null;
  // The live job events of the page's study stream refresh this; no extra stream is opened.
  const jobs = useStudyJobs(studyId, { enabled: queuedJob !== null });
  const job = (queuedJob && jobs.data?.jobs.find((item) => item.id === queuedJob.id)) ?? queuedJob;

  const send = () => {
    if (unsavedEdits) {
      setRefusal("This scene has unsaved edits, and the server runs saved versions only: save a new version first (Edit scene, Save new version), then send it.");
      return;
    }
    setRefusal(null);
    queue.mutate({ sceneVersion });
  };

  const failure = queue.error instanceof ApiError ? refusalWords(queue.error) : queue.error ? queue.error.message : null;
  return (
    // Laid out inside the run controls' wrapping row: the button sits beside "Run in this browser",
    // the explanation and notices take whole lines after the row's other items.
    <>
      <Button variant="secondary" onClick={send} disabled={!canRun || queue.isPending} title={canRun ? `Queue saved version ${sceneVersion} for the team's workers` : "Your role cannot run simulations"} aria-describedby="server-run-hint">
        {queue.isPending ? "Queueing…" : "Run on the server"}
      </Button>
      <div className="order-last flex basis-full flex-col gap-2" data-testid="server-run">
        <p id="server-run-hint" className="text-[13px] text-muted">On the server, saved version {sceneVersion} runs on the team&apos;s workers and is saved to the study; you may close the browser meanwhile.</p>
        {/* Once the edits are saved or dropped, the refusal no longer holds. */}
        {refusal && unsavedEdits ? (
          <p role="alert" className="text-sm text-signal-error">
            {refusal}
          </p>
        ) : null}
        {failure ? (
          <p role="alert" className="text-sm text-signal-error" data-testid="server-run-error">
            Not queued. {failure}
          </p>
        ) : null}
        {job && !queue.isPending ? (
          <p role="status" className="rounded-md border border-tide-100 bg-tide-50 px-3 py-2 text-sm text-ink-soft" data-testid="server-run-notice">
            Version {job.sceneVersion} went to the server: <span className="font-medium text-ink">{stateLabels[job.state].toLowerCase()}</span>, {jobStatusWords(job)}
            {job.state === "running" ? ` (${percentOf(jobFraction(job), false)}%)` : ""}.{" "}
            {job.state === "completed" && job.runId ? (
              <Link href={`/studies/${studyId}/runs/${job.runId}`} className="font-medium text-tide-700 hover:underline">
                Open the saved run
              </Link>
            ) : (
              <Link href={`/studies/${studyId}#${queuePanelAnchor}`} className="font-medium text-tide-700 hover:underline">
                Follow it in the study&apos;s server runs
              </Link>
            )}
          </p>
        ) : null}
      </div>
    </>
  );
}
