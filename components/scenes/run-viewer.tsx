"use client";
// The pressure field of a run: live while it steps, then replayable over its snapshots with a time
// scrubber, and switchable to the level maps once the run has finished. FieldReplay shows any
// result-like object (a live run's result or a saved run read back); RunViewer feeds it a live run.
import { useEffect, useMemo, useRef, useState } from "react";
import { sameGrid, useSessionRuns } from "@/components/run/session-runs";
import type { BrowserRunState } from "@/components/run/use-browser-run";
import { FieldView, type FieldRange, type FieldViewHandle, type FieldViewMode } from "@/components/field-view/field-view";
import { downloadBlob, FieldViewToolbar } from "@/components/field-view/field-view-toolbar";
import { Button } from "@/components/ui/button";
import type { GridPlan } from "@/lib/fdtd/grid";
import type { Scene } from "@/lib/fdtd/scene";
import type { FieldSnapshot, LevelMaps } from "@/lib/fdtd/simulation";

/** What a replay needs of a run: a SimulationResult and a DecodedRun (lib/run-record/payload) both fit. */
export interface FieldReplaySource {
  snapshots: readonly FieldSnapshot[];
  finalPressure: FieldSnapshot;
  levelMaps?: LevelMaps;
  intensity?: { x: FieldSnapshot; y: FieldSnapshot };
}

/** A run whose level maps this one can be subtracted from (same grid), for the insertion-loss view. */
export interface ReplayReference {
  id: string;
  name: string;
  levelMaps: LevelMaps;
}

export function RunViewer({ scene, sceneId, state }: { scene: Scene; sceneId: string; grid: GridPlan; state: BrowserRunState }) {
  const result = state.result;
  const sessionRuns = useSessionRuns();
  // The references this run can be compared with: finished runs of other scenes on the same grid,
  // scenes marked as reference first.
  const references = useMemo(
    () =>
      result
        ? [...sessionRuns.values()]
            .filter((run) => run.sceneId !== sceneId && sameGrid(run.result, result) && run.result.levelMaps)
            .sort((a, b) => Number(b.isReference) - Number(a.isReference) || b.finishedAt - a.finishedAt)
            .map((run) => ({ id: run.sceneId, name: run.sceneName, levelMaps: run.result.levelMaps! }))
        : [],
    [sessionRuns, sceneId, result],
  );
  return <FieldReplay scene={scene} result={result} liveFrame={state.frame} references={references} noReferenceReason="Run the reference scene (same grid) in this tab first" />;
}

export function FieldReplay({
  scene,
  result,
  liveFrame = null,
  references = [],
  noReferenceReason,
}: {
  scene: Scene;
  /** The finished run, or null while it steps (then liveFrame is shown). */
  result: FieldReplaySource | null;
  liveFrame?: FieldSnapshot | null;
  references?: readonly ReplayReference[];
  /** Why the level difference is unavailable when there is no reference. */
  noReferenceReason: string;
}) {
  const view = useRef<FieldViewHandle>(null);
  const [mode, setMode] = useState<FieldViewMode>("pressure");
  const [range, setRange] = useState<FieldRange>({ kind: "auto" });
  const [frameIndex, setFrameIndex] = useState<number | null>(null);
  const [playing, setPlaying] = useState(false);
  const [showFlow, setShowFlow] = useState(false);
  const [referenceId, setReferenceId] = useState<string | null>(null);
  const reference = references.find((run) => run.id === referenceId) ?? references[0];
  const frames = useMemo(() => (result ? [...result.snapshots, ...(result.snapshots.at(-1)?.step === result.finalPressure.step ? [] : [result.finalPressure])] : []), [result]);
  const lastIndex = frames.length - 1;
  const shownIndex = frameIndex ?? lastIndex;
  const field = result ? (frames[shownIndex] ?? null) : liveFrame;

  // Playback: one snapshot per animation frame, from the start when at the end.
  useEffect(() => {
    if (!playing || frames.length === 0) return;
    let request = 0;
    const tick = () => {
      setFrameIndex((index) => {
        const next = (index ?? lastIndex) >= lastIndex ? 0 : (index ?? 0) + 1;
        if (next >= lastIndex) setPlaying(false);
        return next;
      });
      request = requestAnimationFrame(tick);
    };
    request = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(request);
  }, [playing, frames.length, lastIndex]);

  const levelsMissing = result?.levelMaps ? undefined : "Level maps are available when the run has finished";
  const differenceMissing = levelsMissing ?? (reference ? undefined : noReferenceReason);
  const flowAvailable = Boolean(result?.intensity) && (mode === "peak-level" || mode === "rms-level");
  return (
    <div className="flex flex-col gap-3">
      <FieldViewToolbar
        mode={mode}
        onModeChange={setMode}
        unavailableModes={{
          ...(levelsMissing ? { "peak-level": levelsMissing, "rms-level": levelsMissing } : {}),
          ...(differenceMissing ? { "level-difference": differenceMissing } : {}),
        }}
        range={range}
        onRangeChange={setRange}
        onExport={async () => {
          const blob = await view.current?.exportPng();
          if (blob) downloadBlob(blob, `${(scene.name || "scene").replace(/[^\w.-]+/g, "-")}-${mode}.png`);
        }}
      />
      <div data-testid="field-view">
        <FieldView
          ref={view}
          scene={scene}
          field={field}
          mode={mode}
          levelMaps={result?.levelMaps}
          comparison={mode === "level-difference" ? reference?.levelMaps : undefined}
          intensity={showFlow && flowAvailable && result?.intensity ? { x: result.intensity.x, y: result.intensity.y } : undefined}
          range={range}
          className="aspect-[16/7] w-full"
        />
      </div>
      {flowAvailable || (mode === "level-difference" && references.length > 0) ? (
        <div className="flex flex-wrap items-center gap-4 text-sm text-ink-soft">
          {flowAvailable ? (
            <label className="flex items-center gap-2">
              <input type="checkbox" checked={showFlow} onChange={(event) => setShowFlow(event.target.checked)} className="accent-tide-600" />
              Show energy flow (time-averaged intensity)
            </label>
          ) : null}
          {mode === "level-difference" && references.length > 0 ? (
            <label className="flex items-center gap-2">
              Reference
              <select
                value={reference?.id ?? ""}
                onChange={(event) => setReferenceId(event.target.value)}
                className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-sm text-ink"
              >
                {references.map((run) => (
                  <option key={run.id} value={run.id}>
                    {run.name}
                  </option>
                ))}
              </select>
              <span className="text-muted">Insertion loss = reference level − this run&apos;s level</span>
            </label>
          ) : null}
        </div>
      ) : null}
      {result && frames.length > 1 && mode === "pressure" ? (
        <div className="flex items-center gap-3">
          <Button size="sm" variant="secondary" onClick={() => setPlaying((value) => !value)} aria-label={playing ? "Pause playback" : "Play the snapshots"}>
            {playing ? "Pause" : "Play"}
          </Button>
          <input
            type="range"
            aria-label="Time"
            min={0}
            max={lastIndex}
            step={1}
            value={shownIndex}
            onChange={(event) => {
              setPlaying(false);
              setFrameIndex(Number(event.target.value));
            }}
            className="flex-1 accent-tide-600"
          />
          <span className="tabular w-24 text-right font-mono text-xs text-ink-soft">{((frames[shownIndex]?.time ?? 0) * 1000).toFixed(2)} ms</span>
        </div>
      ) : null}
    </div>
  );
}
