// The accuracy estimate of a run: a stored one from its frozen scene and grid, or a browser run just finished
// from the scene it was given and its live result; either with how the run ended and what it recorded (energy
// history, receiver traces), so both give the same estimate once the run is saved. Null when the frozen
// scene no longer validates.
import { runAccuracy, type RunAccuracy } from "@/lib/analysis/accuracy";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import type { ReceiverTrace, SimulationResult } from "@/lib/fdtd/simulation";
import type { DecodedRun } from "@/lib/run-record/payload";

export function accuracyOfRun(run: Pick<DecodedRun, "header" | "receivers">): RunAccuracy | null {
  const parsed = parseScene(run.header.scene);
  if (!parsed.ok) return null;
  const first = run.receivers[0];
  return runAccuracy(parsed.scene, deriveGrid(parsed.scene), {
    simulatedSeconds: run.header.run.simulatedSeconds,
    stoppedBy: run.header.run.stoppedBy,
    energy: run.header.energy,
    traces: run.receivers,
    timeStep: first?.timeStep,
    sampleCount: first?.pressure.length,
  });
}

/** A browser run's result, before or after it is saved: its grid is the one the run stepped. */
export function accuracyOfResult(scene: Scene, result: Pick<SimulationResult, "grid" | "simulatedSeconds" | "stoppedBy" | "energy"> & { receivers: readonly Pick<ReceiverTrace, "id" | "label" | "timeStep" | "pressure">[] }): RunAccuracy {
  const first = result.receivers[0];
  return runAccuracy(scene, result.grid, {
    simulatedSeconds: result.simulatedSeconds,
    stoppedBy: result.stoppedBy,
    energy: result.energy,
    traces: result.receivers,
    timeStep: first?.timeStep,
    sampleCount: first?.pressure.length,
  });
}
