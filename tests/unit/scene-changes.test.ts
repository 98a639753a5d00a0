import { describe, expect, it } from "vitest";
import { describeSceneChanges, summariseSceneChanges } from "@/components/scenes/history/scene-changes";
import type { Scene } from "@/lib/fdtd/scene";
import { barrierScene, deepFreeze } from "../scene-editor/scene-fixtures";

/** A changed copy of the barrier scene; the original is frozen, so the comparison cannot mutate it. */
function edited(change: (scene: Scene) => void): { before: Scene; after: Scene } {
  const before = deepFreeze(barrierScene());
  const after = structuredClone(barrierScene());
  change(after);
  return { before, after };
}

describe("describing the changes between two scene versions", () => {
  it("finds nothing between equal scenes, whatever their key order", () => {
    const scene = barrierScene();
    const reordered = Object.fromEntries(Object.entries(structuredClone(scene)).reverse());
    expect(describeSceneChanges(scene, reordered)).toEqual([]);
  });

  it("treats a field left at its default the same as one written out", () => {
    const scene = barrierScene();
    const sparse = structuredClone(scene) as Partial<Scene>;
    delete sparse.output;
    delete sparse.mediumRegions;
    expect(describeSceneChanges(sparse, scene)).toEqual([]);
  });

  it("says a receiver moved when its position changed", () => {
    const { before, after } = edited((scene) => {
      scene.receivers[0]!.position = { x: 16, y: 2 };
    });
    expect(describeSceneChanges(before, after)).toEqual(["moved receiver “Garden”"]);
  });

  it("says a barrier's height changed, with the old and new height", () => {
    const { before, after } = edited((scene) => {
      scene.geometry.walls[0]!.path = [{ x: 10, y: 0 }, { x: 10, y: 4.5 }];
    });
    expect(describeSceneChanges(before, after)).toEqual(["changed the height of barrier “Barrier” (3 m → 4.5 m)"]);
  });

  it("tells a polygon moved whole from one reshaped in place", () => {
    const moved = edited((scene) => {
      scene.geometry.solids[0]!.polygon = scene.geometry.solids[0]!.polygon.map((p) => ({ x: p.x + 1, y: p.y }));
    });
    expect(describeSceneChanges(moved.before, moved.after)).toEqual(["moved solid “Ground block”"]);
    const reshaped = edited((scene) => {
      scene.geometry.solids[0]!.polygon = [{ x: 8, y: 0 }, { x: 9, y: 0 }, { x: 8.5, y: 1 }, { x: 8, y: 1 }];
    });
    expect(describeSceneChanges(reshaped.before, reshaped.after)).toEqual(["reshaped solid “Ground block”"]);
  });

  it("names added and removed entities", () => {
    const { before, after } = edited((scene) => {
      scene.receivers = [{ id: "terrace", label: "Terrace", position: { x: 17, y: 2 } }];
    });
    expect(describeSceneChanges(before, after)).toEqual(["added receiver “Terrace”", "removed receiver “Garden”"]);
  });

  it("matches an entity whose id changed by its label, and reports the rename of one whose label changed", () => {
    const { before, after } = edited((scene) => {
      scene.receivers[0]!.id = "garden-2";
      scene.sources[0]!.label = "Motorway";
    });
    expect(describeSceneChanges(before, after)).toEqual(["renamed source “Road” to “Motorway”", "changed the id of receiver “Garden”"]);
  });

  it("names the field of an entity that changed, with numbers where they help", () => {
    const { before, after } = edited((scene) => {
      scene.sources[0]!.signal = { kind: "toneBurst", frequency: 250, cycles: 4 };
      scene.receiverLines[0]!.count = 20;
      scene.geometry.walls[0]!.thickness = 0.3;
    });
    expect(describeSceneChanges(before, after)).toEqual([
      "changed the signal of source “Road”",
      "changed the receiver count of receiver line “Facade” (12 → 20)",
      "changed the thickness of barrier “Barrier” (0.2 m → 0.3 m)",
    ]);
  });

  it("describes the scene's settings: duration, resolution, domain and boundaries", () => {
    const { before, after } = edited((scene) => {
      scene.duration = { kind: "time", seconds: 0.25 };
      scene.resolution = { ...scene.resolution, courantNumber: 0.5 };
      scene.domain = { width: 24, height: 8 };
      scene.boundary = { ...scene.boundary, top: { kind: "rigid" } };
    });
    expect(describeSceneChanges(before, after).sort()).toEqual(
      ["changed the duration (0.1 s → 0.25 s)", "changed the Courant number (0.6 → 0.5)", "resized the domain (20 × 8 m → 24 × 8 m)", "changed the top boundary"].sort(),
    );
  });

  it("notices a new order of medium regions, where the later one wins", () => {
    const square = (x: number) => [{ x, y: 0 }, { x: x + 1, y: 0 }, { x: x + 1, y: 1 }, { x, y: 1 }];
    const base = barrierScene();
    base.mediumRegions = [
      { id: "warm", label: "Warm", polygon: square(1), medium: { kind: "air", temperature: 30 } },
      { id: "cold", label: "Cold", polygon: square(1), medium: { kind: "air", temperature: 0 } },
    ];
    const swapped = structuredClone(base);
    swapped.mediumRegions.reverse();
    expect(describeSceneChanges(base, swapped)).toEqual(["reordered the medium regions"]);
  });

  it("still describes versions that no longer validate", () => {
    const before = { sources: [{ id: "s", label: "", position: { x: 1, y: 1 } }] };
    const after = { sources: [{ id: "s", label: "", position: { x: 2, y: 1 } }] };
    expect(describeSceneChanges(before, after)).toEqual(["moved source “s”"]);
  });
});

describe("summarising changes in one line", () => {
  it("shows the first changes in full and counts the rest", () => {
    const changes = ["moved receiver “R2”", "changed the height of barrier “B” (3 m → 4 m)", "added source “S2”", "removed receiver “R9”", "changed the medium"];
    expect(summariseSceneChanges(changes)).toBe("Moved receiver “R2”, changed the height of barrier “B” (3 m → 4 m), added source “S2” and 2 more changes");
    expect(summariseSceneChanges(changes.slice(0, 4))).toMatch(/and 1 more change$/);
    expect(summariseSceneChanges(changes.slice(0, 1))).toBe("Moved receiver “R2”");
  });

  it("says so when nothing in the scene changed", () => {
    expect(summariseSceneChanges([])).toBe("No change to the scene");
  });
});
