// Building an entity from clicks: the points placed so far, and turning them into a solid, barrier,
// treated surface or receiver line when the person finishes. Pure, so the canvas only routes events.
import type { Point, Scene } from "@/lib/fdtd/scene";
import { openRing, samePoint, signedDoubleArea, withoutRepeatedPoints } from "@/lib/scene-import/geometry";

import { addReceiverLine, addSolid, addSurface, addWall, type Added } from "./scene-edits";
import type { ToolId } from "./tools";

export interface DrawingSettings {
  /** Thickness of a new barrier, m. */
  wallThickness: number;
  /** Receivers on a new receiver line. */
  receiverLineCount: number;
}

export const DEFAULT_DRAWING_SETTINGS: DrawingSettings = { wallThickness: 0.2, receiverLineCount: 10 };

// Clicks and imported files tidy points the same way (a double-click places one corner, not two), so
// the plane geometry lives once, in the imports' module; the editor's names stay for its callers.
export { signedDoubleArea };
export const withoutRepeats = withoutRepeatedPoints;

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
      const polygon = openRing(clicked);
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
