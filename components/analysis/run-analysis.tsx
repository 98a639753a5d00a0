"use client";
// The analysis of one saved run, as an engineer reports it: pressure traces and spectra (with other runs of
// the study drawn over them), band levels, insertion loss against a reference with the barrier estimates
// beside it, the sound of a receiver, and exports of each. Every piece is also exported on its own.
import { useMemo, useState } from "react";

import { useRevealPinnedReceiver } from "@/components/comments/pin-context";
import { AddChartButton } from "@/components/notebook/add-chart-block";
import { resolvedFrequencyLimit } from "@/lib/analysis/accuracy";
import { useStudyRuns } from "@/lib/client/run-queries";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import type { RunRecord } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";

import { AnalysisPanel, Note, SectionCaution } from "./analysis-controls";
import { analysisTraces } from "./analysis-traces";
import { BandLevelsPanel } from "./band-levels-panel";
import { InsertionLossPanel, runLabel } from "./insertion-loss-panel";
import { OverlayRunPicker, useOverlayRuns } from "./overlay-runs";
import { ReceiverPicker } from "./receiver-picker";
import { ReceiverSound } from "./receiver-sound";
import { SpectrumChart } from "./spectrum-chart";
import { TraceChart } from "./trace-chart";

export { AnalysisPanel, SectionCaution } from "./analysis-controls";
export { analysisTraces, type AnalysisTrace, type OverlayRun } from "./analysis-traces";
export { BandBarChart } from "./band-bar-chart";
export { BandLevelsPanel } from "./band-levels-panel";
export { BarrierComparison } from "./barrier-comparison";
export { InsertionLossPanel } from "./insertion-loss-panel";
export { OverlayRunPicker, useOverlayRuns } from "./overlay-runs";
export { ReceiverPicker } from "./receiver-picker";
export { ReceiverSound } from "./receiver-sound";
export { ReferenceMaker } from "./reference-maker";
export { SpectrumChart } from "./spectrum-chart";
export { TraceChart } from "./trace-chart";

export interface RunAnalysisProps {
  runId: string;
  studyId: string;
  record: RunRecord;
  run: DecodedRun;
  /** The caller may create scenes and runs in the study (owner or editor): offers "Make a reference". */
  canCreate: boolean;
}

/** Sound speed assumed when the frozen scene cannot be read: air at about 20 °C, m/s. */
const FALLBACK_SOUND_SPEED = 343;

export interface SceneFacts {
  scene: Scene | null;
  problem?: string;
  highestResolvedFrequency: number;
  temperature?: number;
}

/**
 * The frozen scene and the highest frequency a band may reach and count as resolved, from the accuracy
 * estimate's one decision (resolvedFrequencyLimit); an estimate from the cell size when the scene cannot be read.
 */
export function sceneFacts(run: DecodedRun): SceneFacts {
  const parsed = parseScene(run.header.scene);
  if (parsed.ok) {
    const grid = deriveGrid(parsed.scene);
    return { scene: parsed.scene, highestResolvedFrequency: resolvedFrequencyLimit(grid), temperature: parsed.scene.medium.kind === "air" ? parsed.scene.medium.temperature : undefined };
  }
  const first = parsed.problems[0];
  return {
    scene: null,
    problem: first ? `${first.path || "(scene)"}: ${first.message}` : "unknown problem",
    highestResolvedFrequency: resolvedFrequencyLimit({ cellSize: run.header.grid.cellSize, minSoundSpeed: FALLBACK_SOUND_SPEED }),
  };
}

export function RunAnalysis({ runId, studyId, record, run, canCreate }: RunAnalysisProps) {
  const facts = useMemo(() => sceneFacts(run), [run]);
  const [receiverIds, setReceiverIds] = useState<string[]>(() => run.receivers.slice(0, 3).map((receiver) => receiver.id));
  const allReceiverIds = useMemo(() => run.receivers.map((receiver) => receiver.id), [run]);
  // A comment pinned to a receiver not drawn yet: jumping to it adds the receiver (saved run page only).
  useRevealPinnedReceiver(receiverIds, setReceiverIds, allReceiverIds);
  const [overlayIds, setOverlayIds] = useState<string[]>([]);
  const runs = useStudyRuns(studyId);
  const labels = useMemo(() => new Map((runs.data?.runs ?? []).map((item) => [item.id, runLabel(item)])), [runs.data]);
  const overlayState = useOverlayRuns(run, overlayIds, labels);
  const traces = useMemo(() => analysisTraces(run, runId, receiverIds, overlayState.overlays), [run, runId, receiverIds, overlayState.overlays]);
  const drawnRunIds = [runId, ...overlayState.overlays.map((overlay) => overlay.runId)];
  const noReceiver = receiverIds.length === 0 ? "Choose at least one receiver first." : undefined;

  if (run.receivers.length === 0) {
    return (
      <div className="flex flex-col gap-3" data-testid="run-analysis">
        <SectionCaution />
        <Note>This run recorded no receiver, so there are no traces, spectra or band levels to analyse. Add receivers to the scene and run it again.</Note>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4" data-testid="run-analysis">
      <SectionCaution />
      {facts.problem ? (
        <p role="alert" className="text-sm text-signal-warn">
          The run&apos;s frozen scene could not be read ({facts.problem}); the resolved range is estimated as {facts.highestResolvedFrequency.toFixed(0)} Hz from the cell size, and the
          map and barrier estimates are unavailable.
        </p>
      ) : null}
      <div className="grid gap-4 rounded-lg border border-rule bg-panel p-4 lg:grid-cols-2">
        <ReceiverPicker run={run} selected={receiverIds} onChange={setReceiverIds} />
        <OverlayRunPicker studyId={studyId} runId={runId} run={run} chosen={overlayIds} onChange={setOverlayIds} state={overlayState} />
      </div>
      <AnalysisPanel
        title="Pressure at the receivers"
        testId="traces"
        actions={<AddChartButton studyId={studyId} runId={runId} choices={{ quantity: "trace", runIds: drawnRunIds, receiverIds }} unavailableReason={noReceiver} />}
        description={`${record.sceneName ?? "Deleted scene"} v${record.sceneVersion}: ${run.header.run.stepsRun} steps, ${(run.header.run.simulatedSeconds * 1000).toFixed(1)} ms simulated.`}>
        <TraceChart traces={traces} runId={runId} />
      </AnalysisPanel>
      <AnalysisPanel title="Spectra" testId="spectra" actions={<AddChartButton studyId={studyId} runId={runId} choices={{ quantity: "spectrum", runIds: drawnRunIds, receiverIds }} unavailableReason={noReceiver} />}>
        <SpectrumChart traces={traces} runId={runId} highestResolvedFrequency={facts.highestResolvedFrequency} />
      </AnalysisPanel>
      <BandLevelsPanel run={run} runId={runId} studyId={studyId} receiverIds={receiverIds} highestResolvedFrequency={facts.highestResolvedFrequency} sceneTemperature={facts.temperature} />
      <InsertionLossPanel runId={runId} studyId={studyId} run={run} scene={facts.scene} receiverIds={receiverIds} highestResolvedFrequency={facts.highestResolvedFrequency} canCreate={canCreate} />
      <ReceiverSound run={run} runId={runId} receiverIds={receiverIds} />
    </div>
  );
}
