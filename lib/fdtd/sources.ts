// Point sources (line sources in 3D terms) placed on the grid, and the pressure each adds per step.
//
// Physical normalisation: a source is a volume injection Q(t) per unit length (m^2/s) in the continuity
// equation, dp/dt = -rho c^2 div v + rho c^2 Q(t) delta(x - xs). Integrated over one step and spread over
// one cell of area h^2, it adds rho c^2 dt Q((n + 1/2) dt) / h^2 pascals to its cell after the pressure
// update of step n -> n+1. Q = amplitude * signal(t). The resulting field solves
// (1/c^2) p_tt - lap p = rho dQ/dt delta(x - xs), so p = rho dQ/dt convolved with the 2D Green's function
// g(r, t) = H(ct - r) / (2 pi sqrt(t^2 - r^2/c^2)), in pascals.
import type { GridPlan } from "./grid";
import type { RasterisedScene } from "./rasterise";
import type { Scene } from "./scene";
import { prepareSignal, type SignalEvaluator } from "./signals";

export interface PlacedSource {
  id: string;
  label: string;
  /** Cell the source injects into. */
  i: number;
  j: number;
  /** Scene position of that cell's centre (where the source really acts), m. */
  x: number;
  y: number;
  /** Pascals added per unit of Q (m^2/s): rho c^2 dt / h^2 of the source's cell. */
  pressurePerUnitRate: number;
  amplitude: number;
  signal: SignalEvaluator;
}

/** Nearest cell to a scene position, clamped to the grid. */
export function nearestCell(grid: GridPlan, x: number, y: number): { i: number; j: number } {
  const i = Math.min(grid.nx - 1, Math.max(0, Math.floor((x - grid.originX) / grid.cellSize)));
  const j = Math.min(grid.ny - 1, Math.max(0, Math.floor((y - grid.originY) / grid.cellSize)));
  return { i, j };
}

export function placeSources(scene: Scene, grid: GridPlan, raster: RasterisedScene): PlacedSource[] {
  return scene.sources.map((source) => {
    const { i, j } = nearestCell(grid, source.position.x, source.position.y);
    const medium = raster.media[raster.mediumIndex ? raster.mediumIndex[j * grid.nx + i]! : 0]!;
    const bulkModulus = medium.density * medium.soundSpeed * medium.soundSpeed;
    return {
      id: source.id,
      label: source.label,
      i,
      j,
      x: grid.originX + (i + 0.5) * grid.cellSize,
      y: grid.originY + (j + 0.5) * grid.cellSize,
      pressurePerUnitRate: (bulkModulus * grid.timeStep) / (grid.cellSize * grid.cellSize),
      amplitude: source.amplitude,
      signal: prepareSignal(source.signal, grid.timeStep),
    };
  });
}

/** Pressure (Pa) a source adds to its cell at the end of step n -> n+1, from Q at (n + 1/2) dt. */
export function sourceIncrement(source: PlacedSource, step: number, timeStep: number): number {
  return source.pressurePerUnitRate * source.amplitude * source.signal.valueAt((step + 0.5) * timeStep);
}
