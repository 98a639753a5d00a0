import { describe, expect, it } from "vitest";

import { absorptionFromImpedance, impedanceFromAbsorption, MATERIAL_IDS, MATERIALS, materialImpedance, reflectionFromImpedance } from "@/lib/fdtd/materials";
import { COURANT_LIMIT_2D, parseScene, sceneJsonSchema, type SceneInput } from "@/lib/fdtd/scene";

function validScene(): SceneInput {
  return {
    version: 1,
    name: "barrier",
    domain: { width: 20, height: 8 },
    medium: { kind: "air", temperature: 20 },
    resolution: { kind: "frequency", maxFrequency: 500 },
    geometry: {
      solids: [{ id: "ground-block", label: "Block", polygon: [{ x: 8, y: 0 }, { x: 9, y: 0 }, { x: 9, y: 1 }] }],
      walls: [{ id: "barrier", label: "Barrier", path: [{ x: 10, y: 0 }, { x: 10, y: 3 }], thickness: 0.1 }],
      surfaces: [{ id: "lining", label: "Absorber", path: [{ x: 9.95, y: 0 }, { x: 9.95, y: 3 }], treatment: { kind: "material", material: "mineral-wool-50mm" } }],
    },
    boundary: { bottom: { kind: "rigid" }, left: { kind: "pml", layerCells: 16 } },
    sources: [{ id: "road", label: "Road", position: { x: 2, y: 0.5 }, signal: { kind: "ricker", peakFrequency: 200 } }],
    receivers: [{ id: "garden", label: "Garden", position: { x: 15, y: 1.5 } }],
    receiverLines: [{ id: "line", label: "Facade", from: { x: 18, y: 0.5 }, to: { x: 18, y: 6 }, count: 12 }],
    duration: { kind: "time", seconds: 0.1 },
  };
}

describe("parseScene", () => {
  it("accepts a valid scene and fills in the defaults", () => {
    const result = parseScene(validScene());
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const scene = result.scene;
    expect(scene.resolution.courantNumber).toBeGreaterThan(0);
    expect(scene.resolution.courantNumber).toBeLessThan(COURANT_LIMIT_2D);
    expect(scene.resolution.kind === "frequency" && scene.resolution.pointsPerWavelength).toBe(10);
    expect(scene.boundary.right).toEqual({ kind: "pml", layerCells: 20 });
    expect(scene.boundary.left).toEqual({ kind: "pml", layerCells: 16 });
    expect(scene.geometry.solids[0]?.surface).toEqual({ kind: "rigid" });
    expect(scene.sources[0]?.amplitude).toBe(1);
    expect(scene.output.snapshotCellStride).toBe(1);
  });

  it("rejects a Courant number above the 2D limit, naming the field", () => {
    const input = validScene();
    input.resolution = { kind: "frequency", maxFrequency: 500, courantNumber: 0.72 };
    const result = parseScene(input);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]?.path).toBe("resolution.courantNumber");
    expect(result.problems[0]?.message).toMatch(/1\/sqrt\(2\)/);
  });

  it("accepts a Courant number exactly at the 2D limit", () => {
    const input = validScene();
    input.resolution = { kind: "cellSize", cellSize: 0.05, courantNumber: Math.SQRT1_2 };
    expect(parseScene(input).ok).toBe(true);
  });

  it("reports each bad field with its JSON path", () => {
    const input = validScene() as unknown as { geometry: { walls: { thickness: unknown }[] }; sources: { signal: unknown }[]; domain: unknown };
    input.geometry.walls[0]!.thickness = -1;
    input.sources[0]!.signal = { kind: "ricker", peakFrequency: "loud" };
    input.domain = { width: 20 };
    const result = parseScene(input);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const paths = result.problems.map((p) => p.path).sort();
    expect(paths).toEqual(["domain.height", "geometry.walls[0].thickness", "sources[0].signal.peakFrequency"]);
    for (const problem of result.problems) expect(problem.message.length).toBeGreaterThan(5);
  });

  it("rejects an unknown signal kind at the kind field", () => {
    const input = validScene() as unknown as { sources: { signal: unknown }[] };
    input.sources[0]!.signal = { kind: "chirp", frequency: 100 };
    const result = parseScene(input);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map((p) => p.path)).toEqual(["sources[0].signal.kind"]);
  });

  it("reports duplicate ids and points outside the domain", () => {
    const input = validScene();
    input.receivers = [{ id: "road", label: "Clash", position: { x: 25, y: 1 } }];
    const result = parseScene(input);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const paths = result.problems.map((p) => p.path).sort();
    expect(paths).toEqual(["receivers[0].id", "receivers[0].position"]);
  });

  it("rejects unknown fields instead of silently dropping them", () => {
    const input = { ...validScene(), colour: "red" };
    const result = parseScene(input);
    expect(result.ok).toBe(false);
  });

  it("rejects non-objects and unsupported versions with a message at the version", () => {
    expect(parseScene(null)).toMatchObject({ ok: false, problems: [{ path: "" }] });
    expect(parseScene({ ...validScene(), version: 2 })).toMatchObject({ ok: false, problems: [{ path: "version" }] });
    expect(parseScene({ ...validScene(), version: undefined })).toMatchObject({ ok: false, problems: [{ path: "version" }] });
  });

  it("round-trips: a parsed scene serialised to JSON parses to the same scene", () => {
    const first = parseScene(validScene());
    if (!first.ok) throw new Error("valid scene rejected");
    const second = parseScene(JSON.parse(JSON.stringify(first.scene)));
    expect(second).toEqual(first);
  });
});

