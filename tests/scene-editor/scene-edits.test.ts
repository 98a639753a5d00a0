import { describe, expect, it } from "vitest";

import { entityPoints, findEntity, freshId, usedIds } from "@/components/scene-editor/model/entities";
import {
  addReceiver,
  addReceiverLine,
  addSolid,
  addSource,
  addSurface,
  addWall,
  deleteEntity,
  deletionBlocker,
  deleteVertex,
  duplicateEntity,
  insertVertex,
  moveVertex,
  renameScene,
  setAttenuation,
  setDomain,
  setDuration,
  setEdge,
  setEntityLabel,
  setMedium,
  setPmlThickness,
  setReceiverLineCount,
  setResolution,
  setSourceAmplitude,
  setSourceSignal,
  setTreatment,
  setWallThickness,
  tidyCoordinate,
  translateEntity,
} from "@/components/scene-editor/model/scene-edits";
import { parseScene, type Scene } from "@/lib/fdtd/scene";

import { barrierScene, deepFreeze } from "./scene-fixtures";

/** The scene is still one parseScene accepts, unchanged by a round trip through it. */
function expectValid(scene: Scene): void {
  const parsed = parseScene(JSON.parse(JSON.stringify(scene)));
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => `${p.path}: ${p.message}`).join("; "));
  expect(parsed.scene).toEqual(JSON.parse(JSON.stringify(scene)));
}

function frozenScene(): Scene {
  return deepFreeze(barrierScene());
}

describe("adding entities", () => {
  it("adds a solid with a fresh id and label and leaves the input scene untouched", () => {
    const before = frozenScene();
    const { scene, ref } = addSolid(before, [{ x: 1, y: 1 }, { x: 2, y: 1 }, { x: 2, y: 2 }]);
    expect(ref).toEqual({ kind: "solid", id: "solid-1" });
    expect(scene.geometry.solids).toHaveLength(2);
    expect(findEntity(scene, ref)).toMatchObject({ label: "Solid 1", surface: { kind: "rigid" } });
    expect(before.geometry.solids).toHaveLength(1);
    expectValid(scene);
  });

  it("adds a barrier with the given thickness and a treated surface with an absorptive default", () => {
    const wall = addWall(frozenScene(), [{ x: 5, y: 0 }, { x: 5, y: 2.5 }], 0.15);
    expect(findEntity(wall.scene, wall.ref)).toMatchObject({ thickness: 0.15, path: [{ x: 5, y: 0 }, { x: 5, y: 2.5 }] });
    const surface = addSurface(wall.scene, [{ x: 4.9, y: 0 }, { x: 4.9, y: 2.5 }]);
    expect(findEntity(surface.scene, surface.ref)).toMatchObject({ treatment: { kind: "material", material: "mineral-wool-50mm" } });
    expectValid(surface.scene);
  });

  it("gives a new source the signal and amplitude of the last source", () => {
    const base = setSourceAmplitude(frozenScene(), "road", 0.004);
    const { scene, ref } = addSource(base, { x: 3, y: 0.5 });
    expect(findEntity(scene, ref)).toMatchObject({ amplitude: 0.004, signal: { kind: "ricker", peakFrequency: 180 }, position: { x: 3, y: 0.5 } });
    expectValid(scene);
  });

  it("places receivers and receiver lines inside the domain even when clicked outside it", () => {
    const receiver = addReceiver(frozenScene(), { x: -3, y: 9 });
    expect(findEntity(receiver.scene, { kind: "receiver", id: receiver.ref.id })?.position).toEqual({ x: 0, y: 8 });
    const line = addReceiverLine(receiver.scene, { x: 5, y: 1 }, { x: 25, y: 1 }, 7.6);
    expect(findEntity(line.scene, line.ref)).toMatchObject({ from: { x: 5, y: 1 }, to: { x: 20, y: 1 }, count: 8 });
    expectValid(line.scene);
  });

  it("never reuses an id that is taken anywhere in the scene", () => {
    let scene = frozenScene();
    // Take the id the next receiver would get by naming a solid with it.
    scene = { ...scene, geometry: { ...scene.geometry, solids: [...scene.geometry.solids, { ...scene.geometry.solids[0]!, id: "receiver-1" }] } };
    expect(freshId(scene, "receiver")).toBe("receiver-2");
    const { scene: next } = addReceiver(scene, { x: 1, y: 1 });
    expect(usedIds(next).size).toBe(usedIds(scene).size + 1);
  });
});

