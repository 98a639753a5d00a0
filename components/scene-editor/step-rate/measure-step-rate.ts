// A quick measurement of how fast this computer steps the solver, for the run-time estimate: a small
// but realistic grid (PML on three sides, a rigid ground, a barrier, level maps on) stepped with the
// same kernel a browser run uses. Synchronous; run it in a Web Worker so the page stays responsive.
import { buildScene } from "@/lib/fdtd/builders";
import { Simulation } from "@/lib/fdtd/simulation";
import type { Scene } from "@/lib/fdtd/scene";

export interface StepRateMeasurement {
  /** Cell updates per second (cells x steps / seconds) while stepping. */
  cellUpdatesPerSecond: number;
  /** Kernel that stepped, e.g. "wasm-simd" or "typescript". */
  kernel: string;
  cells: number;
  steps: number;
  seconds: number;
}

export interface MeasureOptions {
  /** Stepping time to aim for, s; the rate is averaged over at least this long. */
  minSeconds?: number;
  /** Clock in seconds; injectable so tests can check the arithmetic without timing anything. */
  now?: () => number;
}

/** Steps run before the clock starts, so that the kernel is compiled and the caches are warm. */
const WARM_UP_STEPS = 20;
/** Steps between clock reads. */
const BATCH_STEPS = 10;

/** The benchmark scene: 12 m x 12 m of air on 4 cm cells, 300 x 300 cells plus a 20-cell PML on three sides. */
export function benchmarkScene(): Scene {
  return buildScene({
    name: "step-rate benchmark",
    domain: { width: 12, height: 12 },
    resolution: { kind: "cellSize", cellSize: 0.04, courantNumber: 0.6 },
    boundary: { left: { kind: "pml", layerCells: 20 }, right: { kind: "pml", layerCells: 20 }, top: { kind: "pml", layerCells: 20 }, bottom: { kind: "rigid" } },
    geometry: { walls: [{ id: "barrier", label: "barrier", path: [{ x: 6, y: 0 }, { x: 6, y: 3 }], thickness: 0.1 }] },
    sources: [{ id: "source", label: "source", position: { x: 2, y: 0.5 }, signal: { kind: "ricker", peakFrequency: 200 } }],
    receivers: [{ id: "receiver", label: "receiver", position: { x: 10, y: 1.5 } }],
    // Long enough that the measurement never reaches the end of the run.
    duration: { kind: "time", seconds: 1 },
    output: { levelMaps: true },
  });
}

const defaultNow = (): number => (typeof performance !== "undefined" ? performance.now() : Date.now()) / 1000;

export function measureStepRate(options: MeasureOptions = {}): StepRateMeasurement {
  const now = options.now ?? defaultNow;
  const minSeconds = options.minSeconds ?? 0.3;
  const simulation = new Simulation(benchmarkScene());
  const cells = simulation.grid.cellCount;
  const maxSteps = simulation.grid.steps - WARM_UP_STEPS;
  for (let k = 0; k < WARM_UP_STEPS; k++) simulation.advance();
  const started = now();
  let steps = 0;
  let seconds = 0;
  while (seconds < minSeconds && steps + BATCH_STEPS <= maxSteps) {
    for (let k = 0; k < BATCH_STEPS; k++) simulation.advance();
    steps += BATCH_STEPS;
    seconds = now() - started;
  }
  return { cellUpdatesPerSecond: seconds > 0 ? (cells * steps) / seconds : 0, kernel: simulation.kernel.name, cells, steps, seconds };
}
