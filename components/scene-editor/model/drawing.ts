// Building an entity from clicks: the points placed so far, and turning them into a solid, barrier,
// treated surface or receiver line when the person finishes. Pure, so the canvas only routes events.
import type { Point, Scene } from "@/lib/fdtd/scene";

import { addReceiverLine, addSolid, addSurface, addWall, type Added } from "./scene-edits";
import type { ToolId } from "./tools";

/** Points closer than this (metres) count as the same click: a double-click places one corner, not two. */
export const SAME_POINT_TOLERANCE = 1e-9;

export interface DrawingSettings {
  /** Thickness of a new barrier, m. */
  wallThickness: number;
  /** Receivers on a new receiver line. */
  receiverLineCount: number;
}

export const DEFAULT_DRAWING_SETTINGS: DrawingSettings = { wallThickness: 0.2, receiverLineCount: 10 };

function samePoint(a: Point, b: Point): boolean {
  return Math.abs(a.x - b.x) <= SAME_POINT_TOLERANCE && Math.abs(a.y - b.y) <= SAME_POINT_TOLERANCE;
}

/** The points with each point that repeats its predecessor left out. */
export function withoutRepeats(points: readonly Point[]): Point[] {
  const out: Point[] = [];
  for (const p of points) if (out.length === 0 || !samePoint(out[out.length - 1]!, p)) out.push(p);
  return out;
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

/** Points a path tool needs before it can finish. */
export function pointsNeeded(tool: ToolId): number {
  return tool === "solid" ? 3 : 2;
}

/** Appends a click; a click on the last point again is ignored. */
export function addDrawingPoint(points: readonly Point[], p: Point): Point[] {
  const last = points[points.length - 1];
  if (last && samePoint(last, p)) return points.slice();
  return [...points, p];
}

/** Whether a click at `p` on the first corner (within `tolerance` m) should close a solid being drawn. */
export function closesOutline(tool: ToolId, points: readonly Point[], p: Point, tolerance: number): boolean {
  if (tool !== "solid" || points.length < 3) return false;
  const first = points[0]!;
  return Math.hypot(first.x - p.x, first.y - p.y) <= tolerance;
}

/** Whether the receiver line tool is done (it takes exactly two clicks). */
export function finishesOnClick(tool: ToolId, points: readonly Point[]): boolean {
  return tool === "receiverLine" && withoutRepeats(points).length >= 2;
}

/**
 * The entity the clicks describe, added to the scene; null when there are too few distinct points or a
 * solid would enclose no area (all corners on one line).
 */
export function finishDrawing(scene: Scene, tool: ToolId, clicked: readonly Point[], settings: DrawingSettings): Added | null {
  const points = withoutRepeats(clicked);
  switch (tool) {
    case "solid": {
      // A closing click on the first corner is not a new corner.
      const polygon = points.length > 1 && samePoint(points[0]!, points[points.length - 1]!) ? points.slice(0, -1) : points;
      if (polygon.length < 3 || Math.abs(signedDoubleArea(polygon)) < 1e-12) return null;
      return addSolid(scene, polygon);
    }
    case "wall":
      return points.length >= 2 ? addWall(scene, points, settings.wallThickness) : null;
    case "surface":
      return points.length >= 2 ? addSurface(scene, points) : null;
    case "receiverLine":
      return points.length >= 2 ? addReceiverLine(scene, points[0]!, points[1]!, settings.receiverLineCount) : null;
    default:
      return null;
  }
}
