import { describe, expect, it } from "vitest";
import { hasRunBlock, runBlockAnchor } from "@/components/runs/run-block-placement";
import type { BlockItem } from "@/lib/http/api-types";

function block(id: string, kind: BlockItem["kind"], content: unknown): BlockItem {
  return { id, kind, position: 0, content, collapsed: false, version: 1, updatedByName: null, updatedAt: "2026-01-01T00:00:00.000Z" };
}

const notebook = [
  block("notes", "notes", { markdown: "# Question" }),
  block("scene-a", "scene", { sceneId: "A" }),
  block("run-a1", "run", { runId: "r1" }),
  block("run-a2", "run", { runId: "r2" }),
  block("run-b1", "run", { runId: "r3" }),
  block("scene-b", "scene", { sceneId: "B" }),
  block("plan", "notes", { markdown: "Plan" }),
];
const runScenes = new Map([
  ["r1", "A"],
  ["r2", "A"],
  ["r3", "B"],
]);

describe("placing a saved run's block in the notebook", () => {
  it("goes after the runs of its scene already listed under the scene's block", () => {
    expect(runBlockAnchor(notebook, "A", runScenes)).toBe("run-a2");
  });

  it("goes right after the scene's block when the scene has no runs there yet", () => {
    expect(runBlockAnchor(notebook, "B", runScenes)).toBe("scene-b");
  });

  it("goes at the end when the scene has no block", () => {
    expect(runBlockAnchor(notebook, "C", runScenes)).toBeNull();
  });

  it("knows whether a run already has a block", () => {
    expect(hasRunBlock(notebook, "r2")).toBe(true);
    expect(hasRunBlock(notebook, "r9")).toBe(false);
  });
});
