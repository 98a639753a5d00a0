// Hard limits on what a saved scene may ask of the solver. The editor warns with the same
// numbers; the server enforces them, so a crafted request cannot queue a run no machine can hold.
import { deriveGrid, type GridPlan } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import type { FieldIssue } from "@/lib/http/app-error";

export interface SceneLimits {
  /** Grid cells including the PML. */
  maxCells: number;
  maxSteps: number;
  /** cells x steps of the whole run. */
  maxCellUpdates: number;
  /** Serialised scene JSON, bytes (sampled source signals make it large). */
  maxSceneBytes: number;
}

export const defaultSceneLimits: SceneLimits = {
  maxCells: 4096 * 4096,
  maxSteps: 500_000,
  maxCellUpdates: 5e11,
  maxSceneBytes: 8 * 1024 * 1024,
};

const count = new Intl.NumberFormat("en-GB");

export type SceneCheck = { ok: true; scene: Scene; grid: GridPlan } | { ok: false; issues: FieldIssue[] };

/** Validates untrusted scene JSON and checks it against the limits; issue paths are prefixed (e.g. "data."). */
export function checkSceneWithinLimits(input: unknown, limits: SceneLimits = defaultSceneLimits, pathPrefix = "data"): SceneCheck {
  const at = (path: string) => (path ? `${pathPrefix}.${path}` : pathPrefix);
  const size = JSON.stringify(input ?? null).length;
  if (size > limits.maxSceneBytes) {
    return { ok: false, issues: [{ path: at(""), message: `The scene is ${count.format(size)} bytes; at most ${count.format(limits.maxSceneBytes)} are accepted.` }] };
  }
  const parsed = parseScene(input);
  if (!parsed.ok) return { ok: false, issues: parsed.problems.map((problem) => ({ path: at(problem.path), message: problem.message })) };
  const grid = deriveGrid(parsed.scene);
  const issues: FieldIssue[] = [];
  if (grid.cellCount > limits.maxCells) {
    issues.push({
      path: at("resolution"),
      message: `The grid has ${count.format(grid.cellCount)} cells (${grid.nx} x ${grid.ny}); at most ${count.format(limits.maxCells)} are allowed. Lower the highest frequency or shrink the domain.`,
    });
  }
  if (grid.steps > limits.maxSteps) {
    issues.push({ path: at("duration"), message: `The run needs ${count.format(grid.steps)} time steps; at most ${count.format(limits.maxSteps)} are allowed. Shorten the duration.` });
  }
  if (grid.cellUpdates > limits.maxCellUpdates) {
    issues.push({
      path: at("duration"),
      message: `The run needs ${grid.cellUpdates.toExponential(2)} cell updates; at most ${limits.maxCellUpdates.toExponential(2)} are allowed.`,
    });
  }
  return issues.length ? { ok: false, issues } : { ok: true, scene: parsed.scene, grid };
}
