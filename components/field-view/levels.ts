// Level arithmetic for the field view: sound pressure level maps, the level difference of two runs
// (insertion-loss map), automatic colour ranges and the value under the cursor. Pure functions over
// row-major grids (x index fastest, as FieldSnapshot); the per-frame ones take their outputs and scratch
// space from the caller and allocate nothing.
import type { FieldSnapshot } from "@/lib/fdtd/simulation";

/** Reference sound pressure in air, Pa (IEC 60050-801, ISO 1683: 20 uPa). */
export const REFERENCE_PRESSURE = 20e-6;

/**
 * Level written for a cell whose pressure is zero (inside a solid, or not yet reached), dB re 20 uPa.
 * Far below anything audible, so it never enters a range; it keeps the maps finite for the GPU.
 */
export const LEVEL_FLOOR_DB = -100;

/** Sound pressure level 20 log10(|p| / p0), dB re 20 uPa; -Infinity for p = 0. */
export function soundPressureLevel(pressure: number): number {
  return 20 * Math.log10(Math.abs(pressure) / REFERENCE_PRESSURE);
}

/**
 * Levels of an RMS or peak pressure map, dB re 20 uPa, written into `out` (same length), clamped below at
 * LEVEL_FLOOR_DB. For an RMS map this is the equivalent continuous level over the run; for a peak map the
 * peak level.
 */
export function levelsInto(pressure: Float32Array, out: Float32Array): void {
  if (out.length !== pressure.length) throw new RangeError(`levelsInto: ${pressure.length} pressures but room for ${out.length} levels`);
  for (let k = 0; k < pressure.length; k++) {
    const level = soundPressureLevel(pressure[k]!);
    out[k] = level > LEVEL_FLOOR_DB ? level : LEVEL_FLOOR_DB;
  }
}

/** A new snapshot holding the levels (dB re 20 uPa) of a pressure map; same grid. */
export function levelSnapshot(pressure: FieldSnapshot): FieldSnapshot {
  const values = new Float32Array(pressure.values.length);
  levelsInto(pressure.values, values);
  return { ...pressure, values };
}

/** True when two fields sample the same points (same size, origin and spacing), so cell k means the same place in both. */
export function sameGrid(a: FieldSnapshot, b: FieldSnapshot): boolean {
  const close = (x: number, y: number) => Math.abs(x - y) <= 1e-9 * Math.max(1, Math.abs(x), Math.abs(y));
  return a.width === b.width && a.height === b.height && close(a.spacing, b.spacing) && close(a.x0, b.x0) && close(a.y0, b.y0);
}

/**
 * Level difference reference minus variant, dB: 20 log10(p_ref / p_var) per cell, the insertion loss of the
 * variant where the reference is the situation without the measure. Positive = the variant is quieter.
 * Both levels are floored first, so a cell silent in both runs (inside a solid) reads 0 dB, not NaN.
 */
export function levelDifferenceInto(reference: Float32Array, variant: Float32Array, out: Float32Array): void {
  if (reference.length !== variant.length || out.length !== reference.length) {
    throw new RangeError(`levelDifferenceInto: lengths ${reference.length}, ${variant.length} and ${out.length} must agree`);
  }
  for (let k = 0; k < reference.length; k++) {
    const referenceLevel = Math.max(soundPressureLevel(reference[k]!), LEVEL_FLOOR_DB);
    const variantLevel = Math.max(soundPressureLevel(variant[k]!), LEVEL_FLOOR_DB);
    out[k] = referenceLevel - variantLevel;
  }
}

/** Insertion-loss map of two pressure maps (RMS or peak) on the same grid; throws when the grids differ. */
export function levelDifferenceSnapshot(reference: FieldSnapshot, variant: FieldSnapshot): FieldSnapshot {
  if (!sameGrid(reference, variant)) {
    throw new Error(
      `the two runs are on different grids (${reference.width} x ${reference.height} cells of ${reference.spacing} m against ${variant.width} x ${variant.height} of ${variant.spacing} m): a level difference needs the same grid`,
    );
  }
  const values = new Float32Array(variant.values.length);
  levelDifferenceInto(reference.values, variant.values, values);
  return { ...variant, values };
}