describe("moving entities", () => {
  it("translates every point of a barrier and keeps coordinates free of rounding noise", () => {
    const scene = translateEntity(frozenScene(), { kind: "wall", id: "barrier" }, 0.1, 0.2);
    expect(entityPoints(scene, { kind: "wall", id: "barrier" })).toEqual([
      { x: 10.1, y: 0.2 },
      { x: 10.1, y: 3.2 },
    ]);
    expectValid(scene);
  });

  it("lets geometry extend beyond the domain but stops a source at its edge", () => {
    const moved = translateEntity(frozenScene(), { kind: "solid", id: "block" }, 0, -2);
    expect(entityPoints(moved, { kind: "solid", id: "block" })[0]).toEqual({ x: 8, y: -2 });
    const source = translateEntity(moved, { kind: "source", id: "road" }, -10, 0);
    expect(findEntity(source, { kind: "source", id: "road" })?.position).toEqual({ x: 0, y: 0.5 });
    expectValid(source);
  });

  it("shortens a receiver line's move at the domain edge so that its length is kept", () => {
    const scene = translateEntity(frozenScene(), { kind: "receiverLine", id: "facade" }, 3, 0);
    const line = findEntity(scene, { kind: "receiverLine", id: "facade" })!;
    expect(line.from).toEqual({ x: 20, y: 0.5 });
    expect(line.to).toEqual({ x: 20, y: 6 });
  });

  it("returns the very same scene for a move of nothing or of an unknown entity", () => {
    const scene = frozenScene();
    expect(translateEntity(scene, { kind: "wall", id: "barrier" }, 0, 0)).toBe(scene);
    expect(translateEntity(scene, { kind: "wall", id: "no-such-wall" }, 1, 1)).toBe(scene);
  });

  it("shares the parts an edit does not touch with the previous scene", () => {
    const before = frozenScene();
    const after = translateEntity(before, { kind: "receiver", id: "garden" }, 1, 0);
    expect(after.geometry).toBe(before.geometry);
    expect(after.sources).toBe(before.sources);
    expect(after.receivers).not.toBe(before.receivers);
  });

  it("duplicates an entity beside the original under a fresh id", () => {
    const result = duplicateEntity(frozenScene(), { kind: "wall", id: "barrier" }, { x: 1, y: 0 })!;
    expect(result.ref.id).toBe("barrier-1");
    expect(findEntity(result.scene, result.ref)).toMatchObject({ label: "Barrier (copy)", path: [{ x: 11, y: 0 }, { x: 11, y: 3 }] });
    expectValid(result.scene);
  });
});

describe("deleting entities", () => {
  it("deletes a receiver", () => {
    const scene = deleteEntity(frozenScene(), { kind: "receiver", id: "garden" });
    expect(scene.receivers).toEqual([]);
    expectValid(scene);
  });

  it("refuses to delete the only source, and says why", () => {
    const scene = frozenScene();
    expect(deletionBlocker(scene, { kind: "source", id: "road" })).toMatch(/at least one source/);
    expect(deleteEntity(scene, { kind: "source", id: "road" })).toBe(scene);
    const two = addSource(scene, { x: 3, y: 1 }).scene;
    expect(deleteEntity(two, { kind: "source", id: "road" }).sources.map((s) => s.id)).toEqual(["source-1"]);
  });
});

describe("editing vertices", () => {
  const block = { kind: "solid", id: "block" } as const;

  it("moves one corner of a solid", () => {
    const scene = moveVertex(frozenScene(), block, 2, { x: 9.5, y: 1.5 });
    expect(entityPoints(scene, block)[2]).toEqual({ x: 9.5, y: 1.5 });
    expect(entityPoints(scene, block)[1]).toEqual({ x: 9, y: 0 });
  });

  it("moves a receiver line's end but not out of the domain", () => {
    const scene = moveVertex(frozenScene(), { kind: "receiverLine", id: "facade" }, 1, { x: 19, y: 12 });
    expect(findEntity(scene, { kind: "receiverLine", id: "facade" })?.to).toEqual({ x: 19, y: 8 });
  });

  it("inserts a corner at the requested position in the outline", () => {
    const scene = insertVertex(frozenScene(), block, 1, { x: 8.5, y: -0.2 });
    expect(entityPoints(scene, block).map((p) => [p.x, p.y])).toEqual([
      [8, 0],
      [8.5, -0.2],
      [9, 0],
      [9, 1],
      [8, 1],
    ]);
    expectValid(scene);
  });

  it("deletes a corner but never leaves a solid with fewer than three or a barrier with fewer than two", () => {
    const three = deleteVertex(frozenScene(), block, 3);
    expect(entityPoints(three, block)).toHaveLength(3);
    expect(deleteVertex(three, block, 0)).toBe(three);
    const wall = { kind: "wall", id: "barrier" } as const;
    const scene = frozenScene();
    expect(deleteVertex(scene, wall, 0)).toBe(scene);
  });

  it("does not add or remove points of sources and receivers", () => {
    const scene = frozenScene();
    expect(insertVertex(scene, { kind: "receiver", id: "garden" }, 0, { x: 1, y: 1 })).toBe(scene);
    expect(deleteVertex(scene, { kind: "receiver", id: "garden" }, 0)).toBe(scene);
  });
});

