// Turns a scene's geometry into what the kernel needs on the staggered grid: which cells are solid,
// which velocity faces carry a boundary condition (rigid: v = 0; locally reacting: impedance update),
// and which medium fills each cell.
//
// Grid indices are total-grid indices (PML included): cell (i, j) has its centre at
// (originX + (i + 1/2) h, originY + (j + 1/2) h); x-face (i, j) sits at (originX + i h, originY + (j + 1/2) h)
// between cells (i - 1, j) and (i, j); y-face (i, j) sits at (originX + (i + 1/2) h, originY + j h)
// between cells (i, j - 1) and (i, j).
import { bounds, distanceToPolyline, pointInPolygon, segmentsIntersect } from "./geometry";
import type { GridPlan } from "./grid";
import { impedanceFromAbsorption, materialImpedance } from "./materials";
import { mediumProperties, type MediumProperties } from "./medium";
import type { EdgeSide, Point, Scene, SurfaceTreatment } from "./scene";

/** Real normalised impedance of a treatment; Infinity for rigid. */
export function treatmentImpedance(treatment: SurfaceTreatment): number {
  switch (treatment.kind) {
    case "rigid":
      return Infinity;
    case "impedance":
      return treatment.normalisedImpedance;
    case "absorption":
      return impedanceFromAbsorption(treatment.absorptionCoefficient);
    case "material":
      return materialImpedance(treatment.material);
  }
}

/** A velocity face with a boundary condition. */
export interface BoundaryFace {
  axis: "x" | "y";
  /** Face indices (see the file comment). */
  i: number;
  j: number;
  /** Normalised impedance; Infinity = rigid (v = 0). */
  impedance: number;
  /** The fluid cell whose pressure drives an impedance face, and whether it lies on the face's low side (smaller i or j). */
  fluidI: number;
  fluidJ: number;
  fluidOnLowSide: boolean;
  /** A thin rigid wall's face, with fluid on both sides: always rigid, surfaces do not line it. */
  thinWall?: boolean;
}

export interface RasterisedScene {
  nx: number;
  ny: number;
  /** 1 where the cell is solid; row-major, i fastest, nx * ny. */
  solid: Uint8Array;
  /** Index into `media` of each cell (0 = background); undefined when the medium is uniform. */
  mediumIndex: Uint8Array | undefined;
  media: MediumProperties[];
  boundaryFaces: BoundaryFace[];
}

const SIDES: readonly EdgeSide[] = ["left", "right", "bottom", "top"];

/**
 * Rasterises solids (cell centre inside the polygon), walls (thick: cells whose centre lies within half the
 * thickness, and at least half a cell, of the centre line, which leaves no gap between face neighbours;
 * thin and rigid: the x- and y-faces whose segment between neighbouring cell centres meets the centre line)
 * and medium regions. Solids and walls that reach a PML side continue through it, so that the PML
 * absorbs the wave along them instead of reflecting it from their cut ends.
 */
