// Band levels of receiver traces against closed-form results: a sine of amplitude A has mean square A^2 / 2;
// white noise of variance sigma^2 sampled at fs has a flat one-sided power density sigma^2 / (fs / 2);
// Parseval's relation (Oppenheim & Schafer, Discrete-Time Signal Processing, ch. 8; chapter from memory)
// makes the energy of the bands add up to the energy of the signal. Band edges per IEC 61260-1:2014 (base 10).
import { describe, expect, it } from "vitest";

import { weightingDecibels } from "@/lib/analysis/a-weighting";
import { bandLevelTable, type PressureTrace, receiverBandLevels, selectBands } from "@/lib/analysis/band-levels";
import { bandsBetween, frequencyBand } from "@/lib/analysis/bands";

import { gaussianNoise, levelOf, sineTrace } from "./test-signals";

const SAMPLE_RATE = 48000;
const DT = 1 / SAMPLE_RATE;
const trace = (id: string, pressure: ArrayLike<number>, timeStep = DT): PressureTrace => ({ id, label: `Receiver ${id}`, timeStep, pressure });

describe("band levels of a sine", () => {
  // 1 s at 48 kHz: 1 Hz natural bins, the nearest band edge of a midband sine over a hundred bins away.
  const count = SAMPLE_RATE;

  it("puts a sine of amplitude A into its band at 20 log10(A / sqrt(2) / 20 uPa), within 0.1 dB", () => {
    for (const [amplitude, x] of [[1, 0], [0.02, -10], [3.5, 5]] as const) {
      const band = frequencyBand(x, 3);
      const table = bandLevelTable([trace("r", sineTrace(amplitude, band.centre, DT, count))], { bandsPerOctave: 3, highestResolvedFrequency: 20000 });
      const b = table.bands.findIndex((candidate) => candidate.index === x);
      const expected = 20 * Math.log10(amplitude / Math.SQRT2 / 20e-6);
      expect(Math.abs(table.receivers[0]!.levels[b]! - expected)).toBeLessThan(0.1);
    }
  });

  it("does the same in an octave band, with a Hann window for a sine that does not fit the record", () => {
    const band = frequencyBand(-1, 1); // 501.2 Hz
    const pressure = sineTrace(0.5, band.centre * 1.07, DT, 30011);
    const table = bandLevelTable([trace("r", pressure)], { bandsPerOctave: 1, highestResolvedFrequency: 20000, window: "hann" });
    const b = table.bands.findIndex((candidate) => candidate.index === -1);
    expect(Math.abs(table.receivers[0]!.levels[b]! - 20 * Math.log10(0.5 / Math.SQRT2 / 20e-6))).toBeLessThan(0.1);
  });

  it("A-weights a 100 Hz sine by the IEC 61672-1 value, -19.1 dB (Table 3, from memory), within the table's rounding", () => {
    const band = frequencyBand(-10, 3);
    const pressure = sineTrace(1, band.centre, DT, count);
    const options = { bandsPerOctave: 3 as const, highestResolvedFrequency: 20000 };
    const flat = bandLevelTable([trace("r", pressure)], options);
    const weighted = bandLevelTable([trace("r", pressure)], { ...options, weighting: "A" });
    const b = flat.bands.findIndex((candidate) => candidate.index === -10);
    expect(Math.abs(weighted.receivers[0]!.levels[b]! - flat.receivers[0]!.levels[b]! - -19.1)).toBeLessThan(0.05 + 0.01);
    expect(weighted.weighting).toBe("A");
    expect(weightingDecibels("A", band.centre)).toBeCloseTo(weighted.receivers[0]!.levels[b]! - flat.receivers[0]!.levels[b]!, 2);
  });
});

