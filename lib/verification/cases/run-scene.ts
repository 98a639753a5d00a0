// Runs one of a case's scenes with the solver, reporting progress as a slice of the whole case.
import { runScene, type SimulationResult } from "../../fdtd/simulation";
import type { SceneInput } from "../../fdtd/scene";
import type { VerificationRunOptions } from "./types";

/** Progress of a case with several stages: stage k of n covers fractions [k/n, (k+1)/n). */
export class CaseProgress {
  private done = 0;
  constructor(
    private readonly options: VerificationRunOptions | undefined,
    private readonly stages: number,
  ) {}

  /** Reports a stage's own fraction (0..1) within its slice. */
  report(stage: string, fraction: number): void {
    this.options?.onProgress?.({ fraction: Math.min(1, (this.done + Math.min(1, Math.max(0, fraction))) / this.stages), stage });
  }

  /** Marks the current stage finished. */
  next(stage: string): void {
    this.done = Math.min(this.stages, this.done + 1);
    this.report(stage, 0);
  }

  /** Runs a scene as the current stage, then moves on. */
  run(stage: string, scene: SceneInput): SimulationResult {
    this.report(stage, 0);
    const kernel = this.options?.kernel;
    const result = runScene(scene, { ...(kernel ? { kernel } : {}), onProgress: (p) => this.report(stage, p.fraction) });
    this.next(stage);
    return result;
  }
}
