// What lies under the pointer, in metres: the handles of the selected entity first, then entities
// from the top of the drawing down (sources over receivers over lines over walls over solids).
import { distanceToSegment, pointInPolygon } from "@/lib/fdtd/geometry";
import type { Point, Scene } from "@/lib/fdtd/scene";

import { DRAW_ORDER, entitiesOf, entityPoints, hasEditableVertexCount, type EntityKind, type EntityRef } from "./entities";

export type HitPart =
  /** A handle: point `index` of the entity. */
  | { type: "vertex"; index: number }
  /** The segment from point `index` to the next, at `at` (the nearest point on it). */
  | { type: "edge"; index: number; at: Point }
  /** Anywhere else on the entity. */
  | { type: "body" };

export interface Hit {
  ref: EntityRef;
  part: HitPart;
}

export interface HitOptions {
  /** Its handles and edges are tested first, so they stay reachable under other entities. */
  selected?: EntityRef | null;
}

/** Nearest point of segment a-b to p. */
export function closestPointOnSegment(p: Point, a: Point, b: Point): Point {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const lengthSquared = dx * dx + dy * dy;
  const t = lengthSquared > 0 ? Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSquared)) : 0;
  return { x: a.x + t * dx, y: a.y + t * dy };
}

/** Segments of an entity's outline: closed for a solid, open otherwise. */
function segmentsOf(kind: EntityKind, points: readonly Point[]): [number, Point, Point][] {
  const segments: [number, Point, Point][] = [];
  for (let k = 0; k + 1 < points.length; k++) segments.push([k, points[k]!, points[k + 1]!]);
  if (kind === "solid" && points.length >= 3) segments.push([points.length - 1, points[points.length - 1]!, points[0]!]);
  return segments;
}

/** The handle of `ref` nearest to p within `tolerance`, as its index. */
function vertexNear(points: readonly Point[], p: Point, tolerance: number): number | null {
  let best: number | null = null;
  let bestDistance = tolerance;
  points.forEach((q, index) => {
    const d = Math.hypot(q.x - p.x, q.y - p.y);
    if (d <= bestDistance) {
      best = index;
      bestDistance = d;
    }
  });
  return best;
}

function edgeNear(kind: EntityKind, points: readonly Point[], p: Point, tolerance: number): { index: number; at: Point } | null {
  let best: { index: number; at: Point } | null = null;
  let bestDistance = tolerance;
  for (const [index, a, b] of segmentsOf(kind, points)) {
    const d = distanceToSegment(p.x, p.y, a, b);
    if (d <= bestDistance) {
      best = { index, at: closestPointOnSegment(p, a, b) };
      bestDistance = d;
    }
  }
  return best;
}

/** Whether p lies on the body of an entity (within `tolerance` metres of what is drawn). */
function onBody(scene: Scene, kind: EntityKind, id: string, p: Point, tolerance: number): boolean {
  const points = entityPoints(scene, { kind, id });
  if (points.length === 0) return false;
  switch (kind) {
    case "source":
    case "receiver":
      return Math.hypot(points[0]!.x - p.x, points[0]!.y - p.y) <= tolerance;
    case "wall": {
      const wall = scene.geometry.walls.find((w) => w.id === id);
      const reach = tolerance + (wall ? wall.thickness / 2 : 0);
      return segmentsOf(kind, points).some(([, a, b]) => distanceToSegment(p.x, p.y, a, b) <= reach);
    }
    case "surface":
    case "receiverLine":
      return segmentsOf(kind, points).some(([, a, b]) => distanceToSegment(p.x, p.y, a, b) <= tolerance);
    case "solid":
      return pointInPolygon(p.x, p.y, points) || segmentsOf(kind, points).some(([, a, b]) => distanceToSegment(p.x, p.y, a, b) <= tolerance);
  }
}

/**
 * The top-most thing under `p`. `tolerance` is the pick radius in metres (a few pixels at the current
 * zoom). The selected entity's handles win over everything, then its edges (for inserting vertices),
 * then entities in reverse drawing order, the last-listed of a kind on top.
 */
export function hitTest(scene: Scene, p: Point, tolerance: number, options: HitOptions = {}): Hit | null {
  const selected = options.selected;
  if (selected) {
    const points = entityPoints(scene, selected);
    if (points.length > 0) {
      const index = vertexNear(points, p, tolerance);
      if (index !== null) return { ref: selected, part: { type: "vertex", index } };
      if (hasEditableVertexCount(selected.kind)) {
        const edge = edgeNear(selected.kind, points, p, tolerance);
        if (edge) return { ref: selected, part: { type: "edge", ...edge } };
      }
    }
  }
  for (let k = DRAW_ORDER.length - 1; k >= 0; k--) {
    const kind = DRAW_ORDER[k]!;
    const list = entitiesOf(scene, kind);
    for (let n = list.length - 1; n >= 0; n--) {
      const id = list[n]!.id;
      if (onBody(scene, kind, id, p, tolerance)) return { ref: { kind, id }, part: { type: "body" } };
    }
  }
  return null;
}

/** Every entity under `p`, top-most first (for cycling through stacked entities). */
export function hitTestAll(scene: Scene, p: Point, tolerance: number): EntityRef[] {
  const hits: EntityRef[] = [];
  for (let k = DRAW_ORDER.length - 1; k >= 0; k--) {
    const kind = DRAW_ORDER[k]!;
    const list = entitiesOf(scene, kind);
    for (let n = list.length - 1; n >= 0; n--) {
      const id = list[n]!.id;
      if (onBody(scene, kind, id, p, tolerance)) hits.push({ kind, id });
    }
  }
  return hits;
}
