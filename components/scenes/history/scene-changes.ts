// What changed between two versions of a scene, in words a person scans in a history list ("moved
// receiver “Garden”, changed the height of barrier “Barrier” (3 m → 4 m)"). Entities are matched by
// id, then by label, so a renamed or re-identified entity reads as changed rather than removed and
// added. Pure functions over plain JSON: old versions that no longer validate still get a summary.
import { parseScene } from "@/lib/fdtd/scene";
import { ENTITY_NAMES } from "@/components/scene-editor/model/entities";
import { sameSceneData } from "@/components/scene-editor/model/scene-text";

type JsonObject = Record<string, unknown>;

interface Collection {
  /** Where the list lives in the scene. */
  path: readonly string[];
  /** The trade's word for one entity, lower case. */
  noun: string;
}

const COLLECTIONS: readonly Collection[] = [
  { path: ["sources"], noun: ENTITY_NAMES.source.toLowerCase() },
  { path: ["receivers"], noun: ENTITY_NAMES.receiver.toLowerCase() },
  { path: ["receiverLines"], noun: ENTITY_NAMES.receiverLine.toLowerCase() },
  { path: ["geometry", "solids"], noun: ENTITY_NAMES.solid.toLowerCase() },
  { path: ["geometry", "walls"], noun: ENTITY_NAMES.wall.toLowerCase() },
  { path: ["geometry", "surfaces"], noun: ENTITY_NAMES.surface.toLowerCase() },
  { path: ["mediumRegions"], noun: "medium region" },
];

/** Entity fields whose change is phrased "changed the <words> of …". */
const FIELD_WORDS: Record<string, string> = {
  signal: "signal",
  amplitude: "amplitude",
  surface: "surface treatment",
  treatment: "treatment",
  medium: "medium",
  thickness: "thickness",
  count: "receiver count",
};

/** Fields with a unit worth quoting beside the change. */
const FIELD_UNITS: Record<string, string> = { thickness: "m", amplitude: "m²/s", count: "" };

const RESOLUTION_WORDS: Record<string, { words: string; unit: string }> = {
  maxFrequency: { words: "frequency of interest", unit: "Hz" },
  pointsPerWavelength: { words: "cells per wavelength", unit: "" },
  cellSize: { words: "cell size", unit: "m" },
  courantNumber: { words: "Courant number", unit: "" },
};

