// The field-view harness page: the demo barrier scene with an analytic pulse over rigid ground (see
// synthetic-field.ts), the toolbar, a time scrubber, and hooks on `window.fieldViewHarness` for shoot.mjs.
// Query string: mode, t (s), renderer (auto | webgl-bytes | canvas-2d), bench=1 for the 512 x 512 timing,
// source=solver to run lib/fdtd on this page instead (design A and the no-barrier reference, for the real
// diffraction and insertion loss; the solver has no intensity output, so no arrows then).
import "@fontsource/ibm-plex-sans/400.css";
import "@fontsource/ibm-plex-sans/500.css";
import "@fontsource/ibm-plex-sans/600.css";
import "@fontsource/ibm-plex-mono/400.css";
import "./harness.css";

import { StrictMode, useEffect, useMemo, useRef, useState } from "react";
import { createRoot } from "react-dom/client";

import { FieldView, type FieldRange, type FieldViewHandle, type FieldViewMode } from "@/components/field-view/field-view";
import { downloadBlob, FieldViewToolbar } from "@/components/field-view/field-view-toolbar";
import { SnapshotScrubber } from "@/components/field-view/snapshot-scrubber";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { Simulation, type FieldSnapshot, type LevelMaps } from "@/lib/fdtd/simulation";

import demoScene from "../../../db/seed/scenes/design-a-3m-reflective.json";
import referenceScene from "../../../db/seed/scenes/reference-no-barrier.json";
import { runBenchmark, type BenchmarkReport } from "./bench";
import { makeSyntheticRun, type SyntheticRun } from "./synthetic-field";

interface HarnessApi {
  ready: boolean;
  mode: FieldViewMode;
  setMode(mode: FieldViewMode): void;
  setTime(seconds: number): void;
  exportPng(): Promise<string>;
  currentRange(): { low: number; high: number } | undefined;
  bench?: BenchmarkReport;
}

declare global {
  interface Window {
    fieldViewHarness?: HarnessApi;
  }
}

const params = new URLSearchParams(window.location.search);
const scene = parseSceneOrThrow(demoScene);
const grid = deriveGrid(scene);
const useSolver = params.get("source") === "solver";

/** What the page shows: pressure over time, level maps, the reference's level maps, maybe intensity. */
interface HarnessRun {
  /** Times and steps of the pressure snapshots, every 20 steps as the demo scene asks. */
  snapshots: { time: number; step: number }[];
  snapshotAt(index: number): FieldSnapshot;
  levelMaps: LevelMaps;
  comparison: LevelMaps;
  intensity?: SyntheticRun["intensity"];
  duration: number;
  description: string;
}

function analyticRun(): HarnessRun {
  const run = makeSyntheticRun(scene, {
    cellSize: grid.cellSize,
    width: grid.domainCells.nx,
    height: grid.domainCells.ny,
    timeStep: grid.timeStep,
    soundSpeed: grid.soundSpeed,
    density: grid.density,
  });
  const every = scene.output.snapshotEverySteps ?? 20;
  const snapshots = Array.from({ length: Math.floor(run.duration / grid.timeStep / every) + 1 }, (_, k) => ({ step: k * every, time: k * every * grid.timeStep }));
  return {
    snapshots,
    snapshotAt: (index) => run.pressureAt(snapshots[index]!.time),
    levelMaps: run.levelMaps,
    comparison: run.freeFieldLevelMaps,
    intensity: run.intensity,
    duration: run.duration,
    description:
      "Analytic line-source pulse (Ricker) over rigid ground, image-source method; the barrier and house are drawn but not simulated. Reference run for the level difference: free field.",
  };
}

function solverRun(): HarnessRun {
  const variant = new Simulation(demoScene).run();
  const reference = new Simulation(referenceScene).run();
  if (!variant.levelMaps || !reference.levelMaps) throw new Error("the demo scenes keep level maps");
  return {
    snapshots: variant.snapshots.map(({ time, step }) => ({ time, step })),
    snapshotAt: (index) => variant.snapshots[index]!,
    levelMaps: variant.levelMaps,
    comparison: reference.levelMaps,
    duration: variant.simulatedSeconds,
    description: `lib/fdtd on this page (${variant.kernel}): design A, and the scene without the barrier as the reference for the insertion loss.`,
  };
}

