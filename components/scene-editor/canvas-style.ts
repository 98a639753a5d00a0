// The canvas layers' shared look: house colours, the ruler size, and small drawing helpers in CSS
// pixels (paths in metres through the view, labels with a halo, receiver marks).
import type { Point, SurfaceTreatment } from "@/lib/fdtd/scene";

import { worldToScreen, type Viewport } from "./model/viewport";

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

export function isTreated(treatment: SurfaceTreatment): boolean {
  return treatment.kind !== "rigid";
}

/** Starts a path through scene points (metres), optionally closed. */
export function tracePath(context: CanvasRenderingContext2D, view: Viewport, points: readonly Point[], close: boolean): void {
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

/** Text with a pale halo, so it reads over grid lines and shapes. */
export function drawLabel(context: CanvasRenderingContext2D, text: string, x: number, y: number, colour: string, align: CanvasTextAlign = "left"): void {
  context.textAlign = align;
  context.textBaseline = "middle";
  context.lineJoin = "round";
  context.lineWidth = 3.5;
  context.strokeStyle = CANVAS_COLOURS.halo;
  context.strokeText(text, x, y);
  context.fillStyle = colour;
  context.fillText(text, x, y);
}

/** Screen rectangles already holding a label or a mark, so that later labels that would overlap them are left out. */
export type LabelSpace = { x: number; y: number; width: number; height: number }[];

/** Draws a label unless it would overlap something in `taken`; returns whether it was drawn. */
export function placeLabel(context: CanvasRenderingContext2D, taken: LabelSpace, text: string, x: number, y: number, colour: string, align: CanvasTextAlign = "left"): boolean {
  const width = context.measureText(text).width;
  const left = align === "right" ? x - width : align === "center" ? x - width / 2 : x;
  const box = { x: left - 2, y: y - 8, width: width + 4, height: 16 };
  if (taken.some((other) => box.x < other.x + other.width && other.x < box.x + box.width && box.y < other.y + other.height && other.y < box.y + box.height)) return false;
  taken.push(box);
  drawLabel(context, text, x, y, colour, align);
  return true;
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
export function traceReceiverMark(context: CanvasRenderingContext2D, x: number, y: number, size: number): void {
  context.beginPath();
  context.moveTo(x, y - size);
  context.lineTo(x + size * 0.87, y + size * 0.5);
  context.lineTo(x - size * 0.87, y + size * 0.5);
  context.closePath();
}
