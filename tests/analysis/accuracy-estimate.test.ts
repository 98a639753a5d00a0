// The per-run accuracy estimate: cells per wavelength at each band's upper edge (IEC 61260-1 base-10 edges),
// the ratings at chosen grids, and every warning triggered by a small constructed scene and not by a clean one.
// Thresholds: 10 cells per wavelength for levels (common practice; notes measured for this scheme), 45 degrees
// of phase error over the longest path (derived in lib/analysis/accuracy/thresholds.ts).
import { describe, expect, it } from "vitest";

import { type AccuracyWarningCode, bandAccuracy, finalEnergyRelativeToPeak, receiverWarnings, resolvedFrequencyLimit, runAccuracy, unresolvedBand } from "@/lib/analysis/accuracy";
import { bandLevelTable } from "@/lib/analysis/band-levels";
import { bandLevelsCsv } from "@/lib/analysis/csv";
import { frequencyBand } from "@/lib/analysis/bands";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow, type SceneInput } from "@/lib/fdtd/scene";

/** 10 m by 6 m of air at 20 C, resolved to 500 Hz at 10 cells per wavelength (h = 68.6 mm), Courant 0.6. */
function sceneOf(parts: Partial<SceneInput> = {}) {
  return parseSceneOrThrow({
    version: 1,
    domain: { width: 10, height: 6 },
    resolution: { kind: "frequency", maxFrequency: 500, pointsPerWavelength: 10, courantNumber: 0.6 },
    sources: [{ id: "s", label: "Source", position: { x: 2, y: 3 }, signal: { kind: "ricker", peakFrequency: 150 } }],
    receivers: [{ id: "r", label: "R1", position: { x: 6, y: 3 } }],
    duration: { kind: "time", seconds: 0.1 },
    geometry: { solids: [], walls: [{ id: "w", label: "Barrier", path: [{ x: 4, y: 0 }, { x: 4, y: 2 }], thickness: 0.3 }], surfaces: [] },
    ...parts,
  });
}

const decayed = { simulatedSeconds: 0.1, stoppedBy: "duration" as const, energy: [{ time: 0, joulesPerMetre: 0 }, { time: 0.02, joulesPerMetre: 1 }, { time: 0.1, joulesPerMetre: 1e-4 }] };
const codes = (warnings: { code: AccuracyWarningCode }[]) => warnings.map((w) => w.code).sort();

describe("cells per wavelength and ratings per band", () => {
  const scene = sceneOf();
  const grid = deriveGrid(scene);
  const c = grid.minSoundSpeed;

  it("puts the resolved limit at 10 cells per wavelength in the slowest medium: 500 Hz on this grid", () => {
    expect(resolvedFrequencyLimit(grid)).toBeCloseTo(500, 9);
    expect(grid.cellSize).toBeCloseTo(c / 5000, 12);
  });

  it("counts cells per wavelength at each band's upper edge: 500 Hz octave (upper edge 707.9 Hz) has 7.06", () => {
    const band = frequencyBand(-1, 1);
    const rated = bandAccuracy(band, grid, 4);
    expect(band.upper).toBeCloseTo(707.9, 1);
    expect(rated.pointsPerWavelength).toBeCloseTo(c / (band.upper * grid.cellSize), 12);
    expect(rated.pointsPerWavelength).toBeCloseTo(7.06, 2);
    expect(rated.rating).toBe("not resolved");
    expect(rated.reason).toMatch(/7\.1 cells per wavelength at the upper edge, fewer than the 10/);
  });

  it("rates the 250 Hz octave (14.1 cells per wavelength) reliable over 4 m and with care over 40 m, where the phase error passes 45 degrees", () => {
    const band = frequencyBand(-2, 1);
    const near = bandAccuracy(band, grid, 4);
    expect(near.pointsPerWavelength).toBeCloseTo(14.1, 1);
    expect(near.rating).toBe("reliable");
    expect(near.phaseErrorOverPath).toBeLessThan(45);
    const far = bandAccuracy(band, grid, 40);
    expect(far.phaseErrorOverPath).toBeGreaterThan(45);
    expect(far.rating).toBe("use with care");
    expect(far.reason).toMatch(/of phase over the longest source-receiver distance/);
  });

  it("leaves out of the band-level table exactly the bands it rates not resolved (one decision)", () => {
    const accuracy = runAccuracy(scene, grid);
    const traces = [{ id: "r", label: "R1", timeStep: grid.timeStep, pressure: new Float64Array(4096).map((_, n) => Math.sin(n)) }];
    for (const bandsPerOctave of [1, 3] as const) {
      const table = bandLevelTable(traces, { bandsPerOctave, highestResolvedFrequency: accuracy.resolvedUpTo });
      const rated = bandsPerOctave === 1 ? accuracy.octaveBands : accuracy.thirdOctaveBands;
      const shown = new Set(table.bands.map((band) => band.index));
      const sampling = { timeStep: grid.timeStep, sampleCount: 4096 };
      for (const entry of rated) expect(shown.has(entry.band.index)).toBe(!unresolvedBand(entry.band, grid, sampling));
    }
  });

  it("flags every band left out on a comment line of the CSV export, with the reason, unquoted so that readers skipping comments skip it", () => {
    const traces = [{ id: "r", label: "R1", timeStep: grid.timeStep, pressure: new Float64Array(4096).map((_, n) => Math.sin(n)) }];
    const table = bandLevelTable(traces, { bandsPerOctave: 1, highestResolvedFrequency: resolvedFrequencyLimit(grid) });
    const comments = bandLevelsCsv(table).split("\r\n").filter((line) => line.startsWith("# not resolved"));
    expect(table.excluded.length).toBeGreaterThan(0);
    expect(comments).toHaveLength(table.excluded.length);
    expect(comments.some((line) => line.includes("500 Hz band") && line.includes("above the highest resolved frequency 500 Hz"))).toBe(true);
  });

  it("finds the longest source-receiver distance and each receiver's distance from each source", () => {
    const accuracy = runAccuracy(sceneOf({ receivers: [{ id: "a", label: "A", position: { x: 6, y: 3 } }, { id: "b", label: "B", position: { x: 9, y: 3 } }] }), grid);
    expect(accuracy.longestDistance).toBeCloseTo(7, 12);
    expect(accuracy.receivers.map((r) => r.sources[0]!.distance)).toEqual([4, 7]);
  });
});

