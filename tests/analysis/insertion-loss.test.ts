// Pairing a run with its reference. The physics check is linearity: scaling a pressure trace by g changes
// every band level by 20 log10 g (the level's definition, ISO 1683 reference 20 uPa), so the insertion loss
// of a trace against the same trace scaled by 1/10 is 20 dB in every band. The rest checks the bookkeeping.
import { describe, expect, it } from "vitest";

import { bandLevelTable, type PressureTrace } from "@/lib/analysis/band-levels";
import { insertionLossMap, insertionLossTable, RunMismatchError } from "@/lib/analysis/insertion-loss";
import { type LevelGrid, levelGridFromRms } from "@/lib/analysis/level-grid";

import { gaussianNoise } from "./test-signals";

const DT = 1 / 32000;
const scaled = (values: ArrayLike<number>, gain: number) => Float64Array.from(values, (v) => v * gain);
const receiver = (id: string, pressure: ArrayLike<number>, label = `Receiver ${id}`): PressureTrace => ({ id, label, timeStep: DT, pressure });
const options = { bandsPerOctave: 3 as const, highestResolvedFrequency: 4000 };

describe("insertion loss per receiver and band", () => {
  const noiseA = gaussianNoise(16384, 0.5, 1);
  const noiseB = gaussianNoise(16384, 0.1, 2);
  const reference = bandLevelTable([receiver("a", noiseA), receiver("b", noiseB)], options);

  it("is 20 log10 g in every band when the run with treatment is the reference scaled by 1/g", () => {
    const treated = bandLevelTable([receiver("b", scaled(noiseB, 0.5)), receiver("a", scaled(noiseA, 0.1))], options);
    const table = insertionLossTable(reference, treated);
    expect(table.receivers.map((r) => r.receiverId)).toEqual(["a", "b"]);
    expect(table.bands).toEqual(reference.bands);
    const [a, b] = table.receivers;
    a!.insertionLoss.forEach((il) => expect(il).toBeCloseTo(20, 9));
    b!.insertionLoss.forEach((il) => expect(il).toBeCloseTo(20 * Math.log10(2), 9));
    expect(a!.overall).toBeCloseTo(20, 9);
  });

  it("refuses runs whose receivers differ, naming them", () => {
    const treated = bandLevelTable([receiver("a", noiseA), receiver("c", noiseB)], options);
    expect(() => insertionLossTable(reference, treated)).toThrow(/only in the reference: b; only in the run with treatment: c/);
    const relabelled = bandLevelTable([receiver("a", noiseA), receiver("b", noiseB, "Garden")], options);
    expect(() => insertionLossTable(reference, relabelled)).toThrow(/receiver b is labelled "Receiver b" in the reference and "Garden"/);
  });

  it("refuses runs whose bands, band width or weighting differ", () => {
    const subject = (treated: ReturnType<typeof bandLevelTable>) => {
      try {
        insertionLossTable(reference, treated);
      } catch (error) {
        return error instanceof RunMismatchError ? error.subject : "other error";
      }
      return "no error";
    };
    const traces = [receiver("a", noiseA), receiver("b", noiseB)];
    expect(subject(bandLevelTable(traces, { ...options, highestResolvedFrequency: 2000 }))).toBe("bands");
    expect(subject(bandLevelTable(traces, { ...options, bandsPerOctave: 1 }))).toBe("bands");
    expect(subject(bandLevelTable(traces, { ...options, weighting: "A" }))).toBe("bands");
    expect(() => insertionLossTable(reference, bandLevelTable(traces, { ...options, highestResolvedFrequency: 2000 }))).toThrow(/different bands/);
  });
});

describe("insertion loss maps", () => {
  const grid = (values: number[], overrides: Partial<LevelGrid> = {}): LevelGrid => ({ width: 3, height: 2, x0: 0.05, y0: 0.05, spacing: 0.1, values: Float32Array.from(values), ...overrides });

  it("subtracts cell by cell and is NaN where either map has no level", () => {
    const map = insertionLossMap(grid([80, 70, NaN, 60, 50, 40]), grid([70, 75, 50, 60, Infinity, NaN]));
    expect(Array.from(map.values.slice(0, 4))).toEqual([10, -5, NaN, 0]);
    expect(map.values[4]).toBeNaN();
    expect(map.values[5]).toBeNaN();
    expect([map.width, map.height, map.x0, map.y0, map.spacing]).toEqual([3, 2, 0.05, 0.05, 0.1]);
  });

  it("refuses maps on different grids", () => {
    const values = [1, 2, 3, 4, 5, 6];
    expect(() => insertionLossMap(grid(values), grid(values, { width: 2, height: 3 }))).toThrow(/sizes differ/);
    expect(() => insertionLossMap(grid(values), grid(values, { spacing: 0.2 }))).toThrow(/spacings differ/);
    expect(() => insertionLossMap(grid(values), grid(values, { x0: 0.15 }))).toThrow(/origins differ/);
    expect(() => insertionLossMap(grid(values), grid(values, { x0: 0.05 + 1e-12 }))).not.toThrow();
  });

  it("turns an rms pressure map into levels re 20 uPa, with no level where the rms is zero or the cell is solid", () => {
    const levels = levelGridFromRms(grid([1, 20e-6, 0, 2, NaN, 1]), [0, 0, 0, 0, 0, 1]);
    // 20 log10(1 Pa / 20 uPa) = 93.98 dB.
    expect(levels.values[0]).toBeCloseTo(93.9794, 3);
    expect(levels.values[1]).toBeCloseTo(0, 5);
    expect(levels.values[3]! - levels.values[0]!).toBeCloseTo(20 * Math.log10(2), 5);
    for (const i of [2, 4, 5]) expect(levels.values[i]).toBeNaN();
    expect(() => levelGridFromRms(grid([1, 1, 1, 1, 1, 1]), [0, 0])).toThrow(/solid mask/);
  });
});
