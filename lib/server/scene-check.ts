// Server-side scene check: parse and enforce the limits, or answer 400 naming the scene path.
import "server-only";
import type { Scene } from "@/lib/fdtd/scene";
import { AppError } from "@/lib/http/app-error";
import { checkSceneWithinLimits, defaultSceneLimits, type SceneLimits } from "@/lib/validation/scene-limits";

function limitsFromEnvironment(): SceneLimits {
  const read = (name: string, fallback: number) => {
    const value = Number(process.env[name]);
    return Number.isFinite(value) && value > 0 ? value : fallback;
  };
  return {
    maxCells: read("RAREFACT_MAX_CELLS", defaultSceneLimits.maxCells),
    maxSteps: read("RAREFACT_MAX_STEPS", defaultSceneLimits.maxSteps),
    maxCellUpdates: read("RAREFACT_MAX_CELL_UPDATES", defaultSceneLimits.maxCellUpdates),
    maxSceneBytes: defaultSceneLimits.maxSceneBytes,
  };
}

export function requireValidScene(input: unknown): Scene {
  const check = checkSceneWithinLimits(input, limitsFromEnvironment());
  if (!check.ok) {
    const first = check.issues[0]!;
    throw new AppError("bad_request:scene", `${first.path}: ${first.message}`, check.issues);
  }
  return check.scene;
}
