import { describe, expect, it } from "vitest";

import { entityAtPath, splitJsonPath } from "@/components/scene-editor/model/scene-paths";
import { formatJsonPath } from "@/lib/fdtd/scene";

import { barrierScene } from "./scene-fixtures";

describe("scene paths", () => {
  it("splits a dotted path with indices, the inverse of formatJsonPath", () => {
    const segments = ["geometry", "walls", 0, "path", 12, "x"];
    expect(splitJsonPath(formatJsonPath(segments))).toEqual(segments);
    expect(splitJsonPath("")).toEqual([]);
  });

  it("finds the entity a warning's path points into", () => {
    const scene = barrierScene();
    expect(entityAtPath(scene, splitJsonPath("sources[0].signal"))).toEqual({ kind: "source", id: "road" });
    expect(entityAtPath(scene, splitJsonPath("geometry.walls[0].thickness"))).toEqual({ kind: "wall", id: "barrier" });
    expect(entityAtPath(scene, splitJsonPath("receiverLines[0]"))).toEqual({ kind: "receiverLine", id: "facade" });
    expect(entityAtPath(scene, splitJsonPath("receivers[3].position"))).toBeNull();
    expect(entityAtPath(scene, splitJsonPath("resolution"))).toBeNull();
  });
});