/** Bins of each histogram pass of the automatic ranges. */
export const HISTOGRAM_BINS = 1024;

/** Scratch space for the automatic ranges; allocate once per view and pass it in every frame. */
export function createRangeScratch(): Uint32Array {
  return new Uint32Array(HISTOGRAM_BINS);
}

/** Relative resolution of absoluteQuantile: its answer is at most this fraction above the exact quantile. */
export const ABSOLUTE_QUANTILE_TOLERANCE = 0.01;

/** Resolution of quantileAbove, in the values' unit (dB for level maps). */
export const LEVEL_QUANTILE_TOLERANCE = 0.05;

/**
 * The `fraction` quantile of |v| over the values with |v| > 0; 0 when every value is 0. Found without
 * sorting or allocating: a histogram on [0, max |v|], then, while the bin holding the quantile is wider than
 * 1% of its upper edge, another histogram on that bin alone. One pass usually suffices; a single huge value
 * (a source cell) costs a second one instead of coarsening the answer. Returns the final bin's upper edge:
 * never below the exact quantile, at most ABSOLUTE_QUANTILE_TOLERANCE (relative) above it.
 * A high quantile rather than the maximum keeps a source cell from washing out the rest of the picture.
 */
export function absoluteQuantile(values: Float32Array, fraction: number, scratch: Uint32Array): number {
  let maxAbs = 0;
  let count = 0;
  for (let k = 0; k < values.length; k++) {
    const v = Math.abs(values[k]!);
    if (v > 0) {
      count++;
      if (v > maxAbs) maxAbs = v;
    }
  }
  if (count === 0) return 0;
  if (!Number.isFinite(maxAbs)) return maxAbs;
  return refineQuantile(values, true, 0, 0, maxAbs, fraction, count, scratch, (low, high) => high - low <= ABSOLUTE_QUANTILE_TOLERANCE * high);
}

/**
 * The `fraction` quantile of the values above `floor` (exclusive), to LEVEL_QUANTILE_TOLERANCE, found as in
 * absoluteQuantile (never below the exact quantile); undefined when no value is above the floor.
 */
export function quantileAbove(values: Float32Array, floor: number, fraction: number, scratch: Uint32Array): number | undefined {
  let low = Infinity;
  let high = -Infinity;
  let count = 0;
  for (let k = 0; k < values.length; k++) {
    const v = values[k]!;
    if (v > floor) {
      count++;
      if (v < low) low = v;
      if (v > high) high = v;
    }
  }
  if (count === 0) return undefined;
  if (high === low) return high;
  return refineQuantile(values, false, floor, low, high, fraction, count, scratch, (a, b) => b - a <= LEVEL_QUANTILE_TOLERANCE);
}

/**
 * Narrows [low, high] (which holds every counted value) to the bin holding the quantile until `fineEnough`.
 * Counted values are |v| > 0 (absolute) or v > floor; those under the window count towards the rank.
 */
function refineQuantile(
  values: Float32Array,
  absolute: boolean,
  floor: number,
  low: number,
  high: number,
  fraction: number,
  count: number,
  bins: Uint32Array,
  fineEnough: (low: number, high: number) => boolean,
): number {
  const wanted = Math.max(1, Math.ceil(Math.min(1, Math.max(0, fraction)) * count));
  const last = bins.length - 1;
  // Each pass narrows the window by the bin count; 8 passes reach float32 resolution from any start.
  for (let pass = 0; pass < 8; pass++) {
    bins.fill(0);
    const scale = bins.length / (high - low);
    let under = 0;
    for (let k = 0; k < values.length; k++) {
      const raw = values[k]!;
      const v = absolute ? Math.abs(raw) : raw;
      if (absolute ? !(v > 0) : !(v > floor)) continue;
      if (v < low) {
        under++;
        continue;
      }
      if (v > high) continue;
      const bin = Math.floor((v - low) * scale);
      bins[bin > last ? last : bin]!++;
    }
    let seen = under;
    let found = last;
    for (let bin = 0; bin <= last; bin++) {
      seen += bins[bin]!;
      if (seen >= wanted) {
        found = bin;
        break;
      }
    }
    const binLow = low + found / scale;
    const binHigh = found === last ? high : low + (found + 1) / scale;
    if (fineEnough(binLow, binHigh) || binHigh <= binLow) return binHigh;
    low = binLow;
    high = binHigh;
  }
  return high;
}

