// Drawing the scene editor's two canvas layers with the 2D canvas API. The static layer holds what
// changes only with the scene or the view (grid, domain, PML bands, entities, rulers); the overlay holds
// what follows the pointer (hover, selection handles, the shape being drawn, the snap mark). Each is
// drawn whole by one function, in CSS pixels on a canvas scaled by the device pixel ratio.
import type { EdgeSide, Point, Scene, SurfaceTreatment } from "@/lib/fdtd/scene";

import type { DrawingSettings } from "./model/drawing";
import { entityPoints, type EntityRef } from "./model/entities";
import type { Selection } from "./model/editor-state";
import type { Hit } from "./model/hit-testing";
import type { PmlBandWidths } from "./model/scene-extent";
import { niceStep, type SnapKind } from "./model/snapping";
import type { ToolId } from "./model/tools";
import { worldToScreen, type ScreenSize, type Viewport } from "./model/viewport";

/** House colours (app/globals.css), the same as the read-only scene sketch. */
export const CANVAS_COLOURS = {
  outside: "#ebe9e2",
  domain: "#fbfaf7",
  pml: "#e2eeec",
  pmlHatch: "rgba(18, 118, 115, 0.22)",
  gridMinor: "rgba(22, 33, 43, 0.055)",
  gridMajor: "rgba(22, 33, 43, 0.12)",
  axis: "rgba(22, 33, 43, 0.35)",
  rule: "#dedbd1",
  ruleStrong: "#c9c5b8",
  ink: "#16212b",
  inkSoft: "#3a4753",
  muted: "#66717c",
  panel: "#ffffff",
  solid: "#5a6670",
  wall: "#2c3a45",
  treated: "#d65a2c",
  source: "#d65a2c",
  receiver: "#127673",
  tide: "#127673",
  tide300: "#7cc3bd",
  halo: "rgba(251, 250, 247, 0.92)",
} as const;

/** Width of the rulers along the left and bottom edges, CSS px. */
export const RULER_SIZE = 22;

export interface StaticLayerInput {
  scene: Scene;
  bands: PmlBandWidths;
  view: Viewport;
  size: ScreenSize;
  /** Spacing of the fine grid lines, m. */
  gridStep: number;
  showGrid: boolean;
  showLabels: boolean;
  fontFamily: string;
  monoFontFamily: string;
}

function isTreated(treatment: SurfaceTreatment): boolean {
  return treatment.kind !== "rigid";
}

function tracePath(context: CanvasRenderingContext2D, view: Viewport, points: readonly Point[], close: boolean): void {
  context.beginPath();
  points.forEach((p, k) => {
    const s = worldToScreen(view, p);
    if (k === 0) context.moveTo(s.x, s.y);
    else context.lineTo(s.x, s.y);
  });
  if (close) context.closePath();
}

/** A metre value for an axis label: as many decimals as the tick step needs, "−" for minus. */
export function formatMetres(value: number, step: number): string {
  const decimals = Math.max(0, Math.min(4, Math.ceil(-Math.log10(step) - 1e-9)));
  const text = (Math.abs(value) < step * 1e-6 ? 0 : value).toFixed(decimals);
  return text.replace("-", "−");
}

/** Screen rectangles already holding a label, so that later labels that would overlap them are left out. */
type LabelSpace = { x: number; y: number; width: number; height: number }[];

/** Draws a label unless it would overlap one already drawn; returns whether it was drawn. */
function placeLabel(context: CanvasRenderingContext2D, taken: LabelSpace, text: string, x: number, y: number, colour: string, align: CanvasTextAlign = "left"): boolean {
  const width = context.measureText(text).width;
  const left = align === "right" ? x - width : align === "center" ? x - width / 2 : x;
  const box = { x: left - 2, y: y - 8, width: width + 4, height: 16 };
  if (taken.some((other) => box.x < other.x + other.width && other.x < box.x + box.width && box.y < other.y + other.height && other.y < box.y + box.height)) return false;
  taken.push(box);
  drawLabel(context, text, x, y, colour, align);
  return true;
}

function drawLabel(context: CanvasRenderingContext2D, text: string, x: number, y: number, colour: string, align: CanvasTextAlign = "left"): void {
  context.textAlign = align;
  context.textBaseline = "middle";
  context.lineJoin = "round";
  context.lineWidth = 3.5;
  context.strokeStyle = CANVAS_COLOURS.halo;
  context.strokeText(text, x, y);
  context.fillStyle = colour;
  context.fillText(text, x, y);
}

