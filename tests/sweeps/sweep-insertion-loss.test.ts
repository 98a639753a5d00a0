import { describe, expect, it } from "vitest";
import { padTraces, pickTraces, sweepInsertionLoss, type CaseState } from "@/lib/sweeps/sweep-insertion-loss";
import { planSweep } from "@/lib/sweeps/sweep-plan";
import type { PressureTrace } from "@/lib/analysis/band-levels";
import { deriveGrid } from "@/lib/fdtd/grid";
import { runScene } from "@/lib/fdtd/simulation";
import { sweepResultsSchema } from "@/lib/validation/blocks";
import { barrierScene } from "./fixtures";

const TIME_STEP = 1 / 8000;

/** A decaying click: energy across the low kHz bands, silent by the end of the trace. */
function click(length: number, scale = 1): Float32Array {
  const out = new Float32Array(length);
  for (let n = 0; n < 64 && n < length; n++) out[n] = scale * Math.exp(-n / 6) * Math.cos(0.9 * n);
  return out;
}

const trace = (id: string, pressure: Float32Array): PressureTrace => ({ id, label: id.toUpperCase(), timeStep: TIME_STEP, pressure });
const receivers = [
  { id: "a", label: "A" },
  { id: "b", label: "B" },
];
const base = { receivers, bandsPerOctave: 1 as const, weighting: "Z" as const, highestResolvedFrequency: 3000, completedAt: "2026-01-01T00:00:00.000Z" };

describe("insertion loss of a sweep's cases", () => {
  it("gives 20 log10(2) = 6.02 dB in every band when a case halves the reference's pressure", () => {
    const reference = new Map([["reference:0", [trace("a", click(800)), trace("b", click(800, 3))]]]);
    const cases: CaseState[] = [
      { status: "done", referenceId: "reference:0", traces: [trace("a", click(800, 0.5)), trace("b", click(800, 1.5))] },
      { status: "done", referenceId: "reference:0", traces: [trace("a", click(800, 0.25)), trace("b", click(800, 3))] },
    ];
    const result = sweepInsertionLoss({ ...base, values: [1, 2], cases, references: reference });
    expect(result.bands.length).toBeGreaterThan(2);
    for (const value of result.insertionLoss[0]!.flat()) expect(value).toBeCloseTo(6.02, 2);
    for (const value of result.insertionLoss[1]![0]!) expect(value).toBeCloseTo(12.04, 2);
    for (const value of result.insertionLoss[1]![1]!) expect(value).toBe(0);
    expect(result.overall[0]).toEqual([6.02, 6.02]);
    expect(sweepResultsSchema.safeParse(result).success).toBe(true);
  });

  it("pads a run that stopped early with silence, so a shorter trace of the same click compares equal", () => {
    const reference = new Map([["r", [trace("a", click(1000)), trace("b", click(1000))]]]);
    const cases: CaseState[] = [{ status: "done", referenceId: "r", traces: [trace("a", click(700)), trace("b", click(700))] }];
    const result = sweepInsertionLoss({ ...base, values: [1], cases, references: reference });
    for (const value of result.insertionLoss[0]!.flat()) expect(value).toBe(0);
    expect(padTraces([trace("a", click(3))], 5)[0]!.pressure).toEqual(Float32Array.from([...click(3), 0, 0]));
  });

  it("keeps failed and unrun cases as nulls with their reason, and fails a case whose sampling differs", () => {
    const reference = new Map([["r", [trace("a", click(800)), trace("b", click(800))]]]);
    const odd: PressureTrace[] = [
      { ...trace("a", click(800)), timeStep: TIME_STEP / 2 },
      { ...trace("b", click(800)), timeStep: TIME_STEP / 2 },
    ];
    const cases: CaseState[] = [
      { status: "done", referenceId: "r", traces: [trace("a", click(800, 0.5)), trace("b", click(800, 0.5))] },
      { status: "failed", message: "the fields grew without bound" },
      { status: "not-run" },
      { status: "done", referenceId: "r", traces: odd },
      { status: "done", referenceId: "missing", traces: odd },
    ];
    const result = sweepInsertionLoss({ ...base, values: [1, 2, 3, 4, 5], cases, references: reference });
    expect(result.outcomes.map((o) => o.status)).toEqual(["done", "failed", "not-run", "failed", "failed"]);
    expect(result.outcomes[1]!.message).toBe("the fields grew without bound");
    expect(result.outcomes[3]!.message).toContain("is sampled every");
    expect(result.outcomes[4]!.message).toBe("its reference run did not finish");
    expect(result.insertionLoss[2]).toEqual([result.bands.map(() => null), result.bands.map(() => null)]);
    expect(result.overall[1]).toEqual([null, null]);
    expect(sweepResultsSchema.safeParse(result).success).toBe(true);
  });

  it("has no bands and no numbers before any case has finished", () => {
    const result = sweepInsertionLoss({ ...base, values: [1, 2], cases: [{ status: "not-run" }, { status: "not-run" }], references: new Map() });
    expect(result.bands).toEqual([]);
    expect(result.insertionLoss).toEqual([[[], []], [[], []]]);
  });

  it("picks the chosen receivers in the chosen order and names a missing one", () => {
    const traces = [trace("a", click(10)), trace("b", click(10))];
    expect(pickTraces(traces, ["b", "a"]).map((t) => t.id)).toEqual(["b", "a"]);
    expect(() => pickTraces(traces, ["c"])).toThrow('no receiver "c"');
  });

  it("on a real barrier section, a taller barrier gives more overall insertion loss in its shadow", () => {
    const scene = barrierScene();
    const planned = planSweep(scene, { kind: "wall-height", wallId: "barrier" }, { from: 0.2, to: 0.5, step: 0.3 }, { kind: "without", removedIds: ["barrier"] });
    if (!planned.ok) throw new Error(planned.message);
    const references = new Map<string, PressureTrace[]>();
    const cases: CaseState[] = [];
    for (const run of planned.plan.runs) {
      const traces = pickTraces(runScene(run.scene).receivers, ["shadow", "above"]);
      if (run.kind === "reference") references.set(run.id, traces);
      else cases[run.caseIndex!] = { status: "done", referenceId: run.referenceId!, traces };
    }
    const result = sweepInsertionLoss({
      ...base,
      receivers: [
        { id: "shadow", label: "In the shadow" },
        { id: "above", label: "High up" },
      ],
      values: [0.2, 0.5],
      cases,
      references,
      highestResolvedFrequency: deriveGrid(scene).maxResolvedFrequency,
    });
    expect(result.bands.map((band) => band.nominal)).toEqual([250, 500, 1000]);
    const [low, high] = [result.overall[0]![0]!, result.overall[1]![0]!];
    expect(low).toBeGreaterThan(1);
    expect(high).toBeGreaterThan(low + 3);
  });
});
