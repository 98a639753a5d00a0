// Numerical dispersion of the 2D staggered scheme, checked against a small independent leapfrog run of the
// scheme itself, Taylor expansion, and the known exact cases.
import { describe, expect, it } from "vitest";

import {
  COURANT_LIMIT_2D,
  maxStableTimeStep,
  numericalAngularFrequency,
  numericalPhaseVelocity,
  numericalRoomModeFrequency,
  numericalWavenumber,
  type StaggeredGrid,
} from "@/lib/verification/exact/dispersion";
import { roomModeFrequency } from "@/lib/verification/exact/room-modes";

const SOUND_SPEED = 343;

/**
 * Independent leapfrog run of the staggered scheme (pressure at cell centres, velocity on faces; x fastest in
 * every array), written here from the update equations alone:
 *   vx[i,j] -= dt/(rho dx) (p[i,j] - p[i-1,j]),  vy[i,j] -= dt/(rho dy) (p[i,j] - p[i,j-1]),
 *   p[i,j]  -= rho c^2 dt ((vx[i+1,j] - vx[i,j])/dx + (vy[i,j+1] - vy[i,j])/dy).
 * `periodic` wraps the faces; otherwise the boundary faces are rigid (zero velocity). Starting from a pressure
 * eigenvector with zero velocity, p^{n+1} + p^{n-1} = 2 cos(omega dt) p^n in every cell, which gives omega.
 */
function measuredAngularFrequency(nx: number, ny: number, grid: StaggeredGrid, initial: (i: number, j: number) => number, periodic: boolean): number {
  const rho = 1.2;
  const { cellSizeX: dx, cellSizeY: dy, timeStep: dt, soundSpeed: c } = grid;
  const p = new Float64Array(nx * ny);
  const vx = new Float64Array((nx + 1) * ny); // face i sits between cells i-1 and i
  const vy = new Float64Array(nx * (ny + 1)); // face j sits between cells j-1 and j
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) p[i + nx * j] = initial(i, j);
  const pressureAt = (i: number, j: number) => p[((i + nx) % nx) + nx * ((j + ny) % ny)] ?? 0;
  const step = () => {
    for (let j = 0; j < ny; j++) {
      for (let i = periodic ? 0 : 1; i < nx; i++) {
        vx[i + (nx + 1) * j] = (vx[i + (nx + 1) * j] ?? 0) - (dt / (rho * dx)) * (pressureAt(i, j) - pressureAt(i - 1, j));
      }
      if (periodic) vx[nx + (nx + 1) * j] = vx[(nx + 1) * j] ?? 0;
    }
    for (let i = 0; i < nx; i++) {
      for (let j = periodic ? 0 : 1; j < ny; j++) {
        vy[i + nx * j] = (vy[i + nx * j] ?? 0) - (dt / (rho * dy)) * (pressureAt(i, j) - pressureAt(i, j - 1));
      }
      if (periodic) vy[i + nx * ny] = vy[i] ?? 0;
    }
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const divergence = ((vx[i + 1 + (nx + 1) * j] ?? 0) - (vx[i + (nx + 1) * j] ?? 0)) / dx + ((vy[i + nx * (j + 1)] ?? 0) - (vy[i + nx * j] ?? 0)) / dy;
        p[i + nx * j] = (p[i + nx * j] ?? 0) - rho * c * c * dt * divergence;
      }
    }
  };
  const history: Float64Array[] = [];
  for (let n = 0; n < 7; n++) {
    step();
    history.push(Float64Array.from(p));
  }
  // Use the cell where the middle snapshot is largest.
  const middle = history[3] ?? p;
  let cell = 0;
  for (let k = 1; k < middle.length; k++) if (Math.abs(middle[k] ?? 0) > Math.abs(middle[cell] ?? 0)) cell = k;
  const cosine = ((history[2]?.[cell] ?? 0) + (history[4]?.[cell] ?? 0)) / (2 * (middle[cell] ?? 1));
  return Math.acos(cosine) / dt;
}

