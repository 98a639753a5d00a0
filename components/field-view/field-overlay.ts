// The vector layer above the field: PML bands and boundary marks, the scene (solids, walls, treated
// surfaces, receiver lines, receivers, sources), intensity arrows, axes in metres, the caption and the
// colour bar with its unit. Drawn with the 2D canvas API onto a canvas the size of the WebGL one, in CSS
// pixels scaled by the device pixel ratio so lines and text stay crisp.
import type { EdgeSide, Point, Scene, SurfaceTreatment } from "@/lib/fdtd/scene";

import type { ColourScale } from "./colour-scales";
import { formatTick } from "./format";
import type { IntensityArrowField } from "./intensity-arrows";
import { colourBarTicks, EDGE_SIDES, niceTickStep, ticksBetween, toPixelX, toPixelY, type SceneExtent, type ViewLayout } from "./view-layout";

/** House colours (app/globals.css) the overlay draws with. */
export const OVERLAY_COLOURS = {
  panel: "#ffffff",
  ink: "#16212b",
  inkSoft: "#3a4753",
  muted: "#66717c",
  rule: "#dedbd1",
  ruleStrong: "#c9c5b8",
  tide: "#127673",
  tideDeep: "#0d5f5d",
  pmlTint: "rgba(207, 232, 230, 0.55)",
  pmlHatch: "rgba(18, 118, 115, 0.28)",
  ember: "#d65a2c",
  emberDeep: "#a23f1a",
  solid: "#4b5863",
  halo: "rgba(255, 255, 255, 0.9)",
} as const;

export interface ColourBarSpec {
  scale: ColourScale;
  /** Values at the bottom and top of the bar, in the unit shown (the field's values times `factor`). */
  low: number;
  high: number;
  /** Unit written above the bar, e.g. "mPa" or "dB re 20 \u00b5Pa". */
  unit: string;
  /** A short name above the unit, e.g. "Pressure" or "\u0394L". */
  quantity: string;
  /** Label positive ticks with "+" (signed quantities). */
  signed: boolean;
}

export interface OverlayInput {
  layout: ViewLayout;
  extent: SceneExtent;
  scene: Scene;
  /** Caption above the plot: a title and a quieter detail after it (time, step). */
  title: string;
  detail?: string;
  /** Absent when there is nothing to scale (no field yet). */
  colourBar?: ColourBarSpec;
  arrows?: IntensityArrowField;
  /** True where the field under scene point (x, y) m is drawn dark: arrows there are drawn light. */
  isDarkAt?: (x: number, y: number) => boolean;
  /** Font family list for the text (the page's own, read from CSS). */
  fontFamily: string;
}

/** Draws the whole overlay; the canvas must already have its device-pixel size. */
export function renderFieldOverlay(context: CanvasRenderingContext2D, input: OverlayInput): void {
  const { layout } = input;
  context.setTransform(1, 0, 0, 1, 0, 0);
  context.clearRect(0, 0, context.canvas.width, context.canvas.height);
  context.setTransform(layout.pixelRatio, 0, 0, layout.pixelRatio, 0, 0);
  context.lineJoin = "round";
  context.lineCap = "butt";

  drawPmlBands(context, input);
  context.save();
  clipToOuter(context, input);
  if (input.arrows) drawArrows(context, input, input.arrows);
  drawSolids(context, input);
  drawWalls(context, input);
  drawSurfaces(context, input);
  drawReceiverLines(context, input);
  drawReceivers(context, input);
  drawSources(context, input);
  context.restore();
  drawFrame(context, input);
  drawAxes(context, input);
  drawCaption(context, input);
  drawColourBar(context, input);
}

// ---------------------------------------------------------------------------------------------------
// Helpers

const px = (layout: ViewLayout, p: Point): [number, number] => [toPixelX(layout, p.x), toPixelY(layout, p.y)];

function font(input: OverlayInput, size: number, weight = 400): string {
  return `${weight} ${size}px ${input.fontFamily}`;
}

function tracePolyline(context: CanvasRenderingContext2D, layout: ViewLayout, points: readonly Point[], close = false): void {
  context.beginPath();
  points.forEach((p, k) => {
    const [x, y] = px(layout, p);
    if (k === 0) context.moveTo(x, y);
    else context.lineTo(x, y);
  });
  if (close) context.closePath();
}

