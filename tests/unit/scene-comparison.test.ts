import { describe, expect, it } from "vitest";
import type { BandLevelTable } from "@/lib/analysis/band-levels";
import { bandsBetween } from "@/lib/analysis/bands";
import { ABSENT, compareSceneSettings, countDifferences, forkInsertionLoss, pairReceivers, type ReceiverPlace, type SettingGroup } from "@/lib/collaboration/scene-comparison";
import { buildScene } from "@/lib/fdtd/builders";
import type { Scene, SceneInput } from "@/lib/fdtd/scene";
import { tinySceneInput } from "../run-record/fixtures";

function scene(changes: Partial<SceneInput> = {}): Scene {
  return buildScene({ ...tinySceneInput(), ...changes });
}

function findRow(groups: SettingGroup[], key: string) {
  const found = groups.flatMap((group) => group.rows).find((r) => r.key === key);
  if (!found) throw new Error(`no row ${key}`);
  return found;
}

describe("compareSceneSettings", () => {
  it("finds no difference between a scene and its unchanged copy", () => {
    const groups = compareSceneSettings(scene(), scene());
    expect(countDifferences(groups)).toBe(0);
    expect(groups.map((g) => g.title)).toEqual(["Domain and medium", "Resolution", "Boundaries", "Sources", "Receivers", "Barriers and solids", "Materials"]);
  });

  it("marks a changed resolution, with the derived cell size and resolved frequency", () => {
    const groups = compareSceneSettings(scene(), scene({ resolution: { kind: "cellSize", cellSize: 0.01, courantNumber: 0.5 } }));
    expect(findRow(groups, "resolution")).toMatchObject({ origin: "cell size set to 20 mm", fork: "cell size set to 10 mm", differs: true });
    expect(findRow(groups, "cell-size")).toMatchObject({ origin: "20 mm", fork: "10 mm", differs: true });
    expect(findRow(groups, "courant")).toMatchObject({ origin: "0.6", fork: "0.5", differs: true });
    expect(findRow(groups, "resolved").differs).toBe(true);
    expect(findRow(groups, "domain").differs).toBe(false);
  });

  it("describes boundaries, including materials, side by side", () => {
    const groups = compareSceneSettings(scene(), scene({ boundary: { left: { kind: "pml", layerCells: 8 }, right: { kind: "pml", layerCells: 8 }, top: { kind: "pml", layerCells: 12 }, bottom: { kind: "material", material: "grass-ground" } } }));
    expect(findRow(groups, "boundary:bottom")).toMatchObject({ origin: "rigid", differs: true });
    expect(findRow(groups, "boundary:bottom").fork).toMatch(/^Grass/);
    expect(findRow(groups, "boundary:top")).toMatchObject({ origin: "absorbing layer (PML), 8 cells", fork: "absorbing layer (PML), 12 cells" });
    expect(findRow(groups, "boundary:left").differs).toBe(false);
    expect(findRow(groups, "materials").differs).toBe(true);
  });

  it("matches sources, receivers and solids by id and shows what only one scene has", () => {
    const base = tinySceneInput();
    const fork = scene({
      sources: [{ id: "src", label: "Source", position: { x: 0.3, y: 0.2 }, signal: { kind: "ricker", peakFrequency: 1000 } }],
      receivers: [...(base.receivers ?? []), { id: "rx2", label: "Garden", position: { x: 1.0, y: 0.3 } }],
      geometry: { solids: [{ id: "block", label: "Block", polygon: [{ x: 0.55, y: 0 }, { x: 0.65, y: 0 }, { x: 0.65, y: 0.4 }, { x: 0.55, y: 0.4 }] }] },
    });
    const groups = compareSceneSettings(scene(), fork);
    expect(findRow(groups, "source:src")).toMatchObject({ differs: true });
    expect(findRow(groups, "source:src").origin).toContain("peak 1,500 Hz");
    expect(findRow(groups, "source:src").fork).toContain("peak 1,000 Hz");
    expect(findRow(groups, "receiver:rx2")).toMatchObject({ label: "Receiver “Garden”", origin: ABSENT, fork: "(1, 0.3) m", differs: true });
    expect(findRow(groups, "receivers")).toMatchObject({ origin: "1", fork: "2" });
    expect(findRow(groups, "solid:block").origin).toContain("0.25 m high, top at 0.25 m");
    expect(findRow(groups, "solid:block").fork).toContain("0.4 m high, top at 0.4 m");
    expect(findRow(groups, "receiver-line:line").differs).toBe(false);
  });

  it("gives a wall's length, thickness and top", () => {
    const withWall = scene({ geometry: { walls: [{ id: "barrier", label: "Barrier", path: [{ x: 0.6, y: 0 }, { x: 0.6, y: 0.3 }], thickness: 0.05, surface: { kind: "absorption", absorptionCoefficient: 0.8 } }] } });
    const groups = compareSceneSettings(scene(), withWall);
    expect(findRow(groups, "wall:barrier")).toMatchObject({ origin: ABSENT, fork: "0.3 m long, 0.05 m thick, top at 0.3 m; absorption α = 0.8" });
    expect(findRow(groups, "walls")).toMatchObject({ origin: "0", fork: "1" });
  });
});