function squareGrid(cellSize: number, courant: number): StaggeredGrid {
  return { cellSizeX: cellSize, cellSizeY: cellSize, timeStep: (courant * cellSize) / SOUND_SPEED, soundSpeed: SOUND_SPEED };
}

describe("numerical dispersion of the 2D staggered scheme", () => {
  it("predicts the frequency of rigid-room modes run by an independent leapfrog to 1e-9", () => {
    // Modes (m, n) of a 12 x 8 cell room with square and oblong cells, Courant 0.5 and 0.7.
    const cases: Array<[number, number, StaggeredGrid]> = [
      [1, 0, squareGrid(0.1, 0.5)],
      [2, 3, squareGrid(0.1, 0.7)],
      [5, 1, { cellSizeX: 0.1, cellSizeY: 0.17, timeStep: 1e-4, soundSpeed: SOUND_SPEED }],
    ];
    const nx = 12;
    const ny = 8;
    for (const [m, n, grid] of cases) {
      const shape = (i: number, j: number) => Math.cos((m * Math.PI * (i + 0.5)) / nx) * Math.cos((n * Math.PI * (j + 0.5)) / ny);
      const measured = measuredAngularFrequency(nx, ny, grid, shape, false) / (2 * Math.PI);
      expect(Math.abs(numericalRoomModeFrequency(m, n, nx, ny, grid) / measured - 1)).toBeLessThan(1e-9);
    }
  });

  it("predicts the frequency of an oblique plane wave on a periodic grid and inverts it back to k", () => {
    // Periodic 16 x 16 grid, wave with 3 and 2 periods across: kx = 2 pi 3 / (16 dx), ky = 2 pi 2 / (16 dy).
    const grid = squareGrid(0.05, 0.6);
    const kx = (2 * Math.PI * 3) / (16 * 0.05);
    const ky = (2 * Math.PI * 2) / (16 * 0.05);
    const wave = (i: number, j: number) => Math.cos(kx * (i + 0.5) * 0.05 + ky * (j + 0.5) * 0.05);
    const measured = measuredAngularFrequency(16, 16, grid, wave, true);
    const predicted = numericalAngularFrequency(kx, ky, grid);
    expect(Math.abs(predicted / measured - 1)).toBeLessThan(1e-9);
    expect(numericalWavenumber(predicted / (2 * Math.PI), Math.atan2(ky, kx), grid)).toBeCloseTo(Math.hypot(kx, ky), 9);
  });

  it("tends to the sound speed as the cells shrink, with the second-order error of its Taylor expansion", () => {
    // Along an axis: v/c = 1 - (k dx)^2 (1 - S^2) / 24 + O((k dx)^4), S = c dt / dx (expanding both sines of
    // the dispersion relation); halving dx divides the error by 4 (to within the O((k dx)^4) term, 3% at 20).
    const frequency = 500;
    const wavelength = SOUND_SPEED / frequency;
    const courant = 0.5;
    const errors = [20, 40, 80, 160].map((cellsPerWavelength) => {
      const grid = squareGrid(wavelength / cellsPerWavelength, courant);
      const error = 1 - numericalPhaseVelocity(frequency, 0, grid) / SOUND_SPEED;
      const kdx = (2 * Math.PI) / cellsPerWavelength;
      expect(error / ((kdx * kdx * (1 - courant * courant)) / 24)).toBeCloseTo(1, 1);
      return error;
    });
    for (let i = 0; i + 1 < errors.length; i++) expect(Math.abs((errors[i] ?? 0) / (errors[i + 1] ?? 1) - 4)).toBeLessThan(0.15);
  });

  it("has no dispersion along the diagonal at the Courant limit 1/sqrt(2) (the 2D magic time step)", () => {
    // With kx = ky = k/sqrt(2) and c dt = dx/sqrt(2) the relation reduces to sin(omega dt/2) = sin(k dx/(2 sqrt 2)),
    // i.e. omega = c k exactly (cf. the 1D magic time step, Taflove & Hagness ch. 4).
    for (const cellsPerWavelength of [4, 10, 40]) {
      const frequency = 1000;
      const grid = squareGrid(SOUND_SPEED / frequency / cellsPerWavelength, COURANT_LIMIT_2D);
      expect(numericalPhaseVelocity(frequency, Math.PI / 4, grid) / SOUND_SPEED).toBeCloseTo(1, 12);
    }
  });

  it("is slower than sound in every other direction and at every stable Courant number", () => {
    // Taflove & Hagness ch. 4: the Yee scheme's numerical phase velocity is below c except in the magic case.
    for (const courant of [0.1, 0.4, 0.7]) {
      // From 4 cells per wavelength: at small Courant numbers the axis cut-off lies at pi cells per wavelength.
      for (const cellsPerWavelength of [4, 6, 15, 50]) {
        const frequency = 250;
        const grid = squareGrid(SOUND_SPEED / frequency / cellsPerWavelength, courant);
        for (let angle = 0; angle <= Math.PI / 2 + 1e-12; angle += Math.PI / 24) {
          expect(numericalPhaseVelocity(frequency, angle, grid)).toBeLessThan(SOUND_SPEED);
        }
      }
    }
  });

  it("is stable up to c dt / dx = 1/sqrt(2) and no further", () => {
    // Stability: omega real for all k iff c dt sqrt(1/dx^2 + 1/dy^2) <= 1 (Taflove & Hagness ch. 4, 2D Yee).
    // The worst wave is the grid checkerboard kx = pi/dx, ky = pi/dy.
    const dx = 0.1;
    expect(maxStableTimeStep(dx, dx, SOUND_SPEED)).toBeCloseTo((COURANT_LIMIT_2D * dx) / SOUND_SPEED, 15);
    const checkerboard = (courant: number) => numericalAngularFrequency(Math.PI / dx, Math.PI / dx, squareGrid(dx, courant));
    expect(Number.isFinite(checkerboard(COURANT_LIMIT_2D * (1 - 1e-12)))).toBe(true);
    expect(checkerboard(COURANT_LIMIT_2D * 1.001)).toBeNaN();
    const oblong = maxStableTimeStep(0.1, 0.3, SOUND_SPEED);
    expect(SOUND_SPEED * oblong * Math.sqrt(1 / 0.01 + 1 / 0.09)).toBeCloseTo(1, 14);
  });

  it("puts grid room modes below Rayleigh's frequencies and converges to them as the cells shrink", () => {
    // Room 3.43 m x 2.1 m, modes (1,0), (2,3), (4,4); Courant 0.5. Rayleigh, Theory of Sound, vol. 2, section 267.
    const lengthX = 3.43;
    const lengthY = 2.1;
    for (const [m, n] of [[1, 0], [2, 3], [4, 4]] as const) {
      const continuum = roomModeFrequency(m, n, lengthX, lengthY, SOUND_SPEED);
      const deviations = [1, 2, 4].map((refinement) => {
        const cellsX = 49 * refinement;
        const cellsY = 30 * refinement;
        const grid: StaggeredGrid = { cellSizeX: lengthX / cellsX, cellSizeY: lengthY / cellsY, timeStep: (0.5 * (lengthX / cellsX)) / SOUND_SPEED, soundSpeed: SOUND_SPEED };
        return 1 - numericalRoomModeFrequency(m, n, cellsX, cellsY, grid) / continuum;
      });
      for (const deviation of deviations) expect(deviation).toBeGreaterThan(0);
      expect((deviations[0] ?? 0) / (deviations[1] ?? 1)).toBeCloseTo(4, 0);
      expect((deviations[1] ?? 0) / (deviations[2] ?? 1)).toBeCloseTo(4, 0);
    }
  });

  it("has no propagating wave above the grid cut-off", () => {
    // Along x the spatial symbol peaks at k = pi/dx (two cells per wavelength); beyond, no real k exists.
    const grid = squareGrid(0.1, 0.5);
    const cutOff = (2 / grid.timeStep) * Math.asin(grid.soundSpeed * grid.timeStep * (1 / grid.cellSizeX)) / (2 * Math.PI);
    expect(Number.isFinite(numericalWavenumber(0.999 * cutOff, 0, grid))).toBe(true);
    expect(numericalWavenumber(1.001 * cutOff, 0, grid)).toBeNaN();
  });
});
