// The grid a scene implies: cell size, time step, extent, step count, memory, and warnings a user should
// see before running. A pure function, shared by the solver and the app's "derived numbers" panel.
import { distanceToPolyline, pointInPolygon } from "./geometry";
import { planLayout } from "./layout";
import { mediumProperties } from "./medium";
import { DEFAULT_POINTS_PER_WAVELENGTH, type EdgeSide, type Point, type Scene } from "./scene";
import { prepareSignal } from "./signals";

export interface GridWarning {
  /** Stable machine-readable kind, e.g. `source-above-band`. */
  code: string;
  message: string;
  /** JSON path of the scene field concerned, when there is one. */
  path?: string;
}

export interface GridPlan {
  /** Cell size h, m (square cells). */
  cellSize: number;
  /** Time step dt, s. */
  timeStep: number;
  /** c_max dt / h. */
  courantNumber: number;
  /** Background medium, m/s and kg/m^3. */
  soundSpeed: number;
  density: number;
  /** Extremes over the background and every medium region, m/s. */
  minSoundSpeed: number;
  maxSoundSpeed: number;
  /** Cells per wavelength that define "well resolved" (the scene's, or 10 for an explicit cell size). */
  pointsPerWavelength: number;
  /** Highest frequency with at least `pointsPerWavelength` cells per wavelength in the slowest medium, Hz. */
  maxResolvedFrequency: number;
  /** Cells covering the domain (the domain is extended to a whole number of cells to the right and top). */
  domainCells: { nx: number; ny: number };
  /** PML thickness per side in cells (0 where the side is rigid or an impedance). */
  pmlCells: Record<EdgeSide, number>;
  /** Whole grid, PML included. */
  nx: number;
  ny: number;
  cellCount: number;
  /** Scene coordinates of the grid's lower-left corner, m (negative where a PML lies outside the domain). */
  originX: number;
  originY: number;
  /** Time steps to run (the upper limit when the duration is "until decayed"). */
  steps: number;
  /** steps * dt, s. */
  simulatedSeconds: number;
  stopRule: "time" | "decay";
  /** Estimated bytes of the simulation state. */
  memoryBytes: number;
  /** Cell updates of the whole run: cellCount * steps. */
  cellUpdates: number;
  warnings: GridWarning[];
}

/** Fewer cells per wavelength in a PML than this reflect noticeably (common practice). */
const THIN_PML_CELLS = 10;

function cellSizeOf(scene: Scene, minSoundSpeed: number): { cellSize: number; pointsPerWavelength: number } {
  const r = scene.resolution;
  if (r.kind === "frequency") return { cellSize: minSoundSpeed / (r.maxFrequency * r.pointsPerWavelength), pointsPerWavelength: r.pointsPerWavelength };
  return { cellSize: r.cellSize, pointsPerWavelength: DEFAULT_POINTS_PER_WAVELENGTH };
}

/** Where a point lies inside a solid or a wall, the entity's label; otherwise undefined. */
function blockingEntityAt(scene: Scene, p: Point, cellSize: number): string | undefined {
  for (const solid of scene.geometry.solids) if (pointInPolygon(p.x, p.y, solid.polygon)) return `solid "${solid.label || solid.id}"`;
  for (const wall of scene.geometry.walls) {
    const halfThickness = Math.max(wall.thickness, wall.surface.kind === "rigid" ? 0 : cellSize) / 2;
    if (distanceToPolyline(p.x, p.y, wall.path) <= Math.max(halfThickness, 0.5 * cellSize)) return `wall "${wall.label || wall.id}"`;
  }
  return undefined;
}