/** The snapshot nearest to a time, s. */
function nearestIndex(run: HarnessRun, time: number): number {
  let best = 0;
  run.snapshots.forEach((snapshot, k) => {
    if (Math.abs(snapshot.time - time) < Math.abs(run.snapshots[best]!.time - time)) best = k;
  });
  return best;
}

function Harness() {
  const [mode, setMode] = useState<FieldViewMode>((params.get("mode") as FieldViewMode | null) ?? "pressure");
  const [range, setRange] = useState<FieldRange>({ kind: "auto" });
  const [playing, setPlaying] = useState(false);
  const view = useRef<FieldViewHandle>(null);
  const renderer = (params.get("renderer") ?? "auto") as "auto" | "webgl-bytes" | "canvas-2d";

  const run = useMemo(() => (useSolver ? solverRun() : analyticRun()), []);
  const [index, setIndex] = useState(() => nearestIndex(run, Number(params.get("t") ?? "0.045")));
  const field = useMemo(() => run.snapshotAt(index), [run, index]);

  useEffect(() => {
    window.fieldViewHarness = {
      ready: true,
      mode,
      setMode,
      setTime: (time) => setIndex(nearestIndex(run, time)),
      async exportPng() {
        const blob = await view.current!.exportPng();
        const bytes = new Uint8Array(await blob.arrayBuffer());
        let binary = "";
        for (const byte of bytes) binary += String.fromCharCode(byte);
        return btoa(binary);
      },
      currentRange: () => view.current?.currentRange(),
    };
  }, [mode, run]);

  return (
    <main className="mx-auto flex max-w-[1280px] flex-col gap-4 px-6 py-6">
      <header className="flex items-baseline justify-between gap-4 border-b border-rule pb-3">
        <div>
          <p className="text-[11px] font-medium uppercase tracking-wide text-tide-700">Field view harness</p>
          <h1 className="text-lg font-semibold text-ink">{scene.name}</h1>
        </div>
        <p className="max-w-md text-right text-xs text-muted">{run.description}</p>
      </header>
      <FieldViewToolbar
        mode={mode}
        onModeChange={setMode}
        range={range}
        onRangeChange={setRange}
        currentRange={() => view.current?.currentRange()}
        onExport={async () => {
          const blob = await view.current?.exportPng();
          if (blob) downloadBlob(blob, `field-${mode}.png`);
        }}
      />
      <FieldView
        ref={view}
        scene={scene}
        field={field}
        mode={mode}
        levelMaps={run.levelMaps}
        comparison={run.comparison}
        intensity={run.intensity}
        range={range}
        renderer={renderer}
        className="h-[430px]"
      />
      <SnapshotScrubber snapshots={run.snapshots} index={index} onIndexChange={setIndex} playing={playing} onPlayingChange={setPlaying} loop />
    </main>
  );
}

function BenchPage() {
  const [report, setReport] = useState<BenchmarkReport | null>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    let cancelled = false;
    void runBenchmark(canvas.current!).then((result) => {
      if (cancelled) return;
      setReport(result);
      window.fieldViewHarness = { ready: true, mode: "pressure", setMode() {}, setTime() {}, exportPng: async () => "", currentRange: () => undefined, bench: result };
    });
    return () => {
      cancelled = true;
    };
  }, []);
  return (
    <main className="mx-auto flex max-w-[900px] flex-col gap-3 px-6 py-6">
      <h1 className="text-lg font-semibold text-ink">Field view: 512 x 512 upload and draw</h1>
      <canvas ref={canvas} className="block h-[600px] w-[600px]" />
      <pre className="font-mono text-xs text-ink-soft" data-bench>
        {report ? JSON.stringify(report, null, 2) : "measuring..."}
      </pre>
    </main>
  );
}

createRoot(document.getElementById("root")!).render(<StrictMode>{params.get("bench") ? <BenchPage /> : <Harness />}</StrictMode>);
