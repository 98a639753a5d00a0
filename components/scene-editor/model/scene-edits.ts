// Every edit the scene editor can make, each a pure function from a scene to a new scene. The input
// is never changed; parts that an edit does not touch are shared with the old scene. An edit that
// cannot apply (unknown id, too few points left) returns the very same scene object, so callers can
// tell "nothing happened" by identity.
import type {
  Boundary,
  Duration,
  Edge,
  EdgeSide,
  Medium,
  Point,
  Resolution,
  Scene,
  SceneOutput,
  Signal,
  Source,
  SurfaceTreatment,
} from "@/lib/fdtd/scene";
import { DEFAULT_PML_CELLS } from "@/lib/fdtd/scene";

import { entitiesOf, entityPoints, findEntity, freshId, freshLabel, hasEditableVertexCount, minimumPoints, type EntityByKind, type EntityKind, type EntityRef } from "./entities";

/** Coordinates are kept to a micrometre so that sums of drags do not leave 12.500000000000002 in the JSON. */
export function tidyCoordinate(value: number): number {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Object.is(rounded, -0) ? 0 : rounded;
}

function tidyPoint(p: Point): Point {
  return { x: tidyCoordinate(p.x), y: tidyCoordinate(p.y) };
}

/** The nearest point inside the domain: sources and receivers must lie in it (parseScene checks). */
export function clampToDomain(scene: Scene, p: Point): Point {
  return {
    x: tidyCoordinate(Math.min(scene.domain.width, Math.max(0, p.x))),
    y: tidyCoordinate(Math.min(scene.domain.height, Math.max(0, p.y))),
  };
}

/** Kinds whose points must stay inside the domain. */
function confinedToDomain(kind: EntityKind): boolean {
  return kind === "source" || kind === "receiver" || kind === "receiverLine";
}

function withList<K extends EntityKind>(scene: Scene, kind: K, list: EntityByKind[K][]): Scene {
  switch (kind) {
    case "solid":
      return { ...scene, geometry: { ...scene.geometry, solids: list as EntityByKind["solid"][] } };
    case "wall":
      return { ...scene, geometry: { ...scene.geometry, walls: list as EntityByKind["wall"][] } };
    case "surface":
      return { ...scene, geometry: { ...scene.geometry, surfaces: list as EntityByKind["surface"][] } };
    case "source":
      return { ...scene, sources: list as EntityByKind["source"][] };
    case "receiver":
      return { ...scene, receivers: list as EntityByKind["receiver"][] };
    default:
      return { ...scene, receiverLines: list as EntityByKind["receiverLine"][] };
  }
}

/** Replaces one entity by `update(entity)`; the same scene when the entity is missing or unchanged. */
function updateEntity<K extends EntityKind>(scene: Scene, ref: { kind: K; id: string }, update: (entity: EntityByKind[K]) => EntityByKind[K]): Scene {
  const list = entitiesOf(scene, ref.kind);
  const index = list.findIndex((entity) => entity.id === ref.id);
  if (index < 0) return scene;
  const before = list[index]!;
  const after = update(before);
  if (after === before) return scene;
  const next = list.slice();
  next[index] = after;
  return withList(scene, ref.kind, next);
}

/** Writes the points of an entity back in the shape of its kind. */
function withPoints(kind: EntityKind, entity: EntityByKind[EntityKind], points: Point[]): EntityByKind[EntityKind] {
  switch (kind) {
    case "solid":
      return { ...(entity as EntityByKind["solid"]), polygon: points };
    case "wall":
      return { ...(entity as EntityByKind["wall"]), path: points };
    case "surface":
      return { ...(entity as EntityByKind["surface"]), path: points };
    case "source":
      return { ...(entity as EntityByKind["source"]), position: points[0]! };
    case "receiver":
      return { ...(entity as EntityByKind["receiver"]), position: points[0]! };
    case "receiverLine":
      return { ...(entity as EntityByKind["receiverLine"]), from: points[0]!, to: points[1]! };
  }
}

