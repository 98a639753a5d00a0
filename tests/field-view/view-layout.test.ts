// Placement of the field and overlay: equal scale in metres, letterboxing, the shared transform, ticks.
import { describe, expect, it } from "vitest";

import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import {
  colourBarTicks,
  computeViewLayout,
  decimalsForStep,
  fieldWorldRect,
  niceTickStep,
  PLOT_MARGINS,
  sceneExtent,
  ticksBetween,
  toDeviceViewport,
  toPixelX,
  toPixelY,
  toWorld,
} from "@/components/field-view/view-layout";

import demoScene from "@/db/seed/scenes/design-a-3m-reflective.json";

const world = { xMin: 0, xMax: 20, yMin: 0, yMax: 10 };

describe("view layout", () => {
  it("keeps one scale for x and y and letterboxes a wide world in a tall canvas", () => {
    const layout = computeViewLayout(600, 900, 1, world)!;
    const areaWidth = 600 - PLOT_MARGINS.left - PLOT_MARGINS.right;
    expect(layout.pixelsPerMetre).toBeCloseTo(areaWidth / 20, 12);
    expect(layout.plot.width).toBeCloseTo(areaWidth, 9);
    expect(layout.plot.height / layout.plot.width).toBeCloseTo(0.5, 12);
    // Centred vertically in the room between the margins.
    const spareAbove = layout.plot.y - PLOT_MARGINS.top;
    const spareBelow = 900 - PLOT_MARGINS.bottom - (layout.plot.y + layout.plot.height);
    expect(Math.abs(spareAbove - spareBelow)).toBeLessThanOrEqual(1);
  });

  it("letterboxes a tall world in a wide canvas the other way", () => {
    const layout = computeViewLayout(1200, 500, 1, { xMin: -1, xMax: 4, yMin: -1, yMax: 9 })!;
    expect(layout.plot.height).toBeCloseTo(500 - PLOT_MARGINS.top - PLOT_MARGINS.bottom, 9);
    expect(layout.plot.width).toBeCloseTo(layout.plot.height / 2, 9);
  });

  it("maps metres to pixels (y down) and back", () => {
    const layout = computeViewLayout(800, 500, 2, world)!;
    expect(toPixelX(layout, 0)).toBe(layout.plot.x);
    expect(toPixelY(layout, 10)).toBe(layout.plot.y);
    expect(toPixelY(layout, 0)).toBeCloseTo(layout.plot.y + layout.plot.height, 9);
    const back = toWorld(layout, toPixelX(layout, 12.3), toPixelY(layout, 4.56));
    expect(back.x).toBeCloseTo(12.3, 9);
    expect(back.y).toBeCloseTo(4.56, 9);
  });

  it("gives the WebGL viewport in device pixels from the bottom-left corner", () => {
    const layout = computeViewLayout(800, 500, 2, world)!;
    const viewport = toDeviceViewport(layout, { xMin: 0, xMax: 10, yMin: 0, yMax: 5 });
    expect(viewport.x).toBeCloseTo(2 * layout.plot.x, 9);
    expect(viewport.y).toBeCloseTo(2 * (500 - layout.plot.y - layout.plot.height), 9);
    expect(viewport.width).toBeCloseTo(layout.plot.width, 9);
    expect(viewport.height).toBeCloseTo(layout.plot.height, 9);
  });

  it("has nothing to lay out in a canvas smaller than its margins", () => {
    expect(computeViewLayout(100, 60, 1, world)).toBeUndefined();
    expect(computeViewLayout(800, 600, 1, { xMin: 0, xMax: 0, yMin: 0, yMax: 1 })).toBeUndefined();
  });

  it("covers each cell of a field with a square of its spacing centred on the sample", () => {
    expect(fieldWorldRect({ width: 4, height: 2, x0: 0.05, y0: 0.05, spacing: 0.1 })).toEqual({ xMin: 0, xMax: 0.4, yMin: 0, yMax: expect.closeTo(0.2, 12) });
  });
});

describe("scene extent", () => {
  it("adds a PML band of layerCells x cellSize outside each PML side of the demo barrier scene, none on its rigid ground", () => {
    const scene = parseSceneOrThrow(demoScene);
    const grid = deriveGrid(scene);
    const extent = sceneExtent(scene, grid);
    expect(extent.pml.left).toBeCloseTo(20 * grid.cellSize, 12);
    expect(extent.pml.top).toBeCloseTo(20 * grid.cellSize, 12);
    expect(extent.pml.bottom).toBe(0);
    expect(extent.outer.xMin).toBeCloseTo(-20 * grid.cellSize, 12);
    expect(extent.outer.yMin).toBeCloseTo(0, 12);
    // The domain is extended to whole cells: at least the scene's 50 x 14 m, less than a cell more.
    expect(extent.domain.xMax).toBeGreaterThanOrEqual(50);
    expect(extent.domain.xMax - 50).toBeLessThan(grid.cellSize);
  });
});

describe("ticks", () => {
  it.each([
    [50, 6, 10],
    [14, 5, 2],
    [1, 4, 0.2],
    [0.3, 4, 0.1],
    [300, 6, 50],
  ])("a span of %f m in about %i intervals ticks every %f", (span, count, step) => {
    expect(niceTickStep(span, count)).toBeCloseTo(step, 12);
  });

  it("lists the multiples of the step inside the range, printed without rounding noise", () => {
    expect(ticksBetween(0, 1, 0.1)).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
    expect(ticksBetween(-0.15, 0.15, 0.05)).toEqual([-0.15, -0.1, -0.05, 0, 0.05, 0.1, 0.15]);
    expect(ticksBetween(0.5, 9.9, 2)).toEqual([2, 4, 6, 8]);
    expect(ticksBetween(1, 0, 1)).toEqual([]);
  });

  it.each([
    [-50, 50, [-50, -25, 0, 25, 50]],
    [-150, 150, [-150, -100, -50, 0, 50, 100, 150]],
    [-8, 8, [-8, -6, -4, -2, 0, 2, 4, 6, 8]],
    [65, 85, [65, 70, 75, 80, 85]],
    [-1.5, 1.5, [-1.5, -1, -0.5, 0, 0.5, 1, 1.5]],
  ])("labels both ends of a colour bar from %f to %f when a tidy step fits", (low, high, ticks) => {
    expect(colourBarTicks(low, high).ticks).toEqual(ticks);
  });

  it("falls back to tidy multiples inside an untidy colour range", () => {
    expect(colourBarTicks(43, 91).ticks).toEqual([50, 60, 70, 80, 90]);
  });

  it("knows how many decimals a step needs", () => {
    expect(decimalsForStep(10)).toBe(0);
    expect(decimalsForStep(0.5)).toBe(1);
    expect(decimalsForStep(0.25)).toBe(2);
    expect(decimalsForStep(0.002)).toBe(3);
  });
});