describe("accuracy warnings", () => {
  it("gives none for a clean scene that ran long enough and decayed", () => {
    const scene = sceneOf();
    expect(runAccuracy(scene, deriveGrid(scene), decayed).warnings).toEqual([]);
  });

  it("flags a wall thinner than two cells and names the screen case", () => {
    const scene = sceneOf({ geometry: { solids: [], walls: [{ id: "w", label: "Barrier", path: [{ x: 4, y: 0 }, { x: 4, y: 2 }], thickness: 0.05 }], surfaces: [] } });
    const warnings = runAccuracy(scene, deriveGrid(scene), decayed).warnings;
    expect(codes(warnings)).toEqual(["thin-wall"]);
    expect(warnings[0]!.message).toMatch(/screen of zero thickness/);
  });

  it("flags the thin arm of an L-shaped solid, which its overall width would hide", () => {
    const arm = [{ x: 7, y: 4 }, { x: 9, y: 4 }, { x: 9, y: 5.5 }, { x: 8.9, y: 5.5 }, { x: 8.9, y: 4.1 }, { x: 7, y: 4.1 }];
    const scene = sceneOf({ geometry: { solids: [{ id: "l", label: "Ledge", polygon: arm }], walls: [{ id: "w", label: "Barrier", path: [{ x: 4, y: 0 }, { x: 4, y: 2 }], thickness: 0.3 }], surfaces: [] } });
    const warnings = runAccuracy(scene, deriveGrid(scene), decayed).warnings;
    expect(codes(warnings)).toEqual(["thin-solid"]);
    expect(warnings[0]!.message).toMatch(/0\.10 m across/);
  });

  it("flags an opening narrower than two cells between a wall and a solid", () => {
    const block = [{ x: 4.25, y: 0.5 }, { x: 5, y: 0.5 }, { x: 5, y: 1.5 }, { x: 4.25, y: 1.5 }];
    const scene = sceneOf({ geometry: { solids: [{ id: "b", label: "Block", polygon: block }], walls: [{ id: "w", label: "Barrier", path: [{ x: 4, y: 0 }, { x: 4, y: 2 }], thickness: 0.3 }], surfaces: [] } });
    const warnings = runAccuracy(scene, deriveGrid(scene), decayed).warnings;
    expect(codes(warnings)).toEqual(["narrow-opening"]);
    expect(warnings[0]!.subject).toBe('wall "Barrier" and solid "Block"');
  });

  it("flags a narrow gap under a wall above a rigid floor, and none when the floor is a PML", () => {
    const wall = { id: "w", label: "Barrier", path: [{ x: 4, y: 0.25 }, { x: 4, y: 2 }], thickness: 0.3 }; // its round end lies 0.1 m above the floor
    const rigidFloor = sceneOf({ geometry: { solids: [], walls: [wall], surfaces: [] }, boundary: { bottom: { kind: "rigid" } } });
    expect(codes(runAccuracy(rigidFloor, deriveGrid(rigidFloor), decayed).warnings)).toEqual(["narrow-opening"]);
    const open = sceneOf({ geometry: { solids: [], walls: [wall], surfaces: [] } });
    expect(runAccuracy(open, deriveGrid(open), decayed).warnings).toEqual([]);
  });

  it("flags a receiver within three cells of a surface, and one within three cells of a PML", () => {
    const scene = sceneOf({ receivers: [{ id: "near-wall", label: "Near wall", position: { x: 4.3, y: 1 } }, { id: "near-pml", label: "Near edge", position: { x: 8, y: 0.1 } }] });
    const warnings = runAccuracy(scene, deriveGrid(scene), decayed).warnings;
    expect(codes(warnings)).toEqual(["receiver-near-pml", "receiver-near-surface"]);
    expect(warnings.find((w) => w.code === "receiver-near-surface")!.message).toMatch(/from wall "Barrier"/);
  });

  it("flags a receiver inside a PML (a recorded position outside the domain)", () => {
    const scene = sceneOf();
    const warnings = receiverWarnings(scene, deriveGrid(scene), [{ id: "out", label: "Outside", position: { x: -0.2, y: 3 } }]);
    expect(codes(warnings)).toEqual(["receiver-in-pml"]);
  });

  it("flags a run that stopped before the direct sound plus the Ricker pulse (3 / f0 = 20 ms) passed: 4 m / 343 m/s + 20 ms = 31.7 ms", () => {
    const scene = sceneOf();
    const grid = deriveGrid(scene);
    const short = runAccuracy(scene, grid, { ...decayed, simulatedSeconds: 0.03 }).warnings;
    expect(codes(short)).toEqual(["run-too-short"]);
    expect(short[0]!.remedy).toMatch(/31\.\d ms/);
    expect(codes(runAccuracy(scene, grid, { ...decayed, simulatedSeconds: 0.033 }).warnings)).toEqual([]);
  });

  it("flags energy not 20 dB below its peak when the run stopped, from the energy history or else the traces' tail", () => {
    const scene = sceneOf();
    const grid = deriveGrid(scene);
    const loud = { ...decayed, energy: [{ time: 0.02, joulesPerMetre: 1 }, { time: 0.1, joulesPerMetre: 0.05 }] };
    expect(codes(runAccuracy(scene, grid, loud).warnings)).toEqual(["energy-not-decayed"]);
    expect(codes(runAccuracy(scene, grid, { ...loud, stoppedBy: "decay" }).warnings)).toEqual([]);

    const ringing = Float64Array.from({ length: 1000 }, (_, n) => Math.sin(n / 3) * Math.exp(-n / 1000));
    const quiet = Float64Array.from({ length: 1000 }, (_, n) => Math.sin(n / 3) * Math.exp(-n / 50));
    const fromTraces = (pressure: Float64Array) => ({ simulatedSeconds: 0.1, stoppedBy: "duration" as const, traces: [{ id: "r", label: "R1", pressure }] });
    expect(finalEnergyRelativeToPeak(fromTraces(ringing))?.from).toBe("traces");
    expect(codes(runAccuracy(scene, grid, fromTraces(ringing)).warnings)).toEqual(["energy-not-decayed"]);
    expect(codes(runAccuracy(scene, grid, fromTraces(quiet)).warnings)).toEqual([]);
  });

  it("does not expect a continuous sine to decay", () => {
    const scene = sceneOf({ sources: [{ id: "s", label: "Tone", position: { x: 2, y: 3 }, signal: { kind: "sine", frequency: 200, rampCycles: 3 } }] });
    const loud = { ...decayed, energy: [{ time: 0.02, joulesPerMetre: 1 }, { time: 0.1, joulesPerMetre: 1 }] };
    expect(runAccuracy(scene, deriveGrid(scene), loud).warnings).toEqual([]);
  });
});