function drawPmlBands(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { scene, bands, view } = input;
  const { width, height } = scene.domain;
  const outer = { minX: -bands.left, minY: -bands.bottom, maxX: width + bands.right, maxY: height + bands.top };
  if (bands.left + bands.right + bands.bottom + bands.top === 0) return;
  const a = worldToScreen(view, { x: outer.minX, y: outer.maxY });
  const b = worldToScreen(view, { x: outer.maxX, y: outer.minY });
  const d0 = worldToScreen(view, { x: 0, y: height });
  const d1 = worldToScreen(view, { x: width, y: 0 });
  context.save();
  // The band is the grid rectangle minus the domain (even-odd fill of the two rectangles).
  context.beginPath();
  context.rect(a.x, a.y, b.x - a.x, b.y - a.y);
  context.rect(d0.x, d0.y, d1.x - d0.x, d1.y - d0.y);
  context.fillStyle = CANVAS_COLOURS.pml;
  context.fill("evenodd");
  context.clip("evenodd");
  context.strokeStyle = CANVAS_COLOURS.pmlHatch;
  context.lineWidth = 1;
  context.beginPath();
  const spacing = 7;
  for (let x = a.x - (b.y - a.y); x < b.x; x += spacing) {
    context.moveTo(x, b.y);
    context.lineTo(x + (b.y - a.y), a.y);
  }
  context.stroke();
  context.restore();
  context.strokeStyle = CANVAS_COLOURS.tide300;
  context.lineWidth = 1;
  context.setLineDash([4, 3]);
  context.strokeRect(a.x + 0.5, a.y + 0.5, b.x - a.x - 1, b.y - a.y - 1);
  context.setLineDash([]);

  // "PML 20 cells" in each band wide enough to hold it.
  context.font = `500 10.5px ${input.monoFontFamily}`;
  const label = (side: EdgeSide) => {
    const edge = scene.boundary[side];
    return edge.kind === "pml" ? `PML · ${edge.layerCells} cells` : "";
  };
  const bandPixels = (metres: number) => metres * view.pixelsPerMetre;
  context.fillStyle = CANVAS_COLOURS.tide;
  context.textBaseline = "middle";
  context.textAlign = "center";
  if (bandPixels(bands.top) >= 14) context.fillText(label("top"), (d0.x + d1.x) / 2, (a.y + d0.y) / 2);
  if (bandPixels(bands.bottom) >= 14) context.fillText(label("bottom"), (d0.x + d1.x) / 2, (d1.y + b.y) / 2);
  for (const side of ["left", "right"] as const) {
    if (bandPixels(bands[side]) < 14) continue;
    const x = side === "left" ? (a.x + d0.x) / 2 : (d1.x + b.x) / 2;
    context.save();
    context.translate(x, (d0.y + d1.y) / 2);
    context.rotate(-Math.PI / 2);
    context.fillText(label(side), 0, 0);
    context.restore();
  }
}

function drawGrid(context: CanvasRenderingContext2D, input: StaticLayerInput, majorStep: number): void {
  const { scene, view, gridStep } = input;
  const { width, height } = scene.domain;
  const d0 = worldToScreen(view, { x: 0, y: height });
  const d1 = worldToScreen(view, { x: width, y: 0 });
  context.save();
  context.beginPath();
  context.rect(d0.x, d0.y, d1.x - d0.x, d1.y - d0.y);
  context.clip();
  const lines = (step: number, colour: string) => {
    if (step * view.pixelsPerMetre < 4) return;
    context.strokeStyle = colour;
    context.lineWidth = 1;
    context.beginPath();
    for (let k = 0; k * step <= width + 1e-9; k++) {
      const x = Math.round(worldToScreen(view, { x: k * step, y: 0 }).x) + 0.5;
      context.moveTo(x, d0.y);
      context.lineTo(x, d1.y);
    }
    for (let k = 0; k * step <= height + 1e-9; k++) {
      const y = Math.round(worldToScreen(view, { x: 0, y: k * step }).y) + 0.5;
      context.moveTo(d0.x, y);
      context.lineTo(d1.x, y);
    }
    context.stroke();
  };
  if (gridStep < majorStep) lines(gridStep, CANVAS_COLOURS.gridMinor);
  lines(majorStep, CANVAS_COLOURS.gridMajor);
  context.restore();
}

