// The list of verification cases that npm test and the verification page share, and the bookkeeping of
// their outcomes (checks, curves).
import { describe, expect, it } from "vitest";

import { parseScene } from "@/lib/fdtd/scene";
import { verificationCaseById, verificationCases } from "@/lib/verification/cases";
import { decimateSeries, decimateSeriesKeepingPeaks, makeCeilingCheck, makeCheck, makeOutcome, makeRelativeCheck, MAX_CURVE_POINTS } from "@/lib/verification/cases/outcome";

describe("the verification case list", () => {
  it("holds the seven cases of issue 3 in order, each with a unique id", () => {
    expect(verificationCases.map((c) => c.id)).toEqual(["free-field", "room-modes", "impedance-wall", "pml", "dispersion", "half-plane", "band-levels"]);
    expect(verificationCaseById("half-plane")?.title).toMatch(/screen/);
    expect(verificationCaseById("no-such-case")).toBeUndefined();
  });

  it("names a published reference and states the resolution of every case", () => {
    for (const c of verificationCases) {
      expect(c.reference.source.length, c.id).toBeGreaterThan(20);
      expect(c.reference.name.length, c.id).toBeGreaterThan(10);
      expect(c.resolution, c.id).toMatch(/cells per wavelength|sampling/);
      expect(c.whatIsChecked.length, c.id).toBeGreaterThan(100);
    }
  });

  it("gives every simulated case a scene that the scene parser accepts", () => {
    for (const c of verificationCases.filter((c) => c.scene)) {
      const parsed = parseScene(c.scene!());
      expect(parsed.ok ? [] : parsed.problems, c.id).toEqual([]);
    }
  });
});

describe("checks and curves", () => {
  it("passes a check within its tolerance and fails one outside it, or one that could not be measured", () => {
    expect(makeCheck("a", 1.02, 1, 0.03, "dB").pass).toBe(true);
    expect(makeCheck("a", 1.04, 1, 0.03, "dB").pass).toBe(false);
    expect(makeCheck("a", NaN, 1, 0.03, "dB").pass).toBe(false);
    expect(makeRelativeCheck("a", 101, 100, 0.005, "Hz")).toMatchObject({ pass: false, errorUnit: "relative" });
    expect(makeRelativeCheck("a", 100.4, 100, 0.005, "Hz").error).toBeCloseTo(0.004, 12);
    expect(makeCeilingCheck("a", -45, -40, "dB").pass).toBe(true);
    expect(makeCeilingCheck("a", -35, -40, "dB").pass).toBe(false);
  });

  it("calls an outcome a pass only when it has checks and all of them pass", () => {
    expect(makeOutcome([], [], 0).pass).toBe(false);
    expect(makeOutcome([makeCheck("a", 0, 0, 1, "")], [], 0).pass).toBe(true);
    expect(makeOutcome([makeCheck("a", 0, 0, 1, ""), makeCheck("b", 2, 0, 1, "")], [], 0).pass).toBe(false);
  });

  it("thins a long series to at most 1000 points, keeping the last one", () => {
    const x = Array.from({ length: 4321 }, (_, k) => k);
    const series = decimateSeries("s", "simulated", x, x);
    expect(series.x.length).toBeLessThanOrEqual(MAX_CURVE_POINTS + 1);
    expect(series.x[series.x.length - 1]).toBe(4320);
    expect(decimateSeries("s", "exact", [1, 2, 3], [4, 5, 6]).y).toEqual([4, 5, 6]);
  });

  it("keeps a one-sample spectral peak when it thins a spectrum", () => {
    const y = Array.from({ length: 10000 }, () => -100);
    y[4567] = 0;
    const series = decimateSeriesKeepingPeaks("s", "simulated", y.map((_, k) => k), y);
    expect(series.x.length).toBeLessThanOrEqual(MAX_CURVE_POINTS);
    expect(Math.max(...series.y)).toBe(0);
    expect(series.x[series.y.indexOf(0)]).toBe(4567);
  });
});
