// From a problem's or warning's JSON path to what the editor can show: the path's segments, and the
// drawn entity it lies in, if any.
import type { Scene } from "@/lib/fdtd/scene";

import type { EntityKind, EntityRef } from "./entities";

/** `a.b[2].c` -> ["a", "b", 2, "c"] (the inverse of lib/fdtd/scene's formatJsonPath). */
export function splitJsonPath(path: string): (string | number)[] {
  const segments: (string | number)[] = [];
  for (const match of path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) {
    if (match[2] !== undefined) segments.push(Number(match[2]));
    else if (match[1] !== undefined) segments.push(match[1]);
  }
  return segments;
}

const LISTS: { prefix: string[]; kind: EntityKind }[] = [
  { prefix: ["sources"], kind: "source" },
  { prefix: ["receivers"], kind: "receiver" },
  { prefix: ["receiverLines"], kind: "receiverLine" },
  { prefix: ["geometry", "solids"], kind: "solid" },
  { prefix: ["geometry", "walls"], kind: "wall" },
  { prefix: ["geometry", "surfaces"], kind: "surface" },
];

/** The entity a path points into (e.g. `sources[0].signal` -> the first source), or null. */
export function entityAtPath(scene: Scene, segments: readonly (string | number)[]): EntityRef | null {
  for (const { prefix, kind } of LISTS) {
    if (!prefix.every((key, k) => segments[k] === key)) continue;
    const index = segments[prefix.length];
    if (typeof index !== "number") return null;
    const list = prefix.length === 1 ? (scene as unknown as Record<string, { id: string }[]>)[prefix[0]!] : (scene.geometry as unknown as Record<string, { id: string }[]>)[prefix[1]!];
    const entity = list?.[index];
    return entity ? { kind, id: entity.id } : null;
  }
  return null;
}
