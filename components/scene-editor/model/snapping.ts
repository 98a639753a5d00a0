// Snapping of pointer positions in metres: to a grid whose step follows the zoom, to existing
// vertices nearby, and to 45-degree directions while drawing a polyline.
import type { Point } from "@/lib/fdtd/scene";

import { tidyCoordinate } from "./scene-edits";

/** The smallest "round" length 1, 2 or 5 x 10^n metres that is at least `atLeast` metres. */
export function niceStep(atLeast: number): number {
  if (!(atLeast > 0) || !Number.isFinite(atLeast)) return 1;
  const exponent = Math.floor(Math.log10(atLeast));
  for (let e = exponent - 1; e <= exponent + 1; e++) {
    for (const mantissa of [1, 2, 5]) {
      // Build the step from an integer power so that 0.1 is 0.1, not 0.30000000000000004 / 3.
      const step = e >= 0 ? mantissa * 10 ** e : mantissa / 10 ** -e;
      if (step >= atLeast * (1 - 1e-12)) return step;
    }
  }
  return 10 ** (exponent + 1);
}

/** Grid step in metres for a zoom of `pixelsPerMetre`, so that grid lines are at least `minPixels` apart. */
export function gridStepForZoom(pixelsPerMetre: number, minPixels = 16): number {
  return niceStep(minPixels / pixelsPerMetre);
}

/** Nearest multiple of `step` (metres). */
export function snapValue(value: number, step: number): number {
  if (!(step > 0)) return value;
  return tidyCoordinate(Math.round(value / step) * step);
}

export function snapPoint(p: Point, step: number): Point {
  return { x: snapValue(p.x, step), y: snapValue(p.y, step) };
}

/** The candidate nearest to `p` within `tolerance` metres, or null. */
export function nearestPoint(p: Point, candidates: Iterable<Point>, tolerance: number): Point | null {
  let best: Point | null = null;
  let bestDistance = tolerance;
  for (const c of candidates) {
    const d = Math.hypot(c.x - p.x, c.y - p.y);
    if (d <= bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  return best;
}

export type SnapKind = "vertex" | "grid" | "none";

export interface SnapOptions {
  /** Grid step in metres; 0 turns grid snapping off. */
  gridStep: number;
  /** Existing vertices to snap to, checked before the grid. */
  vertices?: Iterable<Point>;
  /** How close a vertex must be to win, m (a few pixels at the current zoom). */
  vertexTolerance?: number;
}

/** Where a pointer at `p` lands: on a nearby vertex, else on the grid, else where it is. */
export function snap(p: Point, options: SnapOptions): { point: Point; kind: SnapKind } {
  if (options.vertices && options.vertexTolerance && options.vertexTolerance > 0) {
    const vertex = nearestPoint(p, options.vertices, options.vertexTolerance);
    if (vertex) return { point: { x: vertex.x, y: vertex.y }, kind: "vertex" };
  }
  if (options.gridStep > 0) return { point: snapPoint(p, options.gridStep), kind: "grid" };
  return { point: p, kind: "none" };
}

/**
 * `to` moved onto the nearest direction from `from` that is a multiple of `stepDegrees` (45 by default:
 * horizontal, vertical, diagonal), keeping its distance along that direction (orthogonal projection).
 */
export function constrainDirection(from: Point, to: Point, stepDegrees = 45): Point {
  const dx = to.x - from.x;
  const dy = to.y - from.y;
  if (dx === 0 && dy === 0) return to;
  const step = (stepDegrees * Math.PI) / 180;
  const angle = Math.round(Math.atan2(dy, dx) / step) * step;
  const ux = Math.cos(angle);
  const uy = Math.sin(angle);
  const along = dx * ux + dy * uy;
  // Exact zeros for the axis directions, so a constrained wall is truly vertical or horizontal.
  const clean = (v: number) => (Math.abs(v) < 1e-12 ? 0 : v);
  return { x: tidyCoordinate(from.x + clean(along * ux)), y: tidyCoordinate(from.y + clean(along * uy)) };
}

/** Decimal places that show a length to the precision of `step` metres (0.05 -> 2, 1 -> 0). */
export function decimalsForStep(step: number): number {
  if (!(step > 0)) return 3;
  return Math.max(0, Math.min(6, Math.ceil(-Math.log10(step) - 1e-9)));
}
