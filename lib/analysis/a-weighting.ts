// Frequency weightings A and C from their analytic definition in IEC 61672-1:2013 (Annex E; annex and
// equation numbers from memory): poles at f1, f2, f3, f4 derived from fL, fH, fA and D, gain 0 dB at 1 kHz.
import type { RealSpectrum } from "./spectrum";

/** Z is no weighting (flat); A and C as in IEC 61672-1. */
export type FrequencyWeighting = "Z" | "A" | "C";

/** Corner frequencies from which IEC 61672-1 derives the poles, Hz. */
const REFERENCE_FREQUENCY = 1000;
const LOW_CORNER = Math.pow(10, 1.5);
const HIGH_CORNER = Math.pow(10, 3.9);
const A_CORNER = Math.pow(10, 2.45);
/** D^2 = 1/2: the C weighting is 3 dB down (to first order) at fL and fH. */
const D = Math.SQRT1_2;

/**
 * Pole frequencies f1 .. f4 of the weightings, Hz, from the standard's closed-form expressions
 * (about 20.60, 107.7, 737.9 and 12194 Hz). f1 and f4 are the roots of f^4 + b f^2 + c = 0.
 */
export const WEIGHTING_POLES = (() => {
  const c = LOW_CORNER * LOW_CORNER * HIGH_CORNER * HIGH_CORNER;
  const b = (REFERENCE_FREQUENCY ** 2 + c / REFERENCE_FREQUENCY ** 2 - D * (LOW_CORNER ** 2 + HIGH_CORNER ** 2)) / (1 - D);
  const root = Math.sqrt(b * b - 4 * c);
  return {
    f1: Math.sqrt((-b - root) / 2),
    f2: ((3 - Math.sqrt(5)) / 2) * A_CORNER,
    f3: ((3 + Math.sqrt(5)) / 2) * A_CORNER,
    f4: Math.sqrt((-b + root) / 2),
  };
})();

/** Un-normalised C response as an amplitude ratio: f4^2 f^2 / ((f^2 + f1^2)(f^2 + f4^2)). */
function rawGainC(frequency: number): number {
  const { f1, f4 } = WEIGHTING_POLES;
  const f2sq = frequency * frequency;
  return (f4 * f4 * f2sq) / ((f2sq + f1 * f1) * (f2sq + f4 * f4));
}

/** Un-normalised A response: the C response times f^2 / sqrt((f^2 + f2^2)(f^2 + f3^2)). */
function rawGainA(frequency: number): number {
  const { f2, f3 } = WEIGHTING_POLES;
  const f2sq = frequency * frequency;
  return (rawGainC(frequency) * f2sq) / Math.sqrt((f2sq + f2 * f2) * (f2sq + f3 * f3));
}

/**
 * Normalisation constants A1000 and C1000, dB: the raw responses at 1 kHz. The standard prints them rounded
 * (-2.000 and -0.062 dB); we take the unrounded values so that the weighting is exactly 0 dB at 1 kHz.
 */
export const NORMALISATION_A1000 = 20 * Math.log10(rawGainA(REFERENCE_FREQUENCY));
export const NORMALISATION_C1000 = 20 * Math.log10(rawGainC(REFERENCE_FREQUENCY));

const RAW_A_AT_1K = rawGainA(REFERENCE_FREQUENCY);
const RAW_C_AT_1K = rawGainC(REFERENCE_FREQUENCY);

/** Amplitude ratio of the weighting at `frequency` Hz (1 at 1 kHz; 0 at 0 Hz for A and C). */
export function weightingGain(weighting: FrequencyWeighting, frequency: number): number {
  if (weighting === "A") return rawGainA(frequency) / RAW_A_AT_1K;
  if (weighting === "C") return rawGainC(frequency) / RAW_C_AT_1K;
  return 1;
}

/** The weighting in decibels at `frequency` Hz (-Infinity at 0 Hz for A and C). */
export function weightingDecibels(weighting: FrequencyWeighting, frequency: number): number {
  return 20 * Math.log10(weightingGain(weighting, frequency));
}

/**
 * The spectrum with every bin multiplied by the weighting's amplitude ratio at the bin frequency, so that
 * band energies summed from it are weighted bin by bin rather than with one value per band.
 */
export function weightSpectrum(spectrum: RealSpectrum, weighting: FrequencyWeighting): RealSpectrum {
  if (weighting === "Z") return spectrum;
  const re = new Float64Array(spectrum.re.length);
  const im = new Float64Array(spectrum.im.length);
  for (let k = 0; k < re.length; k++) {
    const gain = weightingGain(weighting, k * spectrum.binWidth);
    re[k] = (spectrum.re[k] ?? 0) * gain;
    im[k] = (spectrum.im[k] ?? 0) * gain;
  }
  return { ...spectrum, re, im };
}
