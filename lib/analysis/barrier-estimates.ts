// Textbook estimates of the attenuation of a barrier, per octave band, to set beside a simulated insertion
// loss: Maekawa's chart (Z. Maekawa, "Noise reduction by screens", Applied Acoustics 1 (1968) 157-173) and
// the barrier attenuation D_z of ISO 9613-2:1996 (clause 7.4; clause and equation numbers from memory).
import { bandsBetween, type FrequencyBand } from "./bands";
import { diffractionPath, type DiffractionPath, type SectionPoint } from "./diffraction-path";

/** Shown beside the estimates: they answer a different question from the one a 2D simulation answers. */
export const POINT_SOURCE_CAVEAT =
  "Maekawa's chart and ISO 9613-2 describe a point source radiating spherically in three dimensions. " +
  "A 2D section models a coherent line source, infinitely long and parallel to an infinitely long barrier, spreading cylindrically, " +
  "so its insertion loss need not match these figures. ISO 9613-2 also builds in ground reflections and downwind propagation, which the section may not contain. " +
  "Read them as a plausibility check, not as the expected result.";

/** Sound speed ISO 9613-2 uses for the wavelength at the nominal midband frequency, m/s (from memory). */
export const ISO_9613_2_SOUND_SPEED = 340;

/** Fresnel number N = 2 delta / lambda; delta signed, so N < 0 in the bright zone (Maekawa 1968). */
export function fresnelNumber(signedPathDifference: number, wavelength: number): number {
  return (2 * signedPathDifference) / wavelength;
}

/** Maekawa's chart ends on the bright side at N = -0.3 (from memory), reading 0 dB there. */
const CHART_BRIGHT_LIMIT = -0.3;

/**
 * Attenuation read from Maekawa's chart, dB, through closed-form fits:
 * - N >= 0: 10 log10(3 + 20 N) (common practice; 4.8 dB at grazing incidence, 13 dB at N = 1);
 * - -0.3 < N < 0: 5 + 20 log10(x / tan x), x = sqrt(2 pi |N|) (U. J. Kurze and G. S. Anderson, "Sound
 *   attenuation by barriers", Applied Acoustics 4 (1971) 35-53; from memory), never below 0 dB: it falls
 *   to 0 dB near N = -0.19;
 * - N <= -0.3: 0 dB.
 * The two fits meet at N = 0 with a step of 0.23 dB (4.77 against 5.0 dB), below what a chart can be read to.
 */
export function maekawaAttenuation(fresnel: number): number {
  if (fresnel >= 0) return 10 * Math.log10(3 + 20 * fresnel);
  if (fresnel <= CHART_BRIGHT_LIMIT) return 0;
  const x = Math.sqrt(2 * Math.PI * -fresnel);
  return Math.max(0, 5 + 20 * Math.log10(x / Math.tan(x)));
}

/**
 * ISO 9613-2 factor C3 for double diffraction: (1 + (5 lambda / e)^2) / (1/3 + (5 lambda / e)^2), with e
 * the spacing of the two edges; 1 for a single edge. It runs from 1 (thin) to 3 (edges far apart).
 */
export function doubleDiffractionFactor(wavelength: number, edgeSpacing: number): number {
  if (edgeSpacing <= 0) return 1;
  const ratio = Math.pow((5 * wavelength) / edgeSpacing, 2);
  return (1 + ratio) / (1 / 3 + ratio);
}

/**
 * ISO 9613-2 correction for meteorological effects, K_met = exp(-(1/2000) sqrt(d_ss d_sr d / (2 z))) for
 * z > 0 (lengths in m), 1 otherwise. Here z is the path difference in the section (no lateral offset a).
 */
export function meteorologicalCorrection(path: DiffractionPath): number {
  const z = path.signedPathDifference;
  if (z <= 0) return 1;
  return Math.exp(-Math.sqrt((path.sourceToEdge * path.edgeToReceiver * path.directDistance) / (2 * z)) / 2000);
}

