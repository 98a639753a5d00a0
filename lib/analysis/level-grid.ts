// Sound pressure level maps on the solver's output grid (the layout of FieldSnapshot), in dB re 20 uPa,
// with NaN where no level is defined (inside solids, or where the pressure never moved).
import type { DomainGrid } from "@/lib/fdtd/simulation";

import { levelFromMeanSquare } from "./bands";

/** Levels (or any values) on the solver's output grid: the layout of its snapshots and level maps. */
export type LevelGrid = DomainGrid;

/**
 * Level map from a map of root-mean-square pressure (LevelMaps.rms), Pa. A zero or non-finite rms has no
 * level (NaN rather than -Infinity, so that differences of maps stay NaN there); so has every cell marked
 * in `solidMask` (1 inside a solid, same layout), when given.
 */
export function levelGridFromRms(rms: LevelGrid, solidMask?: ArrayLike<number>): LevelGrid {
  if (solidMask && solidMask.length !== rms.values.length) throw new RangeError(`solid mask of ${solidMask.length} cells for a grid of ${rms.values.length}`);
  const values = new Float32Array(rms.values.length);
  for (let i = 0; i < values.length; i++) {
    const p = rms.values[i] ?? NaN;
    const solid = solidMask ? (solidMask[i] ?? 0) !== 0 : false;
    values[i] = !solid && p > 0 && Number.isFinite(p) ? levelFromMeanSquare(p * p) : NaN;
  }
  return { width: rms.width, height: rms.height, x0: rms.x0, y0: rms.y0, spacing: rms.spacing, values };
}

/** Positions agree to this fraction of a grid spacing: grids built from the same scene match to rounding. */
const POSITION_TOLERANCE = 1e-6;

/** Why two grids do not lie on each other, or undefined when they do. */
export function gridMismatch(first: LevelGrid, second: LevelGrid): string | undefined {
  if (first.width !== second.width || first.height !== second.height) return `sizes differ: ${first.width} x ${first.height} against ${second.width} x ${second.height} values`;
  const tolerance = POSITION_TOLERANCE * Math.max(first.spacing, second.spacing);
  if (Math.abs(first.spacing - second.spacing) > tolerance) return `spacings differ: ${first.spacing} m against ${second.spacing} m`;
  if (Math.abs(first.x0 - second.x0) > tolerance || Math.abs(first.y0 - second.y0) > tolerance) return `origins differ: (${first.x0}, ${first.y0}) m against (${second.x0}, ${second.y0}) m`;
  if (first.values.length !== first.width * first.height || second.values.length !== second.width * second.height) return "a grid holds a different number of values than width x height";
  return undefined;
}
