"use client";
// One saved run opened by a read-only link: what was run and where it stands in review, its figures, the
// field replayed from the stored payload, the scene as run, its accuracy estimate, and the receivers' traces,
// spectra and band levels. The payload comes through the link; nothing is recomputed or saved.
import Link from "next/link";
import { useMemo, useState } from "react";
import { RunAccuracySection } from "@/components/accuracy/run-accuracy-section";
import { AnalysisPanel, SectionCaution } from "@/components/analysis/analysis-controls";
import { BandLevelsPanel } from "@/components/analysis/band-levels-panel";
import { analysisTraces } from "@/components/analysis/analysis-traces";
import { ReceiverPicker } from "@/components/analysis/receiver-picker";
import { sceneFacts } from "@/components/analysis/run-analysis";
import { SpectrumChart } from "@/components/analysis/spectrum-chart";
import { TraceChart } from "@/components/analysis/trace-chart";
import { RunFactList } from "@/components/runs/run-fact-list";
import { RunStatusBadge } from "@/components/runs/run-status-badge";
import { formatWallTime } from "@/components/runs/run-table-model";
import { FrozenSceneSettings } from "@/components/saved-run/frozen-scene-settings";
import { SavedRunFigures } from "@/components/saved-run/saved-run-figures";
import { formatBytes } from "@/components/scenes/grid-figures";
import { FieldReplay } from "@/components/scenes/run-viewer";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { useSharedRunPayload } from "@/lib/client/share-link-queries";
import type { SharedRun } from "@/lib/http/share-link-types";
import type { DecodedRun } from "@/lib/run-record/payload";
import { SharedReviewBadge } from "./review-state-badge";
import { SharedWhen } from "./shared-when";

