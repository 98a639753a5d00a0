// What each mode of the field view shows: values, range, scale, colour-bar unit, read-out.
import { describe, expect, it } from "vitest";

import { LEVEL_DIFFERENCE_SCALE, LEVEL_SCALE, PRESSURE_SCALE } from "@/components/field-view/colour-scales";
import { differenceDisplay, emptyDisplay, levelDisplay, pressureDisplay, QUIET_FIELD_RANGE, readoutAt } from "@/components/field-view/field-display";
import { createRangeScratch, levelDifferenceSnapshot, levelSnapshot } from "@/components/field-view/levels";
import type { FieldSnapshot, LevelMaps } from "@/lib/fdtd/simulation";

function grid(values: number[], width: number, height: number): FieldSnapshot {
  return { step: 240, time: 0.0125, width, height, x0: 0.05, y0: 0.05, spacing: 0.1, values: Float32Array.from(values) };
}

const scratch = createRangeScratch();
// 2 x 2 cells: a 12 mPa pressure field.
const pressure = grid([0.012, -0.006, 0.003, 0], 2, 2);

describe("pressure mode", () => {
  it("centres the diverging scale on zero with a tidy automatic range and labels the bar in mPa", () => {
    const display = pressureDisplay(pressure, { kind: "auto" }, scratch);
    expect(display.scale).toBe(PRESSURE_SCALE);
    expect(display.low).toBeCloseTo(-0.015, 12);
    expect(display.high).toBeCloseTo(0.015, 12);
    expect(display.colourBar).toMatchObject({ unit: "mPa", signed: true });
    expect(display.colourBar.low).toBeCloseTo(-15, 9);
    expect(display.colourBar.high).toBeCloseTo(15, 9);
    expect(display.detail).toBe("t = 12.50 ms \u00b7 step 240");
  });

  it("keeps a fixed range in pascals, and treats a fixed range of the wrong shape as automatic", () => {
    expect(pressureDisplay(pressure, { kind: "fixed", maxAbs: 2 }, scratch)).toMatchObject({ low: -2, high: 2, colourBar: { unit: "Pa", low: -2, high: 2 } });
    expect(pressureDisplay(pressure, { kind: "fixed", min: 40, max: 90 }, scratch).high).toBeCloseTo(0.015, 12);
  });

  it("falls back to a quiet range for a field that is still all zero", () => {
    expect(pressureDisplay(grid([0, 0, 0, 0], 2, 2), { kind: "auto" }, scratch).high).toBe(QUIET_FIELD_RANGE);
  });
});

describe("level modes", () => {
  const rms = grid([1, 0.1, 0.01, 0], 2, 2);
  const maps: LevelMaps = { peak: grid([1.4, 0.14, 0.014, 0], 2, 2), rms, samples: 1000 };

  it("shows dB re 20 uPa on the sequential scale with the fixed span given", () => {
    const display = levelDisplay(levelSnapshot(rms), "rms", maps.samples, 1e-4, { kind: "fixed", min: 40, max: 100 }, scratch);
    expect(display).toMatchObject({ mode: "rms-level", low: 40, high: 100, scale: LEVEL_SCALE, colourBar: { unit: "dB re 20 \u00b5Pa", quantity: "RMS level" } });
    expect(display.detail).toBe("over 100.00 ms \u00b7 1,000 steps");
  });

  it("shows an insertion-loss map on the reversed diverging scale, symmetric about 0 dB", () => {
    const reference = grid([2, 0.1, 0.01, 0], 2, 2);
    const difference = levelDifferenceSnapshot(reference, rms);
    const display = differenceDisplay(difference, "rms", { kind: "auto" }, scratch);
    expect(display.scale).toBe(LEVEL_DIFFERENCE_SCALE);
    // The only non-zero difference is 20 log10(2) = 6.02 dB: the range rounds up to 8 dB.
    expect(display).toMatchObject({ low: -8, high: 8, colourBar: { quantity: "\u0394L", signed: true } });
  });

  it("reads out position, level and pressure under the cursor in each mode", () => {
    // Cell (0, 0) is centred at (0.05, 0.05) m.
    const readout = (mode: "pressure" | "peak-level" | "rms-level" | "level-difference") =>
      Object.fromEntries(readoutAt({ mode, field: pressure, levelMaps: maps, comparison: { ...maps, rms: grid([2, 0.1, 0.01, 0], 2, 2) }, differenceOf: "rms" }, 0.04, 0.06).map((item) => [item.label, item.value]));
    expect(readout("pressure")).toEqual({ x: "0.04 m", y: "0.06 m", p: "12.0 mPa", level: "55.6 dB" });
    expect(readout("rms-level")).toEqual({ x: "0.04 m", y: "0.06 m", "L RMS": "94.0 dB", "p RMS": "1.00 Pa" });
    expect(readout("peak-level")["L peak"]).toBe("96.9 dB");
    expect(readout("level-difference")).toMatchObject({ "\u0394L": "+6.0 dB", "L ref": "100.0 dB", "L this": "94.0 dB" });
  });

  it("says why a mode has nothing to show", () => {
    expect(emptyDisplay("pressure")).toMatchObject({ kind: "empty", message: expect.stringMatching(/No pressure field yet/) });
    expect(emptyDisplay("level-difference")).toMatchObject({ message: expect.stringMatching(/reference run/) });
  });
});
