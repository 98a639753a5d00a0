// Builds a simulation's state inside its buffer: PML damping tables, per-cell coefficients of medium
// regions, the boundary-face and held-cell lists, and the kernel's parameter block.
import type { GridPlan } from "./grid";
import { writeKernelParams, type KernelScalars } from "./kernel-params";
import { planLayout, type StateLayout } from "./layout";
import type { BoundaryFace, RasterisedScene } from "./rasterise";

/** Polynomial order of the PML damping profile sigma(d) = sigma_max (d / L)^m (common practice: 2 to 4). */
export const PML_PROFILE_ORDER = 3;
/** Design reflection of the PML at normal incidence in the continuum, exp(-2 int sigma dx / c). */
export const PML_DESIGN_REFLECTION = 1e-5;

/** Flush offset relative to the largest pressure a source adds in one step (see initialiseState). */
export const FLUSH_FRACTION = 1e-16;

/** 20 log10(e): decibels per neper. */
const DB_PER_NEPER = 20 / Math.LN10;

/** Ad hoc attenuation rate sigma0 (1/s) that gives `dBPerMetre` at every frequency with equal damping of p and v. */
export function attenuationRate(dBPerMetre: number, soundSpeed: number): number {
  // (d/dt + sigma)^2 p = c^2 lap p has plane waves exp(i(kx - wt)) with k = (w + i sigma) / c: alpha = sigma / c Np/m.
  return (dBPerMetre / DB_PER_NEPER) * soundSpeed;
}

/** Per-step decay and gain of a field damped at rate sigma: x+ = a x - g' D, a = (1 - s dt/2)/(1 + s dt/2), g' = g / (1 + s dt/2). */
export function dampedCoefficients(sigma: number, timeStep: number, gain: number): { decay: number; gain: number } {
  const half = 0.5 * sigma * timeStep;
  return { decay: Math.fround((1 - half) / (1 + half)), gain: Math.fround(gain / (1 + half)) };
}

export interface StateSetup {
  layout: StateLayout;
  scalars: KernelScalars;
  /** Impedance faces, for reporting. */
  impedanceFaceCount: number;
  rigidFaceCount: number;
}

/** The sweep row that updates a face: x-faces of row j and y-faces of row j belong to row j; the top edge's y-faces to row ny - 1. */
function sweepRowOf(face: BoundaryFace, ny: number): number {
  return face.axis === "y" && face.j === ny ? ny - 1 : face.j;
}

export function planState(grid: GridPlan, raster: RasterisedScene, levelMaps: boolean): StateLayout {
  const zeroCells = heldCells(grid, raster);
  return planLayout({
    nx: grid.nx,
    ny: grid.ny,
    hasPml: grid.pmlCells.left + grid.pmlCells.right + grid.pmlCells.bottom + grid.pmlCells.top > 0,
    pmlCells: grid.pmlCells,
    heterogeneous: raster.mediumIndex !== undefined,
    levelMaps,
    specialFaceCount: raster.boundaryFaces.length,
    zeroCellCount: zeroCells.length,
  });
}

/** Solid cells behind an impedance face (held at zero pressure), as cell indices j * nx + i, sorted. */
function heldCells(grid: GridPlan, raster: RasterisedScene): number[] {
  const held = new Set<number>();
  for (const face of raster.boundaryFaces) {
    if (face.impedance === Infinity || face.thinWall) continue;
    // The solid cell is the face's other neighbour; outer-edge faces have none inside the grid.
    let i = face.fluidI;
    let j = face.fluidJ;
    if (face.axis === "x") i += face.fluidOnLowSide ? 1 : -1;
    else j += face.fluidOnLowSide ? 1 : -1;
    if (i < 0 || j < 0 || i >= grid.nx || j >= grid.ny) continue;
    held.add(j * grid.nx + i);
  }
  return [...held].sort((a, b) => a - b);
}

/**
 * Fills the state of a zeroed buffer laid out by `planState`: tables, lists and parameter block.
 * `sourceScale` is the largest pressure a source adds in one step (Pa), which sets the subnormal flush level.
 */