describe("pairReceivers", () => {
  const place = (id: string, label: string, x: number, y: number): ReceiverPlace => ({ id, label, position: { x, y } });

  it("pairs by id first, then by a unique name, then by position within the tolerance", () => {
    const origin = [place("a", "Garden", 1, 1), place("b", "Window", 2, 2), place("c", "", 3, 3), place("d", "", 9, 9)];
    const fork = [place("a", "Garden moved", 5, 5), place("w", "Window", 7, 7), place("z", "", 3.01, 3), place("far", "", 9.5, 9)];
    expect(pairReceivers(origin, fork, 0.02)).toEqual([
      { originId: "a", forkId: "a", label: "Garden moved", matchedBy: "id" },
      { originId: "b", forkId: "w", label: "Window", matchedBy: "name" },
      { originId: "c", forkId: "z", label: "z", matchedBy: "position" },
    ]);
  });

  it("does not pair by a name that is used twice", () => {
    const origin = [place("a", "Façade", 1, 1), place("b", "Façade", 2, 2)];
    const fork = [place("x", "Façade", 8, 8)];
    expect(pairReceivers(origin, fork, 0.1)).toEqual([]);
  });

  it("takes the nearest receiver when several lie within the tolerance, and each only once", () => {
    const origin = [place("a", "", 1, 1), place("b", "", 1.001, 1)];
    const fork = [place("x", "", 1.004, 1), place("y", "", 1.0005, 1)];
    const pairs = pairReceivers(origin, fork, 0.01);
    expect(pairs.map((p) => [p.originId, p.forkId])).toEqual([
      ["a", "y"],
      ["b", "x"],
    ]);
  });
});

describe("forkInsertionLoss", () => {
  const octaves = bandsBetween(63, 1000, 1);
  function table(bandCount: number, receivers: { id: string; levels: number[] }[], averagingTime = 0.5, firstBand = 0): BandLevelTable {
    return {
      bandsPerOctave: 1,
      weighting: "Z",
      bands: octaves.slice(firstBand, firstBand + bandCount),
      excluded: [],
      averagingTime,
      receivers: receivers.map((r) => ({ receiverId: r.id, label: r.id, levels: Float64Array.from(r.levels), overall: NaN })),
    };
  }
  const pair = { originId: "rx", forkId: "rx", label: "rx", matchedBy: "id" as const };

  it("is the origin's level minus the fork's: positive where the fork is quieter", () => {
    const result = forkInsertionLoss(table(3, [{ id: "rx", levels: [70, 65, 60] }]), table(3, [{ id: "rx", levels: [64, 66, 50] }]), [pair]);
    expect(result.bands.map((b) => b.nominal)).toEqual([63, 125, 250]);
    expect(result.receivers[0]!.insertionLoss.map((v) => Number(v.toFixed(9)))).toEqual([6, -1, 10]);
    expect(result.durationsDiffer).toBe(false);
  });

  it("keeps only the bands both runs resolve", () => {
    // The origin resolves 63 to 500 Hz, the fork (a coarser grid) 125 to 250 Hz.
    const result = forkInsertionLoss(table(4, [{ id: "rx", levels: [70, 68, 66, 64] }]), table(2, [{ id: "rx", levels: [60, 60] }], 0.5, 1), [pair]);
    expect(result.bands.map((b) => b.nominal)).toEqual([125, 250]);
    expect(result.receivers[0]!.insertionLoss.map((v) => Number(v.toFixed(9)))).toEqual([8, 6]);
  });

  it("compares exposure, so a longer fork run of the same transient shows no loss", () => {
    // The same pulse energy averaged over twice the time reads 3 dB lower as a level, not as exposure.
    const longer = 70 - 10 * Math.log10(2);
    const result = forkInsertionLoss(table(1, [{ id: "rx", levels: [70] }], 0.5), table(1, [{ id: "rx", levels: [longer] }], 1.0), [pair]);
    expect(result.receivers[0]!.insertionLoss[0]).toBeCloseTo(0, 9);
    expect(result.durationsDiffer).toBe(true);
  });

  it("sums the common bands as energy for the overall figure, and skips pairs without levels", () => {
    const result = forkInsertionLoss(
      table(2, [{ id: "rx", levels: [70, 70] }]),
      table(2, [{ id: "rx", levels: [60, 60] }]),
      [pair, { originId: "missing", forkId: "rx", label: "gone", matchedBy: "position" }],
    );
    expect(result.receivers).toHaveLength(1);
    expect(result.receivers[0]!.overall).toBeCloseTo(10, 9);
  });
});