export function rasteriseScene(scene: Scene, grid: GridPlan): RasterisedScene {
  const { nx, ny, cellSize: h, originX, originY, pmlCells } = grid;
  const solid = new Uint8Array(nx * ny);
  // Which treatment each solid cell's faces take; 0 = rigid default of the drawing.
  const cellImpedance = new Float64Array(nx * ny).fill(Infinity);
  const i0 = pmlCells.left;
  const i1 = nx - pmlCells.right;
  const j0 = pmlCells.bottom;
  const j1 = ny - pmlCells.top;
  const cx = (i: number) => originX + (i + 0.5) * h;
  const cy = (j: number) => originY + (j + 0.5) * h;
  const colRange = (minX: number, maxX: number) => [Math.max(i0, Math.floor((minX - originX) / h - 0.5)), Math.min(i1 - 1, Math.ceil((maxX - originX) / h - 0.5))] as const;
  const rowRange = (minY: number, maxY: number) => [Math.max(j0, Math.floor((minY - originY) / h - 0.5)), Math.min(j1 - 1, Math.ceil((maxY - originY) / h - 0.5))] as const;

  const markCell = (i: number, j: number, impedance: number) => {
    const c = j * nx + i;
    solid[c] = 1;
    cellImpedance[c] = impedance;
  };

  for (const s of scene.geometry.solids) {
    const z = treatmentImpedance(s.surface);
    const b = bounds(s.polygon);
    const [ia, ib] = colRange(b.minX, b.maxX);
    const [ja, jb] = rowRange(b.minY, b.maxY);
    for (let j = ja; j <= jb; j++) for (let i = ia; i <= ib; i++) if (pointInPolygon(cx(i), cy(j), s.polygon)) markCell(i, j, z);
  }

  // Thin rigid walls block faces; collect their centre lines (extended through PML sides) first.
  const thinWallPaths: Point[][] = [];
  for (const w of scene.geometry.walls) {
    const z = treatmentImpedance(w.surface);
    const thick = w.thickness >= h || z !== Infinity;
    if (!thick) {
      thinWallPaths.push(extendThroughPml(w.path, scene, grid));
      continue;
    }
    const half = Math.max(w.thickness / 2, 0.5 * h * (1 + 1e-9));
    const b = bounds(w.path);
    const [ia, ib] = colRange(b.minX - half, b.maxX + half);
    const [ja, jb] = rowRange(b.minY - half, b.maxY + half);
    for (let j = ja; j <= jb; j++) for (let i = ia; i <= ib; i++) if (distanceToPolyline(cx(i), cy(j), w.path) <= half) markCell(i, j, z);
  }

  // Continue the domain's edge cells straight through each PML.
  for (let j = j0; j < j1; j++) {
    for (let i = 0; i < i0; i++) copyCell(solid, cellImpedance, nx, j * nx + i0, j * nx + i);
    for (let i = i1; i < nx; i++) copyCell(solid, cellImpedance, nx, j * nx + i1 - 1, j * nx + i);
  }
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < j0; j++) copyCell(solid, cellImpedance, nx, j0 * nx + i, j * nx + i);
    for (let j = j1; j < ny; j++) copyCell(solid, cellImpedance, nx, (j1 - 1) * nx + i, j * nx + i);
  }

  const boundaryFaces: BoundaryFace[] = [];
  const isSolid = (i: number, j: number) => solid[j * nx + i] === 1;

  // Faces between a fluid and a solid cell take the solid's treatment; faces crossed by a thin wall are rigid.
  const thinBlocked = (ax: number, ay: number, bx: number, by: number) => thinWallPaths.some((path) => crossesPath(ax, ay, bx, by, path));
  for (let j = 0; j < ny; j++) {
    for (let i = 1; i < nx; i++) {
      const low = isSolid(i - 1, j);
      const high = isSolid(i, j);
      if (low !== high) {
        const solidCell = low ? j * nx + i - 1 : j * nx + i;
        boundaryFaces.push({ axis: "x", i, j, impedance: cellImpedance[solidCell]!, fluidI: low ? i : i - 1, fluidJ: j, fluidOnLowSide: !low });
      } else if (!low && thinWallPaths.length > 0 && thinBlocked(cx(i - 1), cy(j), cx(i), cy(j))) {
        boundaryFaces.push({ axis: "x", i, j, impedance: Infinity, fluidI: i, fluidJ: j, fluidOnLowSide: false, thinWall: true });
      }
    }
  }
  for (let j = 1; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const low = isSolid(i, j - 1);
      const high = isSolid(i, j);
      if (low !== high) {
        const solidCell = low ? (j - 1) * nx + i : j * nx + i;
        boundaryFaces.push({ axis: "y", i, j, impedance: cellImpedance[solidCell]!, fluidI: i, fluidJ: low ? j : j - 1, fluidOnLowSide: !low });
      } else if (!low && thinWallPaths.length > 0 && thinBlocked(cx(i), cy(j - 1), cx(i), cy(j))) {
        boundaryFaces.push({ axis: "y", i, j, impedance: Infinity, fluidI: i, fluidJ: j, fluidOnLowSide: false, thinWall: true });
      }
    }
  }

  // Outer edges that are not a PML: rigid edges need no entry (their faces are never updated) unless a
  // surface lines them; impedance edges get one face per fluid cell along them.
  for (const side of SIDES) {
    const edge = scene.boundary[side];
    if (edge.kind === "pml") continue;
    const z = treatmentImpedance(edge);
    if (z === Infinity) continue;
    const along = side === "left" || side === "right" ? ny : nx;
    for (let k = 0; k < along; k++) {
      const face = outerFace(side, k, nx, ny, z);
      if (isSolid(face.fluidI, face.fluidJ)) continue;
      boundaryFaces.push(face);
    }
  }

  // Surfaces line boundary faces within one cell of their path; later surfaces win.
  if (scene.geometry.surfaces.length > 0) {
    const faceX = (f: BoundaryFace) => (f.axis === "x" ? originX + f.i * h : cx(f.i));
    const faceY = (f: BoundaryFace) => (f.axis === "y" ? originY + f.j * h : cy(f.j));
    const key = (axis: string, i: number, j: number) => `${axis}:${i}:${j}`;
    const byKey = new Map(boundaryFaces.map((f) => [key(f.axis, f.i, f.j), f]));
    for (const surface of scene.geometry.surfaces) {
      const z = treatmentImpedance(surface.treatment);
      for (const face of boundaryFaces) {
        if (!face.thinWall && distanceToPolyline(faceX(face), faceY(face), surface.path) <= h) face.impedance = z;
      }
      // Rigid outer edges have no entries of their own: add the lined part of them.
      for (const side of SIDES) {
        const edge = scene.boundary[side];
        if (edge.kind === "pml" || treatmentImpedance(edge) !== Infinity) continue;
        const along = side === "left" || side === "right" ? ny : nx;
        for (let k = 0; k < along; k++) {
          const face = outerFace(side, k, nx, ny, z);
          if (isSolid(face.fluidI, face.fluidJ) || byKey.has(key(face.axis, face.i, face.j))) continue;
          if (distanceToPolyline(faceX(face), faceY(face), surface.path) <= h) {
            boundaryFaces.push(face);
            byKey.set(key(face.axis, face.i, face.j), face);
          }
        }
      }
    }
  }

  let mediumIndex: Uint8Array | undefined;
  const media = [mediumProperties(scene.medium)];
  if (scene.mediumRegions.length > 0) {
    mediumIndex = new Uint8Array(nx * ny);
    scene.mediumRegions.forEach((region, k) => {
      media.push(mediumProperties(region.medium));
      const b = bounds(region.polygon);
      const [ia, ib] = colRange(b.minX, b.maxX);
      const [ja, jb] = rowRange(b.minY, b.maxY);
      for (let j = ja; j <= jb; j++) for (let i = ia; i <= ib; i++) if (pointInPolygon(cx(i), cy(j), region.polygon)) mediumIndex![j * nx + i] = k + 1;
    });
  }

  return { nx, ny, solid, mediumIndex, media, boundaryFaces };
}

