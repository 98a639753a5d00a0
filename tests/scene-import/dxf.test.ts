import { describe, expect, it } from "vitest";

import { centringOffset, LENGTH_UNITS, METRES_PER_UNIT, placeDxf, readDxf, type DxfDrawing, type DxfPlacement } from "@/lib/scene-import/dxf";

import { fixtureText } from "./fixture-files";

/** The domain of the scene-editor test scene (tests/scene-editor/scene-fixtures.ts). */
const DOMAIN = { width: 20, height: 8 };

function drawingOf(name: string): DxfDrawing {
  const read = readDxf(fixtureText(name));
  if (!read.ok) throw new Error(read.message);
  return read.drawing;
}

function messageOf(result: { ok: true } | { ok: false; message: string }): string {
  if (result.ok) throw new Error("expected a refusal");
  return result.message;
}

/** A DXF of only an ENTITIES section, from [code, value] pairs. */
function entitiesDxf(pairs: readonly (readonly [number, string | number])[]): string {
  return [[0, "SECTION"], [2, "ENTITIES"], ...pairs, [0, "ENDSEC"], [0, "EOF"]].flatMap(([code, value]) => [String(code), String(value)]).join("\n");
}

const sitePlacement: DxfPlacement = { wallLayers: ["BARRIERS", "FENCE"], solidLayers: ["BUILDINGS"], wallThickness: 0.2 };

describe("reading a drawing", () => {
  it("lists the layers with their entity counts, the extent and the declared millimetres", () => {
    const drawing = drawingOf("site-plan-mm.dxf");
    expect(drawing.layers).toEqual([
      { name: "BARRIERS", lines: 0, openPolylines: 1, closedPolylines: 0 },
      { name: "BUILDINGS", lines: 0, openPolylines: 0, closedPolylines: 2 },
      { name: "FENCE", lines: 2, openPolylines: 0, closedPolylines: 0 },
    ]);
    expect(drawing.extent).toEqual({ minX: 500, minY: 500, maxX: 16000, maxY: 7500 });
    expect(drawing.declaredUnits).toBe("mm");
    expect(drawing.unitsNote).toBeNull();
    expect(drawing.ignored).toEqual([{ type: "CIRCLE", count: 1 }]);
  });

  it("reads old-style POLYLINE entities with their VERTEX records, closed by the flag", () => {
    const drawing = drawingOf("polylines-no-units.dxf");
    const hall = drawing.shapes.find((shape) => shape.layer === "HALL")!;
    expect(hall).toMatchObject({ type: "POLYLINE", closed: true, points: [{ x: 2, y: 1 }, { x: 6, y: 1 }, { x: 6, y: 4 }, { x: 2, y: 4 }] });
    expect(drawing.declaredUnits).toBeNull();
    expect(drawing.unitsNote).toBe("The drawing does not state its units.");
  });

  it("reads a drawing with Windows line ends the same", () => {
    const unix = drawingOf("site-plan-mm.dxf");
    const windows = readDxf(fixtureText("site-plan-mm.dxf").replace(/\n/g, "\r\n"));
    expect(windows.ok && windows.drawing).toEqual(unix);
  });

  it("takes a polyline that ends where it starts as closed, and counts arc segments", () => {
    const read = readDxf(
      entitiesDxf([
        [0, "LWPOLYLINE"], [8, "ROOMS"], [90, 5], [70, 0],
        [10, 0], [20, 0], [10, 4], [20, 0], [42, 0.5], [10, 4], [20, 3], [10, 0], [20, 3], [10, 0], [20, 0],
      ]),
    );
    if (!read.ok) throw new Error(read.message);
    expect(read.drawing.shapes).toEqual([{ layer: "ROOMS", type: "LWPOLYLINE", closed: true, points: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 3 }, { x: 0, y: 3 }] }]);
    expect(read.drawing.arcSegments).toBe(1);
  });

  it("leaves out entities in paper space", () => {
    const read = readDxf(
      entitiesDxf([
        [0, "LINE"], [8, "WALLS"], [10, 0], [20, 0], [11, 1], [21, 0],
        [0, "LINE"], [8, "WALLS"], [67, 1], [10, 0], [20, 5], [11, 1], [21, 5],
      ]),
    );
    if (!read.ok) throw new Error(read.message);
    expect(read.drawing.shapes).toHaveLength(1);
    expect(read.drawing.ignored).toEqual([{ type: "paper space LINE", count: 1 }]);
  });
});

