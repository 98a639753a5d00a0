import { describe, expect, it } from "vitest";

import { fitBounds, panBy, screenToWorld, visibleBounds, wheelZoomFactor, worldToScreen, zoomAt } from "@/components/scene-editor/model/viewport";

const view = { pixelsPerMetre: 20, originX: 50, originY: 400 };

describe("canvas viewport", () => {
  it("maps metres with y up to pixels with y down and back", () => {
    expect(worldToScreen(view, { x: 2, y: 3 })).toEqual({ x: 90, y: 340 });
    expect(screenToWorld(view, { x: 90, y: 340 })).toEqual({ x: 2, y: 3 });
  });

  it("keeps the scene point under the cursor fixed while zooming", () => {
    const cursor = { x: 313, y: 127 };
    const before = screenToWorld(view, cursor);
    const zoomed = zoomAt(view, 2.5, cursor);
    expect(zoomed.pixelsPerMetre).toBe(50);
    const after = screenToWorld(zoomed, cursor);
    expect(after.x).toBeCloseTo(before.x, 12);
    expect(after.y).toBeCloseTo(before.y, 12);
  });

  it("zooms in for a wheel turned away from the user and out for one turned towards", () => {
    expect(wheelZoomFactor(-100, 0)).toBeGreaterThan(1);
    expect(wheelZoomFactor(100, 0)).toBeLessThan(1);
    expect(wheelZoomFactor(3, 1)).toBeCloseTo(wheelZoomFactor(48, 0), 12);
  });

  it("fits bounds centred with the padding on the tighter axis", () => {
    const fitted = fitBounds({ minX: -2, minY: 0, maxX: 52, maxY: 14 }, { width: 1000, height: 500 }, 20);
    expect(fitted.pixelsPerMetre).toBeCloseTo(960 / 54, 12);
    const centre = screenToWorld(fitted, { x: 500, y: 250 });
    expect(centre.x).toBeCloseTo(25, 9);
    expect(centre.y).toBeCloseTo(7, 9);
    const visible = visibleBounds(fitted, { width: 1000, height: 500 });
    expect(visible.minX).toBeCloseTo(-2 - 20 / fitted.pixelsPerMetre, 9);
  });

  it("pans by screen pixels", () => {
    expect(panBy(view, 10, -5)).toEqual({ pixelsPerMetre: 20, originX: 60, originY: 395 });
  });
});
