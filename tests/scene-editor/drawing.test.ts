import { describe, expect, it } from "vitest";

import { addDrawingPoint, closesOutline, DEFAULT_DRAWING_SETTINGS, finishDrawing, finishesOnClick, signedDoubleArea, withoutRepeats } from "@/components/scene-editor/model/drawing";
import { findEntity } from "@/components/scene-editor/model/entities";
import { toolForKey, TOOLS } from "@/components/scene-editor/model/tools";

import { barrierScene } from "./scene-fixtures";

describe("drawing entities from clicks", () => {
  it("ignores the second click of a double-click on the same spot", () => {
    const points = addDrawingPoint(addDrawingPoint([], { x: 1, y: 1 }), { x: 1, y: 1 });
    expect(points).toEqual([{ x: 1, y: 1 }]);
    expect(withoutRepeats([{ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 0 }])).toHaveLength(3);
  });

  it("closes a solid on a click at its first corner, once it has three", () => {
    const corners = [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }];
    expect(closesOutline("solid", corners, { x: 0.05, y: 0.02 }, 0.1)).toBe(true);
    expect(closesOutline("solid", corners.slice(0, 2), { x: 0, y: 0 }, 0.1)).toBe(false);
    expect(closesOutline("wall", corners, { x: 0, y: 0 }, 0.1)).toBe(false);
  });

  it("turns clicked corners into a solid, the closing click not counted as a corner", () => {
    const result = finishDrawing(barrierScene(), "solid", [{ x: 1, y: 1 }, { x: 3, y: 1 }, { x: 3, y: 2 }, { x: 1, y: 1 }], DEFAULT_DRAWING_SETTINGS);
    expect(findEntity(result!.scene, result!.ref)).toMatchObject({ polygon: [{ x: 1, y: 1 }, { x: 3, y: 1 }, { x: 3, y: 2 }] });
  });

  it("refuses a solid whose corners lie on one line", () => {
    expect(finishDrawing(barrierScene(), "solid", [{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }], DEFAULT_DRAWING_SETTINGS)).toBeNull();
    expect(signedDoubleArea([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 1 }])).toBe(1);
  });

  it("makes a barrier of the set thickness and needs two distinct points for it", () => {
    const settings = { ...DEFAULT_DRAWING_SETTINGS, wallThickness: 0.25 };
    expect(finishDrawing(barrierScene(), "wall", [{ x: 5, y: 0 }, { x: 5, y: 0 }], settings)).toBeNull();
    const result = finishDrawing(barrierScene(), "wall", [{ x: 5, y: 0 }, { x: 5, y: 2 }, { x: 6, y: 3 }], settings)!;
    expect(findEntity(result.scene, result.ref)).toMatchObject({ thickness: 0.25, path: [{ x: 5, y: 0 }, { x: 5, y: 2 }, { x: 6, y: 3 }] });
  });

  it("finishes a receiver line on its second click with the set receiver count", () => {
    expect(finishesOnClick("receiverLine", [{ x: 1, y: 1 }])).toBe(false);
    expect(finishesOnClick("receiverLine", [{ x: 1, y: 1 }, { x: 5, y: 1 }])).toBe(true);
    const result = finishDrawing(barrierScene(), "receiverLine", [{ x: 1, y: 1 }, { x: 5, y: 1 }], { ...DEFAULT_DRAWING_SETTINGS, receiverLineCount: 6 })!;
    expect(findEntity(result.scene, result.ref)).toMatchObject({ count: 6 });
  });
});

describe("tool shortcuts", () => {
  it("gives every tool its own key and finds it in either case", () => {
    const keys = TOOLS.map((tool) => tool.key);
    expect(new Set(keys).size).toBe(keys.length);
    for (const tool of TOOLS) {
      expect(toolForKey(tool.key.toLowerCase())).toBe(tool.id);
      expect(toolForKey(tool.key)).toBe(tool.id);
    }
    expect(toolForKey("F")).toBeNull();
  });
});