/** Derives the grid of a valid scene. Never throws for a scene that `parseScene` accepted. */
export function deriveGrid(scene: Scene): GridPlan {
  const warnings: GridWarning[] = [];
  const background = mediumProperties(scene.medium);
  const regionMedia = scene.mediumRegions.map((r) => mediumProperties(r.medium));
  const speeds = [background.soundSpeed, ...regionMedia.map((m) => m.soundSpeed)];
  const minSoundSpeed = Math.min(...speeds);
  const maxSoundSpeed = Math.max(...speeds);
  const { cellSize, pointsPerWavelength } = cellSizeOf(scene, minSoundSpeed);
  const courantNumber = scene.resolution.courantNumber;
  // The fastest medium sets the stable time step.
  const timeStep = (courantNumber * cellSize) / maxSoundSpeed;
  const maxResolvedFrequency = minSoundSpeed / (pointsPerWavelength * cellSize);

  const domainCells = {
    nx: Math.max(1, Math.ceil(scene.domain.width / cellSize - 1e-9)),
    ny: Math.max(1, Math.ceil(scene.domain.height / cellSize - 1e-9)),
  };
  const pmlCells: Record<EdgeSide, number> = { left: 0, right: 0, bottom: 0, top: 0 };
  for (const side of ["left", "right", "bottom", "top"] as const) {
    const edge = scene.boundary[side];
    if (edge.kind === "pml") {
      pmlCells[side] = edge.layerCells;
      if (edge.layerCells < THIN_PML_CELLS) {
        warnings.push({ code: "pml-thin", path: `boundary.${side}.layerCells`, message: `a PML of ${edge.layerCells} cells on the ${side} reflects noticeably; ${THIN_PML_CELLS} or more is common practice` });
      }
    }
  }
  const nx = domainCells.nx + pmlCells.left + pmlCells.right;
  const ny = domainCells.ny + pmlCells.bottom + pmlCells.top;
  const cellCount = nx * ny;

  for (const [axis, count] of [["width", domainCells.nx], ["height", domainCells.ny]] as const) {
    if (count < 10) warnings.push({ code: "few-cells", path: `domain.${axis}`, message: `the domain ${axis} spans only ${count} cells` });
  }

  const stopRule = scene.duration.kind;
  const seconds = scene.duration.kind === "time" ? scene.duration.seconds : scene.duration.maxSeconds;
  const steps = Math.max(1, Math.ceil(seconds / timeStep - 1e-9));
  if (steps > 2_000_000) warnings.push({ code: "many-steps", path: "duration", message: `${steps} time steps is a very long run` });

  scene.sources.forEach((source, index) => {
    const signal = prepareSignal(source.signal, timeStep);
    if (signal.upperFrequency > maxResolvedFrequency) {
      const upper = Number.isFinite(signal.upperFrequency) ? `${signal.upperFrequency.toFixed(0)} Hz` : "every frequency (abrupt start)";
      warnings.push({
        code: "source-above-band",
        path: `sources[${index}].signal`,
        message: `source "${source.label || source.id}" has energy up to ${upper}, above the well-resolved ${maxResolvedFrequency.toFixed(0)} Hz (${pointsPerWavelength} cells per wavelength): those components travel with dispersion error`,
      });
    }
    const blocker = blockingEntityAt(scene, source.position, cellSize);
    if (blocker) warnings.push({ code: "source-in-solid", path: `sources[${index}].position`, message: `source "${source.label || source.id}" lies inside ${blocker} and will radiate nothing outside it` });
  });
  scene.receivers.forEach((receiver, index) => {
    const blocker = blockingEntityAt(scene, receiver.position, cellSize);
    if (blocker) warnings.push({ code: "receiver-in-solid", path: `receivers[${index}].position`, message: `receiver "${receiver.label || receiver.id}" lies inside ${blocker} and records silence` });
  });
  scene.geometry.walls.forEach((wall, index) => {
    if (wall.surface.kind !== "rigid" && wall.thickness < cellSize) {
      warnings.push({ code: "wall-widened", path: `geometry.walls[${index}].thickness`, message: `wall "${wall.label || wall.id}" has an absorbing surface and is drawn one cell (${cellSize.toPrecision(3)} m) thick` });
    }
  });
  scene.mediumRegions.forEach((region, index) => {
    const touchesPml = region.polygon.some(
      (p) =>
        (pmlCells.left > 0 && p.x <= 0) ||
        (pmlCells.right > 0 && p.x >= scene.domain.width) ||
        (pmlCells.bottom > 0 && p.y <= 0) ||
        (pmlCells.top > 0 && p.y >= scene.domain.height),
    );
    if (touchesPml) warnings.push({ code: "region-meets-pml", path: `mediumRegions[${index}]`, message: `medium region "${region.label || region.id}" meets a PML, which is matched to the background medium: expect some reflection there` });
  });

  const layout = planLayout({
    nx,
    ny,
    hasPml: pmlCells.left + pmlCells.right + pmlCells.bottom + pmlCells.top > 0,
    pmlCells,
    heterogeneous: scene.mediumRegions.length > 0,
    levelMaps: scene.output.levelMaps,
    // Boundary faces are a small fraction of a grid: budget a perimeter's worth for the estimate.
    specialFaceCount: 4 * (nx + ny),
    zeroCellCount: 0,
  });
  // One byte per cell of solid mask and one float per cell of the final snapshot live outside the state
  // buffer, and with the level maps two floats per domain cell of intensity sums (intensity.ts).
  const intensityBytes = scene.output.levelMaps ? 8 * domainCells.nx * domainCells.ny : 0;
  const memoryBytes = layout.byteLength + cellCount * 5 + intensityBytes;

  return {
    cellSize,
    timeStep,
    courantNumber,
    soundSpeed: background.soundSpeed,
    density: background.density,
    minSoundSpeed,
    maxSoundSpeed,
    pointsPerWavelength,
    maxResolvedFrequency,
    domainCells,
    pmlCells,
    nx,
    ny,
    cellCount,
    originX: -pmlCells.left * cellSize,
    originY: -pmlCells.bottom * cellSize,
    steps,
    simulatedSeconds: steps * timeStep,
    stopRule,
    memoryBytes,
    cellUpdates: cellCount * steps,
    warnings,
  };
}

/** Scene x of the centre of cell column i. */
export function cellCentreX(grid: GridPlan, i: number): number {
  return grid.originX + (i + 0.5) * grid.cellSize;
}

/** Scene y of the centre of cell row j. */
export function cellCentreY(grid: GridPlan, j: number): number {
  return grid.originY + (j + 0.5) * grid.cellSize;
}
