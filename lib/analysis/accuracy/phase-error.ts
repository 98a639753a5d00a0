// Phase error of the staggered-grid scheme from its own numerical dispersion relation (Taflove & Hagness,
// Computational Electrodynamics, 3rd ed., 2005, ch. 4; written out in lib/verification/exact/dispersion.ts):
//
//   (1/(c dt))^2 sin^2(omega dt/2) = (1/h)^2 [sin^2(kx h/2) + sin^2(ky h/2)]
//
// For square cells and a Courant number S = c dt/h <= 1/sqrt(2) the numerical wave is slowest along a grid
// axis (tested in tests/analysis/accuracy-dispersion.test.ts), so the axis is the worst direction: there
// sin(k h/2) = sin(omega dt/2) / S, and a wave of frequency f gains (k - omega/c) radians per metre.
import { numericalWavenumber, type StaggeredGrid } from "@/lib/verification/exact/dispersion";

/** What the phase error depends on: the cell size (m), the time step (s) and the sound speed (m/s). */
export interface DispersionGrid {
  cellSize: number;
  timeStep: number;
  soundSpeed: number;
}

function staggered(grid: DispersionGrid): StaggeredGrid {
  return { cellSizeX: grid.cellSize, cellSizeY: grid.cellSize, timeStep: grid.timeStep, soundSpeed: grid.soundSpeed };
}

/** Cells per wavelength c / (f h) at frequency f (Hz). */
export function pointsPerWavelength(frequency: number, grid: Pick<DispersionGrid, "cellSize" | "soundSpeed">): number {
  return grid.soundSpeed / (frequency * grid.cellSize);
}

/**
 * Phase error in degrees per wavelength travelled along a grid axis, 360 (k_numerical / k - 1): positive, the
 * numerical wave lags. Infinity when the grid carries no wave of that frequency along the axis (cut-off).
 */
export function axisPhaseErrorPerWavelength(frequency: number, grid: DispersionGrid): number {
  if (!(frequency > 0)) return 0;
  const numerical = numericalWavenumber(frequency, 0, staggered(grid));
  if (!Number.isFinite(numerical)) return Infinity;
  const exact = (2 * Math.PI * frequency) / grid.soundSpeed;
  return 360 * (numerical / exact - 1);
}

/** Phase error in degrees after `distance` metres along a grid axis: (k_numerical - k) distance. */
export function axisPhaseErrorOver(distance: number, frequency: number, grid: DispersionGrid): number {
  if (distance <= 0) return 0;
  const perWavelength = axisPhaseErrorPerWavelength(frequency, grid);
  return perWavelength * ((distance * frequency) / grid.soundSpeed);
}
