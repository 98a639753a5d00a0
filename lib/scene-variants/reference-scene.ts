// Reference scenes for insertion loss. Insertion loss is the level at a receiver without the
// treatment minus the level with it, everything else equal; so a reference is the same scene (grid,
// sources, receivers, duration) with chosen elements taken out, or with every element and every
// reflecting outer side taken out (free field). Same domain and resolution means the same grid, so
// level maps subtract cell by cell.
import { parseScene, type Scene } from "@/lib/fdtd/scene";

/** An element that can be taken out to make a reference. */
export interface RemovableElement {
  id: string;
  kind: "wall" | "solid" | "surface";
  label: string;
}

export type ReferenceScene = { ok: true; scene: Scene } | { ok: false; message: string };

/** The elements a reference may leave out: thin walls (barriers) first, then solids and surface treatments. */
export function removableElements(scene: Scene): RemovableElement[] {
  const { walls, solids, surfaces } = scene.geometry;
  return [
    ...walls.map((wall) => ({ id: wall.id, kind: "wall" as const, label: wall.label || wall.id })),
    ...solids.map((solid) => ({ id: solid.id, kind: "solid" as const, label: solid.label || solid.id })),
    ...surfaces.map((surface) => ({ id: surface.id, kind: "surface" as const, label: surface.label || surface.id })),
  ];
}

/** What a reference takes out by default: every thin wall, the usual shape of a barrier in a section. */
export function defaultRemovedIds(scene: Scene): string[] {
  return scene.geometry.walls.map((wall) => wall.id);
}

function validated(candidate: unknown): ReferenceScene {
  const parsed = parseScene(candidate);
  if (parsed.ok) return { ok: true, scene: parsed.scene };
  const first = parsed.problems[0];
  return { ok: false, message: `the reference scene is not valid: ${first ? `${first.path || "(scene)"}: ${first.message}` : "unknown problem"}` };
}

/** The scene with the named elements taken out; unknown ids are an error, so a typo cannot pass unnoticed. */
export function sceneWithout(scene: Scene, removedIds: readonly string[]): ReferenceScene {
  if (removedIds.length === 0) return { ok: false, message: "choose at least one element to leave out of the reference" };
  const known = new Set(removableElements(scene).map((element) => element.id));
  const unknown = removedIds.filter((id) => !known.has(id));
  if (unknown.length > 0) return { ok: false, message: `no wall, solid or surface with id ${unknown.map((id) => `"${id}"`).join(", ")}` };
  const removed = new Set(removedIds);
  const keep = <T extends { id: string }>(items: T[]) => items.filter((item) => !removed.has(item.id));
  const labels = removableElements(scene)
    .filter((element) => removed.has(element.id))
    .map((element) => element.label);
  return validated({
    ...scene,
    name: `${scene.name || "Scene"}: reference without ${labels.join(", ")}`.slice(0, 200),
    geometry: { solids: keep(scene.geometry.solids), walls: keep(scene.geometry.walls), surfaces: keep(scene.geometry.surfaces) },
  });
}

/**
 * The free field: the same domain, grid, sources and receivers with no geometry, no medium regions and
 * a PML on every side (keeping the scene's layer thickness where it had one), so nothing reflects.
 */
export function freeFieldScene(scene: Scene): ReferenceScene {
  const thickest = Math.max(
    ...Object.values(scene.boundary).map((edge) => (edge.kind === "pml" ? edge.layerCells : 0)),
    0,
  );
  const pml = thickest > 0 ? { kind: "pml" as const, layerCells: thickest } : { kind: "pml" as const };
  return validated({
    ...scene,
    name: `${scene.name || "Scene"}: free field`.slice(0, 200),
    mediumRegions: [],
    geometry: { solids: [], walls: [], surfaces: [] },
    boundary: { left: pml, right: pml, bottom: pml, top: pml },
  });
}
