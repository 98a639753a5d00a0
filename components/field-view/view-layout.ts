// Where things go on the field view's canvases: the scene's extent in metres (domain plus PML bands),
// an equal-scale letterboxed plot rectangle with room for axes, caption and colour bar, the metre <-> pixel
// transform both layers share, and tidy tick values. Pure; CSS pixels with y down unless said otherwise.
import type { GridPlan } from "@/lib/fdtd/grid";
import type { EdgeSide, Scene } from "@/lib/fdtd/scene";

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** A rectangle in scene coordinates, m (y up). */
export interface WorldRect {
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
}

/** What the view shows of a scene: the computed domain and the PML layers outside it. */
export interface SceneExtent {
  /** The computed domain: the scene's domain extended to whole cells to the right and top. */
  domain: WorldRect;
  /** PML thickness per side, m (0 where the side is rigid or an impedance). */
  pml: Record<EdgeSide, number>;
  /** PML thickness per side, cells. */
  pmlCells: Record<EdgeSide, number>;
  /** Domain plus PML bands. */
  outer: WorldRect;
  cellSize: number;
}

export const EDGE_SIDES: readonly EdgeSide[] = ["left", "right", "bottom", "top"];

/** The extent of a scene on its grid (from deriveGrid: cell size, domain cells, PML cells). */
export function sceneExtent(scene: Scene, grid: Pick<GridPlan, "cellSize" | "domainCells" | "pmlCells">): SceneExtent {
  const h = grid.cellSize;
  const domain = {
    xMin: 0,
    xMax: Math.max(scene.domain.width, grid.domainCells.nx * h),
    yMin: 0,
    yMax: Math.max(scene.domain.height, grid.domainCells.ny * h),
  };
  const pml = { left: grid.pmlCells.left * h, right: grid.pmlCells.right * h, bottom: grid.pmlCells.bottom * h, top: grid.pmlCells.top * h };
  return {
    domain,
    pml,
    pmlCells: { ...grid.pmlCells },
    outer: { xMin: -pml.left, xMax: domain.xMax + pml.right, yMin: -pml.bottom, yMax: domain.yMax + pml.top },
    cellSize: h,
  };
}

/** Room around the plot for the axes, the caption above and the colour bar to the right, CSS px. */
export const PLOT_MARGINS = { left: 58, right: 96, top: 34, bottom: 46 } as const;

export interface ViewLayout {
  /** Canvas size, CSS px, and device pixels per CSS px. */
  cssWidth: number;
  cssHeight: number;
  pixelRatio: number;
  /** The letterboxed plot: `world` mapped onto it with one scale for x and y. */
  plot: Rect;
  world: WorldRect;
  /** CSS px per metre, the same along x and y. */
  pixelsPerMetre: number;
  /** The colour bar's strip, CSS px. */
  colourBar: Rect;
}

/**
 * Fits `world` into the canvas at equal scale in x and y, centred (letterboxed), leaving PLOT_MARGINS for
 * the axes and colour bar. Returns undefined when the canvas is too small to draw anything sensible.
 */
export function computeViewLayout(cssWidth: number, cssHeight: number, pixelRatio: number, world: WorldRect): ViewLayout | undefined {
  const areaWidth = cssWidth - PLOT_MARGINS.left - PLOT_MARGINS.right;
  const areaHeight = cssHeight - PLOT_MARGINS.top - PLOT_MARGINS.bottom;
  const worldWidth = world.xMax - world.xMin;
  const worldHeight = world.yMax - world.yMin;
  if (areaWidth < 16 || areaHeight < 16 || !(worldWidth > 0) || !(worldHeight > 0)) return undefined;
  const pixelsPerMetre = Math.min(areaWidth / worldWidth, areaHeight / worldHeight);
  const width = worldWidth * pixelsPerMetre;
  const height = worldHeight * pixelsPerMetre;
  // Whole CSS pixels for the plot's corner keep the frame and the texture edges crisp.
  const x = Math.round(PLOT_MARGINS.left + (areaWidth - width) / 2);
  const y = Math.round(PLOT_MARGINS.top + (areaHeight - height) / 2);
  const plot = { x, y, width, height };
  const barHeight = Math.min(height, Math.max(120, Math.min(260, height)));
  return {
    cssWidth,
    cssHeight,
    pixelRatio,
    plot,
    world,
    pixelsPerMetre,
    colourBar: { x: x + width + 18, y: y + (height - barHeight) / 2, width: 12, height: barHeight },
  };
}