function setPoints(scene: Scene, ref: EntityRef, points: Point[]): Scene {
  return updateEntity(scene, ref, (entity) => withPoints(ref.kind, entity, points));
}

// ---------------------------------------------------------------------------------------------
// Adding entities. Each returns the new scene and a reference to what was added, so the caller can select it.

export interface Added {
  scene: Scene;
  ref: EntityRef;
}

export function addSolid(scene: Scene, polygon: readonly Point[], surface: SurfaceTreatment = { kind: "rigid" }): Added {
  const id = freshId(scene, "solid");
  const solid = { id, label: freshLabel(scene, "solid"), polygon: polygon.map(tidyPoint), surface };
  return { scene: { ...scene, geometry: { ...scene.geometry, solids: [...scene.geometry.solids, solid] } }, ref: { kind: "solid", id } };
}

export function addWall(scene: Scene, path: readonly Point[], thickness: number, surface: SurfaceTreatment = { kind: "rigid" }): Added {
  const id = freshId(scene, "wall");
  const wall = { id, label: freshLabel(scene, "wall"), path: path.map(tidyPoint), thickness, surface };
  return { scene: { ...scene, geometry: { ...scene.geometry, walls: [...scene.geometry.walls, wall] } }, ref: { kind: "wall", id } };
}

/** A treated surface lining existing boundaries; absorptive (a table material) unless told otherwise. */
export function addSurface(scene: Scene, path: readonly Point[], treatment: SurfaceTreatment = { kind: "material", material: "mineral-wool-50mm" }): Added {
  const id = freshId(scene, "surface");
  const surface = { id, label: freshLabel(scene, "surface"), path: path.map(tidyPoint), treatment };
  return { scene: { ...scene, geometry: { ...scene.geometry, surfaces: [...scene.geometry.surfaces, surface] } }, ref: { kind: "surface", id } };
}

/**
 * A new source at `position` (moved inside the domain). It takes the signal and amplitude of the last
 * source, since a second source in a study is usually "the same again, elsewhere" (another lane).
 */
export function addSource(scene: Scene, position: Point, signal?: Signal): Added {
  const id = freshId(scene, "source");
  const template: Source | undefined = scene.sources[scene.sources.length - 1];
  const source: Source = {
    id,
    label: freshLabel(scene, "source"),
    position: clampToDomain(scene, position),
    amplitude: template?.amplitude ?? 1,
    signal: signal ?? template?.signal ?? { kind: "ricker", peakFrequency: 100 },
  };
  return { scene: { ...scene, sources: [...scene.sources, source] }, ref: { kind: "source", id } };
}

export function addReceiver(scene: Scene, position: Point): Added {
  const id = freshId(scene, "receiver");
  const receiver = { id, label: freshLabel(scene, "receiver"), position: clampToDomain(scene, position) };
  return { scene: { ...scene, receivers: [...scene.receivers, receiver] }, ref: { kind: "receiver", id } };
}

export function addReceiverLine(scene: Scene, from: Point, to: Point, count: number): Added {
  const id = freshId(scene, "receiverLine");
  const line = {
    id,
    label: freshLabel(scene, "receiverLine"),
    from: clampToDomain(scene, from),
    to: clampToDomain(scene, to),
    count: Math.max(2, Math.round(count)),
  };
  return { scene: { ...scene, receiverLines: [...scene.receiverLines, line] }, ref: { kind: "receiverLine", id } };
}

// ---------------------------------------------------------------------------------------------
// Moving and deleting

/**
 * Moves a whole entity by (dx, dy) metres. Sources, receivers and receiver lines stop at the domain
 * edge (the move is shortened so the shape is kept); geometry may extend beyond the domain.
 */