/** ISO 9613-2 upper bounds on D_z, dB: 20 for single, 25 for double diffraction. */
export const ISO_SINGLE_DIFFRACTION_CAP = 20;
export const ISO_DOUBLE_DIFFRACTION_CAP = 25;

export interface IsoBarrierOptions {
  /** C2 = 20 as ISO 9613-2 gives it (ground reflections included); 40 when ground reflections are modelled separately (from memory). */
  c2?: number;
  /** Apply K_met (default true). */
  meteorologicalCorrection?: boolean;
}

export interface IsoBarrierAttenuation {
  /** D_z after the cap, dB. */
  value: number;
  /** D_z before the cap, dB. */
  uncapped: number;
  capped: boolean;
}

/**
 * ISO 9613-2 barrier attenuation D_z = 10 log10(3 + (C2 / lambda) C3 z K_met), dB, with z the path
 * difference. ISO 9613-2 counts a barrier only where it blocks the line of sight (from memory); for a receiver
 * in the bright zone (z < 0) we continue the formula with negative z down to 0 dB and no lower (our choice,
 * so that the estimate fades out at the shadow boundary rather than jumping from 4.8 dB to nothing).
 */
export function isoBarrierAttenuation(path: DiffractionPath, wavelength: number, options: IsoBarrierOptions = {}): IsoBarrierAttenuation {
  const double = path.edges.length === 2;
  const c3 = double ? doubleDiffractionFactor(wavelength, path.edgeSpacing) : 1;
  const kMet = options.meteorologicalCorrection === false ? 1 : meteorologicalCorrection(path);
  const argument = 3 + ((options.c2 ?? 20) / wavelength) * c3 * path.signedPathDifference * kMet;
  const uncapped = argument > 1 ? 10 * Math.log10(argument) : 0;
  const cap = double ? ISO_DOUBLE_DIFFRACTION_CAP : ISO_SINGLE_DIFFRACTION_CAP;
  return { value: Math.min(uncapped, cap), uncapped, capped: uncapped > cap };
}

export interface BarrierBandEstimate {
  band: FrequencyBand;
  /** c / nominal midband frequency, m. */
  wavelength: number;
  fresnelNumber: number;
  /** Maekawa's chart value, dB. */
  maekawa: number;
  iso: IsoBarrierAttenuation;
}

export interface BarrierEstimates {
  path: DiffractionPath;
  kMet: number;
  bands: BarrierBandEstimate[];
  caveat: string;
}

export interface BarrierEstimateOptions extends IsoBarrierOptions {
  /** Sound speed for the wavelengths, m/s (default 340, as ISO 9613-2). */
  soundSpeed?: number;
  /** Bands to estimate (default the octaves 63 Hz to 8 kHz of ISO 9613-2). */
  bands?: readonly FrequencyBand[];
}

/** Maekawa and ISO 9613-2 estimates per octave band for a source, a receiver and the barrier's top edge(s). */
export function barrierEstimates(source: SectionPoint, receiver: SectionPoint, edges: readonly SectionPoint[], options: BarrierEstimateOptions = {}): BarrierEstimates {
  const path = diffractionPath(source, receiver, edges);
  const soundSpeed = options.soundSpeed ?? ISO_9613_2_SOUND_SPEED;
  const bands = options.bands ?? bandsBetween(63, 8000, 1);
  const estimates = bands.map((band) => {
    const wavelength = soundSpeed / band.nominal;
    const fresnel = fresnelNumber(path.signedPathDifference, wavelength);
    return { band, wavelength, fresnelNumber: fresnel, maekawa: maekawaAttenuation(fresnel), iso: isoBarrierAttenuation(path, wavelength, options) };
  });
  const kMet = options.meteorologicalCorrection === false ? 1 : meteorologicalCorrection(path);
  return { path, kMet, bands: estimates, caveat: POINT_SOURCE_CAVEAT };
}