function isTreated(surface: SurfaceTreatment): boolean {
  return surface.kind !== "rigid";
}

function clipToOuter(context: CanvasRenderingContext2D, { layout, extent }: OverlayInput): void {
  const left = toPixelX(layout, extent.outer.xMin);
  const right = toPixelX(layout, extent.outer.xMax);
  const top = toPixelY(layout, extent.outer.yMax);
  const bottom = toPixelY(layout, extent.outer.yMin);
  context.beginPath();
  context.rect(left, top, right - left, bottom - top);
  context.clip();
}

// ---------------------------------------------------------------------------------------------------
// Boundary

function drawPmlBands(context: CanvasRenderingContext2D, input: OverlayInput): void {
  const { layout, extent } = input;
  const d = extent.domain;
  const o = extent.outer;
  const bands: Record<EdgeSide, [number, number, number, number]> = {
    left: [o.xMin, o.yMin, d.xMin, o.yMax],
    right: [d.xMax, o.yMin, o.xMax, o.yMax],
    bottom: [d.xMin, o.yMin, d.xMax, d.yMin],
    top: [d.xMin, d.yMax, d.xMax, o.yMax],
  };
  for (const side of EDGE_SIDES) {
    if (!(extent.pml[side] > 0)) continue;
    const [x0, y0, x1, y1] = bands[side];
    const left = toPixelX(layout, x0);
    const right = toPixelX(layout, x1);
    const top = toPixelY(layout, y1);
    const bottom = toPixelY(layout, y0);
    context.save();
    context.beginPath();
    context.rect(left, top, right - left, bottom - top);
    context.fillStyle = OVERLAY_COLOURS.pmlTint;
    context.fill();
    context.clip();
    // Diagonal hatching: an absorbing layer, not part of the computed field.
    context.strokeStyle = OVERLAY_COLOURS.pmlHatch;
    context.lineWidth = 1;
    context.beginPath();
    const step = 7;
    for (let s = left - (bottom - top); s < right; s += step) {
      context.moveTo(s, bottom);
      context.lineTo(s + (bottom - top), top);
    }
    context.stroke();
    context.restore();
  }
  // One label on the widest band, where it fits.
  const labelSide = EDGE_SIDES.filter((side) => extent.pml[side] * layout.pixelsPerMetre >= 13).sort((a, b) => (a === "top" ? -1 : b === "top" ? 1 : 0))[0];
  if (labelSide) {
    const cells = extent.pmlCells[labelSide];
    const label = `PML \u00b7 ${cells} cells, ${extent.pml[labelSide].toFixed(2)} m`;
    context.font = font(input, 10, 500);
    context.fillStyle = OVERLAY_COLOURS.tideDeep;
    context.textBaseline = "middle";
    const thickness = extent.pml[labelSide] * layout.pixelsPerMetre;
    if (labelSide === "top" || labelSide === "bottom") {
      const y = labelSide === "top" ? toPixelY(layout, extent.domain.yMax) - thickness / 2 : toPixelY(layout, extent.domain.yMin) + thickness / 2;
      context.textAlign = "left";
      drawHaloText(context, label, toPixelX(layout, extent.domain.xMin) + 6, y);
    } else {
      const x = labelSide === "left" ? toPixelX(layout, extent.domain.xMin) - thickness / 2 : toPixelX(layout, extent.domain.xMax) + thickness / 2;
      context.save();
      context.translate(x, toPixelY(layout, extent.domain.yMax) + 6);
      context.rotate(Math.PI / 2);
      context.textAlign = "left";
      drawHaloText(context, label, 0, 0);
      context.restore();
    }
  }
}

function drawHaloText(context: CanvasRenderingContext2D, text: string, x: number, y: number): void {
  context.save();
  context.strokeStyle = "rgba(255, 255, 255, 0.85)";
  context.lineWidth = 3;
  context.lineJoin = "round";
  context.strokeText(text, x, y);
  context.restore();
  context.fillText(text, x, y);
}

/** Depth of the hatch drawn outside a rigid outer side, CSS px. */
const RIGID_HATCH_DEPTH = 6;

