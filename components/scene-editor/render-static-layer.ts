// The static layer of the drawing canvas: what changes only with the scene or the view. The grid and
// domain, PML bands outside it (to scale), rigid and treated outer faces, solids, barriers, treated
// surfaces, receiver lines, receivers, sources, their labels, and rulers in metres. Drawn whole with the
// 2D canvas API, in CSS pixels on a canvas scaled by the device pixel ratio.
import type { EdgeSide, Point, Scene } from "@/lib/fdtd/scene";

import { CANVAS_COLOURS, formatMetres, isTreated, placeLabel, receiverLinePositions, RULER_SIZE, traceReceiverMark, tracePath, type LabelSpace } from "./canvas-style";
import type { PmlBandWidths } from "./model/scene-extent";
import { niceStep } from "./model/snapping";
import { worldToScreen, type ScreenSize, type Viewport } from "./model/viewport";

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

function drawPmlBands(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { scene, bands, view } = input;
  const { width, height } = scene.domain;
  if (bands.left + bands.right + bands.bottom + bands.top === 0) return;
  const outer = { minX: -bands.left, minY: -bands.bottom, maxX: width + bands.right, maxY: height + bands.top };
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

  // "PML · 20 cells" in each band wide enough to hold it.
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
    // Half-pixel offsets keep one-pixel lines sharp.
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

/** The domain's outline, and each side that is not a PML as a rigid (ink) or treated (ember) face. */
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
    // True thickness, but never thinner than 3 px: a 12 cm barrier must stay visible on a 50 m site.
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
    const spacing = (Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y) * ppm) / Math.max(1, line.count - 1);
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
    // Two faint arcs, a reminder that the source radiates.
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
 * Labels of sources and receivers, sources first: to the right of the mark, else to the left, else above
 * or below it; left out when no place is free, so labels never pile up.
 */
function drawEntityLabels(context: CanvasRenderingContext2D, input: StaticLayerInput): void {
  const { scene, view, size } = input;
  const taken: LabelSpace = [];
  // Marks are obstacles too: a label must not cover a source, a receiver or a receiver line's receivers.
  const marks = [
    ...scene.sources.map((s) => s.position),
    ...scene.receivers.map((r) => r.position),
    ...scene.receiverLines.flatMap((line) => receiverLinePositions(line.from, line.to, Math.min(line.count, 200))),
  ];
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
  const isMajor = (value: number) => Math.abs(value / majorStep - Math.round(value / majorStep)) < 1e-6;

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
    const major = isMajor(value);
    if (!major && !showMinor) continue;
    context.moveTo(x, size.height - r);
    context.lineTo(x, size.height - r + (major ? 7 : 3.5));
    const text = formatMetres(value, majorStep);
    if (major && x + 3 + context.measureText(text).width < size.width - 2) context.fillText(text, x + 3, size.height - r / 2 + 3);
  }
  // Left ruler: y in metres, labels written upwards from their ticks.
  const yStart = Math.floor((view.originY - (size.height - r)) / view.pixelsPerMetre / minor) * minor;
  const yEnd = view.originY / view.pixelsPerMetre;
  for (let k = 0; yStart + k * minor <= yEnd; k++) {
    const value = yStart + k * minor;
    const y = Math.round(view.originY - value * view.pixelsPerMetre) + 0.5;
    if (y > size.height - r) continue;
    const major = isMajor(value);
    if (!major && !showMinor) continue;
    context.moveTo(r, y);
    context.lineTo(r - (major ? 7 : 3.5), y);
    const text = formatMetres(value, majorStep);
    // A label that would be cut off at the top is left out.
    if (major && y - 3 - context.measureText(text).width > 2) {
      context.save();
      context.translate(r / 2 - 2, y - 3);
      context.rotate(-Math.PI / 2);
      context.fillText(text, 0, 0);
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
