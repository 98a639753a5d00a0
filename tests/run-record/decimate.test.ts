import { describe, expect, it } from "vitest";
import type { FieldSnapshot } from "@/lib/fdtd/simulation";
import { cellStrideForLimit, coarsenField, everyKthFrame, frameStrideForLimit, thinField } from "@/lib/run-record/decimate";

/** A width x height field whose value at (a, b) is 10 b + a, at (0.5, 0.5) m on 1 m spacing. */
function numberedField(width: number, height: number): FieldSnapshot {
  return { step: 7, time: 0.7, width, height, x0: 0.5, y0: 0.5, spacing: 1, values: Float32Array.from({ length: width * height }, (_, n) => 10 * Math.floor(n / width) + (n % width)) };
}

describe("thinning a run to its caps", () => {
  it("keeps every k-th frame, the k-th first, never more than the limit", () => {
    const frames = Array.from({ length: 11 }, (_, n) => n + 1);
    const k = frameStrideForLimit(frames.length, 4);
    expect(k).toBe(3);
    expect(everyKthFrame(frames, k)).toEqual([3, 6, 9]);
    expect(everyKthFrame(frames, frameStrideForLimit(frames.length, 20))).toEqual(frames);
    expect(frameStrideForLimit(0, 4)).toBe(1);
  });

  it("chooses the smallest cell stride that brings a field within the limit", () => {
    expect(cellStrideForLimit(100, 50, 5000)).toBe(1);
    const stride = cellStrideForLimit(1000, 333, 10_000);
    expect(Math.ceil(1000 / stride) * Math.ceil(333 / stride)).toBeLessThanOrEqual(10_000);
    expect(Math.ceil(1000 / (stride - 1)) * Math.ceil(333 / (stride - 1))).toBeGreaterThan(10_000);
  });

  it("thins a field to every s-th cell, keeping the first value where it was", () => {
    const thinned = thinField(numberedField(5, 3), 2);
    expect([thinned.width, thinned.height, thinned.x0, thinned.spacing]).toEqual([3, 2, 0.5, 2]);
    expect(Array.from(thinned.values)).toEqual([0, 2, 4, 20, 22, 24]);
  });

  it("coarsens maps by blocks: largest peak, RMS of RMS values, mean intensity, edge blocks from the cells they have", () => {
    const field = numberedField(3, 3);
    const peak = coarsenField(field, 2, "max");
    expect([peak.width, peak.height, peak.x0, peak.spacing]).toEqual([2, 2, 1, 2]);
    expect(Array.from(peak.values)).toEqual([11, 12, 21, 22]);
    expect(Array.from(coarsenField(field, 2, "mean").values)).toEqual([5.5, 7, 20.5, 22]);
    expect(coarsenField(field, 2, "rms").values[0]).toBeCloseTo(Math.sqrt((0 + 1 + 100 + 121) / 4), 5);
  });
});
