// The run report's pure parts (components/report/model), kept beside the sweep tests they share code with.
import { describe, expect, it } from "vitest";
import { axisTicks } from "@/components/report/model/axis-ticks";
import { describeTreatment, referenceCandidates, reviewOf, runBandLevels, runInsertionLoss, settingsRows, treatmentRows } from "@/components/report/model/report-model";
import { deriveGrid } from "@/lib/fdtd/grid";
import type { RunListItem } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";
import { barrierScene } from "./fixtures";

const TIME_STEP = 1 / 8000;

function click(length: number, scale: number): Float32Array {
  const out = new Float32Array(length);
  for (let n = 0; n < 64; n++) out[n] = scale * Math.exp(-n / 6) * Math.cos(0.9 * n);
  return out;
}

/** Just what the report reads of a decoded run: its grid and receiver traces. */
function decoded(scale: number, grid = { nx: 100, ny: 60, cellSize: 0.02, timeStep: TIME_STEP }, ids = ["a", "b"]): Pick<DecodedRun, "receivers" | "header"> {
  const receivers = ids.map((id) => ({ id, label: id.toUpperCase(), position: { x: 0, y: 0 }, timeStep: TIME_STEP, pressure: click(800, scale), velocityX: new Float32Array(800), velocityY: new Float32Array(800) }));
  return { receivers, header: { grid: { ...grid, domainNx: grid.nx, domainNy: grid.ny, plannedSteps: 799 } } as DecodedRun["header"] };
}

function listItem(id: string, status: RunListItem["status"], nx: number): RunListItem {
  return { id, status, figures: { grid: { nx, ny: 60, cells: nx * 60, domainNx: nx, domainNy: 60, cellSize: 0.02, timeStep: TIME_STEP } } } as RunListItem;
}

describe("run report model", () => {
  it("names each treatment with the absorption coefficient the solver uses", () => {
    expect(describeTreatment({ kind: "rigid" })).toEqual({ treatment: "Rigid", absorption: 0 });
    expect(describeTreatment({ kind: "material", material: "grass-ground" })).toMatchObject({ treatment: "Grass-covered ground", absorption: 0.35 });
    expect(describeTreatment({ kind: "impedance", normalisedImpedance: 1 }).absorption).toBeCloseTo(1, 12);
    const rows = treatmentRows(barrierScene());
    expect(rows.map((r) => `${r.kind}: ${r.element}`)).toEqual(["Wall: Test barrier (0.02 m thick)", "Outer side: Bottom side"]);
  });

  it("lists the settings a reader checks, with every source's signal", () => {
    const scene = barrierScene();
    const rows = new Map(settingsRows(scene, deriveGrid(scene)));
    expect(rows.get("Domain")).toBe("2 m wide × 1 m high");
    expect(rows.get("Source: Source")).toContain("Ricker wavelet peaking at 700 Hz");
    expect(rows.get("Boundaries")).toContain("bottom rigid");
    expect(rows.get("Duration")).toBe("8 ms");
  });

  it("gives 6.02 dB of insertion loss per band when the run has half the reference's pressure", () => {
    const table = runInsertionLoss(decoded(0.5), decoded(1), 3000);
    if (!table.ok) throw new Error(table.message);
    for (const receiver of table.value.receivers) for (const value of receiver.insertionLoss) expect(value).toBeCloseTo(6.02, 2);
  });

  it("refuses a reference on another grid or with other receivers, saying why", () => {
    const otherGrid = runInsertionLoss(decoded(0.5), decoded(1, { nx: 120, ny: 60, cellSize: 0.02, timeStep: TIME_STEP }), 3000);
    expect(otherGrid.ok ? "" : otherGrid.message).toContain("another grid");
    const otherReceivers = runInsertionLoss(decoded(0.5), decoded(1, undefined, ["a", "c"]), 3000);
    expect(otherReceivers.ok ? "" : otherReceivers.message).toContain("different receivers");
  });

  it("computes band levels, or says why not", () => {
    expect(runBandLevels(decoded(1), 3000).ok).toBe(true);
    expect(runBandLevels({ receivers: [] }, 3000)).toEqual({ ok: false, message: "The run has no receivers." });
  });

  it("offers as references only the study's other finished runs on the same grid", () => {
    const runs = [listItem("self", "completed", 100), listItem("same", "completed", 100), listItem("failed", "failed", 100), listItem("other", "completed", 120)];
    expect(referenceCandidates(runs, runs[0]!).map((r) => r.id)).toEqual(["same"]);
  });

  it("reads a review when the record has one, and none otherwise", () => {
    expect(reviewOf({ id: "x" })).toBeNull();
    expect(reviewOf({ review: { status: "approved", reviewerName: "Priya Raman", reviewedAt: "2026-01-02T00:00:00Z" } })).toMatchObject({ status: "approved", reviewerName: "Priya Raman" });
  });

  it("puts axis ticks on round metres", () => {
    expect(axisTicks(-1.7, 51.7, 10)).toEqual({ step: 10, ticks: [0, 10, 20, 30, 40, 50] });
    expect(axisTicks(0, 1, 5).ticks).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
  });
});
