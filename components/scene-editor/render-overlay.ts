// The interaction overlay of the drawing canvas: what follows the pointer. Hover and selection
// outlines, handles, the shape being drawn with the length of its last segment, and the snap mark.
// Drawn whole on every change, in CSS pixels on a canvas scaled by the device pixel ratio.
import type { Point, Scene } from "@/lib/fdtd/scene";

import { CANVAS_COLOURS, drawLabel, receiverLinePositions, tracePath } from "./canvas-style";
import type { DrawingSettings } from "./model/drawing";
import type { Selection } from "./model/editor-state";
import { entityPoints, type EntityRef } from "./model/entities";
import type { Hit } from "./model/hit-testing";
import type { SnapKind } from "./model/snapping";
import type { ToolId } from "./model/tools";
import { worldToScreen, type ScreenSize, type Viewport } from "./model/viewport";

export interface DrawingPreview {
  tool: ToolId;
  /** Points placed so far, m. */
  points: readonly Point[];
  /** Where the next point would go (snapped), m; null when the pointer is off the canvas. */
  cursor: Point | null;
  /** The next click closes the solid on its first corner. */
  closing: boolean;
  settings: DrawingSettings;
}

export interface OverlayInput {
  scene: Scene;
  view: Viewport;
  size: ScreenSize;
  selection: Selection | null;
  hover: Hit | null;
  drawing: DrawingPreview | null;
  snapMark: { point: Point; kind: SnapKind } | null;
  fontFamily: string;
  monoFontFamily: string;
  /** Decimals for lengths shown next to the cursor. */
  decimals: number;
}

function outlineEntity(context: CanvasRenderingContext2D, scene: Scene, view: Viewport, ref: EntityRef, colour: string, width: number): void {
  const points = entityPoints(scene, ref);
  if (points.length === 0) return;
  context.strokeStyle = colour;
  context.lineWidth = width;
  context.lineJoin = "round";
  if (ref.kind === "source" || ref.kind === "receiver") {
    const s = worldToScreen(view, points[0]!);
    context.beginPath();
    context.arc(s.x, s.y, 11, 0, 2 * Math.PI);
    context.stroke();
    return;
  }
  if (ref.kind === "wall") {
    // A translucent band a little wider than the barrier as drawn.
    const wall = scene.geometry.walls.find((w) => w.id === ref.id);
    tracePath(context, view, points, false);
    context.lineCap = "square";
    context.lineWidth = Math.max((wall?.thickness ?? 0) * view.pixelsPerMetre, 3) + 2 * width + 2;
    context.globalAlpha = 0.45;
    context.stroke();
    context.globalAlpha = 1;
    context.lineCap = "butt";
    return;
  }
  tracePath(context, view, points, ref.kind === "solid");
  context.stroke();
}

function drawHandles(context: CanvasRenderingContext2D, scene: Scene, view: Viewport, selection: Selection): void {
  if (selection.ref.kind === "source" || selection.ref.kind === "receiver") return;
  entityPoints(scene, selection.ref).forEach((p, index) => {
    const s = worldToScreen(view, p);
    const active = selection.vertex === index;
    context.beginPath();
    context.rect(Math.round(s.x) - 4.5, Math.round(s.y) - 4.5, 9, 9);
    context.fillStyle = active ? CANVAS_COLOURS.tide : CANVAS_COLOURS.panel;
    context.fill();
    context.strokeStyle = CANVAS_COLOURS.tide;
    context.lineWidth = 1.5;
    context.stroke();
  });
}