/** The next value at or above x on the ladder 1, 1.5, 2, 3, 4, 5, 6, 8 x 10^k: steps of at most 1.5x, tidy colour-bar ends. */
export function niceCeiling(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) return x;
  const decade = Math.pow(10, Math.floor(Math.log10(x)));
  for (const m of [1, 1.5, 2, 3, 4, 5, 6, 8, 10]) {
    const candidate = m * decade;
    // Guards against 3 * 0.1 = 0.30000000000000004 rounding past an exact ladder value.
    if (candidate >= x * (1 - 1e-12)) return candidate;
  }
  return 10 * decade;
}

/** Quantile used for the automatic pressure and level-difference range. */
export const AUTO_RANGE_QUANTILE = 0.995;

/**
 * Automatic symmetric range for signed pressure, Pa: the 99.5th percentile of |p| rounded up to a tidy
 * value. Undefined when the field is all zero (nothing to scale to; the caller keeps its last range).
 */
export function autoSymmetricRange(values: Float32Array, scratch: Uint32Array): number | undefined {
  const quantile = absoluteQuantile(values, AUTO_RANGE_QUANTILE, scratch);
  return quantile > 0 ? niceCeiling(quantile) : undefined;
}

/** Smallest automatic range of a level-difference map, dB: differences below this are not worth colour. */
export const MIN_DIFFERENCE_RANGE_DB = 3;

/** Automatic symmetric range of a level-difference map, dB: the 99.5th percentile of |dL|, tidy, at least 3 dB. */
export function autoDifferenceRange(values: Float32Array, scratch: Uint32Array): number {
  const quantile = absoluteQuantile(values, AUTO_RANGE_QUANTILE, scratch);
  return Math.max(MIN_DIFFERENCE_RANGE_DB, niceCeiling(quantile));
}

/** The automatic level range spans at least this and at most LEVEL_SPAN_MAX_DB, dB. */
export const LEVEL_SPAN_MIN_DB = 20;
export const LEVEL_SPAN_MAX_DB = 60;

/**
 * Automatic range of a level map, dB: top at the 99.5th percentile rounded up to 5 dB, bottom at the 2nd
 * percentile rounded down to 5 dB, the span kept within 20..60 dB. Cells at the floor (silent) are left out.
 */
export function autoLevelRange(levels: Float32Array, scratch: Uint32Array): { min: number; max: number } | undefined {
  const top = quantileAbove(levels, LEVEL_FLOOR_DB, AUTO_RANGE_QUANTILE, scratch);
  const bottom = quantileAbove(levels, LEVEL_FLOOR_DB, 0.02, scratch);
  if (top === undefined || bottom === undefined) return undefined;
  const max = Math.ceil(top / 5) * 5;
  const span = Math.min(LEVEL_SPAN_MAX_DB, Math.max(LEVEL_SPAN_MIN_DB, max - Math.floor(bottom / 5) * 5));
  return { min: max - span, max };
}

/** Index of the cell of `field` whose centre is nearest to scene point (x, y) m, or -1 outside the grid. */
export function cellIndexAt(field: Pick<FieldSnapshot, "width" | "height" | "x0" | "y0" | "spacing">, x: number, y: number): number {
  const a = Math.round((x - field.x0) / field.spacing);
  const b = Math.round((y - field.y0) / field.spacing);
  if (!(a >= 0 && a < field.width && b >= 0 && b < field.height)) return -1;
  return b * field.width + a;
}

/** The value of the cell under scene point (x, y) m (what the view shows there: cells are drawn unsmoothed), or undefined outside. */
export function sampleField(field: FieldSnapshot, x: number, y: number): number | undefined {
  const k = cellIndexAt(field, x, y);
  return k < 0 ? undefined : field.values[k];
}