describe("refusing files that are not usable drawings", () => {
  it("refuses a text that is not a DXF", () => {
    expect(messageOf(readDxf(fixtureText("not-a-drawing.dxf")))).toBe("This is not a DXF file: a DXF starts with a group code (0) and SECTION.");
  });

  it("refuses an empty file and a binary DXF", () => {
    expect(messageOf(readDxf(""))).toBe("The file is empty.");
    expect(messageOf(readDxf("AutoCAD Binary DXF\r\n\u001a\u0000"))).toMatch(/binary DXF; save the drawing as an ASCII DXF/);
  });

  it("refuses a POLYLINE without its SEQEND instead of hanging the parser", () => {
    expect(messageOf(readDxf(fixtureText("polyline-without-seqend.dxf")))).toBe("The DXF is damaged: the POLYLINE at line 5 (layer “HALL”) has no SEQEND before the next entity.");
  });

  it("refuses a file cut short inside its entities", () => {
    expect(messageOf(readDxf(fixtureText("cut-short.dxf")))).toBe("The DXF ends inside its ENTITIES section: the file looks cut short.");
  });

  it("refuses a drawing with no lines or polylines and says what it does hold", () => {
    expect(messageOf(readDxf(fixtureText("only-circles.dxf")))).toBe("The DXF has no lines or polylines in model space to import. It holds only 2 CIRCLE, 1 TEXT.");
  });

  it("names the line where a group code is not a number", () => {
    const text = fixtureText("site-plan-mm.dxf").replace("\n 70\n4\n", "\nseventy\n4\n");
    expect(messageOf(readDxf(text))).toMatch(/^The DXF is damaged at line 13: expected a group code/);
  });
});