function drawFrame(context: CanvasRenderingContext2D, input: OverlayInput): void {
  const { layout, extent, scene } = input;
  const d = extent.domain;
  const left = toPixelX(layout, d.xMin);
  const right = toPixelX(layout, d.xMax);
  const top = toPixelY(layout, d.yMax);
  const bottom = toPixelY(layout, d.yMin);
  context.strokeStyle = OVERLAY_COLOURS.inkSoft;
  context.lineWidth = 1;
  context.strokeRect(left + 0.5, top + 0.5, right - left - 1, bottom - top - 1);
  const o = extent.outer;
  context.strokeStyle = OVERLAY_COLOURS.ruleStrong;
  context.strokeRect(toPixelX(layout, o.xMin) + 0.5, toPixelY(layout, o.yMax) + 0.5, (o.xMax - o.xMin) * layout.pixelsPerMetre - 1, (o.yMax - o.yMin) * layout.pixelsPerMetre - 1);

  // Reflecting outer sides: a heavy line with the engineering hatch on the far side (rigid), or the treated-
  // surface dashes (impedance).
  const sides: Record<EdgeSide, { from: [number, number]; to: [number, number]; outward: [number, number] }> = {
    left: { from: [left, top], to: [left, bottom], outward: [-1, 0] },
    right: { from: [right, top], to: [right, bottom], outward: [1, 0] },
    bottom: { from: [left, bottom], to: [right, bottom], outward: [0, 1] },
    top: { from: [left, top], to: [right, top], outward: [0, -1] },
  };
  for (const side of EDGE_SIDES) {
    const edge = scene.boundary[side];
    if (edge.kind === "pml") continue;
    const { from, to, outward } = sides[side];
    context.save();
    if (edge.kind === "rigid") {
      context.strokeStyle = OVERLAY_COLOURS.ink;
      context.lineWidth = 1;
      context.beginPath();
      const length = Math.hypot(to[0] - from[0], to[1] - from[1]);
      const ux = (to[0] - from[0]) / length;
      const uy = (to[1] - from[1]) / length;
      for (let s = 4; s < length; s += 7) {
        const x = from[0] + ux * s + outward[0] * 1.5;
        const y = from[1] + uy * s + outward[1] * 1.5;
        context.moveTo(x, y);
        context.lineTo(x + outward[0] * (RIGID_HATCH_DEPTH - 1.5) - ux * 4, y + outward[1] * (RIGID_HATCH_DEPTH - 1.5) - uy * 4);
      }
      context.stroke();
      context.lineWidth = 2.5;
    } else {
      context.strokeStyle = OVERLAY_COLOURS.emberDeep;
      context.lineWidth = 3;
      context.setLineDash([7, 4]);
    }
    context.beginPath();
    context.moveTo(from[0], from[1]);
    context.lineTo(to[0], to[1]);
    context.stroke();
    context.restore();
  }
}

// ---------------------------------------------------------------------------------------------------
// Scene

function drawSolids(context: CanvasRenderingContext2D, { layout, scene }: OverlayInput): void {
  for (const solid of scene.geometry.solids) {
    tracePolyline(context, layout, solid.polygon, true);
    context.fillStyle = OVERLAY_COLOURS.solid;
    context.fill();
    context.strokeStyle = isTreated(solid.surface) ? OVERLAY_COLOURS.ember : OVERLAY_COLOURS.ink;
    context.lineWidth = isTreated(solid.surface) ? 2 : 1;
    context.stroke();
  }
}

function drawWalls(context: CanvasRenderingContext2D, { layout, scene }: OverlayInput): void {
  for (const wall of scene.geometry.walls) {
    const width = Math.max(wall.thickness * layout.pixelsPerMetre, 3);
    tracePolyline(context, layout, wall.path);
    context.lineCap = "square";
    context.strokeStyle = OVERLAY_COLOURS.halo;
    context.lineWidth = width + 3;
    context.stroke();
    context.strokeStyle = OVERLAY_COLOURS.ink;
    context.lineWidth = width;
    context.stroke();
    if (isTreated(wall.surface)) {
      context.strokeStyle = OVERLAY_COLOURS.ember;
      context.lineWidth = Math.max(1, width / 3);
      context.stroke();
    }
    context.lineCap = "butt";
  }
}