export function initialiseState(buffer: ArrayBufferLike, layout: StateLayout, grid: GridPlan, raster: RasterisedScene, attenuationDbPerMetre: number, sourceScale: number): StateSetup {
  const { nx, ny, stride } = layout;
  const h = grid.cellSize;
  const dt = grid.timeStep;
  const f = new Float32Array(buffer);
  const n = new Int32Array(buffer);
  const background = raster.media[0]!;
  const rho = background.density;
  const c = background.soundSpeed;
  const velocityGainRaw = dt / (rho * h);
  const pressureGainRaw = (rho * c * c * dt) / h;
  const sigma0 = attenuationRate(attenuationDbPerMetre, c);
  const uniformVelocity = dampedCoefficients(sigma0, dt, velocityGainRaw);
  const uniformPressure = dampedCoefficients(sigma0, dt, pressureGainRaw);

  // Flush offset F = 1e-16 of the largest per-step source increment: every FLUSH_INTERVAL steps values
  // become multiples of about F 2^-23 (some 470 dB below that increment, far below any physical signal),
  // and a value at that quantum needs a decay by 1e-15 or more to reach the float32 subnormals (1.2e-38),
  // which it cannot undergo in a few steps.
  const scale = sourceScale > 0 && Number.isFinite(sourceScale) ? sourceScale : 1;
  const scalars: KernelScalars = {
    decay: uniformPressure.decay,
    velocityGain: uniformVelocity.gain,
    pressureGain: uniformPressure.gain,
    flushPressure: Math.fround(FLUSH_FRACTION * scale),
    flushVelocity: Math.fround((FLUSH_FRACTION * scale) / (rho * c)),
  };

  if (layout.hasPml) {
    const { left, right, bottom, top } = grid.pmlCells;
    const sigmaMax = (thickness: number) => ((PML_PROFILE_ORDER + 1) * c * Math.log(1 / PML_DESIGN_REFLECTION)) / (2 * thickness * h);
    // Depth (in cells) of a position into the PML along one axis; positions in cell units from the grid edge.
    const sigmaAt = (position: number, low: number, high: number, count: number): number => {
      let depth = 0;
      let thickness = 0;
      if (low > 0 && position < low) {
        depth = low - position;
        thickness = low;
      } else if (high > 0 && position > count - high) {
        depth = position - (count - high);
        thickness = high;
      }
      return thickness > 0 ? sigmaMax(thickness) * Math.pow(depth / thickness, PML_PROFILE_ORDER) : 0;
    };
    const cols = layout.pmlColumns;
    for (let i = 0; i < stride; i++) {
      const cell = dampedCoefficients(sigmaAt(i + 0.5, left, right, nx) + sigma0, dt, pressureGainRaw);
      const face = dampedCoefficients(sigmaAt(i, left, right, nx) + sigma0, dt, velocityGainRaw);
      f[cols + i] = cell.decay;
      f[cols + stride + i] = cell.gain;
      f[cols + 2 * stride + i] = face.decay;
      f[cols + 3 * stride + i] = face.gain;
    }
    const rows = layout.pmlRows;
    for (let j = 0; j <= ny; j++) {
      const cell = dampedCoefficients(sigmaAt(j + 0.5, bottom, top, ny) + sigma0, dt, pressureGainRaw);
      const face = dampedCoefficients(sigmaAt(j, bottom, top, ny) + sigma0, dt, velocityGainRaw);
      f[rows + j] = cell.decay;
      f[rows + (ny + 1) + j] = cell.gain;
      f[rows + 2 * (ny + 1) + j] = face.decay;
      f[rows + 3 * (ny + 1) + j] = face.gain;
    }
  }

  const mediumIndex = raster.mediumIndex;
  if (layout.heterogeneous && mediumIndex) {
    const density = (i: number, j: number) => raster.media[mediumIndex[j * nx + i]!]!.density;
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const m = raster.media[mediumIndex[j * nx + i]!]!;
        f[layout.cellGain + j * stride + i] = dampedCoefficients(sigma0, dt, (m.density * m.soundSpeed * m.soundSpeed * dt) / h).gain;
      }
      // An x-face takes the mean density of its two cells (the outer faces, that of the one inside).
      for (let i = 0; i <= nx; i++) {
        const rhoFace = 0.5 * (density(Math.max(0, i - 1), j) + density(Math.min(nx - 1, i), j));
        f[layout.faceGainX + j * stride + i] = dampedCoefficients(sigma0, dt, dt / (rhoFace * h)).gain;
      }
    }
    for (let j = 0; j <= ny; j++) {
      for (let i = 0; i < nx; i++) {
        const rhoFace = 0.5 * (density(i, Math.max(0, j - 1)) + density(i, Math.min(ny - 1, j)));
        f[layout.faceGainY + j * stride + i] = dampedCoefficients(sigma0, dt, dt / (rhoFace * h)).gain;
      }
    }
  }

  // Boundary faces, grouped by sweep row (counting sort keeps the rasteriser's order within a row).
  const faces = raster.boundaryFaces;
  const counts = new Int32Array(ny + 1);
  for (const face of faces) counts[sweepRowOf(face, ny) + 1]!++;
  for (let j = 0; j < ny; j++) counts[j + 1]! += counts[j]!;
  for (let j = 0; j <= ny; j++) n[layout.specialRowStart + j] = counts[j]!;
  const cursor = counts.slice();
  let impedanceFaceCount = 0;
  for (const face of faces) {
    const s = cursor[sweepRowOf(face, ny)]!++;
    const field = face.axis === "x" ? layout.velocityX : layout.velocityY;
    n[layout.specialTarget + s] = field + face.j * stride + face.i;
    n[layout.specialFluidCell + s] = layout.pressure + face.fluidJ * stride + face.fluidI;
    if (face.impedance === Infinity || face.thinWall) {
      f[layout.specialDecay + s] = 0;
      f[layout.specialGain + s] = 0;
    } else {
      // Half-cell momentum balance between the fluid cell centre and the wall, with p_wall = Z v_n
      // averaged over the step: rho (v+ - v-)/dt = -(Z (v+ + v-)/2 - p_fluid) / (h/2).
      impedanceFaceCount++;
      const m = raster.media[mediumIndex ? mediumIndex[face.fluidJ * nx + face.fluidI]! : 0]!;
      const zl = (face.impedance * m.soundSpeed * dt) / h;
      f[layout.specialDecay + s] = Math.fround((1 - zl) / (1 + zl));
      f[layout.specialGain + s] = Math.fround(((face.fluidOnLowSide ? 2 : -2) * dt) / (m.density * h) / (1 + zl));
    }
    f[layout.specialState + s] = 0;
  }

  const held = heldCells(grid, raster);
  const heldCounts = new Int32Array(ny + 1);
  for (const cell of held) heldCounts[Math.floor(cell / nx) + 1]!++;
  for (let j = 0; j < ny; j++) heldCounts[j + 1]! += heldCounts[j]!;
  for (let j = 0; j <= ny; j++) n[layout.zeroRowStart + j] = heldCounts[j]!;
  held.forEach((cell, s) => {
    n[layout.zeroCell + s] = Math.floor(cell / nx) * stride + (cell % nx);
  });

  writeKernelParams(buffer, layout, grid.pmlCells, scalars);
  return { layout, scalars, impedanceFaceCount, rigidFaceCount: faces.length - impedanceFaceCount };
}
