// Level arithmetic of the field view: SPL, insertion loss, automatic ranges, the value under the cursor.
import { describe, expect, it } from "vitest";

import {
  ABSOLUTE_QUANTILE_TOLERANCE,
  absoluteQuantile,
  autoDifferenceRange,
  autoLevelRange,
  autoSymmetricRange,
  cellIndexAt,
  createRangeScratch,
  LEVEL_FLOOR_DB,
  LEVEL_QUANTILE_TOLERANCE,
  levelDifferenceInto,
  levelDifferenceSnapshot,
  levelSnapshot,
  levelsInto,
  niceCeiling,
  quantileAbove,
  sameGrid,
  sampleField,
  soundPressureLevel,
} from "@/components/field-view/levels";
import type { FieldSnapshot } from "@/lib/fdtd/simulation";

function grid(values: number[], width: number, height: number, spacing = 0.1): FieldSnapshot {
  return { step: 0, time: 0, width, height, x0: spacing / 2, y0: spacing / 2, spacing, values: Float32Array.from(values) };
}

describe("sound pressure level", () => {
  // Definition of sound pressure level, IEC 60050-801 / ISO 1683: L = 20 log10(p / p0), p0 = 20 uPa.
  // Expected values hand-computed: 20 log10(1 / 2e-5) = 93.9794; 20 log10(2) = 6.0206.
  it.each([
    { pressure: 1, level: 93.9794 },
    { pressure: -1, level: 93.9794 },
    { pressure: 20e-6, level: 0 },
    { pressure: 2, level: 99.9794 + 0.0206 },
    { pressure: 0.2, level: 80 },
    { pressure: 2e-5 / 10, level: -20 },
  ])("is $level dB re 20 uPa for $pressure Pa", ({ pressure, level }) => {
    expect(soundPressureLevel(pressure)).toBeCloseTo(level, 4);
  });

  it("maps an RMS or peak map cell by cell and floors silent cells instead of writing -Infinity", () => {
    const out = new Float32Array(4);
    // A sine of amplitude sqrt(2) Pa has an RMS of 1 Pa: 93.98 dB.
    levelsInto(Float32Array.from([1, Math.SQRT2 / Math.SQRT2, 0, 2e-4]), out);
    expect(out[0]).toBeCloseTo(93.9794, 3);
    expect(out[1]).toBeCloseTo(93.9794, 3);
    expect(out[2]).toBe(LEVEL_FLOOR_DB);
    expect(out[3]).toBeCloseTo(20, 4);
    expect(() => levelsInto(new Float32Array(3), new Float32Array(2))).toThrow(RangeError);
  });

  it("keeps the grid of the map it converts", () => {
    const rms = grid([1, 0.1, 0.01, 0.001], 2, 2);
    const levels = levelSnapshot(rms);
    expect({ ...levels, values: undefined }).toEqual({ ...rms, values: undefined });
    expect(Array.from(levels.values, (v) => Number(v.toFixed(2)))).toEqual([93.98, 73.98, 53.98, 33.98]);
  });
});

describe("level difference (insertion-loss map)", () => {
  it("is reference minus variant in dB: halving the pressure is +6.02 dB, a tenfold rise -20 dB", () => {
    const out = new Float32Array(4);
    levelDifferenceInto(Float32Array.from([2, 1, 1, 0]), Float32Array.from([1, 1, 10, 0]), out);
    expect(out[0]).toBeCloseTo(6.0206, 4);
    expect(out[1]).toBe(0);
    expect(out[2]).toBeCloseTo(-20, 4);
    // Silent in both runs (inside a solid): 0 dB, not NaN.
    expect(out[3]).toBe(0);
  });

  it("refuses two runs on different grids", () => {
    const reference = grid([1, 1, 1, 1], 2, 2);
    expect(sameGrid(reference, grid([1, 1, 1, 1], 2, 2))).toBe(true);
    expect(() => levelDifferenceSnapshot(reference, grid([1, 1, 1, 1], 4, 1))).toThrow(/different grids/);
    expect(() => levelDifferenceSnapshot(reference, grid([1, 1, 1, 1], 2, 2, 0.2))).toThrow(/different grids/);
    expect(levelDifferenceSnapshot(reference, grid([0.5, 1, 2, 1], 2, 2)).values[0]).toBeCloseTo(6.0206, 4);
  });
});

