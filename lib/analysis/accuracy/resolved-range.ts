// The one decision of which bands a run resolves, shared by the accuracy panel and every band table, chart,
// spectrum and export: a band is left out when its upper edge has fewer than RESOLVED_POINTS_PER_WAVELENGTH
// cells per wavelength in the slowest medium (or lies above the Nyquist frequency, or is narrower than the
// trace's frequency resolution: band-levels.ts says so for the traces it is given).
import { exclusionOf, type ExcludedBand } from "../band-levels";
import type { FrequencyBand } from "../bands";
import { RESOLVED_POINTS_PER_WAVELENGTH } from "./thresholds";

/** What the limit depends on: the cell size (m) and the slowest sound speed of the scene (m/s). */
export interface ResolutionGrid {
  cellSize: number;
  minSoundSpeed: number;
}

/**
 * Highest frequency (Hz) a band's upper edge may reach and still count as resolved: c_min / (10 h). Pass it as
 * `highestResolvedFrequency` to band-level tables and spectra so that they hide exactly what the accuracy
 * panel rates "not resolved".
 */
export function resolvedFrequencyLimit(grid: ResolutionGrid): number {
  return grid.minSoundSpeed / (RESOLVED_POINTS_PER_WAVELENGTH * grid.cellSize);
}

/** Sampling of the run's traces: the time step (s) and, once a run exists, its length in samples. */
export interface TraceSampling {
  timeStep: number;
  sampleCount?: number;
}

/** Why a band is not resolved, in the words band tables show; undefined for a resolved band. */
export function unresolvedBand(band: FrequencyBand, grid: ResolutionGrid, sampling: TraceSampling): ExcludedBand | undefined {
  const nyquist = 1 / (2 * sampling.timeStep);
  const frequencyResolution = sampling.sampleCount ? 1 / (sampling.sampleCount * sampling.timeStep) : 0;
  const exclusion = exclusionOf(band, resolvedFrequencyLimit(grid), nyquist, frequencyResolution);
  if (!exclusion || exclusion.reason !== "above-resolved-frequency") return exclusion;
  const cells = grid.minSoundSpeed / (band.upper * grid.cellSize);
  return { ...exclusion, message: `${exclusion.message}: ${cells.toFixed(1)} cells per wavelength at the upper edge, fewer than the ${RESOLVED_POINTS_PER_WAVELENGTH} needed for levels` };
}
