// What a sweep will run: the parameters a scene offers, a sensible starting range for each, and the
// runs themselves, each case paired with the reference its insertion loss is measured against.
// Pure, so the page only shows and runs what this decides.
import { deriveGrid } from "@/lib/fdtd/grid";
import { absorptionFromImpedance, materialImpedance } from "@/lib/fdtd/materials";
import { receiverSpecs } from "@/lib/fdtd/receivers";
import type { Scene, SurfaceTreatment } from "@/lib/fdtd/scene";
import { canonicalJson } from "@/lib/run-record/canonical-json";
import { defaultRemovedIds, freeFieldScene, sceneWithout } from "@/lib/scene-variants/reference-scene";
import { describeParameter, sweepScenes, type SweepParameter, type SweepRange } from "@/lib/scene-variants/sweep";
import { MAX_SAVED_SWEEP_RECEIVERS, type SweepReference } from "@/lib/validation/blocks";

export interface ParameterChoice {
  /** Stable key for a select element. */
  key: string;
  parameter: SweepParameter;
  /** In words, from describeParameter: "height of Timber barrier, 3.0 m". */
  label: string;
  unit: string;
  group: "Walls" | "Receivers" | "Sources";
}

export function parameterKey(parameter: SweepParameter): string {
  switch (parameter.kind) {
    case "wall-height":
    case "wall-position":
    case "wall-absorption":
      return `${parameter.kind}:${parameter.wallId}`;
    case "receiver-height":
      return `${parameter.kind}:${parameter.receiverId}`;
    case "source-height":
      return `${parameter.kind}:${parameter.sourceId}`;
  }
}

/** Every parameter the scene's walls, point receivers and sources offer, walls first. */
export function parameterChoices(scene: Scene): ParameterChoice[] {
  const choice = (parameter: SweepParameter, group: ParameterChoice["group"]): ParameterChoice => ({ key: parameterKey(parameter), parameter, group, ...describeParameter(scene, parameter) });
  return [
    ...scene.geometry.walls.flatMap((wall) => [
      choice({ kind: "wall-height", wallId: wall.id }, "Walls"),
      choice({ kind: "wall-position", wallId: wall.id }, "Walls"),
      choice({ kind: "wall-absorption", wallId: wall.id }, "Walls"),
    ]),
    ...scene.receivers.map((receiver) => choice({ kind: "receiver-height", receiverId: receiver.id }, "Receivers")),
    ...scene.sources.map((source) => choice({ kind: "source-height", sourceId: source.id }, "Sources")),
  ];
}

function absorptionOf(surface: SurfaceTreatment): number {
  switch (surface.kind) {
    case "rigid":
      return 0;
    case "absorption":
      return surface.absorptionCoefficient;
    case "impedance":
      return absorptionFromImpedance(surface.normalisedImpedance);
    case "material":
      return absorptionFromImpedance(materialImpedance(surface.material));
  }
}

/** The parameter's value in the scene as saved, or undefined when the element is gone. */
export function currentValue(scene: Scene, parameter: SweepParameter): number | undefined {
  if (parameter.kind === "receiver-height") return scene.receivers.find((r) => r.id === parameter.receiverId)?.position.y;
  if (parameter.kind === "source-height") return scene.sources.find((s) => s.id === parameter.sourceId)?.position.y;
  const wall = scene.geometry.walls.find((w) => w.id === parameter.wallId);
  if (!wall) return undefined;
  const ys = wall.path.map((p) => p.y);
  if (parameter.kind === "wall-height") return Math.max(...ys) - Math.min(...ys);
  if (parameter.kind === "wall-position") return wall.path.reduce((a, b) => (b.y < a.y ? b : a)).x;
  return absorptionOf(wall.surface);
}

const round = (value: number, step: number) => Number((Math.round(value / step) * step).toPrecision(12));

/**
 * A first range to offer: about five values around the current one, on a round step, kept inside the
 * domain (heights and positions) or inside [0, 1] (absorption). The engineer edits it anyway.
 */
export function defaultRange(scene: Scene, parameter: SweepParameter): SweepRange {
  const value = currentValue(scene, parameter) ?? 0;
  if (parameter.kind === "wall-absorption") return { from: 0, to: 1, step: 0.2 };
  const limit = parameter.kind === "wall-position" ? scene.domain.width : scene.domain.height;
  const step = limit >= 20 ? 1 : limit >= 5 ? 0.5 : 0.1;
  const lowest = parameter.kind === "wall-height" ? step : 0;
  const highest = round(Math.floor(limit / step + 1e-9) * step, step);
  let from = Math.max(lowest, round(value - 2 * step, step));
  const to = Math.min(highest, round(from + 4 * step, step));
  if (to - from < 4 * step) from = Math.max(lowest, round(to - 4 * step, step));
  return { from, to, step };
}