describe("placing the chosen layers", () => {
  it("converts millimetres to metres: solids from closed polylines, barriers from lines and open polylines", () => {
    const placed = placeDxf(drawingOf("site-plan-mm.dxf"), sitePlacement, DOMAIN);
    if (!placed.ok) throw new Error(placed.message);
    expect(placed.solids).toEqual([
      { polygon: [{ x: 2, y: 1 }, { x: 6, y: 1 }, { x: 6, y: 4 }, { x: 2, y: 4 }] },
      { polygon: [{ x: 9, y: 1 }, { x: 12, y: 1 }, { x: 10.5, y: 3.5 }] },
    ]);
    expect(placed.walls).toEqual([
      { path: [{ x: 1, y: 6 }, { x: 8, y: 6 }, { x: 14, y: 7 }], thickness: 0.2 },
      { path: [{ x: 0.5, y: 0.5 }, { x: 0.5, y: 7.5 }], thickness: 0.2 },
      { path: [{ x: 0.5, y: 7.5 }, { x: 16, y: 7.5 }], thickness: 0.2 },
    ]);
    expect(placed.extent).toEqual({ minX: 0.5, minY: 0.5, maxX: 16, maxY: 7.5 });
    expect(placed.units).toBe("mm");
  });

  it.each(LENGTH_UNITS)("scales a drawing by the chosen unit (%s)", (unit) => {
    const placed = placeDxf(drawingOf("polylines-no-units.dxf"), { wallLayers: ["SCREEN"], solidLayers: [], units: unit, wallThickness: 0.1 }, { width: 1000, height: 1000 });
    if (!placed.ok) throw new Error(placed.message);
    const [from, to] = placed.walls[0]!.path;
    expect(from!.x).toBeCloseTo(8 * METRES_PER_UNIT[unit], 12);
    expect(to!.y).toBeCloseTo(5 * METRES_PER_UNIT[unit], 12);
  });

  it("uses the factors of the units' definitions", () => {
    expect(METRES_PER_UNIT).toEqual({ mm: 0.001, cm: 0.01, m: 1, inch: 0.0254, foot: 0.3048 });
  });

  it("asks for the units when the drawing does not state them", () => {
    expect(messageOf(placeDxf(drawingOf("polylines-no-units.dxf"), { wallLayers: ["SCREEN"], solidLayers: [], wallThickness: 0.1 }, DOMAIN))).toBe(
      "The drawing does not state its units. Choose the units it was drawn in.",
    );
  });

  it("lets the chosen units override the declared ones, and refuses geometry that then leaves the domain", () => {
    expect(messageOf(placeDxf(drawingOf("site-plan-mm.dxf"), { ...sitePlacement, units: "cm" }, DOMAIN))).toBe(
      "In centimetres, the chosen layers span x 5 to 160 m, y 5 to 75 m, outside the domain (0 to 20 m across and 0 to 8 m up). Check the units, or move the drawing with the offset.",
    );
  });

  it("moves the drawing by the offset in metres, and refuses an offset that pushes it out", () => {
    const drawing = drawingOf("site-plan-mm.dxf");
    const moved = placeDxf(drawing, { ...sitePlacement, offset: { x: 2, y: 0.25 } }, DOMAIN);
    if (!moved.ok) throw new Error(moved.message);
    expect(moved.extent).toEqual({ minX: 2.5, minY: 0.75, maxX: 18, maxY: 7.75 });
    expect(placeDxf(drawing, { ...sitePlacement, offset: { x: 5, y: 0 } }, DOMAIN).ok).toBe(false);
  });

  it("finds the offset that centres the chosen layers in the domain", () => {
    const drawing = drawingOf("site-plan-mm.dxf");
    const offset = centringOffset(drawing, { wallLayers: [], solidLayers: ["BUILDINGS"] }, DOMAIN)!;
    // The buildings span 2 to 12 m by 1 to 4 m, centred on (7, 2.5); the domain's centre is (10, 4).
    expect(offset.x).toBeCloseTo(3, 12);
    expect(offset.y).toBeCloseTo(1.5, 12);
    expect(centringOffset(drawing, { wallLayers: [], solidLayers: [] }, DOMAIN)).toBeNull();
  });

  it("turns a closed polyline on a barrier layer into a barrier that returns to its start", () => {
    const placed = placeDxf(drawingOf("site-plan-mm.dxf"), { wallLayers: ["BUILDINGS"], solidLayers: [], wallThickness: 0.3 }, DOMAIN);
    if (!placed.ok) throw new Error(placed.message);
    expect(placed.walls[0]!.path).toEqual([{ x: 2, y: 1 }, { x: 6, y: 1 }, { x: 6, y: 4 }, { x: 2, y: 4 }, { x: 2, y: 1 }]);
    expect(placed.solids).toEqual([]);
  });

  it("refuses a chosen layer that gives nothing for its role", () => {
    const drawing = drawingOf("site-plan-mm.dxf");
    expect(messageOf(placeDxf(drawing, { wallLayers: [], solidLayers: ["FENCE"], wallThickness: 0.2 }, DOMAIN))).toBe("Layer “FENCE” has no closed polylines enclosing an area to become solids.");
    expect(messageOf(placeDxf(drawing, { wallLayers: ["BUILDINGS"], solidLayers: ["BUILDINGS"], wallThickness: 0.2 }, DOMAIN))).toBe(
      "Layer “BUILDINGS” has no open lines or polylines besides its closed outlines to become barriers.",
    );
    expect(messageOf(placeDxf(drawing, { wallLayers: ["ROADS"], solidLayers: [], wallThickness: 0.2 }, DOMAIN))).toBe("Layer “ROADS” has no lines or polylines in this drawing.");
  });

  it("refuses an empty choice and a thickness that is not positive", () => {
    const drawing = drawingOf("site-plan-mm.dxf");
    expect(messageOf(placeDxf(drawing, { wallLayers: [], solidLayers: [], wallThickness: 0.2 }, DOMAIN))).toBe("Choose at least one layer for barriers or solids.");
    expect(messageOf(placeDxf(drawing, { ...sitePlacement, wallThickness: 0 }, DOMAIN))).toBe("The barrier thickness must be a number above 0 m.");
  });
});
