// The spectrum shown is the density the band levels integrate (Parseval): summed over a band's bins it
// gives the band level of the table, and summed over all bins the mean square of the trace.
import { describe, expect, it } from "vitest";

import { bandLevelTable } from "@/lib/analysis/band-levels";
import { spectralDensity } from "@/lib/analysis/spectral-density";

import { gaussianNoise, levelOf, sineTrace } from "./test-signals";

const timeStep = 1 / 16000;
const toMeanSquare = (level: number) => Math.pow(10, level / 10) * 4e-10;

describe("power spectral density", () => {
  it("integrates to the mean square of the trace", () => {
    const pressure = sineTrace(0.3, 1000, timeStep, 5000);
    const density = spectralDensity(pressure, timeStep);
    let total = 0;
    density.levels.forEach((level) => (total += toMeanSquare(level) * density.binWidth));
    const meanSquare = pressure.reduce((sum, p) => sum + p * p, 0) / pressure.length;
    // Bin 0 is left out; a sine carries almost nothing there.
    expect(levelOf(total)).toBeCloseTo(levelOf(meanSquare), 3);
  });

  it("integrates over a band's bins to that band's level in the band table", () => {
    const pressure = gaussianNoise(8192, 0.1, 7);
    const table = bandLevelTable([{ id: "a", label: "A", timeStep, pressure }], { bandsPerOctave: 3, highestResolvedFrequency: 4000 });
    const density = spectralDensity(pressure, timeStep);
    table.bands.forEach((band, b) => {
      let sum = 0;
      density.frequencies.forEach((f, k) => {
        if (f >= band.lower && f < band.upper) sum += toMeanSquare(density.levels[k]!) * density.binWidth;
      });
      expect(levelOf(sum)).toBeCloseTo(table.receivers[0]!.levels[b]!, 6);
    });
  });

  it("zero-pads to a common size so that traces of different lengths share bins", () => {
    const a = spectralDensity(sineTrace(1, 500, timeStep, 3000), timeStep, { size: 8192 });
    const b = spectralDensity(sineTrace(1, 500, timeStep, 7000), timeStep, { size: 8192 });
    expect(a.frequencies).toEqual(b.frequencies);
    expect(a.binWidth).toBeCloseTo(16000 / 8192, 12);
  });
});
