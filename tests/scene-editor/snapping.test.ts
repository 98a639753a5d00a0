import { describe, expect, it } from "vitest";

import { constrainDirection, decimalsForStep, gridStepForZoom, niceStep, snap, snapPoint, snapValue } from "@/components/scene-editor/model/snapping";

describe("grid snapping", () => {
  it("picks round steps of 1, 2 or 5 times a power of ten", () => {
    expect(niceStep(0.3)).toBe(0.5);
    expect(niceStep(0.5)).toBe(0.5);
    expect(niceStep(0.051)).toBe(0.1);
    expect(niceStep(7)).toBe(10);
    expect(niceStep(0.0011)).toBe(0.002);
    expect(niceStep(150)).toBe(200);
  });

  it("chooses a finer grid as the view zooms in", () => {
    // 16 px apart at least: at 40 px/m that is 0.4 m, so 0.5 m; at 400 px/m, 0.05 m.
    expect(gridStepForZoom(40)).toBe(0.5);
    expect(gridStepForZoom(400)).toBe(0.05);
  });

  it("snaps to the nearest multiple of the step without binary rounding noise", () => {
    expect(snapValue(1.26, 0.1)).toBe(1.3);
    expect(snapValue(-0.74, 0.5)).toBe(-0.5);
    expect(snapPoint({ x: 12.449, y: 3.251 }, 0.1)).toEqual({ x: 12.4, y: 3.3 });
  });

  it("prefers a nearby vertex to the grid, and uses the grid otherwise", () => {
    const vertices = [{ x: 10.03, y: 2.97 }];
    expect(snap({ x: 10.05, y: 2.99 }, { gridStep: 0.5, vertices, vertexTolerance: 0.1 })).toEqual({ point: { x: 10.03, y: 2.97 }, kind: "vertex" });
    expect(snap({ x: 10.4, y: 2.6 }, { gridStep: 0.5, vertices, vertexTolerance: 0.1 })).toEqual({ point: { x: 10.5, y: 2.5 }, kind: "grid" });
    expect(snap({ x: 10.4, y: 2.6 }, { gridStep: 0 })).toEqual({ point: { x: 10.4, y: 2.6 }, kind: "none" });
  });

  it("holds a drawn segment to the nearest 45-degree direction", () => {
    expect(constrainDirection({ x: 1, y: 1 }, { x: 1.1, y: 4 })).toEqual({ x: 1, y: 4 });
    expect(constrainDirection({ x: 0, y: 0 }, { x: 3, y: -0.2 })).toEqual({ x: 3, y: 0 });
    const diagonal = constrainDirection({ x: 0, y: 0 }, { x: 2, y: 1.8 });
    expect(diagonal.x).toBeCloseTo(1.9, 6);
    expect(diagonal.y).toBeCloseTo(1.9, 6);
  });

  it("shows as many decimals as the step needs", () => {
    expect(decimalsForStep(1)).toBe(0);
    expect(decimalsForStep(0.5)).toBe(1);
    expect(decimalsForStep(0.05)).toBe(2);
    expect(decimalsForStep(0.002)).toBe(3);
  });
});
