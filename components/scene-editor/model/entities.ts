// What the editor can select and drag: the scene's drawn entities, named by kind and id, and the
// points that define each one (its handles). Pure functions over the plain scene data.
import type { Point, Receiver, ReceiverLine, Scene, Solid, Source, Surface, Wall } from "@/lib/fdtd/scene";

export type EntityKind = "solid" | "wall" | "surface" | "source" | "receiver" | "receiverLine";

/** One entity of a scene, by kind and id (ids are unique across the whole scene). */
export interface EntityRef {
  kind: EntityKind;
  id: string;
}

export interface EntityByKind {
  solid: Solid;
  wall: Wall;
  surface: Surface;
  source: Source;
  receiver: Receiver;
  receiverLine: ReceiverLine;
}

export type AnyEntity = EntityByKind[EntityKind];

/** Order in which entities are drawn; hit testing walks it backwards so the top-most wins. */
export const DRAW_ORDER: readonly EntityKind[] = ["solid", "wall", "surface", "receiverLine", "receiver", "source"];

/** The trade's word for each kind, for menus, the inspector and messages. */
export const ENTITY_NAMES: Record<EntityKind, string> = {
  solid: "Solid",
  wall: "Barrier",
  surface: "Treated surface",
  source: "Source",
  receiver: "Receiver",
  receiverLine: "Receiver line",
};

/** The list of a scene that holds entities of `kind`. */
export function entitiesOf<K extends EntityKind>(scene: Scene, kind: K): readonly EntityByKind[K][] {
  switch (kind) {
    case "solid":
      return scene.geometry.solids as EntityByKind[K][];
    case "wall":
      return scene.geometry.walls as EntityByKind[K][];
    case "surface":
      return scene.geometry.surfaces as EntityByKind[K][];
    case "source":
      return scene.sources as EntityByKind[K][];
    case "receiver":
      return scene.receivers as EntityByKind[K][];
    default:
      return scene.receiverLines as EntityByKind[K][];
  }
}

export function findEntity<K extends EntityKind>(scene: Scene, ref: { kind: K; id: string }): EntityByKind[K] | undefined {
  return entitiesOf(scene, ref.kind).find((entity) => entity.id === ref.id);
}

export function sameRef(a: EntityRef | null | undefined, b: EntityRef | null | undefined): boolean {
  return Boolean(a && b && a.kind === b.kind && a.id === b.id);
}

/**
 * The editable points of an entity, in order: a polygon's corners, a polyline's vertices, a source's or
 * receiver's position, a receiver line's two ends.
 */
export function entityPoints(scene: Scene, ref: EntityRef): readonly Point[] {
  switch (ref.kind) {
    case "solid":
      return findEntity(scene, { kind: "solid", id: ref.id })?.polygon ?? [];
    case "wall":
      return findEntity(scene, { kind: "wall", id: ref.id })?.path ?? [];
    case "surface":
      return findEntity(scene, { kind: "surface", id: ref.id })?.path ?? [];
    case "source": {
      const source = findEntity(scene, { kind: "source", id: ref.id });
      return source ? [source.position] : [];
    }
    case "receiver": {
      const receiver = findEntity(scene, { kind: "receiver", id: ref.id });
      return receiver ? [receiver.position] : [];
    }
    case "receiverLine": {
      const line = findEntity(scene, { kind: "receiverLine", id: ref.id });
      return line ? [line.from, line.to] : [];
    }
  }
}

/** Fewest points an entity of `kind` may have (the scene schema's minimum). */
export function minimumPoints(kind: EntityKind): number {
  if (kind === "solid") return 3;
  if (kind === "source" || kind === "receiver") return 1;
  return 2;
}

/** Whether vertices can be added to and removed from this kind (polygons and polylines). */
export function hasEditableVertexCount(kind: EntityKind): boolean {
  return kind === "solid" || kind === "wall" || kind === "surface";
}

/** Every id used anywhere in the scene (ids must be unique across all lists). */
export function usedIds(scene: Scene): Set<string> {
  const ids = new Set<string>();
  for (const region of scene.mediumRegions) ids.add(region.id);
  for (const kind of DRAW_ORDER) for (const entity of entitiesOf(scene, kind)) ids.add(entity.id);
  return ids;
}

const ID_STEMS: Record<EntityKind, string> = {
  solid: "solid",
  wall: "barrier",
  surface: "surface",
  source: "source",
  receiver: "receiver",
  receiverLine: "receiver-line",
};

/** A new id for an entity of `kind`, e.g. `barrier-2`, not used anywhere in the scene. */
export function freshId(scene: Scene, kind: EntityKind): string {
  const ids = usedIds(scene);
  const stem = ID_STEMS[kind];
  for (let n = 1; ; n++) {
    const candidate = `${stem}-${n}`;
    if (!ids.has(candidate)) return candidate;
  }
}

/** A label a person reads for a new entity, numbered like its fresh id: `barrier-2` is "Barrier 2". */
export function freshLabel(scene: Scene, kind: EntityKind): string {
  const number = /-(\d+)$/.exec(freshId(scene, kind))?.[1] ?? "1";
  return `${ENTITY_NAMES[kind]} ${number}`;
}

/** Label to show for an entity: its label, or its id when the label is empty. */
export function displayName(entity: { id: string; label: string }): string {
  return entity.label.trim() || entity.id;
}