export function SharedRunView({ token, studyTitle, run }: { token: string; studyTitle: string; run: SharedRun }) {
  const payload = useSharedRunPayload(token, run.id);
  const facts: [string, React.ReactNode][] = [
    [
      "Run by",
      <span key="by">
        {run.createdByName ?? "a former member"}, <SharedWhen iso={run.createdAt} />
      </span>,
    ],
    ["Wall time", run.summary ? formatWallTime(run.summary.wallSeconds) : "–"],
    ["Solver", run.solverVersion],
    [
      "Input hash",
      <abbr key="hash" title={run.inputHash} className="font-mono no-underline">
        {run.inputHash.slice(0, 12)}
      </abbr>,
    ],
    ["Stored", formatBytes(run.resultBytes)],
  ];
  const waiting = payload.isPending ? <LoadingRows rows={1} label={`Loading the stored result (${formatBytes(run.resultBytes)})`} /> : <p className="text-sm text-muted">Shown once the stored result can be read.</p>;

  return (
    <div className="flex flex-col gap-6">
      <div>
        <nav aria-label="Breadcrumb" className="text-sm text-muted">
          <Link href={`/shared/${token}`} className="hover:text-tide-600">
            {studyTitle}
          </Link>
          <span aria-hidden> / </span>
          <span className="text-ink-soft">Saved run</span>
        </nav>
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <h1 className="text-[26px] font-semibold leading-tight text-ink">
            {run.sceneName ?? "Deleted scene"} <span className="font-normal text-muted">version {run.sceneVersion}</span>
          </h1>
          <RunStatusBadge status={run.status} />
          <SharedReviewBadge state={run.reviewState} />
        </div>
        {run.statusMessage ? <p className="mt-1 text-sm text-ink-soft">{run.statusMessage}</p> : null}
        <RunFactList facts={facts} />
      </div>
      {payload.isError ? <ErrorState title="The stored result could not be read" message={payload.error.message} onRetry={() => void payload.refetch()} /> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <section aria-labelledby="field-heading" className="flex min-w-0 flex-col gap-3">
          <h2 id="field-heading" className="text-base font-semibold text-ink">
            Field, replayed from storage
          </h2>
          <div className="rounded-lg border border-rule bg-panel p-3">{payload.data ? <StoredField saved={payload.data} /> : waiting}</div>
        </section>
        <aside className="flex flex-col gap-6">
          <section aria-labelledby="figures-heading" className="flex flex-col gap-3">
            <h2 id="figures-heading" className="text-base font-semibold text-ink">
              Grid and figures
            </h2>
            <div className="rounded-lg border border-rule bg-panel p-4">{run.summary ? <SavedRunFigures summary={run.summary} /> : <p className="text-sm text-muted">This run has no summary.</p>}</div>
          </section>
          <section aria-labelledby="settings-heading" className="flex flex-col gap-3">
            <h2 id="settings-heading" className="text-base font-semibold text-ink">
              Scene and settings as run
            </h2>
            <div className="rounded-lg border border-rule bg-panel p-4">{payload.data ? <FrozenSceneOf saved={payload.data} /> : waiting}</div>
          </section>
        </aside>
      </div>
      <section aria-labelledby="accuracy-heading" className="flex flex-col gap-3">
        <h2 id="accuracy-heading" className="text-base font-semibold text-ink">
          Accuracy
        </h2>
        {payload.data ? <RunAccuracySection run={payload.data} /> : waiting}
      </section>
      <section aria-labelledby="analysis-heading" className="flex flex-col gap-3">
        <h2 id="analysis-heading" className="text-base font-semibold text-ink">
          Receivers
        </h2>
        {payload.data ? <SharedAnalysis runId={run.id} saved={payload.data} /> : waiting}
      </section>
    </div>
  );
}

function StoredField({ saved }: { saved: DecodedRun }) {
  const { scene, problem } = useMemo(() => sceneFacts(saved), [saved]);
  if (!scene) return <ErrorState title="The stored scene does not validate" message={problem ?? ""} />;
  return <FieldReplay scene={scene} result={saved} noReferenceReason="Level differences need a reference run, compared in the workbench" />;
}

function FrozenSceneOf({ saved }: { saved: DecodedRun }) {
  const { scene, problem } = useMemo(() => sceneFacts(saved), [saved]);
  if (!scene) return <p className="text-sm text-signal-error">The stored scene does not validate with this version of Rarefact: {problem}</p>;
  return <FrozenSceneSettings scene={scene} header={saved.header} />;
}

/** Traces, spectra and band levels of the chosen receivers, with the analysis's own panels (no notebook controls). */
function SharedAnalysis({ runId, saved }: { runId: string; saved: DecodedRun }) {
  const facts = useMemo(() => sceneFacts(saved), [saved]);
  const [receiverIds, setReceiverIds] = useState<string[]>(() => saved.receivers.slice(0, 3).map((receiver) => receiver.id));
  const traces = useMemo(() => analysisTraces(saved, runId, receiverIds), [saved, runId, receiverIds]);
  if (saved.receivers.length === 0) return <p className="text-sm text-muted">This run recorded no receiver, so there are no traces or band levels.</p>;
  return (
    <div className="flex flex-col gap-4" data-testid="shared-analysis">
      <SectionCaution />
      <div className="rounded-lg border border-rule bg-panel p-4">
        <ReceiverPicker run={saved} selected={receiverIds} onChange={setReceiverIds} />
      </div>
      <AnalysisPanel title="Pressure at the receivers" testId="traces" description={`${saved.header.run.stepsRun} steps, ${(saved.header.run.simulatedSeconds * 1000).toFixed(1)} ms simulated.`}>
        <TraceChart traces={traces} runId={runId} />
      </AnalysisPanel>
      <AnalysisPanel title="Spectra" testId="spectra">
        <SpectrumChart traces={traces} runId={runId} highestResolvedFrequency={facts.highestResolvedFrequency} />
      </AnalysisPanel>
      <BandLevelsPanel run={saved} runId={runId} receiverIds={receiverIds} highestResolvedFrequency={facts.highestResolvedFrequency} sceneTemperature={facts.temperature} />
    </div>
  );
}
