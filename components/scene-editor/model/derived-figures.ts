// What the derived-numbers panel says about a scene: the grid figures, an estimate of the run time on
// this computer, and every reason to think twice before running (the solver's warnings, a grid too big
// for a browser tab, the server's hard limits).
import { deriveGrid, type GridPlan } from "@/lib/fdtd/grid";
import type { Scene } from "@/lib/fdtd/scene";
import { checkSceneWithinLimits, defaultSceneLimits, type SceneLimits } from "@/lib/validation/scene-limits";

/**
 * Above this much simulation state a browser tab is likely to fail or crawl: tabs get a few GB at most
 * and the page needs room beside the solver (a rule of thumb, common practice for in-browser tools).
 */
export const BROWSER_MEMORY_LIMIT_BYTES = 1e9;

export type ConcernLevel = "limit" | "browser" | "check";

export interface Concern {
  level: ConcernLevel;
  message: string;
  /** Scene field concerned (dotted JSON path), when there is one. */
  path?: string;
}

export interface DerivedFigures {
  grid: GridPlan;
  /** Seconds of computation on this computer at `rate` cell updates per second; null without a rate. */
  estimatedRunSeconds: number | null;
  concerns: Concern[];
}

/**
 * Run time estimate: the run's cell updates divided by a measured rate. Ignores setup and the
 * energy checks (about 1% of the stepping), so it is a floor rather than a promise.
 */
export function estimateRunSeconds(grid: Pick<GridPlan, "cellUpdates">, cellUpdatesPerSecond: number | null | undefined): number | null {
  if (!cellUpdatesPerSecond || !(cellUpdatesPerSecond > 0)) return null;
  return grid.cellUpdates / cellUpdatesPerSecond;
}

/** Strips the "data." prefix that checkSceneWithinLimits puts on issue paths. */
function scenePath(path: string): string | undefined {
  const stripped = path.replace(/^data\.?/, "");
  return stripped === "" ? undefined : stripped;
}

export function deriveFigures(scene: Scene, cellUpdatesPerSecond: number | null, limits: SceneLimits = defaultSceneLimits): DerivedFigures {
  const grid = deriveGrid(scene);
  const concerns: Concern[] = [];
  const check = checkSceneWithinLimits(scene, limits);
  if (!check.ok) for (const issue of check.issues) concerns.push({ level: "limit", message: issue.message, path: scenePath(issue.path) });
  if (grid.memoryBytes > BROWSER_MEMORY_LIMIT_BYTES) {
    concerns.push({
      level: "browser",
      message: `The simulation needs about ${formatBytes(grid.memoryBytes)}, more than a browser tab can be relied on for (about ${formatBytes(BROWSER_MEMORY_LIMIT_BYTES)}). Lower the highest frequency, shrink the domain or run it on the server.`,
      path: "resolution",
    });
  }
  for (const warning of grid.warnings) concerns.push({ level: "check", message: warning.message, path: warning.path });
  return { grid, estimatedRunSeconds: estimateRunSeconds(grid, cellUpdatesPerSecond), concerns };
}

const significant = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });

export function formatBytes(bytes: number): string {
  if (bytes >= 1e9) return `${significant.format(bytes / 1e9)} GB`;
  if (bytes >= 1e6) return `${significant.format(bytes / 1e6)} MB`;
  return `${significant.format(bytes / 1e3)} kB`;
}

/** A duration as a person reads it: "0.42 s", "42 s", "3 min 20 s", "2 h 05 min". */
export function formatRunTime(seconds: number): string {
  if (!Number.isFinite(seconds)) return "–";
  if (seconds < 1) return `${Number(Math.max(seconds, 0.01).toPrecision(2))} s`;
  const wholeSeconds = Math.round(seconds);
  if (wholeSeconds < 60) return `${wholeSeconds} s`;
  if (wholeSeconds < 3600) return `${Math.floor(wholeSeconds / 60)} min ${String(wholeSeconds % 60).padStart(2, "0")} s`;
  const wholeMinutes = Math.round(seconds / 60);
  return `${Math.floor(wholeMinutes / 60)} h ${String(wholeMinutes % 60).padStart(2, "0")} min`;
}
