import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { parseSceneOrThrow, type Scene } from "@/lib/fdtd/scene";
import { canonicalJson, CanonicalJsonError } from "@/lib/run-record/canonical-json";
import { computeRunInputHash } from "@/lib/run-record/input-hash";
import { defaultRunSettings, type RunSettings } from "@/lib/run-record/settings";
import { tinyScene, tinySceneInput } from "./fixtures";

/** The same value with the keys of every object in reverse order. */
function reversedKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(reversedKeys);
  if (value === null || typeof value !== "object") return value;
  return Object.fromEntries(
    Object.entries(value)
      .reverse()
      .map(([key, inner]) => [key, reversedKeys(inner)]),
  );
}

/** Paths of every number, string and boolean in a JSON value. */
function leafPaths(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.flatMap((item, index) => leafPaths(item, [...path, index]));
  if (value !== null && typeof value === "object") return Object.entries(value).flatMap(([key, inner]) => leafPaths(inner, [...path, key]));
  return [path];
}

/** A deep copy of `value` with the leaf at `path` changed (numbers nudged, strings extended, booleans flipped). */
function changedAt<T>(value: T, path: (string | number)[]): T {
  const copy = structuredClone(value) as Record<string | number, unknown>;
  let parent = copy;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  const last = path.at(-1)!;
  const leaf = parent[last];
  parent[last] = typeof leaf === "number" ? leaf * 1.5 + 1 : typeof leaf === "string" ? `${leaf}x` : !leaf;
  return copy as T;
}

describe("canonical JSON", () => {
  it("sorts the keys of every object, keeps array order and drops undefined members", () => {
    expect(canonicalJson({ b: [3, { z: 1, a: 2 }], a: "x", c: undefined })).toBe('{"a":"x","b":[3,{"a":2,"z":1}]}');
  });

  it("writes one form per number: -0 as 0, 1.0 as 1, exponents as JavaScript writes them", () => {
    expect(canonicalJson([-0, 1.0, 1e21, 0.1, 2.5e-7])).toBe("[0,1,1e+21,0.1,2.5e-7]");
  });

  it("refuses values without a JSON form, naming where they are", () => {
    expect(() => canonicalJson({ a: { b: [1, Number.NaN] } })).toThrow(CanonicalJsonError);
    expect(() => canonicalJson({ a: { b: [1, Number.NaN] } })).toThrow(/a\.b\[1\]/);
    expect(() => canonicalJson({ values: new Float32Array(2) })).toThrow(/values/);
  });
});

describe("the run input hash", () => {
  const scene = tinyScene();
  const base = computeRunInputHash({ scene, settings: defaultRunSettings });

  it("is SHA-256 of the canonical JSON of the scene and the settings", () => {
    const text = canonicalJson({ domain: "rarefact.run-input.v1", scene, settings: defaultRunSettings });
    expect(base).toBe(createHash("sha256").update(text, "utf8").digest("hex"));
  });

  it("does not depend on key order", () => {
    const reordered = reversedKeys(scene) as Scene;
    expect(JSON.stringify(reordered)).not.toBe(JSON.stringify(scene));
    const settings = reversedKeys(defaultRunSettings) as RunSettings;
    expect(computeRunInputHash({ scene: reordered, settings })).toBe(base);
  });

  it("is the same for a scene that leaves its defaults out and one that writes them", () => {
    const input = tinySceneInput();
    delete input.medium;
    delete input.attenuation;
    const written = { ...input, medium: { kind: "air", temperature: 20 }, output: { ...input.output, snapshotCellStride: 1 } };
    expect(computeRunInputHash({ scene: parseSceneOrThrow(input), settings: defaultRunSettings })).toBe(base);
    expect(computeRunInputHash({ scene: parseSceneOrThrow(written), settings: defaultRunSettings })).toBe(base);
  });

  it("changes when any value of the scene or the settings changes", () => {
    const paths = leafPaths(scene);
    expect(paths.length).toBeGreaterThan(40);
    const hashes = new Set([base]);
    for (const path of paths) hashes.add(computeRunInputHash({ scene: changedAt(scene, path), settings: defaultRunSettings }));
    for (const path of leafPaths(defaultRunSettings)) hashes.add(computeRunInputHash({ scene, settings: changedAt(defaultRunSettings, path) }));
    // Every change gave a hash of its own, different from the base and from one another.
    expect(hashes.size).toBe(1 + paths.length + Object.keys(defaultRunSettings).length);
  });
});