function drawSurfaces(context: CanvasRenderingContext2D, { layout, scene }: OverlayInput): void {
  for (const surface of scene.geometry.surfaces) {
    tracePolyline(context, layout, surface.path);
    context.strokeStyle = OVERLAY_COLOURS.halo;
    context.lineWidth = 5;
    context.stroke();
    context.setLineDash([6, 4]);
    context.strokeStyle = OVERLAY_COLOURS.emberDeep;
    context.lineWidth = 2.5;
    context.stroke();
    context.setLineDash([]);
  }
}

function drawReceiverLines(context: CanvasRenderingContext2D, { layout, scene }: OverlayInput): void {
  for (const line of scene.receiverLines) {
    const [x0, y0] = px(layout, line.from);
    const [x1, y1] = px(layout, line.to);
    context.beginPath();
    context.moveTo(x0, y0);
    context.lineTo(x1, y1);
    context.strokeStyle = OVERLAY_COLOURS.halo;
    context.lineWidth = 3;
    context.stroke();
    context.strokeStyle = OVERLAY_COLOURS.tideDeep;
    context.lineWidth = 1;
    context.setLineDash([2, 3]);
    context.stroke();
    context.setLineDash([]);
    for (let k = 0; k < line.count; k++) {
      const f = line.count > 1 ? k / (line.count - 1) : 0;
      context.beginPath();
      context.arc(x0 + (x1 - x0) * f, y0 + (y1 - y0) * f, 2.6, 0, 2 * Math.PI);
      context.fillStyle = OVERLAY_COLOURS.tideDeep;
      context.strokeStyle = OVERLAY_COLOURS.halo;
      context.lineWidth = 1.5;
      context.stroke();
      context.fill();
    }
  }
}

function drawReceivers(context: CanvasRenderingContext2D, { layout, scene }: OverlayInput): void {
  const s = 6;
  for (const receiver of scene.receivers) {
    const [x, y] = px(layout, receiver.position);
    context.beginPath();
    context.moveTo(x, y - s);
    context.lineTo(x + s * 0.87, y + s * 0.5);
    context.lineTo(x - s * 0.87, y + s * 0.5);
    context.closePath();
    context.strokeStyle = OVERLAY_COLOURS.halo;
    context.lineWidth = 3;
    context.stroke();
    context.fillStyle = OVERLAY_COLOURS.tide;
    context.fill();
    context.strokeStyle = OVERLAY_COLOURS.ink;
    context.lineWidth = 1.25;
    context.stroke();
  }
}

function drawSources(context: CanvasRenderingContext2D, { layout, scene }: OverlayInput): void {
  for (const source of scene.sources) {
    const [x, y] = px(layout, source.position);
    context.beginPath();
    context.arc(x, y, 5, 0, 2 * Math.PI);
    context.strokeStyle = OVERLAY_COLOURS.halo;
    context.lineWidth = 3.5;
    context.stroke();
    context.fillStyle = OVERLAY_COLOURS.ember;
    context.fill();
    context.strokeStyle = OVERLAY_COLOURS.ink;
    context.lineWidth = 1;
    context.stroke();
  }
}

// ---------------------------------------------------------------------------------------------------
// Intensity

function drawArrows(context: CanvasRenderingContext2D, { layout, isDarkAt }: OverlayInput, field: IntensityArrowField): void {
  const full = Math.max(6, field.arrowSpacing * layout.pixelsPerMetre * 0.85);
  context.lineCap = "round";
  context.lineJoin = "round";
  // Dark strokes with a light halo on light parts of the map, light strokes with a dark halo on dark parts.
  const styles = {
    light: { halo: "rgba(255, 255, 255, 0.55)", stroke: "rgba(22, 33, 43, 0.9)" },
    dark: { halo: "rgba(17, 32, 41, 0.45)", stroke: "rgba(255, 255, 255, 0.92)" },
  };
  for (const pass of ["halo", "stroke"] as const) {
    context.lineWidth = pass === "halo" ? 2.8 : 1.15;
    for (const arrow of field.arrows) {
      const length = full * arrow.lengthFraction;
      if (length < 2) continue;
      context.strokeStyle = styles[isDarkAt?.(arrow.x, arrow.y) ? "dark" : "light"][pass];
      // Centred on the block; screen y runs down, so the y direction flips.
      const cx = toPixelX(layout, arrow.x);
      const cy = toPixelY(layout, arrow.y);
      const dx = arrow.directionX * length;
      const dy = -arrow.directionY * length;
      const tipX = cx + dx / 2;
      const tipY = cy + dy / 2;
      const head = Math.min(4.5, 1.5 + length * 0.2);
      const ux = dx / length;
      const uy = dy / length;
      context.beginPath();
      context.moveTo(cx - dx / 2, cy - dy / 2);
      context.lineTo(tipX, tipY);
      context.moveTo(tipX - ux * head - uy * head * 0.6, tipY - uy * head + ux * head * 0.6);
      context.lineTo(tipX, tipY);
      context.lineTo(tipX - ux * head + uy * head * 0.6, tipY - uy * head - ux * head * 0.6);
      context.stroke();
    }
  }
  context.lineCap = "butt";
}

