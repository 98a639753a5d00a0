// The drawing canvas's view: a uniform scale in pixels per metre and where the scene origin sits on
// screen. Scene y points up, screen y points down. Zooming keeps the point under the cursor in place.
import type { Point } from "@/lib/fdtd/scene";

export interface Viewport {
  /** Screen pixels (CSS) per metre. */
  pixelsPerMetre: number;
  /** Screen position of the scene origin (0, 0) m, CSS pixels from the canvas's top-left. */
  originX: number;
  originY: number;
}

export interface ScreenSize {
  width: number;
  height: number;
}

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Zoom range: from a 100 km site on a laptop screen to millimetre detail. */
export const MIN_PIXELS_PER_METRE = 0.005;
export const MAX_PIXELS_PER_METRE = 50_000;

export function worldToScreen(view: Viewport, p: Point): Point {
  return { x: view.originX + p.x * view.pixelsPerMetre, y: view.originY - p.y * view.pixelsPerMetre };
}

export function screenToWorld(view: Viewport, s: Point): Point {
  return { x: (s.x - view.originX) / view.pixelsPerMetre, y: (view.originY - s.y) / view.pixelsPerMetre };
}

/** Zooms by `factor` about the screen point `at`: the scene point under it stays under it. */
export function zoomAt(view: Viewport, factor: number, at: Point): Viewport {
  const pixelsPerMetre = Math.min(MAX_PIXELS_PER_METRE, Math.max(MIN_PIXELS_PER_METRE, view.pixelsPerMetre * factor));
  const anchor = screenToWorld(view, at);
  return { pixelsPerMetre, originX: at.x - anchor.x * pixelsPerMetre, originY: at.y + anchor.y * pixelsPerMetre };
}

/** Zoom factor for one wheel event: smooth for trackpads (small deltas), about 1.2 per mouse notch. */
export function wheelZoomFactor(deltaY: number, deltaMode: number): number {
  // deltaMode 1 counts lines (about 16 px each), 2 counts pages.
  const pixels = deltaMode === 1 ? deltaY * 16 : deltaMode === 2 ? deltaY * 400 : deltaY;
  return Math.exp(-pixels * 0.0018);
}

export function panBy(view: Viewport, dx: number, dy: number): Viewport {
  return { ...view, originX: view.originX + dx, originY: view.originY + dy };
}

/** The view that shows `bounds` whole and centred, with `padding` CSS pixels to spare on every side. */
export function fitBounds(bounds: Bounds, size: ScreenSize, padding = 32): Viewport {
  const width = Math.max(bounds.maxX - bounds.minX, 1e-6);
  const height = Math.max(bounds.maxY - bounds.minY, 1e-6);
  const usableWidth = Math.max(size.width - 2 * padding, 1);
  const usableHeight = Math.max(size.height - 2 * padding, 1);
  const pixelsPerMetre = Math.min(MAX_PIXELS_PER_METRE, Math.max(MIN_PIXELS_PER_METRE, Math.min(usableWidth / width, usableHeight / height)));
  const centreX = (bounds.minX + bounds.maxX) / 2;
  const centreY = (bounds.minY + bounds.maxY) / 2;
  return { pixelsPerMetre, originX: size.width / 2 - centreX * pixelsPerMetre, originY: size.height / 2 + centreY * pixelsPerMetre };
}

/** The scene region visible in a view of `size`. */
export function visibleBounds(view: Viewport, size: ScreenSize): Bounds {
  const topLeft = screenToWorld(view, { x: 0, y: 0 });
  const bottomRight = screenToWorld(view, { x: size.width, y: size.height });
  return { minX: topLeft.x, maxX: bottomRight.x, minY: bottomRight.y, maxY: topLeft.y };
}

export function unionBounds(a: Bounds, b: Bounds): Bounds {
  return { minX: Math.min(a.minX, b.minX), minY: Math.min(a.minY, b.minY), maxX: Math.max(a.maxX, b.maxX), maxY: Math.max(a.maxY, b.maxY) };
}
