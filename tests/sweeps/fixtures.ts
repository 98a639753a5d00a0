// A small barrier section for sweep tests: source and receiver on a rigid ground either side of a
// thin wall, fine enough to resolve the 250 Hz to 1 kHz octaves and quick to run in Node.
import { buildScene } from "@/lib/fdtd/builders";
import type { Scene } from "@/lib/fdtd/scene";
import type { SweepDefinition, SweepResults } from "@/lib/validation/blocks";

export function barrierScene(): Scene {
  return buildScene({
    name: "Sweep test barrier",
    domain: { width: 2, height: 1 },
    resolution: { kind: "cellSize", cellSize: 0.02 },
    boundary: { left: { kind: "pml", layerCells: 10 }, right: { kind: "pml", layerCells: 10 }, top: { kind: "pml", layerCells: 10 }, bottom: { kind: "rigid" } },
    geometry: { walls: [{ id: "barrier", label: "Test barrier", path: [{ x: 1, y: 0 }, { x: 1, y: 0.3 }], thickness: 0.02 }] },
    sources: [{ id: "source", label: "Source", position: { x: 0.5, y: 0.1 }, signal: { kind: "ricker", peakFrequency: 700 } }],
    receivers: [
      { id: "shadow", label: "In the shadow", position: { x: 1.5, y: 0.1 } },
      { id: "above", label: "High up", position: { x: 1.5, y: 0.8 } },
    ],
    receiverLines: [{ id: "line", label: "Line", from: { x: 1.2, y: 0.5 }, to: { x: 1.8, y: 0.5 }, count: 3 }],
    duration: { kind: "time", seconds: 0.008 },
    output: { snapshotEverySteps: 10, levelMaps: true },
  });
}

/** A saved sweep as the notebook holds it: three values, two receivers, two octave bands, one failed case. */
export const definition: SweepDefinition = {
  sceneId: "0b0c7c1e-8f8e-4c57-a3a4-2a1f7d3c9e10",
  sceneVersion: 3,
  sceneName: "Design A",
  parameter: { kind: "wall-height", wallId: "barrier" },
  parameterLabel: "height of Timber barrier, 3.0 m",
  unit: "m",
  range: { from: 2, to: 3, step: 0.5 },
  reference: { kind: "without", removedIds: ["barrier"] },
  bandsPerOctave: 1,
  weighting: "Z",
  receiverIds: ["garden", "window"],
};

export const results: SweepResults = {
  values: [2, 2.5, 3],
  outcomes: [{ status: "done" }, { status: "failed", message: "unstable" }, { status: "done" }],
  receivers: [
    { id: "garden", label: "Garden, 1.5 m" },
    { id: "window", label: "Window" },
  ],
  bands: [
    { index: -6, nominal: 125, lower: 88.4, upper: 177 },
    { index: -3, nominal: 250, lower: 177, upper: 354 },
  ],
  insertionLoss: [
    [
      [5.1, 7.25],
      [3, 4],
    ],
    [
      [null, null],
      [null, null],
    ],
    [
      [6, 9.5],
      [4.5, null],
    ],
  ],
  overall: [
    [6.3, 3.4],
    [null, null],
    [7.7, 4.5],
  ],
  excludedBands: [],
  completedAt: "2026-02-01T10:00:00.000Z",
};