/** The reference offered first: without every thin wall when there is one, else the free field. */
export function defaultReference(scene: Scene): SweepReference {
  const removed = defaultRemovedIds(scene);
  return removed.length > 0 ? { kind: "without", removedIds: removed } : { kind: "free-field" };
}

/** Receivers offered for the result: point receivers, then each line's receivers. */
export function receiverOptions(scene: Scene): { id: string; label: string }[] {
  return receiverSpecs(scene).map((spec) => ({ id: spec.id, label: spec.label || spec.id }));
}

/** The receivers chosen at first: the point receivers, or the first of the lines' when there are none. */
export function defaultReceiverIds(scene: Scene): string[] {
  const points = scene.receivers.map((r) => r.id);
  const chosen = points.length > 0 ? points : receiverOptions(scene).map((r) => r.id);
  return chosen.slice(0, MAX_SAVED_SWEEP_RECEIVERS);
}

/**
 * Snapshots and level maps are not needed to compare receiver levels: leaving them out makes each run
 * lighter and leaves the pressure at the receivers exactly as it was.
 */
export function forSweepRun(scene: Scene): Scene {
  return { ...scene, output: { ...scene.output, snapshotEverySteps: undefined, levelMaps: false } };
}

export interface PlannedRun {
  /** "reference:<n>" or "case:<k>". */
  id: string;
  kind: "reference" | "case";
  scene: Scene;
  /** Value of the parameter and its place in the sweep (cases only). */
  value?: number;
  caseIndex?: number;
  /** The reference run a case is compared with. */
  referenceId?: string;
}

export interface SweepPlan {
  /** In the order to run them: each reference before the first case that needs it. */
  runs: PlannedRun[];
  caseCount: number;
  referenceCount: number;
  /** True when every case shares one reference (the swept element is not in the reference). */
  sharedReference: boolean;
  /** Cell updates of one run (every run has the same grid). */
  cellUpdatesPerRun: number;
  label: string;
  unit: string;
}

export type SweepPlanResult = { ok: true; plan: SweepPlan } | { ok: false; message: string; field: "range" | "reference" };

function referenceOf(scene: Scene, reference: SweepReference) {
  return reference.kind === "free-field" ? freeFieldScene(scene) : sceneWithout(scene, reference.removedIds);
}

/** The scene's physics without its name, which changes from case to case and means nothing to the solver. */
function physicsKey(scene: Scene): string {
  return canonicalJson({ ...scene, name: "" });
}

/**
 * Every run of a sweep. Each case gets the reference made from its own scene; references that come out
 * the same (the swept wall is left out of them, say) are run once. A moved receiver or source is in
 * every reference, so such a sweep needs one reference per case.
 */
export function planSweep(scene: Scene, parameter: SweepParameter, range: SweepRange, reference: SweepReference): SweepPlanResult {
  const cases = sweepScenes(scene, parameter, range);
  if (!cases.ok) return { ok: false, message: cases.message, field: "range" };
  const runs: PlannedRun[] = [];
  const referenceIds = new Map<string, string>();
  for (const [k, sweepCase] of cases.cases.entries()) {
    const made = referenceOf(sweepCase.scene, reference);
    if (!made.ok) return { ok: false, message: made.message, field: "reference" };
    const key = physicsKey(made.scene);
    let referenceId = referenceIds.get(key);
    if (!referenceId) {
      referenceId = `reference:${referenceIds.size}`;
      referenceIds.set(key, referenceId);
      runs.push({ id: referenceId, kind: "reference", scene: forSweepRun(made.scene) });
    }
    runs.push({ id: `case:${k}`, kind: "case", scene: forSweepRun(sweepCase.scene), value: sweepCase.value, caseIndex: k, referenceId });
  }
  const { label, unit } = describeParameter(scene, parameter);
  return {
    ok: true,
    plan: {
      runs,
      caseCount: cases.cases.length,
      referenceCount: referenceIds.size,
      sharedReference: referenceIds.size === 1,
      cellUpdatesPerRun: deriveGrid(scene).cellUpdates,
      label,
      unit,
    },
  };
}

/** Seconds the whole plan should take at `cellUpdatesPerSecond`; an estimate, since rates vary. */
export function estimatedSeconds(plan: SweepPlan, cellUpdatesPerSecond: number): number {
  return (plan.cellUpdatesPerRun * plan.runs.length) / cellUpdatesPerSecond;
}
