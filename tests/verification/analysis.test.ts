// The analysis machinery the verification cases rely on: fractional-octave bands (IEC 61260-1:2014, base 10;
// nominal frequencies per ISO 266:1997), Parseval bin energies, peak refinement and phase unwrapping.
import { describe, expect, it } from "vitest";

import { bandEnergies, bandsBetween, frequencyBand, midbandFrequency, nominalFrequency, OCTAVE_RATIO } from "@/lib/analysis/bands";
import { unwrapPhases, wrapPhase } from "@/lib/analysis/phase";
import { findSpectralPeak } from "@/lib/analysis/spectral-peaks";
import { binEnergies, fourierTransformAt, magnitudes, nextPowerOfTwo, realSpectrum } from "@/lib/analysis/spectrum";
import { blackmanHarrisWindow, hannWindow, windowPowerSum } from "@/lib/analysis/windows";

/** A repeatable pseudo-random sequence in [-1, 1) (linear congruential, Numerical Recipes constants). */
function pseudoRandom(count: number, seed = 12345): Float64Array {
  const out = new Float64Array(count);
  let state = seed;
  for (let n = 0; n < count; n++) {
    state = (1664525 * state + 1013904223) % 4294967296;
    out[n] = state / 2147483648 - 1;
  }
  return out;
}

describe("fractional-octave bands, base 10 (IEC 61260-1:2014)", () => {
  it("uses the octave ratio G = 10^(3/10) and puts band 0 at 1 kHz", () => {
    expect(OCTAVE_RATIO).toBeCloseTo(1.99526, 5);
    expect(midbandFrequency(0, 3)).toBe(1000);
    expect(midbandFrequency(0, 1)).toBe(1000);
  });

  it("repeats the one-third octave midband frequencies every decade (ten bands), as base 10 must", () => {
    for (let x = -20; x <= 3; x++) expect(midbandFrequency(x + 10, 3) / midbandFrequency(x, 3)).toBeCloseTo(10, 12);
    expect(midbandFrequency(1, 3)).toBeCloseTo(1258.925, 3);
    expect(midbandFrequency(-1, 1)).toBeCloseTo(501.187, 3);
  });

  it("labels bands with the ISO 266 nominal frequencies", () => {
    // ISO 266:1997 preferred frequencies, one-third octave series 10 Hz to 20 kHz (list from memory).
    const nominal = [10, 12.5, 16, 20, 25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500, 3150, 4000, 5000, 6300, 8000, 10000, 12500, 16000, 20000];
    expect(bandsBetween(10, 20000, 3).map((b) => b.nominal)).toEqual(nominal);
    expect(bandsBetween(31.5, 16000, 1).map((b) => b.nominal)).toEqual([31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000, 16000]);
    expect(nominalFrequency(3162.28)).toBe(3150);
  });

  it("makes neighbouring bands share their edges and nests three one-third octaves in each octave", () => {
    const thirds = bandsBetween(20, 20000, 3);
    for (let k = 1; k < thirds.length; k++) expect(thirds[k]!.lower).toBeCloseTo(thirds[k - 1]!.upper, 9);
    const octave = frequencyBand(0, 1);
    expect(octave.lower).toBeCloseTo(frequencyBand(-1, 3).lower, 9);
    expect(octave.upper).toBeCloseTo(frequencyBand(1, 3).upper, 9);
    // Edges fm G^(+-1/6) for one-third octaves: 891.25 and 1122.02 Hz around 1 kHz.
    expect(frequencyBand(0, 3).lower).toBeCloseTo(891.251, 3);
    expect(frequencyBand(0, 3).upper).toBeCloseTo(1122.018, 3);
  });

  it("uses the half-band offset for even bandwidth designators", () => {
    expect(midbandFrequency(0, 2)).toBeCloseTo(1000 * Math.pow(OCTAVE_RATIO, 1 / 4), 9);
  });
});