describe("sceneJsonSchema", () => {
  it("describes the scene for editors, with the Courant limit and the signal kinds", () => {
    const schema = sceneJsonSchema();
    const text = JSON.stringify(schema);
    expect(schema.type).toBe("object");
    expect(text).toContain(String(Math.SQRT1_2));
    for (const kind of ["ricker", "gaussianPulse", "toneBurst", "sine", "sampled"]) expect(text).toContain(`"${kind}"`);
    expect((schema.required as string[]).sort()).toEqual(["domain", "duration", "resolution", "sources", "version"]);
  });
});

describe("materials", () => {
  // Normal incidence on a surface of specific impedance Z = z rho c: R = (z - 1)/(z + 1), alpha = 1 - R^2
  // (Kinsler, Frey, Coppens & Sanders, Fundamentals of Acoustics, 4th ed., ch. 6).
  it("converts impedance to reflection and absorption by the normal-incidence formulas", () => {
    expect(reflectionFromImpedance(1)).toBe(0);
    expect(reflectionFromImpedance(3)).toBeCloseTo(0.5, 15);
    expect(reflectionFromImpedance(Infinity)).toBe(1);
    expect(absorptionFromImpedance(3)).toBeCloseTo(0.75, 15);
    expect(absorptionFromImpedance(1 / 3)).toBeCloseTo(0.75, 15);
  });

  it("inverts absorption to the impedance root z >= 1", () => {
    expect(impedanceFromAbsorption(0.75)).toBeCloseTo(3, 12);
    expect(impedanceFromAbsorption(1)).toBe(1);
    expect(impedanceFromAbsorption(0)).toBe(Infinity);
    for (const alpha of [0.01, 0.2, 0.5, 0.9, 0.99]) expect(absorptionFromImpedance(impedanceFromAbsorption(alpha))).toBeCloseTo(alpha, 12);
    expect(() => impedanceFromAbsorption(1.5)).toThrow(RangeError);
  });

  it("gives every table material a finite impedance of at least 1 and names its source", () => {
    for (const id of MATERIAL_IDS) {
      const z = materialImpedance(id);
      expect(Number.isFinite(z)).toBe(true);
      expect(z).toBeGreaterThanOrEqual(1);
      expect(MATERIALS[id].source).toMatch(/from memory|Table/);
    }
  });
});
