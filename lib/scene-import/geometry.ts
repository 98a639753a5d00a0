// Plane geometry shared by the imports: bounding boxes, the domain test, and tidying point lists that
// came from other programs (repeated vertices, outlines that close by repeating their first point).
import type { Point } from "@/lib/fdtd/scene";

/** What every import returns: its result, or one message a person can act on. Imports never throw. */
export type ImportResult<T> = ({ ok: true } & T) | { ok: false; message: string };

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export interface DomainSize {
  width: number;
  height: number;
}

/** Points closer than this (in the file's own units) are the same vertex: CAD files often repeat one. */
const SAME_POINT_TOLERANCE = 1e-9;

/** A point outside the domain by less than this (metres) still counts as inside: unit conversion rounds. */
const DOMAIN_TOLERANCE = 1e-9;

export function samePoint(a: Point, b: Point): boolean {
  return Math.abs(a.x - b.x) <= SAME_POINT_TOLERANCE && Math.abs(a.y - b.y) <= SAME_POINT_TOLERANCE;
}

/** The points with every point that repeats its predecessor left out. */
export function withoutRepeatedPoints(points: readonly Point[]): Point[] {
  const out: Point[] = [];
  for (const p of points) if (out.length === 0 || !samePoint(out[out.length - 1]!, p)) out.push(p);
  return out;
}

/** A polygon's corners without the closing repeat of its first corner, if the file wrote one. */
export function openRing(points: readonly Point[]): Point[] {
  const ring = withoutRepeatedPoints(points);
  if (ring.length > 1 && samePoint(ring[0]!, ring[ring.length - 1]!)) ring.pop();
  return ring;
}

/** Twice the signed area of a polygon (shoelace formula); zero when it encloses nothing. */
export function signedDoubleArea(polygon: readonly Point[]): number {
  let sum = 0;
  for (let k = 0; k < polygon.length; k++) {
    const a = polygon[k]!;
    const b = polygon[(k + 1) % polygon.length]!;
    sum += a.x * b.y - b.x * a.y;
  }
  return sum;
}

/** The smallest box holding every point of every list; null when there are no points. */
export function boundsOf(lists: readonly (readonly Point[])[]): Bounds | null {
  let bounds: Bounds | null = null;
  for (const points of lists) {
    for (const p of points) {
      if (!bounds) bounds = { minX: p.x, minY: p.y, maxX: p.x, maxY: p.y };
      else {
        bounds.minX = Math.min(bounds.minX, p.x);
        bounds.minY = Math.min(bounds.minY, p.y);
        bounds.maxX = Math.max(bounds.maxX, p.x);
        bounds.maxY = Math.max(bounds.maxY, p.y);
      }
    }
  }
  return bounds;
}

export function insideDomain(p: Point, domain: DomainSize): boolean {
  return p.x >= -DOMAIN_TOLERANCE && p.y >= -DOMAIN_TOLERANCE && p.x <= domain.width + DOMAIN_TOLERANCE && p.y <= domain.height + DOMAIN_TOLERANCE;
}

export function boundsInsideDomain(bounds: Bounds, domain: DomainSize): boolean {
  return insideDomain({ x: bounds.minX, y: bounds.minY }, domain) && insideDomain({ x: bounds.maxX, y: bounds.maxY }, domain);
}

/** A length for messages: no float noise, at most four significant figures beyond the integer part. */
export function formatLength(value: number): string {
  const rounded = Math.abs(value) >= 1000 ? Math.round(value) : Number(value.toPrecision(4));
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

export function describeDomain(domain: DomainSize): string {
  return `0 to ${formatLength(domain.width)} m across and 0 to ${formatLength(domain.height)} m up`;
}

export function describeBounds(bounds: Bounds, unit: string): string {
  return `x ${formatLength(bounds.minX)} to ${formatLength(bounds.maxX)} ${unit}, y ${formatLength(bounds.minY)} to ${formatLength(bounds.maxY)} ${unit}`;
}