function copyCell(solid: Uint8Array, impedance: Float64Array, _nx: number, from: number, to: number) {
  solid[to] = solid[from]!;
  impedance[to] = impedance[from]!;
}

function crossesPath(ax: number, ay: number, bx: number, by: number, path: readonly Point[]): boolean {
  for (let k = 0; k + 1 < path.length; k++) if (segmentsIntersect(ax, ay, bx, by, path[k]!, path[k + 1]!)) return true;
  return false;
}

/** The k-th face along an outer side, with the fluid cell inside it. */
function outerFace(side: EdgeSide, k: number, nx: number, ny: number, impedance: number): BoundaryFace {
  switch (side) {
    case "left":
      return { axis: "x", i: 0, j: k, impedance, fluidI: 0, fluidJ: k, fluidOnLowSide: false };
    case "right":
      return { axis: "x", i: nx, j: k, impedance, fluidI: nx - 1, fluidJ: k, fluidOnLowSide: true };
    case "bottom":
      return { axis: "y", i: k, j: 0, impedance, fluidI: k, fluidJ: 0, fluidOnLowSide: false };
    case "top":
      return { axis: "y", i: k, j: ny, impedance, fluidI: k, fluidJ: ny - 1, fluidOnLowSide: true };
  }
}

/**
 * Extends a thin wall's end points that lie on a PML side of the domain straight out through the PML,
 * so the wall does not end at the PML's inner edge.
 */
function extendThroughPml(path: readonly Point[], scene: Scene, grid: GridPlan): Point[] {
  const out = path.map((p) => ({ ...p }));
  const { width, height } = scene.domain;
  const eps = 1e-9 * Math.max(width, height);
  const reach = (grid.pmlCells.left + grid.pmlCells.right + grid.pmlCells.bottom + grid.pmlCells.top + 2) * grid.cellSize;
  for (const end of [out[0]!, out[out.length - 1]!]) {
    if (grid.pmlCells.left > 0 && end.x <= eps) end.x = -reach;
    else if (grid.pmlCells.right > 0 && end.x >= width - eps) end.x = width + reach;
    if (grid.pmlCells.bottom > 0 && end.y <= eps) end.y = -reach;
    else if (grid.pmlCells.top > 0 && end.y >= height - eps) end.y = height + reach;
  }
  return out;
}
