"use client";
// Start, pause, resume and cancel a browser run, with its progress in the units an engineer
// watches: steps, simulated time, cell updates per second, time left. A finished run can be saved, and says
// how far to trust it (the accuracy estimate, collapsed to one line).
import { useQueryClient } from "@tanstack/react-query";
import { useParams } from "next/navigation";
import { useState, type ReactNode } from "react";
import { LiveRunAccuracy } from "@/components/accuracy/live-run-accuracy";
import { RunSaveControl, type RunSaveSource } from "@/components/runs/run-save-control";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { queryKeys } from "@/lib/client/queries";
import { parseScene } from "@/lib/fdtd/scene";
import type { SceneResponse } from "@/lib/http/api-types";
import type { BrowserRunState } from "./use-browser-run";

const compact = new Intl.NumberFormat("en-GB", { notation: "compact", maximumSignificantDigits: 3 });

function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds)) return "–";
  if (seconds < 60) return `${seconds.toFixed(seconds < 10 ? 1 : 0)} s`;
  return `${Math.floor(seconds / 60)} min ${Math.round(seconds % 60)} s`;
}

const phaseLabels: Record<BrowserRunState["phase"], string> = {
  idle: "Not run yet",
  starting: "Preparing the grid…",
  running: "Running",
  paused: "Paused",
  finished: "Finished",
  cancelled: "Cancelled",
  failed: "Stopped",
};

/**
 * The scene page's scene as it is cached when a run starts: the workspace runs that record's saved
 * version, so the run is filed under it. Null outside a scene page or before the scene has loaded.
 */
function useCachedSceneSource(): () => RunSaveSource | null {
  const client = useQueryClient();
  const params = useParams<{ studyId?: string; sceneId?: string }>();
  return () => {
    const { studyId, sceneId } = params;
    if (typeof studyId !== "string" || typeof sceneId !== "string") return null;
    const record = client.getQueryData<SceneResponse>(queryKeys.scene(sceneId))?.scene;
    const parsed = record ? parseScene(record.data) : null;
    if (!record || !parsed?.ok) return null;
    return { studyId, sceneId, sceneVersion: record.version, scene: parsed.scene, unsavedEdits: false };
  };
}

export function RunPanel({
  state,
  canRun,
  onStart,
  onPause,
  onResume,
  onCancel,
  source,
  serverRun,
}: {
  state: BrowserRunState;
  canRun: boolean;
  onStart: () => void;
  onPause: () => void;
  onResume: () => void;
  onCancel: () => void;
  /** What the next run is made from; without it, the scene page's cached scene at the moment the run starts. */
  source?: RunSaveSource | null;
  /** The scene page's "Run on the server" action, beside the browser's run controls (it lays out in their row). */
  serverRun?: ReactNode;
}) {
  const { phase, progress } = state;
  const cachedSource = useCachedSceneSource();
  // Captured at the start: saving the scene while it runs must not re-file the run under the new version.
  const [runSource, setRunSource] = useState<RunSaveSource | null>(null);
  const start = () => {
    setRunSource(source !== undefined ? source : cachedSource());
    onStart();
  };
  const active = phase === "starting" || phase === "running" || phase === "paused";
  const percent = progress ? Math.round(progress.fraction * 1000) / 10 : 0;
  return (
    <section aria-label="Run" className="flex flex-col gap-4">
      {!state.isolated ? (
        <p role="note" className="rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-3 py-2 text-[13px] text-ink-soft">
          This page is not cross-origin isolated, so the run uses one worker without shared memory; pause and cancel act between chunks of steps.
        </p>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        {!active ? (
          <Button onClick={start} disabled={!canRun} title={canRun ? undefined : "Your role cannot run simulations"}>
            {phase === "idle" ? "Run in this browser" : "Run again"}
          </Button>
        ) : (
          <>
            {phase === "paused" ? (
              <Button onClick={onResume}>Resume</Button>
            ) : (
              <Button variant="secondary" onClick={onPause} disabled={phase === "starting"}>
                Pause
              </Button>
            )}
            <Button variant="secondary" onClick={onCancel}>
              Cancel
            </Button>
          </>
        )}
        {serverRun}
        <span data-testid="run-phase" className="text-sm font-medium text-ink-soft">
          {phaseLabels[phase]}
        </span>
        {state.engine ? (
          <span className="text-xs text-muted" title="Kernel and worker threads stepping this run">
            {state.engine.kernel.split(" ")[0]!.replace("wasm-simd", "WebAssembly SIMD").replace("typescript", "JavaScript")} · {state.engine.threads} {state.engine.threads === 1 ? "thread" : "threads"}
          </span>
        ) : null}
      </div>
      <div>
        <div
          role="progressbar"
          aria-label="Run progress"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percent}
          className="h-2 overflow-hidden rounded-full bg-rule"
        >
          <div className={`h-full rounded-full transition-[width] ${phase === "paused" ? "bg-signal-warn" : "bg-tide-500"}`} style={{ width: `${percent}%` }} />
        </div>
        {progress ? (
          <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
            <Stat label="Steps" value={`${progress.step.toLocaleString("en-GB")} / ${progress.steps.toLocaleString("en-GB")}`} testId="run-steps" />
            <Stat label="Simulated" value={`${(progress.simulatedSeconds * 1000).toFixed(1)} ms`} />
            <Stat label="Cell updates/s" value={compact.format(progress.cellUpdatesPerSecond)} />
            <Stat label="Time left" value={progress.remainingSeconds === null ? "–" : formatDuration(progress.remainingSeconds)} />
          </dl>
        ) : null}
      </div>
      {state.result && (phase === "finished" || phase === "cancelled") ? (
        <RunSaveControl result={state.result} threads={state.engine?.threads} source={runSource} canSave={canRun} />
      ) : null}
      {/* The scene captured at the start is the one the run stepped and a save files: the estimate describes it. */}
      {state.result && runSource && (phase === "finished" || phase === "cancelled") ? <LiveRunAccuracy scene={runSource.scene} result={state.result} /> : null}
      {state.error ? (
        <ErrorState title={state.error.unstable ? "The simulation became unstable" : "The simulation stopped"} message={state.error.message} />
      ) : null}
    </section>
  );
}

function Stat({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div>
      <dt className="text-xs text-muted">{label}</dt>
      <dd data-testid={testId} className="tabular font-mono text-[13px] text-ink">
        {value}
      </dd>
    </div>
  );
}
