// A and C frequency weightings against IEC 61672-1:2013. The tabulated design values (Table 3, table number
// from memory) are given to 0.1 dB at the nominal one-third-octave frequencies and were computed at the exact
// base-10 midband frequencies 1000 * 10^(x/10) Hz; the values below are from memory.
import { describe, expect, it } from "vitest";

import { NORMALISATION_A1000, NORMALISATION_C1000, weightingDecibels, weightingGain, WEIGHTING_POLES, weightSpectrum } from "@/lib/analysis/a-weighting";
import { midbandFrequency } from "@/lib/analysis/bands";
import { realSpectrum } from "@/lib/analysis/spectrum";

/** One-third-octave band numbers x = -20 (10 Hz) .. 13 (20 kHz). */
const BAND_NUMBERS = Array.from({ length: 34 }, (_, k) => k - 20);
const NOMINAL = [10, 12.5, 16, 20, 25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500, 3150, 4000, 5000, 6300, 8000, 10000, 12500, 16000, 20000];

// IEC 61672-1:2013 Table 3, A weighting, dB, 10 Hz .. 20 kHz (from memory).
const TABLE_A = [-70.4, -63.4, -56.7, -50.5, -44.7, -39.4, -34.6, -30.2, -26.2, -22.5, -19.1, -16.1, -13.4, -10.9, -8.6, -6.6, -4.8, -3.2, -1.9, -0.8, 0, 0.6, 1.0, 1.2, 1.3, 1.2, 1.0, 0.5, -0.1, -1.1, -2.5, -4.3, -6.6, -9.3];
// IEC 61672-1:2013 Table 3, C weighting, dB, 10 Hz .. 20 kHz (from memory).
const TABLE_C = [-14.3, -11.2, -8.5, -6.2, -4.4, -3.0, -2.0, -1.3, -0.8, -0.5, -0.3, -0.2, -0.1, 0, 0, 0, 0, 0, 0, 0, 0, 0, -0.1, -0.2, -0.3, -0.5, -0.8, -1.3, -2.0, -3.0, -4.4, -6.2, -8.5, -11.2];

/** The table is rounded to 0.1 dB: an exact implementation lies within half a step (plus float noise). */
const TABLE_HALF_STEP = 0.05 + 1e-9;

describe("frequency weightings (IEC 61672-1:2013)", () => {
  it("derives the pole frequencies the standard quotes: about 20.60, 107.7, 737.9 and 12194 Hz (Annex E, from memory)", () => {
    expect(WEIGHTING_POLES.f1).toBeCloseTo(20.6, 2);
    expect(WEIGHTING_POLES.f2).toBeCloseTo(107.7, 1);
    expect(WEIGHTING_POLES.f3).toBeCloseTo(737.9, 1);
    expect(Math.abs(WEIGHTING_POLES.f4 - 12194)).toBeLessThan(0.5);
  });

  it("has normalisation constants A1000 = -2.000 dB and C1000 = -0.062 dB to the standard's 0.001 dB (Annex E, from memory)", () => {
    expect(Math.abs(NORMALISATION_A1000 - -2.0)).toBeLessThan(0.0005);
    expect(Math.abs(NORMALISATION_C1000 - -0.062)).toBeLessThan(0.0005);
  });

  it("matches the tabulated A weighting from 10 Hz to 20 kHz to the table's 0.1 dB", () => {
    BAND_NUMBERS.forEach((x, k) => {
      const computed = weightingDecibels("A", midbandFrequency(x, 3));
      expect(Math.abs(computed - TABLE_A[k]!), `A at ${NOMINAL[k]} Hz: ${computed.toFixed(3)} dB`).toBeLessThanOrEqual(TABLE_HALF_STEP);
    });
  });

  it("matches the tabulated C weighting from 10 Hz to 20 kHz to the table's 0.1 dB", () => {
    BAND_NUMBERS.forEach((x, k) => {
      const computed = weightingDecibels("C", midbandFrequency(x, 3));
      expect(Math.abs(computed - TABLE_C[k]!), `C at ${NOMINAL[k]} Hz: ${computed.toFixed(3)} dB`).toBeLessThanOrEqual(TABLE_HALF_STEP);
    });
  });

  it("is exactly 0 dB at 1 kHz, silences 0 Hz, and leaves Z flat", () => {
    expect(weightingDecibels("A", 1000)).toBeCloseTo(0, 12);
    expect(weightingDecibels("C", 1000)).toBeCloseTo(0, 12);
    expect(weightingGain("A", 0)).toBe(0);
    expect(weightingGain("C", 0)).toBe(0);
    expect(weightingGain("Z", 37)).toBe(1);
  });

  it("weights each bin of a spectrum by the amplitude ratio at its frequency", () => {
    const signal = Float64Array.from({ length: 64 }, (_, n) => Math.sin(0.3 * n) + 0.2 * Math.cos(1.1 * n));
    const spectrum = realSpectrum(signal, 1 / 8000);
    const weighted = weightSpectrum(spectrum, "A");
    for (const k of [1, 5, 20, 32]) {
      const gain = weightingGain("A", k * spectrum.binWidth);
      expect(weighted.re[k]).toBeCloseTo(spectrum.re[k]! * gain, 12);
      expect(weighted.im[k]).toBeCloseTo(spectrum.im[k]! * gain, 12);
    }
    expect(weightSpectrum(spectrum, "Z")).toBe(spectrum);
  });
});