function drawDomainEdges(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { scene, view } = input;
  const { width, height } = scene.domain;
  const corners: Record<EdgeSide, [Point, Point]> = {
    left: [{ x: 0, y: 0 }, { x: 0, y: height }],
    right: [{ x: width, y: 0 }, { x: width, y: height }],
    bottom: [{ x: 0, y: 0 }, { x: width, y: 0 }],
    top: [{ x: 0, y: height }, { x: width, y: height }],
  };
  const d0 = worldToScreen(view, { x: 0, y: height });
  const d1 = worldToScreen(view, { x: width, y: 0 });
  context.strokeStyle = CANVAS_COLOURS.ruleStrong;
  context.lineWidth = 1;
  context.strokeRect(d0.x + 0.5, d0.y + 0.5, d1.x - d0.x - 1, d1.y - d0.y - 1);
  for (const side of ["left", "right", "bottom", "top"] as const) {
    const edge = scene.boundary[side];
    if (edge.kind === "pml") continue;
    context.strokeStyle = edge.kind === "rigid" ? CANVAS_COLOURS.wall : CANVAS_COLOURS.treated;
    context.lineWidth = 3;
    context.lineCap = "square";
    tracePath(context, view, corners[side], false);
    context.stroke();
  }
  context.lineCap = "butt";
}

/** Positions of the receivers on a line: `count` points, both ends included. */
export function receiverLinePositions(from: Point, to: Point, count: number): Point[] {
  const points: Point[] = [];
  for (let k = 0; k < count; k++) {
    const t = count > 1 ? k / (count - 1) : 0;
    points.push({ x: from.x + t * (to.x - from.x), y: from.y + t * (to.y - from.y) });
  }
  return points;
}

/** Triangle of a receiver (a microphone mark), centred on (x, y) in screen px. */
function traceReceiverMark(context: CanvasRenderingContext2D, x: number, y: number, size: number): void {
  context.beginPath();
  context.moveTo(x, y - size);
  context.lineTo(x + size * 0.87, y + size * 0.5);
  context.lineTo(x - size * 0.87, y + size * 0.5);
  context.closePath();
}

function drawEntities(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { scene, view } = input;
  const ppm = view.pixelsPerMetre;

  for (const solid of scene.geometry.solids) {
    tracePath(context, view, solid.polygon, true);
    context.fillStyle = CANVAS_COLOURS.solid;
    context.globalAlpha = 0.88;
    context.fill();
    context.globalAlpha = 1;
    context.lineJoin = "round";
    context.strokeStyle = isTreated(solid.surface) ? CANVAS_COLOURS.treated : CANVAS_COLOURS.wall;
    context.lineWidth = isTreated(solid.surface) ? 2.5 : 1.25;
    context.stroke();
  }

  for (const wall of scene.geometry.walls) {
    tracePath(context, view, wall.path, false);
    context.lineJoin = "miter";
    context.lineCap = "square";
    context.strokeStyle = CANVAS_COLOURS.wall;
    context.lineWidth = Math.max(wall.thickness * ppm, 3);
    context.stroke();
    if (isTreated(wall.surface)) {
      context.strokeStyle = CANVAS_COLOURS.treated;
      context.lineWidth = Math.max(Math.min(wall.thickness * ppm * 0.45, 4), 1.5);
      context.stroke();
    }
    context.lineCap = "butt";
  }

  for (const surface of scene.geometry.surfaces) {
    tracePath(context, view, surface.path, false);
    context.lineJoin = "round";
    context.strokeStyle = CANVAS_COLOURS.halo;
    context.lineWidth = 5;
    context.stroke();
    context.strokeStyle = CANVAS_COLOURS.treated;
    context.lineWidth = 3;
    context.setLineDash([7, 4]);
    context.stroke();
    context.setLineDash([]);
  }

  for (const line of scene.receiverLines) {
    tracePath(context, view, [line.from, line.to], false);
    context.strokeStyle = CANVAS_COLOURS.receiver;
    context.lineWidth = 1.25;
    context.setLineDash([2, 4]);
    context.stroke();
    context.setLineDash([]);
    const positions = receiverLinePositions(line.from, line.to, line.count);
    // Individual receivers only while they are at least 5 px apart; otherwise the dotted line says enough.
    const spacing = Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y) * ppm / Math.max(1, line.count - 1);
    context.fillStyle = CANVAS_COLOURS.receiver;
    for (const [k, p] of positions.entries()) {
      if (spacing < 5 && k !== 0 && k !== positions.length - 1) continue;
      const s = worldToScreen(view, p);
      context.beginPath();
      context.arc(s.x, s.y, 2.4, 0, 2 * Math.PI);
      context.fill();
    }
  }

  for (const receiver of scene.receivers) {
    const s = worldToScreen(view, receiver.position);
    traceReceiverMark(context, s.x, s.y, 7);
    context.fillStyle = CANVAS_COLOURS.receiver;
    context.fill();
    context.strokeStyle = CANVAS_COLOURS.panel;
    context.lineWidth = 1.25;
    context.stroke();
  }

  for (const source of scene.sources) {
    const s = worldToScreen(view, source.position);
    // Two faint rings, a reminder that the source radiates.
    context.strokeStyle = "rgba(214, 90, 44, 0.35)";
    context.lineWidth = 1.25;
    for (const r of [10, 15]) {
      context.beginPath();
      context.arc(s.x, s.y, r, -Math.PI / 3, Math.PI / 3);
      context.stroke();
    }
    context.beginPath();
    context.arc(s.x, s.y, 6, 0, 2 * Math.PI);
    context.fillStyle = CANVAS_COLOURS.source;
    context.fill();
    context.strokeStyle = CANVAS_COLOURS.panel;
    context.lineWidth = 1.5;
    context.stroke();
  }
  if (input.showLabels) drawEntityLabels(context, input);
}

