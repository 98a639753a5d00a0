// A tiny real run shared by the run-record tests: 2 cm air cells, a 1.2 m x 0.6 m domain, a PML on
// three sides and a rigid floor, one Ricker pulse, a point receiver and a short receiver line,
// snapshots every 4 steps and level maps. About a hundred steps: quick, yet every part of a payload
// (traces, snapshots, final field, level and intensity maps) holds real, non-trivial values.
import { buildScene } from "@/lib/fdtd/builders";
import type { Scene, SceneInput } from "@/lib/fdtd/scene";
import { runScene, type SimulationResult } from "@/lib/fdtd/simulation";

export function tinySceneInput(): SceneInput {
  return {
    version: 1,
    name: "Tiny run-record scene",
    domain: { width: 1.2, height: 0.6 },
    resolution: { kind: "cellSize", cellSize: 0.02 },
    boundary: { left: { kind: "pml", layerCells: 8 }, right: { kind: "pml", layerCells: 8 }, top: { kind: "pml", layerCells: 8 }, bottom: { kind: "rigid" } },
    geometry: { solids: [{ id: "block", label: "Block", polygon: [{ x: 0.55, y: 0 }, { x: 0.65, y: 0 }, { x: 0.65, y: 0.25 }, { x: 0.55, y: 0.25 }] }] },
    sources: [{ id: "src", label: "Source", position: { x: 0.3, y: 0.2 }, signal: { kind: "ricker", peakFrequency: 1500 } }],
    receivers: [{ id: "rx", label: "Behind the block", position: { x: 0.9, y: 0.1 } }],
    receiverLines: [{ id: "line", label: "Line", from: { x: 0.1, y: 0.5 }, to: { x: 1.1, y: 0.5 }, count: 4 }],
    duration: { kind: "time", seconds: 0.004 },
    output: { snapshotEverySteps: 4, levelMaps: true },
  };
}

export function tinyScene(): Scene {
  return buildScene(tinySceneInput());
}

let cached: { scene: Scene; result: SimulationResult } | undefined;

/** The tiny scene and its result, computed once per test file. Treat both as read-only. */
export function tinyRun(): { scene: Scene; result: SimulationResult } {
  if (!cached) {
    const scene = tinyScene();
    cached = { scene, result: runScene(scene) };
  }
  return cached;
}