/** Scene x, m -> CSS px from the canvas's left edge. */
export function toPixelX(layout: ViewLayout, x: number): number {
  return layout.plot.x + (x - layout.world.xMin) * layout.pixelsPerMetre;
}

/** Scene y, m (up) -> CSS px from the canvas's top edge (down). */
export function toPixelY(layout: ViewLayout, y: number): number {
  return layout.plot.y + (layout.world.yMax - y) * layout.pixelsPerMetre;
}

/** CSS px -> scene coordinates, m. */
export function toWorld(layout: ViewLayout, px: number, py: number): { x: number; y: number } {
  return {
    x: layout.world.xMin + (px - layout.plot.x) / layout.pixelsPerMetre,
    y: layout.world.yMax - (py - layout.plot.y) / layout.pixelsPerMetre,
  };
}

/**
 * The rectangle covered by a field's cells, m: cell (a, b) is the square of side `spacing` centred on
 * (x0 + a spacing, y0 + b spacing).
 */
export function fieldWorldRect(field: { width: number; height: number; x0: number; y0: number; spacing: number }): WorldRect {
  const half = field.spacing / 2;
  return {
    xMin: field.x0 - half,
    xMax: field.x0 + (field.width - 0.5) * field.spacing,
    yMin: field.y0 - half,
    yMax: field.y0 + (field.height - 0.5) * field.spacing,
  };
}

/**
 * A world rectangle on the WebGL canvas: device pixels, origin bottom-left (gl.viewport's convention).
 * Not rounded: the quad lands where the overlay draws the same rectangle.
 */
export function toDeviceViewport(layout: ViewLayout, rect: WorldRect): Rect {
  const r = layout.pixelRatio;
  const left = toPixelX(layout, rect.xMin) * r;
  const right = toPixelX(layout, rect.xMax) * r;
  const top = toPixelY(layout, rect.yMax) * r;
  const bottom = toPixelY(layout, rect.yMin) * r;
  return { x: left, y: layout.cssHeight * r - bottom, width: right - left, height: bottom - top };
}

/** A tick interval of 1, 2 or 5 x 10^k giving about `targetCount` intervals over `span`. */
export function niceTickStep(span: number, targetCount: number): number {
  if (!(span > 0) || !(targetCount > 0)) return 1;
  const raw = span / targetCount;
  const decade = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / decade;
  const factor = m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10;
  return factor * decade;
}

/**
 * Ticks for a colour bar: when a tidy step (1, 2, 2.5 or 5 x 10^k) splits [low, high] into 3 to 8 equal
 * parts starting at a multiple of itself, both ends get a label (the ends of a colour range are the
 * values people read first); otherwise the multiples of a tidy step inside the range.
 */
export function colourBarTicks(low: number, high: number, maxIntervals = 8): { ticks: number[]; step: number } {
  const span = high - low;
  if (!(span > 0)) return { ticks: [], step: 1 };
  const whole = (x: number) => Math.abs(x - Math.round(x)) < 1e-9 * Math.max(1, Math.abs(x));
  let best: number | undefined;
  for (let exponent = Math.floor(Math.log10(span)) - 2; exponent <= Math.floor(Math.log10(span)); exponent++) {
    for (const m of [1, 2, 2.5, 5]) {
      const step = m * Math.pow(10, exponent);
      const intervals = span / step;
      if (intervals < 3 - 1e-9 || intervals > maxIntervals + 1e-9 || !whole(intervals) || !whole(low / step)) continue;
      // Prefer about five intervals.
      if (best === undefined || Math.abs(intervals - 5) < Math.abs(span / best - 5)) best = step;
    }
  }
  const step = best ?? niceTickStep(span, Math.min(5, maxIntervals));
  return { ticks: ticksBetween(low, high, step), step };
}

/** Multiples of `step` within [min, max] (inclusive, allowing for rounding), snapped so 0.1 * 3 prints as 0.3. */
export function ticksBetween(min: number, max: number, step: number): number[] {
  if (!(step > 0) || !(max >= min)) return [];
  const decimals = decimalsForStep(step);
  const ticks: number[] = [];
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  for (let k = first; k <= last; k++) ticks.push(Number((k * step).toFixed(decimals)));
  return ticks;
}

/** Decimal places that show every multiple of `step` exactly (0 for steps of 1 or more). */
export function decimalsForStep(step: number): number {
  if (!(step > 0)) return 0;
  for (let decimals = 0; decimals < 12; decimals++) {
    const scaled = step * Math.pow(10, decimals);
    if (Math.abs(scaled - Math.round(scaled)) < 1e-9 * Math.max(1, scaled)) return decimals;
  }
  return 12;
}
