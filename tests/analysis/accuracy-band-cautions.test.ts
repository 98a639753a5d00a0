// Which shown bands carry the "use with care" mark in band tables and charts, and the one-line summary the
// scene page shows for a finished browser run. Both read the ratings of the accuracy estimate (bandAccuracy
// through runAccuracy): 10 cells per wavelength for levels (common practice), 45 degrees of phase error over
// the longest path (derived in lib/analysis/accuracy/thresholds.ts).
// Grid: 44 m by 6 m of air at 20 C resolved to 500 Hz at 10 cells per wavelength (h = 68.6 mm), Courant 0.6;
// source and receiver 40 m apart along a grid axis, so the 250 Hz octave (80.7 degrees over the path) is the
// one resolved octave band to use with care.
import { describe, expect, it } from "vitest";

import { accuracyOfResult } from "@/components/accuracy/accuracy-of-run";
import { accuracySummary, bandsToUseWithCare, ratedBandsOf, runAccuracy } from "@/lib/analysis/accuracy";
import { selectBands } from "@/lib/analysis/band-levels";
import { bandsBetween } from "@/lib/analysis/bands";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow, type SceneInput } from "@/lib/fdtd/scene";

function sceneOf(parts: Partial<SceneInput> = {}) {
  return parseSceneOrThrow({
    version: 1,
    domain: { width: 44, height: 6 },
    resolution: { kind: "frequency", maxFrequency: 500, pointsPerWavelength: 10, courantNumber: 0.6 },
    sources: [{ id: "s", label: "Source", position: { x: 2, y: 3 }, signal: { kind: "ricker", peakFrequency: 150 } }],
    receivers: [{ id: "r", label: "R1", position: { x: 42, y: 3 } }],
    duration: { kind: "time", seconds: 0.2 },
    geometry: { solids: [], walls: [], surfaces: [] },
    ...parts,
  });
}

const scene = sceneOf();
const grid = deriveGrid(scene);
const accuracy = runAccuracy(scene, grid);
/** The bands a band table of a 0.2 s run on this grid shows: the same selection the tables make. */
const shownBands = (bandsPerOctave: 1 | 3, resolvedUpTo = accuracy.resolvedUpTo) => selectBands({ bandsPerOctave, highestResolvedFrequency: resolvedUpTo }, grid.timeStep, Math.round(0.2 / grid.timeStep)).bands;
const nominals = (marks: ReadonlyMap<number, string>, bandsPerOctave: 1 | 3) => bandsBetween(20, 20000, bandsPerOctave).filter((band) => marks.has(band.index)).map((band) => band.nominal);

describe("bands marked use with care", () => {
  it("marks the 250 Hz octave only, with the estimate's own reason", () => {
    const shown = shownBands(1);
    expect(shown.map((band) => band.nominal)).toEqual([31.5, 63, 125, 250]);
    const marks = bandsToUseWithCare(shown, ratedBandsOf(accuracy, 1));
    expect(nominals(marks, 1)).toEqual([250]);
    const rated = accuracy.octaveBands.find((entry) => entry.band.nominal === 250)!;
    expect(rated.rating).toBe("use with care");
    expect(marks.get(rated.band.index)).toBe(rated.reason);
    expect(rated.reason).toMatch(/81° of phase over the longest source-receiver distance/);
  });

  it("marks the 315 and 400 Hz third-octave bands, not 250 Hz (40 degrees over the path)", () => {
    const marks = bandsToUseWithCare(shownBands(3), ratedBandsOf(accuracy, 3));
    expect(nominals(marks, 3)).toEqual([315, 400]);
  });

  it("marks nothing a table does not show, and nothing over a short path", () => {
    expect(bandsToUseWithCare(shownBands(1, 180), ratedBandsOf(accuracy, 1)).size).toBe(0);
    const near = sceneOf({ receivers: [{ id: "r", label: "R1", position: { x: 6, y: 3 } }] });
    const nearAccuracy = runAccuracy(near, deriveGrid(near));
    expect(bandsToUseWithCare(shownBands(1, nearAccuracy.resolvedUpTo), ratedBandsOf(nearAccuracy, 1)).size).toBe(0);
  });

  it("does not carry octave ratings over to one-third-octave bands of the same index", () => {
    // Octave index -2 (250 Hz) is rated with care; one-third-octave index -2 is the 630 Hz band.
    const marks = bandsToUseWithCare(bandsBetween(20, 20000, 3), ratedBandsOf(accuracy, 1));
    expect(marks.size).toBe(0);
  });
});

describe("the one-line summary", () => {
  it("counts the octave bands by rating and the warnings", () => {
    expect(accuracySummary(accuracy)).toBe("Accuracy: 3 octave bands reliable, 1 to use with care, 6 not resolved; no warnings");
    // A receiver 0.1 m from a rigid wall (fewer than 3 cells) draws a warning.
    const walled = sceneOf({ geometry: { solids: [], walls: [{ id: "w", label: "Barrier", path: [{ x: 42.2, y: 0 }, { x: 42.2, y: 6 }], thickness: 0.2 }], surfaces: [] } });
    const walledAccuracy = runAccuracy(walled, deriveGrid(walled));
    expect(walledAccuracy.warnings.map((w) => w.code)).toEqual(["receiver-near-surface"]);
    expect(accuracySummary(walledAccuracy)).toBe("Accuracy: 3 octave bands reliable, 1 to use with care, 6 not resolved; 1 warning");
  });

  it("speaks of one band in the singular and leaves out empty ratings", () => {
    const one = { octaveBands: accuracy.octaveBands.filter((entry) => entry.band.nominal === 125), warnings: [...accuracy.warnings, ...accuracy.warnings] };
    expect(accuracySummary(one)).toBe("Accuracy: 1 octave band reliable; no warnings");
  });
});

describe("a browser run's estimate before it is saved", () => {
  it("uses the run's grid and how it ended: a run cancelled before the sound arrived warns", () => {
    const receivers = [{ id: "r", label: "R1", timeStep: grid.timeStep, pressure: new Float32Array(100) }];
    const cancelled = accuracyOfResult(scene, { grid, simulatedSeconds: 0.05, stoppedBy: "cancelled", energy: [], receivers });
    expect(cancelled.warnings.map((w) => w.code)).toContain("run-too-short");
    expect(cancelled.cellSize).toBe(grid.cellSize);
    expect(accuracySummary(cancelled)).toMatch(/; \d+ warnings?$/);
  });
});