describe("surface treatments and entity properties", () => {
  it("sets a solid's faces to an explicit absorption coefficient and a surface's lining to an impedance", () => {
    let scene = setTreatment(frozenScene(), { kind: "solid", id: "block" }, { kind: "absorption", absorptionCoefficient: 0.4 });
    scene = setTreatment(scene, { kind: "surface", id: "lining" }, { kind: "impedance", normalisedImpedance: 3 });
    scene = setTreatment(scene, { kind: "wall", id: "barrier" }, { kind: "material", material: "absorptive-barrier-panel" });
    expect(scene.geometry.solids[0]?.surface).toEqual({ kind: "absorption", absorptionCoefficient: 0.4 });
    expect(scene.geometry.surfaces[0]?.treatment).toEqual({ kind: "impedance", normalisedImpedance: 3 });
    expect(scene.geometry.walls[0]?.surface).toEqual({ kind: "material", material: "absorptive-barrier-panel" });
    expectValid(scene);
  });

  it("leaves sources alone when asked to treat their surface", () => {
    const scene = frozenScene();
    expect(setTreatment(scene, { kind: "source", id: "road" }, { kind: "rigid" })).toBe(scene);
  });

  it("sets barrier thickness, labels, source signal and receiver count, refusing impossible values", () => {
    let scene = setWallThickness(frozenScene(), "barrier", 0.3);
    expect(scene.geometry.walls[0]?.thickness).toBe(0.3);
    expect(setWallThickness(scene, "barrier", 0)).toBe(scene);
    scene = setEntityLabel(scene, { kind: "receiver", id: "garden" }, "Garden, 1.5 m");
    scene = setSourceSignal(scene, "road", { kind: "toneBurst", frequency: 250, cycles: 4 });
    scene = setReceiverLineCount(scene, "facade", 20);
    expect(setReceiverLineCount(scene, "facade", 1)).toBe(scene);
    expect(scene.receivers[0]?.label).toBe("Garden, 1.5 m");
    expect(scene.sources[0]?.signal).toEqual({ kind: "toneBurst", frequency: 250, cycles: 4 });
    expect(scene.receiverLines[0]?.count).toBe(20);
    expectValid(scene);
  });
});

describe("scene settings", () => {
  it("sets each side's boundary, including the PML thickness", () => {
    let scene = setEdge(frozenScene(), "top", { kind: "absorption", absorptionCoefficient: 0.7 });
    scene = setPmlThickness(scene, "bottom", 32);
    expect(scene.boundary.top).toEqual({ kind: "absorption", absorptionCoefficient: 0.7 });
    expect(scene.boundary.bottom).toEqual({ kind: "pml", layerCells: 32 });
    expect(scene.boundary.left).toEqual({ kind: "pml", layerCells: 20 });
    expect(setPmlThickness(scene, "left", 2.5)).toBe(scene);
    expectValid(scene);
  });

  it("sets resolution, medium, duration, domain, attenuation and name", () => {
    let scene = setResolution(frozenScene(), { kind: "cellSize", cellSize: 0.05, courantNumber: 0.5 });
    scene = setMedium(scene, { kind: "air", temperature: 5 });
    scene = setDuration(scene, { kind: "decay", decayDb: 40, maxSeconds: 0.5 });
    scene = setDomain(scene, 24, 10);
    scene = setAttenuation(scene, 0.01);
    scene = renameScene(scene, "Design B");
    expect(scene).toMatchObject({
      name: "Design B",
      domain: { width: 24, height: 10 },
      resolution: { kind: "cellSize", cellSize: 0.05 },
      medium: { kind: "air", temperature: 5 },
      duration: { kind: "decay", decayDb: 40 },
      attenuation: { dBPerMetre: 0.01 },
    });
    expectValid(scene);
    const without = setAttenuation(scene, 0);
    expect("attenuation" in without).toBe(false);
    expectValid(without);
  });
});

describe("tidyCoordinate", () => {
  it("rounds to a micrometre and never returns minus zero", () => {
    expect(tidyCoordinate(0.1 + 0.2)).toBe(0.3);
    expect(Object.is(tidyCoordinate(-1e-9), 0)).toBe(true);
    expect(tidyCoordinate(12.3456789)).toBe(12.345679);
  });
});
