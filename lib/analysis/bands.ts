// Fractional-octave bands with base-10 midband frequencies (IEC 61260-1:2014, clause 5; ISO 266:1997 for the
// nominal values; clause and equation numbers from memory) and band levels from a spectrum by summing bin
// energies (Parseval).
import { binEnergies, type RealSpectrum, realSpectrum } from "./spectrum";
import { windowPowerSum } from "./windows";

/** Reference frequency of the band series, Hz (IEC 61260-1). */
export const REFERENCE_FREQUENCY = 1000;
/** Octave frequency ratio, base 10: G = 10^(3/10) (IEC 61260-1). */
export const OCTAVE_RATIO = Math.pow(10, 0.3);
/** Reference sound pressure for levels in air, Pa (ISO 1683). */
export const REFERENCE_PRESSURE = 20e-6;

/** Preferred numbers of the R10 series (ISO 3), from which ISO 266 takes the nominal midband frequencies. */
const PREFERRED_NUMBERS = [1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8] as const;

/** One fractional-octave band. */
export interface FrequencyBand {
  /** Band number x: the midband frequency is f_r G^(x/b) (odd b). */
  index: number;
  /** Exact midband frequency, Hz. */
  centre: number;
  /** Nominal midband frequency for labels (ISO 266), Hz. */
  nominal: number;
  /** Band edges f1 = fm G^(-1/(2b)) and f2 = fm G^(1/(2b)), Hz. */
  lower: number;
  upper: number;
}

/**
 * Exact midband frequency of band x for bandwidth designator b (1 = octave, 3 = one-third octave):
 * fm = fr G^(x/b) for odd b, fr G^((2x + 1)/(2b)) for even b (IEC 61260-1:2014).
 */
export function midbandFrequency(index: number, bandsPerOctave: number): number {
  const exponent = bandsPerOctave % 2 === 1 ? index / bandsPerOctave : (2 * index + 1) / (2 * bandsPerOctave);
  return REFERENCE_FREQUENCY * Math.pow(OCTAVE_RATIO, exponent);
}

/** The ISO 266 nominal value of an exact midband frequency: the nearest R10 preferred number (in log). */
export function nominalFrequency(exact: number): number {
  const decade = Math.floor(Math.log10(exact));
  let best = exact;
  let bestDistance = Infinity;
  for (const shift of [-1, 0, 1]) {
    for (const mantissa of PREFERRED_NUMBERS) {
      const candidate = mantissa * Math.pow(10, decade + shift);
      const distance = Math.abs(Math.log(candidate / exact));
      if (distance < bestDistance) {
        bestDistance = distance;
        best = candidate;
      }
    }
  }
  // Round away binary noise such as 3.1500000000000004.
  return Number(best.toPrecision(3));
}

/** Band x of designator b, with its edges. */
export function frequencyBand(index: number, bandsPerOctave: number): FrequencyBand {
  const centre = midbandFrequency(index, bandsPerOctave);
  const halfWidth = Math.pow(OCTAVE_RATIO, 1 / (2 * bandsPerOctave));
  return { index, centre, nominal: nominalFrequency(centre), lower: centre / halfWidth, upper: centre * halfWidth };
}

/** Every band whose midband frequency lies within [lowest, highest] Hz (a little slack for nominal values). */
export function bandsBetween(lowest: number, highest: number, bandsPerOctave: number): FrequencyBand[] {
  const position = (f: number) => (bandsPerOctave * Math.log(f / REFERENCE_FREQUENCY)) / Math.log(OCTAVE_RATIO) - (bandsPerOctave % 2 === 1 ? 0 : 0.5);
  const first = Math.ceil(position(lowest) - 0.05);
  const last = Math.floor(position(highest) + 0.05);
  const bands: FrequencyBand[] = [];
  for (let x = first; x <= last; x++) bands.push(frequencyBand(x, bandsPerOctave));
  return bands;
}

/**
 * Sum of bin energies (see binEnergies) whose frequency lies in [lower, upper) of each band. With the
 * spectrum of an unwindowed transient this is the band's share of sum_n x_n^2.
 */
export function bandEnergies(spectrum: RealSpectrum, bands: readonly FrequencyBand[]): Float64Array {
  const energy = binEnergies(spectrum);
  const out = new Float64Array(bands.length);
  bands.forEach((band, b) => {
    const first = Math.max(0, Math.ceil(band.lower / spectrum.binWidth));
    const last = Math.min(energy.length - 1, Math.ceil(band.upper / spectrum.binWidth) - 1);
    let sum = 0;
    for (let k = first; k <= last; k++) sum += energy[k] ?? 0;
    out[b] = sum;
  });
  return out;
}

/** Sound pressure level of a mean-square pressure, dB re 20 uPa. */
export function levelFromMeanSquare(meanSquare: number): number {
  return 10 * Math.log10(meanSquare / (REFERENCE_PRESSURE * REFERENCE_PRESSURE));
}

/**
 * Band levels (dB re 20 uPa) of a steady signal from its windowed spectrum: each band's mean square is
 * its bin energies divided by sum_n w_n^2 (Parseval, with the window's power gain taken out).
 */
export function bandLevelsOfSteadySignal(pressure: ArrayLike<number>, timeStep: number, bands: readonly FrequencyBand[], window: ArrayLike<number>): Float64Array {
  const spectrum = realSpectrum(pressure, timeStep, { window });
  const energies = bandEnergies(spectrum, bands);
  const powerSum = windowPowerSum(window);
  return energies.map((e) => levelFromMeanSquare(e / powerSum));
}