function isObject(value: unknown): value is JsonObject {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

function keysOf(value: unknown): string[] {
  return isObject(value) ? Object.keys(value) : [];
}

function objectAt(value: unknown, path: readonly string[]): unknown {
  let current = value;
  for (const key of path) current = isObject(current) ? current[key] : undefined;
  return current;
}

/** Entities of a list: objects only, anything else in the list is ignored. */
function entitiesAt(scene: unknown, path: readonly string[]): JsonObject[] {
  const list = objectAt(scene, path);
  return Array.isArray(list) ? list.filter(isObject) : [];
}

function text(value: unknown): string {
  return typeof value === "string" ? value : "";
}

/** How the entity is named to people: its label, or its id when it has none. */
function nameOf(entity: JsonObject): string {
  return `“${text(entity.label).trim() || text(entity.id)}”`;
}

/** A number as people write it: at most four significant figures, no trailing zeros. */
function formatQuantity(value: number, unit: string): string {
  const shown = String(Number(value.toPrecision(4)));
  return unit ? `${shown} ${unit}` : shown;
}

function fromTo(before: unknown, after: unknown, unit: string): string {
  return typeof before === "number" && typeof after === "number" ? ` (${formatQuantity(before, unit)} → ${formatQuantity(after, unit)})` : "";
}

interface Point {
  x: number;
  y: number;
}

function pointsOf(value: unknown): Point[] | null {
  if (!Array.isArray(value)) return null;
  const points = value.filter((p): p is Point => isObject(p) && typeof p.x === "number" && typeof p.y === "number");
  return points.length === value.length ? points : null;
}

/** The points that place an entity: a polygon, a polyline, a position, or a receiver line's two ends. */
function placementOf(entity: JsonObject): Point[] | null {
  if (entity.polygon !== undefined) return pointsOf(entity.polygon);
  if (entity.path !== undefined) return pointsOf(entity.path);
  if (entity.position !== undefined) return pointsOf([entity.position]);
  if (entity.from !== undefined || entity.to !== undefined) return pointsOf([entity.from, entity.to]);
  return null;
}

const PLACEMENT_FIELDS = new Set(["polygon", "path", "position", "from", "to"]);
/** Coordinates closer than this are the same (m): floating-point noise from dragging is not a change. */
const SAME_COORDINATE = 1e-9;

function extent(points: readonly Point[]): { width: number; height: number } {
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  return { width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

/**
 * How an entity's placement changed: moved as a whole, grew or shrank (its extent), or reshaped with
 * the same extent. A single point can only move.
 */
function describePlacement(before: Point[], after: Point[], subject: string): string[] {
  const first = before[0];
  const firstAfter = after[0];
  if (before.length === after.length && first && firstAfter) {
    const dx = firstAfter.x - first.x;
    const dy = firstAfter.y - first.y;
    const rigid = before.every((p, k) => Math.abs(after[k]!.x - p.x - dx) < SAME_COORDINATE && Math.abs(after[k]!.y - p.y - dy) < SAME_COORDINATE);
    if (rigid) return Math.abs(dx) < SAME_COORDINATE && Math.abs(dy) < SAME_COORDINATE ? [] : [`moved ${subject}`];
  }
  const was = extent(before);
  const now = extent(after);
  const widthChanged = Math.abs(was.width - now.width) >= SAME_COORDINATE;
  const heightChanged = Math.abs(was.height - now.height) >= SAME_COORDINATE;
  if (heightChanged && !widthChanged) return [`changed the height of ${subject}${fromTo(was.height, now.height, "m")}`];
  if (widthChanged && !heightChanged) return [`changed the width of ${subject}${fromTo(was.width, now.width, "m")}`];
  if (widthChanged && heightChanged) return [`resized ${subject}`];
  return [`reshaped ${subject}`];
}

function describeEntityChange(noun: string, before: JsonObject, after: JsonObject): string[] {
  const subject = `${noun} ${nameOf(after)}`;
  const changes: string[] = [];
  if (text(before.label) !== text(after.label)) changes.push(`renamed ${noun} ${nameOf(before)} to ${nameOf(after)}`);
  if (text(before.id) !== text(after.id)) changes.push(`changed the id of ${subject}`);
  const placedBefore = placementOf(before);
  const placedAfter = placementOf(after);
  const placementDiffers = [...PLACEMENT_FIELDS].some((field) => !sameSceneData(before[field], after[field]));
  if (placementDiffers) changes.push(...(placedBefore && placedAfter ? describePlacement(placedBefore, placedAfter, subject) : [`moved ${subject}`]));
  const fields = new Set([...keysOf(before), ...keysOf(after)]);
  for (const field of fields) {
    if (field === "id" || field === "label" || PLACEMENT_FIELDS.has(field)) continue;
    if (sameSceneData(before[field], after[field])) continue;
    changes.push(`changed the ${FIELD_WORDS[field] ?? field} of ${subject}${fromTo(before[field], after[field], FIELD_UNITS[field] ?? "")}`);
  }
  return changes;
}

/** Pairs before and after entities: by id, then the rest by a label that is unique on both sides. */
function matchEntities(before: JsonObject[], after: JsonObject[]): { pairs: [JsonObject, JsonObject][]; removed: JsonObject[]; added: JsonObject[] } {
  const pairs: [JsonObject, JsonObject][] = [];
  const unmatchedAfter = new Set(after);
  const unmatchedBefore: JsonObject[] = [];
  for (const old of before) {
    const partner = [...unmatchedAfter].find((candidate) => text(candidate.id) !== "" && text(candidate.id) === text(old.id));
    if (partner) {
      pairs.push([old, partner]);
      unmatchedAfter.delete(partner);
    } else unmatchedBefore.push(old);
  }
  const removed: JsonObject[] = [];
  for (const old of unmatchedBefore) {
    const label = text(old.label).trim();
    const sameLabel = (entity: JsonObject) => label !== "" && text(entity.label).trim() === label;
    const candidates = [...unmatchedAfter].filter(sameLabel);
    if (candidates.length === 1 && unmatchedBefore.filter(sameLabel).length === 1) {
      pairs.push([old, candidates[0]!]);
      unmatchedAfter.delete(candidates[0]!);
    } else removed.push(old);
  }
  return { pairs, removed, added: after.filter((entity) => unmatchedAfter.has(entity)) };
}

function describeCollection({ path, noun }: Collection, before: unknown, after: unknown): string[] {
  const { pairs, removed, added } = matchEntities(entitiesAt(before, path), entitiesAt(after, path));
  const changes = [
    ...added.map((entity) => `added ${noun} ${nameOf(entity)}`),
    ...removed.map((entity) => `removed ${noun} ${nameOf(entity)}`),
    ...pairs.flatMap(([old, now]) => describeEntityChange(noun, old, now)),
  ];
  // Order matters to the solver (later medium regions win) and to the order of the results.
  const afterList = entitiesAt(after, path);
  const orderAfter = pairs.map(([, now]) => afterList.indexOf(now));
  if (orderAfter.some((position, k) => k > 0 && position < orderAfter[k - 1]!)) changes.push(`reordered the ${noun}s`);
  return changes;
}

function describeResolution(before: unknown, after: unknown): string[] {
  if (!isObject(before) || !isObject(after) || before.kind !== after.kind) return ["changed how the cell size is chosen"];
  const changes: string[] = [];
  for (const field of new Set([...keysOf(before), ...keysOf(after)])) {
    if (sameSceneData(before[field], after[field])) continue;
    const words = RESOLUTION_WORDS[field];
    changes.push(words ? `changed the ${words.words}${fromTo(before[field], after[field], words.unit)}` : `changed the resolution's ${field}`);
  }
  return changes;
}

function describeDomain(before: unknown, after: unknown): string[] {
  const size = (domain: unknown) => (isObject(domain) && typeof domain.width === "number" && typeof domain.height === "number" ? `${formatQuantity(domain.width, "")} × ${formatQuantity(domain.height, "m")}` : null);
  const was = size(before);
  const now = size(after);
  return [was && now ? `resized the domain (${was} → ${now})` : "resized the domain"];
}

function describeDuration(before: unknown, after: unknown): string[] {
  const seconds = (duration: unknown) => (isObject(duration) ? (duration.kind === "time" ? duration.seconds : duration.maxSeconds) : undefined);
  if (isObject(before) && isObject(after) && before.kind !== after.kind) {
    return [after.kind === "decay" ? "made the run stop once the sound has decayed" : "made the run stop at a fixed time"];
  }
  const changes: string[] = [];
  if (!sameSceneData(seconds(before), seconds(after))) changes.push(`changed the duration${fromTo(seconds(before), seconds(after), "s")}`);
  if (isObject(before) && isObject(after) && !sameSceneData(before.decayDb, after.decayDb)) changes.push(`changed the decay to stop at${fromTo(before.decayDb, after.decayDb, "dB")}`);
  return changes.length ? changes : ["changed the duration"];
}

function describeBoundary(before: unknown, after: unknown): string[] {
  const sides = ["left", "right", "bottom", "top"] as const;
  const changed = sides.filter((side) => !sameSceneData(objectAt(before, [side]), objectAt(after, [side])));
  if (changed.length === 0) return [];
  if (changed.length === sides.length) return ["changed every outer boundary"];
  return [`changed the ${changed.join(", ")} boundary`];
}

function describeSettings(before: unknown, after: unknown): string[] {
  const changes: string[] = [];
  const keys = new Set([...keysOf(before), ...keysOf(after)]);
  const handled = new Set(["version", "sources", "receivers", "receiverLines", "geometry", "mediumRegions"]);
  for (const key of keys) {
    if (handled.has(key)) continue;
    const was = objectAt(before, [key]);
    const now = objectAt(after, [key]);
    if (sameSceneData(was, now)) continue;
    switch (key) {
      case "name":
        changes.push(`renamed the scene to “${text(now)}”`);
        break;
      case "domain":
        changes.push(...describeDomain(was, now));
        break;
      case "medium":
        changes.push("changed the medium");
        break;
      case "resolution":
        changes.push(...describeResolution(was, now));
        break;
      case "boundary":
        changes.push(...describeBoundary(was, now));
        break;
      case "duration":
        changes.push(...describeDuration(was, now));
        break;
      case "attenuation":
        changes.push(was === undefined ? "added air attenuation" : now === undefined ? "removed the air attenuation" : `changed the air attenuation${fromTo(objectAt(was, ["dBPerMetre"]), objectAt(now, ["dBPerMetre"]), "dB/m")}`);
        break;
      case "output":
        changes.push("changed what the run keeps");
        break;
      default:
        changes.push(`changed ${key}`);
    }
  }
  // Geometry lists the collections cover; anything else under it is still a change.
  for (const key of new Set([...keysOf(objectAt(before, ["geometry"])), ...keysOf(objectAt(after, ["geometry"]))])) {
    if (!["solids", "walls", "surfaces"].includes(key) && !sameSceneData(objectAt(before, ["geometry", key]), objectAt(after, ["geometry", key]))) changes.push(`changed geometry ${key}`);
  }
  return changes;
}

/** Parsed scenes by the JSON they came from: a history list compares each version twice (with the one before and after). */
const normalisedByInput = new WeakMap<object, unknown>();

/** The scene with its defaults filled in when it validates (so "left at the default" is no change), as stored otherwise. */
function normalised(scene: unknown): unknown {
  if (typeof scene !== "object" || scene === null) return scene;
  const known = normalisedByInput.get(scene);
  if (known !== undefined) return known;
  const parsed = parseScene(scene);
  const result = parsed.ok ? parsed.scene : scene;
  normalisedByInput.set(scene, result);
  return result;
}

/**
 * Every change from `before` to `after`, each a short phrase starting with a verb in the past tense:
 * the settings first, then entity by entity in the order of the scene's lists.
 */
export function describeSceneChanges(before: unknown, after: unknown): string[] {
  const was = normalised(before);
  const now = normalised(after);
  if (sameSceneData(was, now)) return [];
  return [...describeSettings(was, now), ...COLLECTIONS.flatMap((collection) => describeCollection(collection, was, now))];
}

/** A one-line summary of changes, the first `limit` in full and a count of the rest. */
export function summariseSceneChanges(changes: readonly string[], limit = 3): string {
  if (changes.length === 0) return "No change to the scene";
  const shown = changes.slice(0, limit).join(", ");
  const rest = changes.length - limit;
  const sentence = rest > 0 ? `${shown} and ${rest} more change${rest === 1 ? "" : "s"}` : shown;
  return sentence.charAt(0).toUpperCase() + sentence.slice(1);
}