export function translateEntity(scene: Scene, ref: EntityRef, dx: number, dy: number): Scene {
  const points = entityPoints(scene, ref);
  if (points.length === 0 || (dx === 0 && dy === 0)) return scene;
  let moveX = dx;
  let moveY = dy;
  if (confinedToDomain(ref.kind)) {
    const { width, height } = scene.domain;
    const xs = points.map((p) => p.x);
    const ys = points.map((p) => p.y);
    moveX = Math.min(width - Math.max(...xs), Math.max(-Math.min(...xs), dx));
    moveY = Math.min(height - Math.max(...ys), Math.max(-Math.min(...ys), dy));
  }
  if (moveX === 0 && moveY === 0) return scene;
  return setPoints(
    scene,
    ref,
    points.map((p) => ({ x: tidyCoordinate(p.x + moveX), y: tidyCoordinate(p.y + moveY) })),
  );
}

/** Why an entity may not be deleted, or null when it may. */
export function deletionBlocker(scene: Scene, ref: EntityRef): string | null {
  if (ref.kind === "source" && scene.sources.length <= 1 && findEntity(scene, ref)) return "A scene needs at least one source: add another before deleting this one.";
  return null;
}

export function deleteEntity(scene: Scene, ref: EntityRef): Scene {
  if (deletionBlocker(scene, ref)) return scene;
  const list = entitiesOf(scene, ref.kind);
  const next = list.filter((entity) => entity.id !== ref.id);
  if (next.length === list.length) return scene;
  return withList(scene, ref.kind, next);
}

/** A copy of an entity beside the original (offset by `offset` metres), with a fresh id. */
export function duplicateEntity(scene: Scene, ref: EntityRef, offset: Point): Added | null {
  const entity = findEntity(scene, ref);
  if (!entity) return null;
  const id = freshId(scene, ref.kind);
  const label = entity.label ? `${entity.label} (copy)` : "";
  const copy = { ...entity, id, label } as EntityByKind[EntityKind];
  const list = entitiesOf(scene, ref.kind);
  const added = withList(scene, ref.kind, [...list, copy] as EntityByKind[EntityKind][]);
  return { scene: translateEntity(added, { kind: ref.kind, id }, offset.x, offset.y), ref: { kind: ref.kind, id } };
}

// ---------------------------------------------------------------------------------------------
// Vertices

/** Moves point `index` of an entity to `to` (inside the domain for sources, receivers and receiver lines). */
export function moveVertex(scene: Scene, ref: EntityRef, index: number, to: Point): Scene {
  const points = entityPoints(scene, ref);
  if (index < 0 || index >= points.length) return scene;
  const target = confinedToDomain(ref.kind) ? clampToDomain(scene, to) : tidyPoint(to);
  const current = points[index]!;
  if (current.x === target.x && current.y === target.y) return scene;
  const next = points.slice();
  next[index] = target;
  return setPoints(scene, ref, next);
}

/** Inserts a vertex so that it becomes point `index` of a solid, wall or surface. */
export function insertVertex(scene: Scene, ref: EntityRef, index: number, at: Point): Scene {
  if (!hasEditableVertexCount(ref.kind)) return scene;
  const points = entityPoints(scene, ref);
  if (points.length === 0 || index < 0 || index > points.length) return scene;
  const next = points.slice();
  next.splice(index, 0, tidyPoint(at));
  return setPoints(scene, ref, next);
}

/** Removes vertex `index`, unless the entity would be left with fewer points than it needs. */
export function deleteVertex(scene: Scene, ref: EntityRef, index: number): Scene {
  if (!hasEditableVertexCount(ref.kind)) return scene;
  const points = entityPoints(scene, ref);
  if (index < 0 || index >= points.length || points.length <= minimumPoints(ref.kind)) return scene;
  return setPoints(
    scene,
    ref,
    points.filter((_, k) => k !== index),
  );
}

// ---------------------------------------------------------------------------------------------
// Properties of entities

export function setEntityLabel(scene: Scene, ref: EntityRef, label: string): Scene {
  return updateEntity(scene, ref, (entity) => (entity.label === label ? entity : { ...entity, label }));
}