describe("spectra and Parseval", () => {
  it("rounds a length up to the FFT size", () => {
    expect([1, 2, 3, 1024, 1025].map(nextPowerOfTwo)).toEqual([2, 2, 4, 1024, 2048]);
  });

  it("splits the signal energy over the one-sided bins exactly (zero-padded or not)", () => {
    const x = pseudoRandom(1000);
    const total = x.reduce((s, v) => s + v * v, 0);
    for (const size of [1024, 4096]) {
      const sum = binEnergies(realSpectrum(x, 1e-3, { size })).reduce((s, v) => s + v, 0);
      expect(sum / total).toBeCloseTo(1, 12);
    }
  });

  it("counts the bins from the lower band edge up to, not including, the upper edge", () => {
    // A unit impulse has |X_k| = 1: every interior bin holds energy 2 / N.
    const impulse = new Float64Array(8);
    impulse[0] = 1;
    const spectrum = realSpectrum(impulse, 1 / 8192, { size: 8192 }); // 1 Hz bins
    const band = frequencyBand(0, 3); // 891.25 .. 1122.02 Hz: bins 892 .. 1122
    expect(bandEnergies(spectrum, [band])[0]).toBeCloseTo((2 * (1122 - 892 + 1)) / 8192, 12);
  });

  it("gives the same transform at a bin frequency by direct summation as the FFT", () => {
    const x = pseudoRandom(3000, 7);
    const spectrum = realSpectrum(x, 0.001, { size: 4096 });
    for (const k of [1, 100, 777, 2047]) {
      const z = fourierTransformAt(x, 0.001, k * spectrum.binWidth);
      expect(z.re).toBeCloseTo(spectrum.re[k]!, 8);
      expect(z.im).toBeCloseTo(spectrum.im[k]!, 8);
    }
  });
});

describe("windows", () => {
  it("gives the Hann window zero ends, a unit middle and power sum 3N/8", () => {
    const w = hannWindow(1001);
    expect(w[0]).toBe(0);
    expect(w[500]).toBeCloseTo(1, 15);
    expect(windowPowerSum(w) / 1001).toBeCloseTo(3 / 8, 2);
  });

  it("makes the Blackman-Harris window symmetric with a unit peak", () => {
    const w = blackmanHarrisWindow(513);
    expect(w[256]).toBeCloseTo(1, 12);
    for (let n = 0; n < 513; n++) expect(w[n]).toBeCloseTo(w[512 - n]!, 14);
  });
});

describe("spectral peaks", () => {
  it("recovers the frequency of a lone sine to 1e-9, and to 1e-6 next to a sine ten times stronger twelve bins away", () => {
    const dt = 1 / 1000;
    const count = 8192;
    const f1 = 123.456789;
    const f2 = f1 + (12 * 1000) / count;
    const window = blackmanHarrisWindow(count);
    const locate = (neighbour: number) => {
      const x = Float64Array.from({ length: count }, (_, n) => Math.sin(2 * Math.PI * f1 * n * dt + 0.3) + neighbour * Math.sin(2 * Math.PI * f2 * n * dt));
      const spectrum = realSpectrum(x, dt, { window, size: 2 * count });
      return findSpectralPeak(x, dt, window, spectrum, magnitudes(spectrum), 120, 124.5)!;
    };
    const lone = locate(0);
    expect(Math.abs(lone.parabolicFrequency / f1 - 1)).toBeLessThan(1e-4);
    expect(Math.abs(lone.frequency / f1 - 1)).toBeLessThan(1e-9);
    // The neighbour's sidelobes, 92 dB down but 20 dB stronger, pull the peak by a few 1e-7.
    expect(Math.abs(locate(10).frequency / f1 - 1)).toBeLessThan(1e-6);
  });
});

describe("phase unwrapping", () => {
  it("wraps into (-pi, pi]", () => {
    expect(wrapPhase(Math.PI)).toBeCloseTo(Math.PI, 15);
    expect(wrapPhase(-Math.PI)).toBeCloseTo(Math.PI, 15);
    expect(wrapPhase(7)).toBeCloseTo(7 - 2 * Math.PI, 15);
  });

  it("restores a steep phase ramp from its wrapped values, on the branch nearest the nominal start", () => {
    const ramp = Array.from({ length: 200 }, (_, k) => 40 + 2.5 * k);
    const unwrapped = unwrapPhases(ramp.map(wrapPhase), 41);
    for (let k = 0; k < ramp.length; k++) expect(unwrapped[k]).toBeCloseTo(ramp[k]!, 10);
  });
});