/**
 * Labels of sources and receivers, sources first: to the right of the mark, or to the left when that
 * side is taken or off the canvas; left out when neither side is free, so labels never pile up.
 */
function drawEntityLabels(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { scene, view, size } = input;
  const taken: LabelSpace = [];
  // Marks are obstacles too: a label must not cover a source, a receiver or a receiver line's receivers.
  const marks = [...scene.sources.map((s) => s.position), ...scene.receivers.map((r) => r.position), ...scene.receiverLines.flatMap((line) => receiverLinePositions(line.from, line.to, Math.min(line.count, 200)))];
  for (const p of marks) {
    const s = worldToScreen(view, p);
    taken.push({ x: s.x - 6, y: s.y - 6, width: 12, height: 12 });
  }
  context.font = `500 11.5px ${input.fontFamily}`;
  const place = (text: string, p: Point, gap: number, colour: string) => {
    const s = worldToScreen(view, p);
    const width = context.measureText(text).width;
    const rightFits = s.x + gap + width < size.width - 4;
    const leftFits = s.x - gap - width > RULER_SIZE + 4;
    if (rightFits && placeLabel(context, taken, text, s.x + gap, s.y - 1, colour)) return;
    if (leftFits && placeLabel(context, taken, text, s.x - gap, s.y - 1, colour, "right")) return;
    // Above, then below, the mark: a receiver on a receiver line has neighbours left and right.
    if (placeLabel(context, taken, text, s.x, s.y - 16, colour, "center")) return;
    placeLabel(context, taken, text, s.x, s.y + 16, colour, "center");
  };
  for (const source of scene.sources) place(source.label || source.id, source.position, 19, "#a23f1a");
  for (const receiver of scene.receivers) place(receiver.label || receiver.id, receiver.position, 10, CANVAS_COLOURS.tide);
}