describe("band levels of white noise", () => {
  // 2^19 samples (10.9 s): the 400 Hz one-third octave holds about 1010 natural bins.
  const count = 524288;
  const sigma = 0.2;
  const noise = gaussianNoise(count, sigma);
  // The one-third octaves reach one band beyond the octaves at each end, so that every octave is complete.
  const thirds = bandLevelTable([trace("r", noise)], { bandsPerOctave: 3, highestResolvedFrequency: 23000, lowestMidband: 400, highestMidband: 20000 });
  const octaves = bandLevelTable([trace("r", noise)], { bandsPerOctave: 1, highestResolvedFrequency: 23000, lowestMidband: 500, highestMidband: 16000 });

  it("gives each band the energy sigma^2 B / (fs / 2), to within four standard deviations of the estimate", () => {
    thirds.bands.forEach((band, b) => {
      const bandwidth = band.upper - band.lower;
      const expected = (sigma * sigma * bandwidth) / (SAMPLE_RATE / 2);
      const measured = 4e-10 * Math.pow(10, thirds.receivers[0]!.levels[b]! / 10);
      // The band energy of Gaussian noise over K independent bins is chi-square with 2K degrees of freedom:
      // relative standard deviation 1 / sqrt(K).
      const independentBins = bandwidth * count * DT;
      expect(Math.abs(measured / expected - 1), `${band.nominal} Hz`).toBeLessThan(4 / Math.sqrt(independentBins));
    });
  });

  it("makes the three one-third octaves of each octave add up to the octave", () => {
    expect(octaves.bands.length).toBeGreaterThan(3);
    octaves.bands.forEach((octave, o) => {
      const members = thirds.bands.flatMap((third, t) => (Math.abs(third.index - 3 * octave.index) <= 1 ? [thirds.receivers[0]!.levels[t]!] : []));
      expect(members).toHaveLength(3);
      const sum = 10 * Math.log10(members.reduce((s, level) => s + Math.pow(10, level / 10), 0));
      expect(sum).toBeCloseTo(octaves.receivers[0]!.levels[o]!, 9);
    });
  });
});

describe("overall level (Parseval)", () => {
  it("equals the level of the trace's mean square when all its energy lies in the reported bands", () => {
    const count = 48000;
    const parts = [sineTrace(0.3, frequencyBand(-7, 3).centre, DT, count, 0.1), sineTrace(1.2, frequencyBand(0, 3).centre, DT, count, 2.0), sineTrace(0.05, frequencyBand(5, 3).centre, DT, count, 4.0)];
    const pressure = Float64Array.from({ length: count }, (_, n) => parts.reduce((s, part) => s + part[n]!, 0));
    const meanSquare = pressure.reduce((s, p) => s + p * p, 0) / count;
    const levels = receiverBandLevels(trace("r", pressure), bandsBetween(20, 20000, 3));
    expect(Math.abs(levels.overall - levelOf(meanSquare))).toBeLessThan(0.01);
  });
});

describe("which bands are reported", () => {
  it("leaves out bands reaching above the highest resolved frequency and says so", () => {
    const { bands, excluded } = selectBands({ bandsPerOctave: 3, highestResolvedFrequency: 2000 }, DT, 48000);
    expect(bands[bands.length - 1]!.nominal).toBe(1600); // upper edge 1778 Hz
    expect(excluded[0]!.band.nominal).toBe(2000); // upper edge 2239 Hz
    expect(excluded.every((e) => e.reason === "above-resolved-frequency")).toBe(true);
    expect(excluded[0]!.message).toMatch(/highest resolved frequency 2000 Hz/);
  });

  it("leaves out bands above the Nyquist frequency and bands narrower than 1 / duration", () => {
    // 8 kHz sampling, 0.1 s: Nyquist 4 kHz, resolution 10 Hz.
    const { bands, excluded } = selectBands({ bandsPerOctave: 3, highestResolvedFrequency: 10000 }, 1 / 8000, 800);
    const reasonOf = (nominal: number) => excluded.find((e) => e.band.nominal === nominal)?.reason;
    expect(reasonOf(40)).toBe("narrower-than-resolution"); // 9.2 Hz wide
    expect(reasonOf(4000)).toBe("above-nyquist"); // upper edge 4467 Hz
    expect(excluded.find((e) => e.band.nominal === 4000)?.message).toBe("upper edge 4467 Hz is above the Nyquist frequency 4000 Hz");
    expect(bands[0]!.nominal).toBe(50); // 11.6 Hz wide
    expect(bands[bands.length - 1]!.nominal).toBe(3150); // upper edge 3548 Hz
  });

  it("keeps the receivers' ids, labels and order, and refuses traces sampled differently", () => {
    const a = trace("a", sineTrace(1, 1000, DT, 4800));
    const b = trace("b", sineTrace(0.1, 1000, DT, 4800));
    const table = bandLevelTable([b, a], { bandsPerOctave: 1, highestResolvedFrequency: 5000 });
    expect(table.receivers.map((r) => [r.receiverId, r.label])).toEqual([["b", "Receiver b"], ["a", "Receiver a"]]);
    expect(table.averagingTime).toBeCloseTo(0.1, 12);
    expect(table.receivers[0]!.overall).toBeCloseTo(table.receivers[1]!.overall - 20, 6);
    expect(() => bandLevelTable([a, trace("c", sineTrace(1, 1000, DT, 4801))], { bandsPerOctave: 1, highestResolvedFrequency: 5000 })).toThrow(/sampled differently/);
    expect(() => bandLevelTable([], { bandsPerOctave: 1, highestResolvedFrequency: 5000 })).toThrow(/at least one/);
  });
});
