// Per reported band: cells per wavelength at the upper edge, the phase error the scheme's dispersion gives a
// wave of that frequency per wavelength and over the longest source-receiver distance, and a rating in words.
import { bandsBetween, type FrequencyBand } from "../bands";
import { axisPhaseErrorOver, axisPhaseErrorPerWavelength, pointsPerWavelength } from "./phase-error";
import { type ResolutionGrid, type TraceSampling, unresolvedBand } from "./resolved-range";
import { CAREFUL_PHASE_ERROR_DEGREES, RESOLVED_POINTS_PER_WAVELENGTH } from "./thresholds";

export type BandRating = "reliable" | "use with care" | "not resolved";

export interface BandAccuracy {
  band: FrequencyBand;
  /** Cells per wavelength at the band's upper edge in the slowest medium. */
  pointsPerWavelength: number;
  /** Degrees of phase lag per wavelength travelled along a grid axis (the worst direction), at the upper edge. */
  phaseErrorPerWavelength: number;
  /** Degrees of phase lag over the longest source-receiver distance, at the upper edge. */
  phaseErrorOverPath: number;
  rating: BandRating;
  /** Why, in words. */
  reason: string;
}

export interface BandAccuracyGrid extends ResolutionGrid {
  timeStep: number;
}

const degrees = (value: number) => (Number.isFinite(value) ? `${value < 10 ? value.toFixed(1) : value.toFixed(0)}°` : "unbounded");

/** Rates one band; `longestDistance` is the longest source-receiver distance of the scene, m (0 without receivers). */
export function bandAccuracy(band: FrequencyBand, grid: BandAccuracyGrid, longestDistance: number, sampling: TraceSampling = { timeStep: grid.timeStep }): BandAccuracy {
  // The slowest medium has the fewest cells per wavelength and, at the common time step, the lowest Courant
  // number: the worst case on both counts.
  const dispersionGrid = { cellSize: grid.cellSize, timeStep: grid.timeStep, soundSpeed: grid.minSoundSpeed };
  const ppw = pointsPerWavelength(band.upper, dispersionGrid);
  const perWavelength = axisPhaseErrorPerWavelength(band.upper, dispersionGrid);
  const overPath = axisPhaseErrorOver(longestDistance, band.upper, dispersionGrid);
  const base = { band, pointsPerWavelength: ppw, phaseErrorPerWavelength: perWavelength, phaseErrorOverPath: overPath };

  const unresolved = unresolvedBand(band, grid, sampling);
  if (unresolved) return { ...base, rating: "not resolved", reason: `Not resolved: ${unresolved.message}.` };
  if (overPath > CAREFUL_PHASE_ERROR_DEGREES) {
    return {
      ...base,
      rating: "use with care",
      reason: `${ppw.toFixed(1)} cells per wavelength, but the grid delays this frequency by ${degrees(overPath)} of phase over the longest source-receiver distance (more than ${CAREFUL_PHASE_ERROR_DEGREES}°): energy levels hold, interference dips and peaks may sit at the wrong place.`,
    };
  }
  return {
    ...base,
    rating: "reliable",
    reason: `${ppw.toFixed(1)} cells per wavelength (${RESOLVED_POINTS_PER_WAVELENGTH} or more) and ${degrees(overPath)} of phase error over the longest source-receiver distance.`,
  };
}

/** Every octave or one-third-octave band from 20 Hz to 20 kHz, rated. */
export function bandAccuracyTable(bandsPerOctave: 1 | 3, grid: BandAccuracyGrid, longestDistance: number, sampling?: TraceSampling): BandAccuracy[] {
  return bandsBetween(20, 20000, bandsPerOctave).map((band) => bandAccuracy(band, grid, longestDistance, sampling));
}
