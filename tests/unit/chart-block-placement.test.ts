import { describe, expect, it } from "vitest";
import { chartBlockAnchor, chartBlockTitle, chartRunRole } from "@/components/notebook/chart-block-model";
import type { BlockItem } from "@/lib/http/api-types";

function block(id: string, kind: BlockItem["kind"], content: unknown): BlockItem {
  return { id, kind, position: 0, content, collapsed: false, version: 1, updatedByName: null, updatedAt: "2026-01-01T00:00:00.000Z" };
}

const notebook = [
  block("scene-a", "scene", { sceneId: "A" }),
  block("run-r1", "run", { runId: "r1" }),
  block("chart-r1", "chart", { runIds: ["r1", "r2"], quantity: "trace" }),
  block("chart-r2", "chart", { runIds: ["r2"], quantity: "band-levels" }),
  block("run-r2", "run", { runId: "r2" }),
  block("notes", "notes", { markdown: "Findings" }),
];

describe("placing a chart of a saved run in the notebook", () => {
  it("goes after the run's block and the charts of that run already under it", () => {
    expect(chartBlockAnchor(notebook, "r1")).toBe("chart-r1");
  });

  it("goes right after the run's block when no chart of that run follows it", () => {
    expect(chartBlockAnchor(notebook, "r2")).toBe("run-r2");
  });

  it("goes to the end when the run has no block", () => {
    expect(chartBlockAnchor(notebook, "r3")).toBeNull();
  });
});

describe("naming a chart block", () => {
  it("says which quantity it draws, with its own title after", () => {
    expect(chartBlockTitle(block("c", "chart", { runIds: ["r1"], quantity: "band-levels" }))).toBe("Chart: band levels");
    expect(chartBlockTitle(block("c", "chart", { runIds: ["r1", "r2"], quantity: "insertion-loss", title: "Barrier A" }))).toBe("Chart: insertion loss – Barrier A");
  });

  it("calls the second run of an insertion-loss chart its reference", () => {
    expect(chartRunRole("insertion-loss", 1)).toBe("Reference");
    expect(chartRunRole("trace", 1)).toBe("Drawn over it");
  });
});
