// Time-averaged sound intensity I = <p v> per domain cell, for the energy-flow arrows over a level
// map. Velocity comes from the staggered faces (Euler's relation as stepped by the kernel),
// averaged to the cell centre; the half-step between p (at n dt) and v (at (n - 1/2) dt) is a phase
// error of omega dt / 2, negligible for display at ten or more steps per period.

/** Steps between two samples of p v: every fourth step still samples a 10-points-per-wavelength wave four times per period. */
export const INTENSITY_SAMPLE_INTERVAL = 4;

export interface IntensityRegion {
  /** First grid column and row of the domain (the PML thickness on the left and bottom). */
  i0: number;
  j0: number;
  /** Domain cells across and up. */
  width: number;
  height: number;
}

/**
 * Adds p * v_x and p * v_y at the centre of every domain cell to `sumX` and `sumY` (W/m^2, one sample).
 * f: the state; pressure/velocityX/velocityY: offsets of the fields in f; stride: row length.
 * v_x at cell (i, j) = (vx[i, j] + vx[i + 1, j]) / 2 (faces left and right of the cell);
 * v_y at cell (i, j) = (vy[i, j] + vy[i, j + 1]) / 2 (faces below and above).
 */
export function accumulateIntensity(
  f: Float32Array,
  pressure: number,
  velocityX: number,
  velocityY: number,
  stride: number,
  region: IntensityRegion,
  sumX: Float32Array,
  sumY: Float32Array,
): void {
  const { i0, j0, width, height } = region;
  for (let b = 0; b < height; b++) {
    const row = (j0 + b) * stride + i0;
    const p = pressure + row;
    const vx = velocityX + row;
    const vy = velocityY + row;
    const out = b * width;
    for (let a = 0; a < width; a++) {
      const pa = f[p + a]!;
      sumX[out + a]! += pa * 0.5 * (f[vx + a]! + f[vx + a + 1]!);
      sumY[out + a]! += pa * 0.5 * (f[vy + a]! + f[vy + a + stride]!);
    }
  }
}
