// Time-averaged sound intensity as a readable field of arrows: the intensity vector averaged over square
// blocks of cells (the mean energy flux through the block), one arrow per block, its length on a level
// (log) scale so that the flow far from the source still shows beside the strong flow near it. Pure.
import type { FieldSnapshot } from "@/lib/fdtd/simulation";

import { sameGrid } from "./levels";

export interface IntensityArrow {
  /** Centre of the block, scene m. */
  x: number;
  y: number;
  /** Unit vector of the mean intensity. */
  directionX: number;
  directionY: number;
  /** |mean intensity| of the block, W/m^2. */
  magnitude: number;
  /** Arrow length as a fraction of the full length, in (0, 1]: 1 + L_rel / dynamicRangeDb, L_rel = 10 log10(|I| / |I|max). */
  lengthFraction: number;
}

export interface IntensityArrowField {
  arrows: IntensityArrow[];
  /** The largest block magnitude, W/m^2: the full-length arrow. */
  maxMagnitude: number;
  /** Level range the lengths span, dB: an arrow this far below the largest has zero length (and is left out). */
  dynamicRangeDb: number;
  /** Cells per block side. */
  cellsPerArrow: number;
  /** Distance between neighbouring arrows, m. */
  arrowSpacing: number;
}

/** Default level range of arrow lengths, dB (common practice for vector plots over a level map: a few tens of dB). */
export const ARROW_DYNAMIC_RANGE_DB = 30;

/**
 * Block-averaged intensity arrows. `cellsPerArrow` cells (at least 1) per block side; partial blocks at
 * the right and top edges are averaged over the cells they have. Blocks whose mean is zero, or more than
 * `dynamicRangeDb` below the strongest, give no arrow.
 */
export function intensityArrows(
  intensityX: FieldSnapshot,
  intensityY: FieldSnapshot,
  cellsPerArrow: number,
  dynamicRangeDb = ARROW_DYNAMIC_RANGE_DB,
): IntensityArrowField {
  if (!sameGrid(intensityX, intensityY)) throw new Error("the two intensity components must share one grid");
  const n = Math.max(1, Math.floor(cellsPerArrow));
  const { width, height, x0, y0, spacing } = intensityX;
  const blocks: { x: number; y: number; ix: number; iy: number; magnitude: number }[] = [];
  let maxMagnitude = 0;
  for (let b0 = 0; b0 < height; b0 += n) {
    const b1 = Math.min(height, b0 + n);
    for (let a0 = 0; a0 < width; a0 += n) {
      const a1 = Math.min(width, a0 + n);
      let sumX = 0;
      let sumY = 0;
      for (let b = b0; b < b1; b++) {
        for (let a = a0; a < a1; a++) {
          sumX += intensityX.values[b * width + a]!;
          sumY += intensityY.values[b * width + a]!;
        }
      }
      const cells = (a1 - a0) * (b1 - b0);
      const ix = sumX / cells;
      const iy = sumY / cells;
      const magnitude = Math.hypot(ix, iy);
      if (!(magnitude > 0) || !Number.isFinite(magnitude)) continue;
      // Block centre: midway between its first and last cell centres.
      blocks.push({ x: x0 + ((a0 + a1 - 1) / 2) * spacing, y: y0 + ((b0 + b1 - 1) / 2) * spacing, ix, iy, magnitude });
      if (magnitude > maxMagnitude) maxMagnitude = magnitude;
    }
  }
  const arrows: IntensityArrow[] = [];
  for (const block of blocks) {
    const lengthFraction = 1 + (10 * Math.log10(block.magnitude / maxMagnitude)) / dynamicRangeDb;
    if (lengthFraction <= 0) continue;
    arrows.push({
      x: block.x,
      y: block.y,
      directionX: block.ix / block.magnitude,
      directionY: block.iy / block.magnitude,
      magnitude: block.magnitude,
      lengthFraction,
    });
  }
  return { arrows, maxMagnitude, dynamicRangeDb, cellsPerArrow: n, arrowSpacing: n * spacing };
}

/** Cells per arrow so that arrows sit about `targetPixels` apart on screen. */
export function cellsPerArrowFor(spacingMetres: number, pixelsPerMetre: number, targetPixels = 36): number {
  const cellPixels = spacingMetres * pixelsPerMetre;
  return cellPixels > 0 ? Math.max(1, Math.round(targetPixels / cellPixels)) : 1;
}