describe("automatic ranges", () => {
  const scratch = createRangeScratch();

  it("finds a high quantile of |p| no lower than the exact one and at most 1% above it", () => {
    // |v| = 1 .. 1000 with alternating signs: the exact 99.5% quantile of 1000 values is the 995th, 995.
    const values = Float32Array.from({ length: 1000 }, (_, k) => (k % 2 ? -1 : 1) * (k + 1));
    const q = absoluteQuantile(values, 0.995, scratch);
    expect(q).toBeGreaterThanOrEqual(995);
    expect(q).toBeLessThanOrEqual(995 * (1 + ABSOLUTE_QUANTILE_TOLERANCE));
  });

  it("is not washed out by a source cell a million times stronger than the field", () => {
    // A 19 mPa sine sampled 10 000 times, and one cell at 19 kPa: the maximum would set the range 10^6 too wide.
    const values = Float32Array.from({ length: 10_000 }, (_, k) => 0.019 * Math.sin(k * 0.37));
    values[5000] = 1.9e4;
    const q = absoluteQuantile(values, 0.995, scratch);
    expect(q).toBeLessThanOrEqual(0.019 * (1 + ABSOLUTE_QUANTILE_TOLERANCE));
    expect(q).toBeGreaterThan(0.018);
    expect(autoSymmetricRange(values, scratch)).toBe(0.02);
  });

  it("has no range for an all-zero field (before the wave starts)", () => {
    expect(absoluteQuantile(new Float32Array(100), 0.995, scratch)).toBe(0);
    expect(autoSymmetricRange(new Float32Array(100), scratch)).toBeUndefined();
  });

  it.each([
    [0.73, 0.8],
    [1, 1],
    [1.01, 1.5],
    [0.3, 0.3],
    [2.5, 3],
    [9, 10],
    [0.0042, 0.005],
    [1234, 1500],
  ])("rounds %f up to the tidy range end %f", (x, expected) => {
    expect(niceCeiling(x)).toBeCloseTo(expected, 12);
  });

  it("spans a level map from its 2nd to its 99.5th percentile in 5 dB steps, leaving silent cells out", () => {
    // 1000 cells evenly from 40 to 80 dB, and as many silent ones (at the floor).
    const levels = Float32Array.from({ length: 2000 }, (_, k) => (k < 1000 ? 40 + (40 * k) / 999 : LEVEL_FLOOR_DB));
    expect(autoLevelRange(levels, scratch)).toEqual({ min: 40, max: 80 });
    // The 99.5th percentile of the counted cells: 40 + 40 * 994 / 999 = 79.80 dB, found to 0.05 dB.
    const top = quantileAbove(levels, LEVEL_FLOOR_DB, 0.995, scratch)!;
    expect(top).toBeGreaterThanOrEqual(79.8 - 1e-3);
    expect(top).toBeLessThanOrEqual(79.8 + LEVEL_QUANTILE_TOLERANCE + 1e-3);
  });

  it("keeps the automatic level span between 20 and 60 dB", () => {
    const narrow = Float32Array.from({ length: 1000 }, (_, k) => 70 + (2 * k) / 999);
    expect(autoLevelRange(narrow, scratch)).toEqual({ min: 55, max: 75 });
    const wide = Float32Array.from({ length: 1000 }, (_, k) => (120 * k) / 999);
    expect(autoLevelRange(wide, scratch)).toEqual({ min: 60, max: 120 });
    expect(autoLevelRange(Float32Array.from([LEVEL_FLOOR_DB]), scratch)).toBeUndefined();
  });

  it("gives a level difference at least 3 dB either side of zero", () => {
    expect(autoDifferenceRange(Float32Array.from([0.1, -0.2, 0.05]), scratch)).toBe(3);
    expect(autoDifferenceRange(Float32Array.from({ length: 1000 }, (_, k) => (k % 2 ? -1 : 1) * (k / 100)), scratch)).toBe(10);
  });
});

describe("the value under the cursor", () => {
  // 4 x 3 cells of 0.1 m, centres at 0.05 + 0.1 a, 0.05 + 0.1 b; value = index.
  const field = grid(
    Array.from({ length: 12 }, (_, k) => k),
    4,
    3,
  );

  it("is the cell whose centre is nearest, row-major with x fastest", () => {
    expect(cellIndexAt(field, 0.26, 0.14)).toBe(1 * 4 + 2);
    expect(sampleField(field, 0.26, 0.14)).toBe(6);
    expect(sampleField(field, 0.001, 0.001)).toBe(0);
    expect(sampleField(field, 0.399, 0.299)).toBe(11);
  });

  it("is undefined outside the grid", () => {
    expect(sampleField(field, -0.2, 0.1)).toBeUndefined();
    expect(sampleField(field, 0.2, 0.31)).toBeUndefined();
    expect(cellIndexAt(field, 0.41, 0.1)).toBe(-1);
  });
});