function drawPreview(context: CanvasRenderingContext2D, input: OverlayInput, preview: DrawingPreview): void {
  const { view } = input;
  const points = preview.cursor ? [...preview.points, preview.cursor] : [...preview.points];
  if (points.length === 0) return;
  const colour = preview.tool === "surface" ? CANVAS_COLOURS.treated : preview.tool === "receiverLine" ? CANVAS_COLOURS.receiver : CANVAS_COLOURS.tide;
  if (preview.tool === "solid" && points.length >= 3) {
    tracePath(context, view, points, true);
    context.fillStyle = "rgba(90, 102, 112, 0.28)";
    context.fill();
  }
  if (preview.tool === "wall" && points.length >= 2) {
    tracePath(context, view, points, false);
    context.lineCap = "square";
    context.strokeStyle = "rgba(44, 58, 69, 0.35)";
    context.lineWidth = Math.max(preview.settings.wallThickness * view.pixelsPerMetre, 3);
    context.stroke();
    context.lineCap = "butt";
  }
  tracePath(context, view, points, false);
  context.strokeStyle = colour;
  context.lineWidth = 1.75;
  context.setLineDash([6, 4]);
  context.stroke();
  context.setLineDash([]);
  if (preview.tool === "receiverLine" && points.length === 2) {
    context.fillStyle = CANVAS_COLOURS.receiver;
    for (const p of receiverLinePositions(points[0]!, points[1]!, preview.settings.receiverLineCount)) {
      const s = worldToScreen(view, p);
      context.beginPath();
      context.arc(s.x, s.y, 2.6, 0, 2 * Math.PI);
      context.fill();
    }
  }
  preview.points.forEach((p, k) => {
    const s = worldToScreen(view, p);
    context.beginPath();
    context.rect(Math.round(s.x) - 4, Math.round(s.y) - 4, 8, 8);
    const closingTarget = k === 0 && preview.closing;
    context.fillStyle = closingTarget ? colour : CANVAS_COLOURS.panel;
    context.fill();
    context.strokeStyle = colour;
    context.lineWidth = 1.5;
    context.stroke();
  });
  // Length of the segment under construction, beside the cursor.
  const last = preview.points[preview.points.length - 1];
  if (last && preview.cursor) {
    const length = Math.hypot(preview.cursor.x - last.x, preview.cursor.y - last.y);
    const s = worldToScreen(view, preview.cursor);
    context.font = `500 11px ${input.monoFontFamily}`;
    drawLabel(context, `${length.toFixed(input.decimals)} m`, s.x + 12, s.y + 14, CANVAS_COLOURS.ink);
  }
}

function drawSnapMark(context: CanvasRenderingContext2D, view: Viewport, mark: { point: Point; kind: SnapKind }): void {
  const s = worldToScreen(view, mark.point);
  context.strokeStyle = mark.kind === "vertex" ? CANVAS_COLOURS.treated : CANVAS_COLOURS.tide;
  context.lineWidth = 1.25;
  context.beginPath();
  if (mark.kind === "vertex") {
    // A diamond for "on an existing corner".
    context.moveTo(s.x, s.y - 6);
    context.lineTo(s.x + 6, s.y);
    context.lineTo(s.x, s.y + 6);
    context.lineTo(s.x - 6, s.y);
    context.closePath();
  } else {
    context.moveTo(s.x - 7, s.y);
    context.lineTo(s.x + 7, s.y);
    context.moveTo(s.x, s.y - 7);
    context.lineTo(s.x, s.y + 7);
  }
  context.stroke();
}

/** Draws the whole overlay layer; the context's transform must map CSS px to device px. */
export function renderOverlay(context: CanvasRenderingContext2D, input: OverlayInput): void {
  context.clearRect(0, 0, input.size.width, input.size.height);
  const { scene, view, selection, hover } = input;
  if (hover && !(selection && hover.ref.kind === selection.ref.kind && hover.ref.id === selection.ref.id)) {
    outlineEntity(context, scene, view, hover.ref, "rgba(18, 118, 115, 0.55)", 1.5);
  }
  if (selection) {
    outlineEntity(context, scene, view, selection.ref, CANVAS_COLOURS.tide, 2);
    drawHandles(context, scene, view, selection);
  }
  if (hover && hover.part.type === "vertex") {
    const p = entityPoints(scene, hover.ref)[hover.part.index];
    if (p) {
      const s = worldToScreen(view, p);
      context.strokeStyle = CANVAS_COLOURS.tide;
      context.lineWidth = 1.5;
      context.beginPath();
      context.arc(s.x, s.y, 8, 0, 2 * Math.PI);
      context.stroke();
    }
  }
  if (hover && hover.part.type === "edge") {
    // Where a double-click would add a corner.
    const s = worldToScreen(view, hover.part.at);
    context.fillStyle = CANVAS_COLOURS.tide;
    context.beginPath();
    context.arc(s.x, s.y, 3.5, 0, 2 * Math.PI);
    context.fill();
  }
  if (input.drawing) drawPreview(context, input, input.drawing);
  if (input.snapMark) drawSnapMark(context, view, input.snapMark);
}