/**
 * Sets how an entity's faces treat sound: the faces of a solid or wall, or the lining of a treated surface.
 * Sources and receivers have no surface; they are left alone.
 */
export function setTreatment(scene: Scene, ref: EntityRef, treatment: SurfaceTreatment): Scene {
  if (ref.kind === "solid") return updateEntity(scene, { kind: "solid", id: ref.id }, (solid) => ({ ...solid, surface: treatment }));
  if (ref.kind === "wall") return updateEntity(scene, { kind: "wall", id: ref.id }, (wall) => ({ ...wall, surface: treatment }));
  if (ref.kind === "surface") return updateEntity(scene, { kind: "surface", id: ref.id }, (surface) => ({ ...surface, treatment }));
  return scene;
}

export function setWallThickness(scene: Scene, id: string, thickness: number): Scene {
  if (!(thickness > 0) || !Number.isFinite(thickness)) return scene;
  return updateEntity(scene, { kind: "wall", id }, (wall) => (wall.thickness === thickness ? wall : { ...wall, thickness }));
}

export function setSourceSignal(scene: Scene, id: string, signal: Signal): Scene {
  return updateEntity(scene, { kind: "source", id }, (source) => ({ ...source, signal }));
}

export function setSourceAmplitude(scene: Scene, id: string, amplitude: number): Scene {
  if (!Number.isFinite(amplitude)) return scene;
  return updateEntity(scene, { kind: "source", id }, (source) => (source.amplitude === amplitude ? source : { ...source, amplitude }));
}

export function setReceiverLineCount(scene: Scene, id: string, count: number): Scene {
  if (!Number.isInteger(count) || count < 2) return scene;
  return updateEntity(scene, { kind: "receiverLine", id }, (line) => (line.count === count ? line : { ...line, count }));
}

// ---------------------------------------------------------------------------------------------
// Scene settings

export function renameScene(scene: Scene, name: string): Scene {
  return scene.name === name ? scene : { ...scene, name };
}

/** Sets one side's outer boundary: a PML, rigid, or a locally reacting treatment. */
export function setEdge(scene: Scene, side: EdgeSide, edge: Edge): Scene {
  const boundary: Boundary = { ...scene.boundary, [side]: edge };
  return { ...scene, boundary };
}

/** Sets the PML thickness of one side in cells, turning that side into a PML if it was not one. */
export function setPmlThickness(scene: Scene, side: EdgeSide, layerCells: number): Scene {
  if (!Number.isInteger(layerCells) || layerCells < 1) return scene;
  return setEdge(scene, side, { kind: "pml", layerCells });
}

/** The edge a side gets when a person picks "PML" in a list: the former thickness if there was one. */
export function pmlEdge(current: Edge): Edge {
  return current.kind === "pml" ? current : { kind: "pml", layerCells: DEFAULT_PML_CELLS };
}

export function setResolution(scene: Scene, resolution: Resolution): Scene {
  return { ...scene, resolution };
}

export function setMedium(scene: Scene, medium: Medium): Scene {
  return { ...scene, medium };
}

export function setDuration(scene: Scene, duration: Duration): Scene {
  return { ...scene, duration };
}

export function setOutput(scene: Scene, output: SceneOutput): Scene {
  return { ...scene, output };
}

/** Sets the frequency-independent attenuation in dB/m, or removes it with `undefined` or 0. */
export function setAttenuation(scene: Scene, dBPerMetre: number | undefined): Scene {
  if (dBPerMetre === undefined || dBPerMetre === 0) {
    if (scene.attenuation === undefined) return scene;
    const { attenuation: _removed, ...rest } = scene;
    return rest;
  }
  return { ...scene, attenuation: { dBPerMetre } };
}

/** Resizes the domain; the origin stays at the bottom-left corner. */
export function setDomain(scene: Scene, width: number, height: number): Scene {
  if (!(width > 0 && height > 0)) return scene;
  if (scene.domain.width === width && scene.domain.height === height) return scene;
  return { ...scene, domain: { width, height } };
}
