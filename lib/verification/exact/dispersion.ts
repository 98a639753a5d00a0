/**
 * Numerical dispersion of the 2D second-order staggered-grid (Yee) scheme for linear acoustics: pressure at
 * cell centres, velocity on faces, leapfrog in time. A discrete plane wave e^{i(kx x + ky y - omega t)}
 * exists when
 *
 *   (1/(c dt))^2 sin^2(omega dt / 2) = (1/dx)^2 sin^2(kx dx / 2) + (1/dy)^2 sin^2(ky dy / 2)
 *
 * (Taflove & Hagness, Computational Electrodynamics: The Finite-Difference Time-Domain Method, 3rd ed.,
 * 2005, ch. 4, the 2D numerical dispersion relation of the TM mode; the acoustic scheme has the same update
 * with p in place of Ez and velocity in place of H). omega is real for every k, i.e. the scheme is stable,
 * when c dt sqrt(1/dx^2 + 1/dy^2) <= 1: the Courant number c dt / dx <= 1/sqrt(2) for square cells.
 * In a rigid room of nx by ny cells the pressure modes cos(m pi (i + 1/2) / nx) cos(n pi (j + 1/2) / ny)
 * are exact discrete eigenvectors, so their frequencies follow the same relation with kx = m pi / Lx,
 * ky = n pi / Ly.
 */

/** Courant number c dt / dx at the stability limit of the 2D scheme on square cells. */
export const COURANT_LIMIT_2D = Math.SQRT1_2;

/** Grid and medium: cell sizes (m), time step (s), sound speed (m/s). */
export interface StaggeredGrid {
  readonly cellSizeX: number;
  readonly cellSizeY: number;
  readonly timeStep: number;
  readonly soundSpeed: number;
}

/** Largest stable time step, 1 / (c sqrt(1/dx^2 + 1/dy^2)), s. */
export function maxStableTimeStep(cellSizeX: number, cellSizeY: number, soundSpeed: number): number {
  return 1 / (soundSpeed * Math.sqrt(1 / (cellSizeX * cellSizeX) + 1 / (cellSizeY * cellSizeY)));
}

/** Right-hand side of the dispersion relation for a wavevector (kx, ky), 1/m^2. */
function spatialSymbol(kx: number, ky: number, grid: StaggeredGrid): number {
  const sx = Math.sin(0.5 * kx * grid.cellSizeX) / grid.cellSizeX;
  const sy = Math.sin(0.5 * ky * grid.cellSizeY) / grid.cellSizeY;
  return sx * sx + sy * sy;
}

/**
 * Angular frequency omega (rad/s) of the discrete plane wave with wavevector (kx, ky) rad/m.
 * NaN when the grid cannot carry it stably (the time step is above the Courant limit for this k).
 */
export function numericalAngularFrequency(kx: number, ky: number, grid: StaggeredGrid): number {
  const argument = grid.soundSpeed * grid.timeStep * Math.sqrt(spatialSymbol(kx, ky, grid));
  if (argument > 1) return NaN;
  return (2 / grid.timeStep) * Math.asin(argument);
}

/**
 * Wavenumber |k| (rad/m) of the discrete plane wave of frequency f travelling at `angle` (rad from the
 * x axis). NaN when no propagating discrete wave exists at that frequency and angle (above the grid's
 * cut-off). Found by bisection on [0, k_edge], where the spatial symbol rises monotonically.
 */
export function numericalWavenumber(frequency: number, angle: number, grid: StaggeredGrid): number {
  if (!(frequency >= 0)) throw new RangeError(`frequency must be >= 0, got ${frequency}`);
  if (frequency === 0) return 0;
  const omega = 2 * Math.PI * frequency;
  const s = Math.sin(0.5 * omega * grid.timeStep) / (grid.soundSpeed * grid.timeStep);
  if (0.5 * omega * grid.timeStep > 0.5 * Math.PI) return NaN; // above the time step's Nyquist frequency
  const target = s * s;
  const cx = Math.abs(Math.cos(angle));
  const cy = Math.abs(Math.sin(angle));
  // Each sin^2 term rises until its argument reaches pi/2.
  const edge = Math.min(cx > 0 ? Math.PI / (cx * grid.cellSizeX) : Infinity, cy > 0 ? Math.PI / (cy * grid.cellSizeY) : Infinity);
  const symbol = (k: number) => spatialSymbol(k * cx, k * cy, grid);
  if (symbol(edge) < target) return NaN;
  let lo = 0;
  let hi = edge;
  for (let iteration = 0; iteration < 200 && hi - lo > 4 * Number.EPSILON * hi; iteration++) {
    const middle = 0.5 * (lo + hi);
    if (symbol(middle) < target) lo = middle;
    else hi = middle;
  }
  return 0.5 * (lo + hi);
}

/** Numerical phase velocity omega / |k| (m/s) at frequency f (Hz) and direction `angle` (rad from x). */
export function numericalPhaseVelocity(frequency: number, angle: number, grid: StaggeredGrid): number {
  return (2 * Math.PI * frequency) / numericalWavenumber(frequency, angle, grid);
}

/**
 * Frequency (Hz) of the rigid-room mode (m, n) on a grid of cellsX by cellsY cells: the scheme's
 * counterpart of roomModeFrequency in ./room-modes.ts (always slightly lower on a stable grid).
 */
export function numericalRoomModeFrequency(orderX: number, orderY: number, cellsX: number, cellsY: number, grid: StaggeredGrid): number {
  const kx = (orderX * Math.PI) / (cellsX * grid.cellSizeX);
  const ky = (orderY * Math.PI) / (cellsY * grid.cellSizeY);
  return numericalAngularFrequency(kx, ky, grid) / (2 * Math.PI);
}