// ---------------------------------------------------------------------------------------------------
// Axes, caption, colour bar

function drawAxes(context: CanvasRenderingContext2D, input: OverlayInput): void {
  const { layout, extent, scene } = input;
  const d = extent.domain;
  // A reflecting side carries the hatch just outside the frame: the axis steps clear of it.
  const bottom = toPixelY(layout, extent.outer.yMin) + (scene.boundary.bottom.kind === "pml" ? 0 : RIGID_HATCH_DEPTH);
  const left = toPixelX(layout, extent.outer.xMin) - (scene.boundary.left.kind === "pml" ? 0 : RIGID_HATCH_DEPTH);
  context.strokeStyle = OVERLAY_COLOURS.inkSoft;
  context.fillStyle = OVERLAY_COLOURS.inkSoft;
  context.lineWidth = 1;
  context.font = font(input, 11);

  const xStep = niceTickStep(d.xMax - d.xMin, Math.max(2, Math.floor(((d.xMax - d.xMin) * layout.pixelsPerMetre) / 80)));
  const yStep = niceTickStep(d.yMax - d.yMin, Math.max(2, Math.floor(((d.yMax - d.yMin) * layout.pixelsPerMetre) / 48)));
  const xTicks = ticksBetween(d.xMin, d.xMax, xStep);
  const yTicks = ticksBetween(d.yMin, d.yMax, yStep);

  context.beginPath();
  for (const x of xTicks) {
    const sx = Math.round(toPixelX(layout, x)) + 0.5;
    context.moveTo(sx, bottom);
    context.lineTo(sx, bottom + 5);
  }
  for (const y of yTicks) {
    const sy = Math.round(toPixelY(layout, y)) + 0.5;
    context.moveTo(left, sy);
    context.lineTo(left - 5, sy);
  }
  context.stroke();

  context.textAlign = "center";
  context.textBaseline = "top";
  for (const x of xTicks) context.fillText(formatTick(x, xStep), toPixelX(layout, x), bottom + 7);
  context.textAlign = "right";
  context.textBaseline = "middle";
  for (const y of yTicks) context.fillText(formatTick(y, yStep), left - 8, toPixelY(layout, y));

  context.fillStyle = OVERLAY_COLOURS.muted;
  context.font = font(input, 11, 500);
  context.textAlign = "center";
  context.textBaseline = "top";
  context.fillText("x (m)", layout.plot.x + layout.plot.width / 2, bottom + 23);
  context.save();
  context.translate(left - 38, layout.plot.y + layout.plot.height / 2);
  context.rotate(-Math.PI / 2);
  context.textBaseline = "bottom";
  context.fillText("y (m)", 0, 0);
  context.restore();
}

function drawCaption(context: CanvasRenderingContext2D, input: OverlayInput): void {
  const { layout } = input;
  const y = layout.plot.y - 11;
  context.textBaseline = "alphabetic";
  context.textAlign = "left";
  context.font = font(input, 13, 600);
  context.fillStyle = OVERLAY_COLOURS.ink;
  context.fillText(input.title, layout.plot.x, y);
  const titleWidth = context.measureText(input.title).width;
  if (input.detail) {
    context.font = font(input, 12);
    context.fillStyle = OVERLAY_COLOURS.muted;
    context.fillText(input.detail, layout.plot.x + titleWidth + 10, y);
  }
  if (input.arrows && input.arrows.arrows.length > 0) {
    context.textAlign = "right";
    context.font = font(input, 11);
    context.fillStyle = OVERLAY_COLOURS.inkSoft;
    const legend = `Intensity: length \u221d level over ${input.arrows.dynamicRangeDb} dB, full length ${formatIntensity(input.arrows.maxMagnitude)}`;
    const right = layout.plot.x + layout.plot.width;
    context.fillText(legend, right, y);
    // A sample arrow before the words.
    const end = right - context.measureText(legend).width - 8;
    context.strokeStyle = OVERLAY_COLOURS.ink;
    context.lineWidth = 1.2;
    context.lineCap = "round";
    context.beginPath();
    context.moveTo(end - 18, y - 4);
    context.lineTo(end, y - 4);
    context.moveTo(end - 4, y - 7);
    context.lineTo(end, y - 4);
    context.lineTo(end - 4, y - 1);
    context.stroke();
    context.lineCap = "butt";
  }
}

