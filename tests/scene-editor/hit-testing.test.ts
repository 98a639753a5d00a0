import { describe, expect, it } from "vitest";

import { closestPointOnSegment, hitTest, hitTestAll } from "@/components/scene-editor/model/hit-testing";
import { addReceiver } from "@/components/scene-editor/model/scene-edits";

import { barrierScene } from "./scene-fixtures";

const tolerance = 0.1;

describe("hit testing in metres", () => {
  it("finds a source at its position and misses it just beyond the pick radius", () => {
    const scene = barrierScene();
    expect(hitTest(scene, { x: 2.05, y: 0.55 }, tolerance)).toEqual({ ref: { kind: "source", id: "road" }, part: { type: "body" } });
    expect(hitTest(scene, { x: 2.2, y: 0.5 }, tolerance)).toBeNull();
  });

  it("reaches a barrier across half its thickness plus the pick radius", () => {
    const scene = barrierScene();
    // Thickness 0.2 m: the face is 0.1 m from the centre line, so 0.19 m out is a hit and 0.21 m a miss.
    expect(hitTest(scene, { x: 10.19, y: 1.5 }, tolerance)?.ref).toEqual({ kind: "wall", id: "barrier" });
    expect(hitTest(scene, { x: 10.21, y: 1.5 }, tolerance)).toBeNull();
  });

  it("finds a solid anywhere inside its outline", () => {
    expect(hitTest(barrierScene(), { x: 8.5, y: 0.5 }, tolerance)?.ref).toEqual({ kind: "solid", id: "block" });
  });

  it("puts receivers above the geometry they stand on", () => {
    const { scene } = addReceiver(barrierScene(), { x: 8.5, y: 0.5 });
    expect(hitTest(scene, { x: 8.5, y: 0.5 }, tolerance)?.ref).toEqual({ kind: "receiver", id: "receiver-1" });
    expect(hitTestAll(scene, { x: 8.5, y: 0.5 }, tolerance)).toEqual([
      { kind: "receiver", id: "receiver-1" },
      { kind: "solid", id: "block" },
    ]);
  });

  it("gives the selected entity's handles priority over what lies on top of it", () => {
    const { scene } = addReceiver(barrierScene(), { x: 9, y: 1 });
    const selected = { kind: "solid", id: "block" } as const;
    expect(hitTest(scene, { x: 9.02, y: 1.01 }, tolerance)?.ref.kind).toBe("receiver");
    expect(hitTest(scene, { x: 9.02, y: 1.01 }, tolerance, { selected })).toEqual({ ref: selected, part: { type: "vertex", index: 2 } });
  });

  it("reports the edge of the selected outline with the nearest point on it, for inserting a corner", () => {
    const selected = { kind: "solid", id: "block" } as const;
    // The closing edge runs from corner 3 (8, 1) back to corner 0 (8, 0).
    const hit = hitTest(barrierScene(), { x: 7.95, y: 0.4 }, tolerance, { selected });
    expect(hit).toEqual({ ref: selected, part: { type: "edge", index: 3, at: { x: 8, y: 0.4 } } });
  });

  it("projects onto a segment and clamps to its ends", () => {
    expect(closestPointOnSegment({ x: 5, y: 3 }, { x: 0, y: 0 }, { x: 10, y: 0 })).toEqual({ x: 5, y: 0 });
    expect(closestPointOnSegment({ x: -5, y: 3 }, { x: 0, y: 0 }, { x: 10, y: 0 })).toEqual({ x: 0, y: 0 });
  });
});
