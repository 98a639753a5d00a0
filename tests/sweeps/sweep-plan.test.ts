import { describe, expect, it } from "vitest";
import { currentValue, defaultRange, defaultReceiverIds, defaultReference, estimatedSeconds, forSweepRun, parameterChoices, planSweep, receiverOptions } from "@/lib/sweeps/sweep-plan";
import { deriveGrid } from "@/lib/fdtd/grid";
import { sweepValues } from "@/lib/scene-variants/sweep";
import { barrierScene } from "./fixtures";

describe("sweep plan", () => {
  it("offers the wall's height, position and absorption, each receiver's and source's height, in words", () => {
    const choices = parameterChoices(barrierScene());
    expect(choices.map((c) => c.label)).toEqual([
      "height of Test barrier",
      "position of Test barrier",
      "absorption coefficient of Test barrier",
      "height of In the shadow",
      "height of High up",
      "height of Source",
    ]);
    expect(choices.map((c) => c.group)).toEqual(["Walls", "Walls", "Walls", "Receivers", "Receivers", "Sources"]);
  });

  it("reads the current value of each parameter from the scene", () => {
    const scene = barrierScene();
    expect(currentValue(scene, { kind: "wall-height", wallId: "barrier" })).toBeCloseTo(0.3, 12);
    expect(currentValue(scene, { kind: "wall-position", wallId: "barrier" })).toBe(1);
    expect(currentValue(scene, { kind: "wall-absorption", wallId: "barrier" })).toBe(0);
    expect(currentValue(scene, { kind: "receiver-height", receiverId: "above" })).toBe(0.8);
    expect(currentValue(scene, { kind: "source-height", sourceId: "nowhere" })).toBeUndefined();
  });

  it("offers default ranges that make valid sweeps inside the domain", () => {
    const scene = barrierScene();
    for (const choice of parameterChoices(scene)) {
      const range = defaultRange(scene, choice.parameter);
      const values = sweepValues(range);
      expect(values.ok, `${choice.label}: ${JSON.stringify(range)}`).toBe(true);
      const plan = planSweep(scene, choice.parameter, range, { kind: "free-field" });
      expect(plan.ok, `${choice.label}: ${plan.ok ? "" : plan.message}`).toBe(true);
    }
    expect(defaultRange(scene, { kind: "wall-absorption", wallId: "barrier" })).toEqual({ from: 0, to: 1, step: 0.2 });
  });

  it("runs one shared reference when the swept wall is left out of it", () => {
    const scene = barrierScene();
    const planned = planSweep(scene, { kind: "wall-height", wallId: "barrier" }, { from: 0.2, to: 0.6, step: 0.2 }, defaultReference(scene));
    if (!planned.ok) throw new Error(planned.message);
    expect(planned.plan.sharedReference).toBe(true);
    expect(planned.plan.runs.map((run) => run.kind)).toEqual(["reference", "case", "case", "case"]);
    expect(planned.plan.runs.filter((run) => run.kind === "case").map((run) => run.value)).toEqual([0.2, 0.4, 0.6]);
    expect(planned.plan.runs[0]!.scene.geometry.walls).toEqual([]);
    expect(planned.plan.cellUpdatesPerRun).toBe(deriveGrid(scene).cellUpdates);
  });

  it("gives each case its own reference when the swept receiver stays in the reference", () => {
    const scene = barrierScene();
    const planned = planSweep(scene, { kind: "receiver-height", receiverId: "shadow" }, { from: 0.1, to: 0.3, step: 0.1 }, defaultReference(scene));
    if (!planned.ok) throw new Error(planned.message);
    expect(planned.plan.referenceCount).toBe(3);
    expect(planned.plan.runs.map((run) => run.kind)).toEqual(["reference", "case", "reference", "case", "reference", "case"]);
    const heights = planned.plan.runs.filter((run) => run.kind === "reference").map((run) => run.scene.receivers.find((r) => r.id === "shadow")!.position.y);
    expect(heights).toEqual([0.1, 0.2, 0.3]);
    expect(planned.plan.runs[3]!.referenceId).toBe(planned.plan.runs[2]!.id);
  });

  it("says which field is wrong: a range that leaves the domain, a reference that names no element", () => {
    const scene = barrierScene();
    const tooHigh = planSweep(scene, { kind: "source-height", sourceId: "source" }, { from: 0.5, to: 1.5, step: 0.5 }, { kind: "free-field" });
    expect(tooHigh).toMatchObject({ ok: false, field: "range" });
    expect(tooHigh.ok ? "" : tooHigh.message).toContain("outside the domain");
    const unknown = planSweep(scene, { kind: "wall-height", wallId: "barrier" }, { from: 0.2, to: 0.4, step: 0.2 }, { kind: "without", removedIds: ["fence"] });
    expect(unknown).toMatchObject({ ok: false, field: "reference" });
  });

  it("leaves snapshots and level maps out of sweep runs, and nothing else", () => {
    const scene = barrierScene();
    const light = forSweepRun(scene);
    expect(light.output.snapshotEverySteps).toBeUndefined();
    expect(light.output.levelMaps).toBe(false);
    expect({ ...light, output: scene.output }).toEqual(scene);
  });

  it("estimates the time as cell updates of every run over the rate", () => {
    const scene = barrierScene();
    const planned = planSweep(scene, { kind: "wall-height", wallId: "barrier" }, { from: 0.2, to: 0.6, step: 0.2 }, { kind: "free-field" });
    if (!planned.ok) throw new Error(planned.message);
    expect(estimatedSeconds(planned.plan, 1e6)).toBeCloseTo((4 * deriveGrid(scene).cellUpdates) / 1e6, 9);
  });

  it("chooses the point receivers first and lists the lines' receivers after them", () => {
    const scene = barrierScene();
    expect(defaultReceiverIds(scene)).toEqual(["shadow", "above"]);
    expect(receiverOptions(scene).map((r) => r.id)).toEqual(["shadow", "above", "line[0]", "line[1]", "line[2]"]);
  });
});