function drawRulers(context: CanvasRenderingContext2D, input: StaticLayerInput, majorStep: number): void {
  const { view, size } = input;
  const r = RULER_SIZE;
  context.fillStyle = "rgba(255, 255, 255, 0.94)";
  context.fillRect(0, size.height - r, size.width, r);
  context.fillRect(0, 0, r, size.height - r);
  context.strokeStyle = CANVAS_COLOURS.rule;
  context.lineWidth = 1;
  context.beginPath();
  context.moveTo(0, size.height - r + 0.5);
  context.lineTo(size.width, size.height - r + 0.5);
  context.moveTo(r - 0.5, 0);
  context.lineTo(r - 0.5, size.height - r);
  context.stroke();

  context.font = `10.5px ${input.monoFontFamily}`;
  context.fillStyle = CANVAS_COLOURS.muted;
  context.strokeStyle = CANVAS_COLOURS.axis;
  const minor = majorStep / 5;
  const showMinor = minor * view.pixelsPerMetre >= 6;

  // Bottom ruler: x in metres.
  const xStart = Math.floor(-view.originX / view.pixelsPerMetre / minor) * minor;
  const xEnd = (size.width - view.originX) / view.pixelsPerMetre;
  context.textAlign = "left";
  context.textBaseline = "middle";
  context.beginPath();
  for (let k = 0; xStart + k * minor <= xEnd; k++) {
    const value = xStart + k * minor;
    const x = Math.round(view.originX + value * view.pixelsPerMetre) + 0.5;
    if (x < r) continue;
    const major = Math.abs(value / majorStep - Math.round(value / majorStep)) < 1e-6;
    if (!major && !showMinor) continue;
    context.moveTo(x, size.height - r);
    context.lineTo(x, size.height - r + (major ? 7 : 3.5));
    if (major) context.fillText(formatMetres(value, majorStep), x + 3, size.height - r / 2 + 3);
  }
  // Left ruler: y in metres, labels written upwards.
  const yStart = Math.floor((view.originY - (size.height - r)) / view.pixelsPerMetre / minor) * minor;
  const yEnd = view.originY / view.pixelsPerMetre;
  for (let k = 0; yStart + k * minor <= yEnd; k++) {
    const value = yStart + k * minor;
    const y = Math.round(view.originY - value * view.pixelsPerMetre) + 0.5;
    if (y > size.height - r) continue;
    const major = Math.abs(value / majorStep - Math.round(value / majorStep)) < 1e-6;
    if (!major && !showMinor) continue;
    context.moveTo(r, y);
    context.lineTo(r - (major ? 7 : 3.5), y);
    if (major) {
      context.save();
      context.translate(r / 2 - 2, y - 3);
      context.rotate(-Math.PI / 2);
      context.fillText(formatMetres(value, majorStep), 0, 0);
      context.restore();
    }
  }
  context.stroke();
  // The unit in the corner where the rulers meet.
  context.fillStyle = CANVAS_COLOURS.panel;
  context.fillRect(0, size.height - r, r, r);
  context.fillStyle = CANVAS_COLOURS.inkSoft;
  context.textAlign = "center";
  context.font = `600 10.5px ${input.monoFontFamily}`;
  context.fillText("m", r / 2, size.height - r / 2);
}

/** Spacing of the labelled ruler ticks and the stronger grid lines: at least 64 px apart. */
export function majorStepFor(view: Viewport): number {
  return niceStep(64 / view.pixelsPerMetre);
}

/** Draws the whole static layer; the context's transform must map CSS px to device px. */
export function renderStaticLayer(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { size } = input;
  const majorStep = majorStepFor(input.view);
  context.fillStyle = CANVAS_COLOURS.outside;
  context.fillRect(0, 0, size.width, size.height);
  drawPmlBands(context, input);
  const { width, height } = input.scene.domain;
  const d0 = worldToScreen(input.view, { x: 0, y: height });
  const d1 = worldToScreen(input.view, { x: width, y: 0 });
  context.fillStyle = CANVAS_COLOURS.domain;
  context.fillRect(d0.x, d0.y, d1.x - d0.x, d1.y - d0.y);
  if (input.showGrid) drawGrid(context, input, majorStep);
  drawDomainEdges(context, input);
  drawEntities(context, input);
  drawRulers(context, input, majorStep);
}

// ---------------------------------------------------------------------------------------------
// Overlay

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
  const points = entityPoints(scene, selection.ref);
  if (selection.ref.kind === "source" || selection.ref.kind === "receiver") return;
  points.forEach((p, index) => {
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
    const s = worldToScreen(view, hover.part.at);
    context.fillStyle = CANVAS_COLOURS.tide;
    context.beginPath();
    context.arc(s.x, s.y, 3.5, 0, 2 * Math.PI);
    context.fill();
  }
  if (input.drawing) drawPreview(context, input, input.drawing);
  if (input.snapMark) drawSnapMark(context, view, input.snapMark);
}
