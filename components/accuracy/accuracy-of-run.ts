// The accuracy estimate of a stored run: its frozen scene and grid, with how the run ended and what it
// recorded (energy history, receiver traces). Null when the frozen scene no longer validates.
import { runAccuracy, type RunAccuracy } from "@/lib/analysis/accuracy";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
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
