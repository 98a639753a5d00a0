// The traces the analysis charts draw: a receiver of this run, or the same receiver of another saved run
// of the study, each with a colour (by receiver) and a dash (by run) so that overlays read at a glance.
import type { DecodedRun } from "@/lib/run-record/payload";

export interface AnalysisTrace {
  /** Unique among the traces drawn: run id and receiver id. */
  key: string;
  receiverId: string;
  /** "Garden" for this run; "Garden · Design B #2" for another run. */
  label: string;
  colour: string;
  dash?: number[];
  /** Pa, every timeStep s from t = 0. */
  pressure: Float32Array;
  timeStep: number;
}

/** Colour per receiver: distinct hues of similar weight, readable on the light panel. */
export const RECEIVER_COLOURS = ["#1f6f8b", "#c05621", "#4a7d2c", "#8b3a8f", "#b7791f", "#2c5282", "#9b2c2c", "#285e61"] as const;

/** Dash per overlaid run; this run is drawn solid. */
const RUN_DASHES: readonly number[][] = [[6, 3], [2, 2], [8, 3, 2, 3], [12, 4]];

export function receiverColour(receiverIndex: number): string {
  return RECEIVER_COLOURS[receiverIndex % RECEIVER_COLOURS.length]!;
}

/** A saved run chosen for overlay, decoded. */
export interface OverlayRun {
  runId: string;
  label: string;
  run: DecodedRun;
}

/**
 * This run's chosen receivers, then the same receivers of each overlaid run (skipped where that run lacks
 * the receiver), in a stable order.
 */
export function analysisTraces(run: DecodedRun, runId: string, receiverIds: readonly string[], overlays: readonly OverlayRun[] = []): AnalysisTrace[] {
  const indexOf = new Map(run.receivers.map((receiver, index) => [receiver.id, index]));
  const traces: AnalysisTrace[] = [];
  for (const id of receiverIds) {
    const index = indexOf.get(id);
    if (index === undefined) continue;
    const receiver = run.receivers[index]!;
    traces.push({ key: `${runId}:${id}`, receiverId: id, label: receiver.label || id, colour: receiverColour(index), pressure: receiver.pressure, timeStep: receiver.timeStep });
  }
  overlays.forEach((overlay, o) => {
    for (const id of receiverIds) {
      const index = indexOf.get(id);
      const receiver = overlay.run.receivers.find((r) => r.id === id);
      if (index === undefined || !receiver) continue;
      traces.push({
        key: `${overlay.runId}:${id}`,
        receiverId: id,
        label: `${receiver.label || id} · ${overlay.label}`,
        colour: receiverColour(index),
        dash: RUN_DASHES[o % RUN_DASHES.length],
        pressure: receiver.pressure,
        timeStep: receiver.timeStep,
      });
    }
  });
  return traces;
}
