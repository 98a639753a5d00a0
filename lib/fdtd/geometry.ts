// Plane geometry used to rasterise a scene: point in polygon, distance to a polyline, segment crossing.
import type { Point } from "./scene";

/** Even-odd rule; points exactly on an edge may fall either way. */
export function pointInPolygon(x: number, y: number, polygon: readonly Point[]): boolean {
  let inside = false;
  const n = polygon.length;
  for (let a = 0, b = n - 1; a < n; b = a++) {
    const pa = polygon[a]!;
    const pb = polygon[b]!;
    if (pa.y > y !== pb.y > y) {
      const xCross = pa.x + ((y - pa.y) * (pb.x - pa.x)) / (pb.y - pa.y);
      if (x < xCross) inside = !inside;
    }
  }
  return inside;
}

/** Distance from (x, y) to the segment a-b. */
export function distanceToSegment(x: number, y: number, a: Point, b: Point): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const lengthSquared = dx * dx + dy * dy;
  let t = lengthSquared > 0 ? ((x - a.x) * dx + (y - a.y) * dy) / lengthSquared : 0;
  t = Math.max(0, Math.min(1, t));
  const ex = a.x + t * dx - x;
  const ey = a.y + t * dy - y;
  return Math.hypot(ex, ey);
}

/** Distance from (x, y) to an open polyline. */
export function distanceToPolyline(x: number, y: number, path: readonly Point[]): number {
  if (path.length === 1) return Math.hypot(x - path[0]!.x, y - path[0]!.y);
  let best = Infinity;
  for (let k = 0; k + 1 < path.length; k++) best = Math.min(best, distanceToSegment(x, y, path[k]!, path[k + 1]!));
  return best;
}

function orientation(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  const v = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
  return v > 0 ? 1 : v < 0 ? -1 : 0;
}

/**
 * Whether the segment p-q meets the segment a-b, touching included. Used to block the velocity face
 * between two neighbouring cell centres p, q when a thin wall's centre line passes between them.
 */
export function segmentsIntersect(px: number, py: number, qx: number, qy: number, a: Point, b: Point): boolean {
  const o1 = orientation(px, py, qx, qy, a.x, a.y);
  const o2 = orientation(px, py, qx, qy, b.x, b.y);
  const o3 = orientation(a.x, a.y, b.x, b.y, px, py);
  const o4 = orientation(a.x, a.y, b.x, b.y, qx, qy);
  if (o1 !== o2 && o3 !== o4) return true;
  const onSegment = (sx: number, sy: number, ex: number, ey: number, x: number, y: number) =>
    Math.min(sx, ex) <= x && x <= Math.max(sx, ex) && Math.min(sy, ey) <= y && y <= Math.max(sy, ey);
  if (o1 === 0 && onSegment(px, py, qx, qy, a.x, a.y)) return true;
  if (o2 === 0 && onSegment(px, py, qx, qy, b.x, b.y)) return true;
  if (o3 === 0 && onSegment(a.x, a.y, b.x, b.y, px, py)) return true;
  if (o4 === 0 && onSegment(a.x, a.y, b.x, b.y, qx, qy)) return true;
  return false;
}

/** Axis-aligned bounds of a point list. */
export function bounds(points: readonly Point[]): { minX: number; minY: number; maxX: number; maxY: number } {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    minX = Math.min(minX, p.x);
    minY = Math.min(minY, p.y);
    maxX = Math.max(maxX, p.x);
    maxY = Math.max(maxY, p.y);
  }
  return { minX, minY, maxX, maxY };
}
