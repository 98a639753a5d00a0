import { describe, expect, it } from "vitest";
import { dequantiseFrame, largestMagnitude, QUANTISATION_LEVELS, quantisationScale, quantiseFrame, snapshotErrorBound } from "@/lib/run-record/quantise";

function roundTrip(values: Float32Array): Float32Array {
  const scale = quantisationScale(largestMagnitude(values));
  const stored = new Int16Array(values.length);
  quantiseFrame(values, scale, stored);
  return dequantiseFrame(stored, scale);
}

describe("snapshot quantisation", () => {
  it("states its bound as half a step, max|p| / 65534, plus float32 rounding", () => {
    expect(snapshotErrorBound(65534)).toBeCloseTo(1 + 65534 * 2 ** -24, 12);
    expect(snapshotErrorBound(0)).toBe(0);
  });

  it("keeps every value of a frame within the bound, over six decades of level", () => {
    let seed = 7;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (const amplitude of [1e-4, 0.37, 2, 1234.5]) {
      const values = Float32Array.from({ length: 5000 }, () => (2 * random() - 1) * amplitude);
      const maxAbs = largestMagnitude(values);
      const decoded = roundTrip(values);
      let worst = 0;
      for (let i = 0; i < values.length; i++) worst = Math.max(worst, Math.abs(decoded[i]! - values[i]!));
      expect(worst).toBeLessThanOrEqual(snapshotErrorBound(maxAbs));
      // ...and the bound is not loose: random values come within a few percent of it.
      expect(worst).toBeGreaterThan(0.9 * (maxAbs / 65534));
    }
  });

  it("maps the largest magnitude to the end of the integer range, either sign", () => {
    const stored = new Int16Array(3);
    const values = Float32Array.from([-4, 2, 4]);
    quantiseFrame(values, quantisationScale(4), stored);
    expect(Array.from(stored)).toEqual([-QUANTISATION_LEVELS, 16384, QUANTISATION_LEVELS]);
  });

  it("keeps a silent frame silent", () => {
    expect(Array.from(roundTrip(new Float32Array(4)))).toEqual([0, 0, 0, 0]);
  });

  it("reports a frame holding a value that is not finite", () => {
    expect(largestMagnitude(Float32Array.from([1, Number.NaN, 2]))).toBeNaN();
    expect(largestMagnitude(Float32Array.from([1, -Infinity]))).toBeNaN();
  });
});
