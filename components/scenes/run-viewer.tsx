"use client";
// The pressure field of a run: live while it steps, then replayable over its snapshots with a time
// scrubber, and switchable to the level maps once the run has finished. FieldReplay shows any
// result-like object (a live run's result or a saved run read back); RunViewer feeds it a live run.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { useFieldPins } from "@/components/comments/pin-context";
import { formatPin, roundPickedPin } from "@/components/comments/pin-format";
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

/**
 * Comment pins on the replay (only inside the saved run page's pin board): markers in metres, a jump
 * to the snapshot nearest a pin's time, and pin mode, where a click on the domain makes a pin at the
 * shown time. Null elsewhere, so other pages draw no pins.
 */
function useReplayPins({ scene, frames, shownTime, showFrame }: { scene: Scene; frames: readonly FieldSnapshot[]; shownTime: number; showFrame: (index: number) => void }) {
  const board = useFieldPins();
  const viewBox = useRef<HTMLDivElement>(null);
  const [expiredNonce, setExpiredNonce] = useState<number | null>(null);
  const [outside, setOutside] = useState(false);
  const markers = useMemo(
    () => (board?.pins ?? []).map((placed) => ({ id: placed.commentId, label: String(placed.number), x: placed.pin.x, y: placed.pin.y, title: `${placed.title} (${formatPin(placed.pin)})`, muted: placed.resolved })),
    [board?.pins],
  );

  // A chip asked for this pin: show the nearest stored snapshot, bring the view into sight, flash the marker.
  const focus = board?.focus ?? null;
  // Primitives only: the board hands out a new object whenever anything on it changes.
  const focusNonce = focus?.nonce;
  const focusTime = focus?.placed.pin.t;
  useEffect(() => {
    if (focusNonce === undefined || focusTime === undefined || frames.length === 0) return;
    let nearest = 0;
    frames.forEach((frame, index) => {
      if (Math.abs(frame.time - focusTime) < Math.abs(frames[nearest]!.time - focusTime)) nearest = index;
    });
    showFrame(nearest);
    viewBox.current?.scrollIntoView({ behavior: "smooth", block: "center" });
    const timer = setTimeout(() => setExpiredNonce(focusNonce), 3000);
    return () => clearTimeout(timer);
  }, [focusNonce, focusTime, frames, showFrame]);
  const emphasis = focus && focus.nonce !== expiredNonce ? { id: focus.placed.commentId, key: focus.nonce } : null;

  if (!board) return null;
  const picking = board.picking;
  return {
    viewBox,
    viewProps: {
      markers,
      emphasisedMarkerId: emphasis?.id ?? null,
      flashKey: emphasis?.key,
      onMarkerSelect: board.selectComment,
      onPickPoint: picking
        ? (point: { x: number; y: number }) => {
            const inside = point.x >= 0 && point.x <= scene.domain.width && point.y >= 0 && point.y <= scene.domain.height;
            setOutside(!inside);
            if (inside) board.pick(roundPickedPin({ kind: "field", x: point.x, y: point.y, t: shownTime }));
          }
        : undefined,
    },
    banner: picking ? (
      <p role="status" className="flex flex-wrap items-center gap-3 rounded-md border border-ember-100 bg-ember-50 px-3 py-2 text-sm text-ember-700" data-testid="field-pin-mode">
        {outside ? "That point is outside the domain (the PML bands are not part of it)." : `Click a point in the domain to pin your comment there at t = ${(shownTime * 1000).toFixed(2)} ms; move the time slider first to pin another moment.`}
        <button type="button" onClick={board.stopPicking} className="ml-auto font-medium underline underline-offset-2">
          Stop pinning
        </button>
      </p>
    ) : null,
  };
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
  const showFrame = useCallback((index: number) => {
    setPlaying(false);
    setMode("pressure");
    setFrameIndex(index);
  }, []);
  const pins = useReplayPins({ scene, frames, shownTime: frames[shownIndex]?.time ?? 0, showFrame });

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
      {pins?.banner}
      <div data-testid="field-view" ref={pins?.viewBox}>
        <FieldView
          {...pins?.viewProps}
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