/** W/m^2 to 2 significant figures with a fitting prefix. */
export function formatIntensity(watts: number): string {
  const units: [number, string][] = [
    [1, "W/m\u00b2"],
    [1e-3, "mW/m\u00b2"],
    [1e-6, "\u00b5W/m\u00b2"],
    [1e-9, "nW/m\u00b2"],
  ];
  const [factor, unit] = units.find(([f]) => watts >= f) ?? [1e-12, "pW/m\u00b2"];
  return `${(watts / factor).toPrecision(2)} ${unit}`;
}

// The colour table as a 1 x 256 image, highest entry at the top, built once per scale.
const barImages = new WeakMap<ColourScale, HTMLCanvasElement>();

function barImage(scale: ColourScale): HTMLCanvasElement | undefined {
  const cached = barImages.get(scale);
  if (cached) return cached;
  const entries = scale.lut.length / 4;
  const canvas = document.createElement("canvas");
  canvas.width = 1;
  canvas.height = entries;
  const context = canvas.getContext("2d");
  if (!context) return undefined;
  const image = context.createImageData(1, entries);
  for (let i = 0; i < entries; i++) {
    const row = entries - 1 - i;
    for (let c = 0; c < 4; c++) image.data[4 * row + c] = scale.lut[4 * i + c]!;
  }
  context.putImageData(image, 0, 0);
  barImages.set(scale, canvas);
  return canvas;
}

function drawColourBar(context: CanvasRenderingContext2D, input: OverlayInput): void {
  const { colourBar: spec, layout } = input;
  if (!spec) return;
  const bar = layout.colourBar;
  const image = barImage(spec.scale);
  if (image) {
    context.save();
    context.imageSmoothingEnabled = true;
    context.drawImage(image, bar.x, bar.y, bar.width, bar.height);
    context.restore();
  }
  context.strokeStyle = OVERLAY_COLOURS.inkSoft;
  context.lineWidth = 1;
  context.strokeRect(Math.round(bar.x) + 0.5, Math.round(bar.y) + 0.5, Math.round(bar.width) - 1, Math.round(bar.height) - 1);

  // Quantity and unit above the bar.
  context.textAlign = "left";
  context.textBaseline = "alphabetic";
  context.font = font(input, 11, 600);
  context.fillStyle = OVERLAY_COLOURS.ink;
  context.fillText(spec.quantity, bar.x, bar.y - 23);
  context.font = font(input, 10.5);
  context.fillStyle = OVERLAY_COLOURS.muted;
  // Clear of the top tick label, which is centred on the bar's top edge.
  context.fillText(spec.unit, bar.x, bar.y - 10);

  const span = spec.high - spec.low;
  if (!(span > 0)) return;
  const { ticks, step } = colourBarTicks(spec.low, spec.high, Math.max(3, Math.min(8, Math.floor(bar.height / 30))));
  context.font = font(input, 10.5);
  context.fillStyle = OVERLAY_COLOURS.inkSoft;
  context.textBaseline = "middle";
  context.beginPath();
  for (const value of ticks) {
    const y = Math.round(bar.y + bar.height * (1 - (value - spec.low) / span)) + 0.5;
    context.moveTo(bar.x + bar.width, y);
    context.lineTo(bar.x + bar.width + 4, y);
  }
  context.stroke();
  for (const value of ticks) {
    const y = bar.y + bar.height * (1 - (value - spec.low) / span);
    context.fillText(formatTick(value, step, spec.signed), bar.x + bar.width + 7, y);
  }
}
