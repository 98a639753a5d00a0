// Reference scenes for insertion loss and parameter sweeps, on the demo's design A section.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { defaultRemovedIds, freeFieldScene, removableElements, sceneWithout } from "@/lib/scene-variants/reference-scene";
import { MAX_SWEEP_CASES, sweepScenes, sweepValues } from "@/lib/scene-variants/sweep";

const designA = parseSceneOrThrow(JSON.parse(readFileSync("db/seed/scenes/design-a-3m-reflective.json", "utf8")));

describe("reference scenes", () => {
  it("offers the barrier first and leaves it out by default", () => {
    expect(removableElements(designA)[0]).toMatchObject({ id: "barrier", kind: "wall" });
    expect(defaultRemovedIds(designA)).toEqual(["barrier"]);
  });

  it("takes out only the chosen elements and keeps the grid, sources and receivers", () => {
    const reference = sceneWithout(designA, ["barrier"]);
    if (!reference.ok) throw new Error(reference.message);
    expect(reference.scene.geometry.walls).toEqual([]);
    expect(reference.scene.geometry.solids.map((solid) => solid.id)).toEqual(["house-east", "road-verge"]);
    expect(reference.scene.receivers).toEqual(designA.receivers);
    expect(reference.scene.sources).toEqual(designA.sources);
    const [a, b] = [deriveGrid(designA), deriveGrid(reference.scene)];
    expect([b.nx, b.ny, b.cellSize, b.timeStep, b.steps]).toEqual([a.nx, a.ny, a.cellSize, a.timeStep, a.steps]);
    expect(reference.scene.name).toContain("without Timber barrier");
  });

  it("refuses an unknown element or an empty choice", () => {
    expect(sceneWithout(designA, ["barier"])).toEqual({ ok: false, message: 'no wall, solid or surface with id "barier"' });
    expect(sceneWithout(designA, []).ok).toBe(false);
  });

  it("makes the free field: no geometry and a PML on every side", () => {
    const free = freeFieldScene(designA);
    if (!free.ok) throw new Error(free.message);
    expect(free.scene.geometry).toEqual({ solids: [], walls: [], surfaces: [] });
    expect(Object.values(free.scene.boundary).every((edge) => edge.kind === "pml" && edge.layerCells === 20)).toBe(true);
    expect(deriveGrid(free.scene).cellSize).toBe(deriveGrid(designA).cellSize);
  });
});

describe("parameter sweeps", () => {
  it("includes both ends of a range without rounding drift", () => {
    expect(sweepValues({ from: 2, to: 5, step: 0.5 })).toEqual({ ok: true, values: [2, 2.5, 3, 3.5, 4, 4.5, 5] });
    expect(sweepValues({ from: 0.1, to: 0.3, step: 0.1 })).toEqual({ ok: true, values: [0.1, 0.2, 0.3] });
  });

  it("refuses a bad or too long range with a reason", () => {
    expect(sweepValues({ from: 2, to: 5, step: 0 })).toMatchObject({ ok: false, message: expect.stringMatching(/step/) });
    expect(sweepValues({ from: 5, to: 2, step: 1 })).toMatchObject({ ok: false });
    expect(sweepValues({ from: 0, to: 100, step: 1 })).toMatchObject({ ok: false, message: expect.stringContaining(String(MAX_SWEEP_CASES)) });
  });

  it("raises the barrier's top from its foot, 2 to 5 m", () => {
    const sweep = sweepScenes(designA, { kind: "wall-height", wallId: "barrier" }, { from: 2, to: 5, step: 0.5 });
    if (!sweep.ok) throw new Error(sweep.message);
    expect(sweep.cases.map((c) => c.value)).toEqual([2, 2.5, 3, 3.5, 4, 4.5, 5]);
    for (const { value, scene } of sweep.cases) {
      const path = scene.geometry.walls[0]!.path;
      // The barrier stands on the verge at y = 0.4 m; its top is the foot plus the height.
      expect(path).toEqual([{ x: 12.5, y: 0.4 }, { x: 12.5, y: 0.4 + value }]);
      expect(scene.name).toContain(`= ${value} m`);
    }
  });

  it("moves a receiver, and sets a wall's absorption", () => {
    const receiverId = designA.receivers[0]!.id;
    const heights = sweepScenes(designA, { kind: "receiver-height", receiverId }, { from: 1.5, to: 4.5, step: 1.5 });
    if (!heights.ok) throw new Error(heights.message);
    expect(heights.cases.map((c) => c.scene.receivers[0]!.position.y)).toEqual([1.5, 3, 4.5]);
    const absorption = sweepScenes(designA, { kind: "wall-absorption", wallId: "barrier" }, { from: 0.2, to: 0.8, step: 0.3 });
    if (!absorption.ok) throw new Error(absorption.message);
    expect(absorption.cases.map((c) => c.scene.geometry.walls[0]!.surface)).toEqual([0.2, 0.5, 0.8].map((a) => ({ kind: "absorption", absorptionCoefficient: a })));
  });

  it("names the value that makes an invalid scene", () => {
    const sweep = sweepScenes(designA, { kind: "receiver-height", receiverId: designA.receivers[0]!.id }, { from: 10, to: 20, step: 5 });
    expect(sweep).toMatchObject({ ok: false, message: expect.stringMatching(/= 15 m makes an invalid scene/) });
    expect(sweepScenes(designA, { kind: "wall-height", wallId: "nope" }, { from: 1, to: 2, step: 1 })).toMatchObject({ ok: false, message: expect.stringContaining('"nope"') });
  });
});
