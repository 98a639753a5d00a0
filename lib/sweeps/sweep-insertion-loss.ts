// From the receiver traces of a sweep's runs to its result: per case, receiver and band the insertion
// loss IL = L_reference - L_case (lib/analysis/insertion-loss.ts), in one list of bands for the whole
// sweep. Recomputed whole as cases finish: a few FFTs of a few thousand samples each.
import { bandLevelTable, selectBands, type BandsPerOctave, type PressureTrace } from "@/lib/analysis/band-levels";
import { insertionLossTable, RunMismatchError } from "@/lib/analysis/insertion-loss";
import type { SweepResults } from "@/lib/validation/blocks";

export type CaseState =
  | { status: "done"; referenceId: string; traces: PressureTrace[] }
  | { status: "failed"; message: string }
  | { status: "not-run" };

export interface SweepAnalysisInput {
  values: number[];
  /** One per value, in the same order. */
  cases: CaseState[];
  /** Traces of each reference run that finished, by reference id. */
  references: ReadonlyMap<string, PressureTrace[]>;
  receivers: { id: string; label: string }[];
  bandsPerOctave: BandsPerOctave;
  weighting: "Z" | "A";
  /** GridPlan.maxResolvedFrequency of the swept scene, Hz. */
  highestResolvedFrequency: number;
  completedAt: string;
}

/** The chosen receivers' traces of a run, in the chosen order; throws when one is missing. */
export function pickTraces(traces: readonly PressureTrace[], receiverIds: readonly string[]): PressureTrace[] {
  return receiverIds.map((id) => {
    const trace = traces.find((t) => t.id === id);
    if (!trace) throw new RangeError(`the run has no receiver "${id}"`);
    // A copy: the run's full result (every receiver, velocities) can then be let go.
    return { id: trace.id, label: trace.label, timeStep: trace.timeStep, pressure: Float32Array.from(trace.pressure) };
  });
}

/**
 * Runs that stop on decay end at different times. A decayed transient adds nothing after its end, so
 * the shorter traces are extended with silence: every run is then averaged over the same time and the
 * levels' difference is the difference of their energies.
 */
export function padTraces(traces: readonly PressureTrace[], length: number): PressureTrace[] {
  return traces.map((trace) => {
    if (trace.pressure.length === length) return trace;
    const pressure = new Float32Array(length);
    for (let n = 0; n < Math.min(length, trace.pressure.length); n++) pressure[n] = trace.pressure[n] ?? 0;
    return { ...trace, pressure };
  });
}

/** Rounded to 0.01 dB; null for what is not a finite number (a silent band gives -Infinity - -Infinity). */
export function decibelsOrNull(value: number): number | null {
  return Number.isFinite(value) ? Math.round(value * 100) / 100 : null;
}

/** The sweep's result from what has run so far; cases whose runs do not pair become failed, with the reason. */
export function sweepInsertionLoss(input: SweepAnalysisInput): SweepResults {
  const receiverIds = input.receivers.map((r) => r.id);
  const outcomes: SweepResults["outcomes"] = input.cases.map((c) => (c.status === "failed" ? { status: "failed", message: c.message } : { status: c.status }));
  const finished = input.cases.flatMap((c, k) => (c.status === "done" && input.references.has(c.referenceId) ? [{ k, traces: c.traces, reference: input.references.get(c.referenceId)! }] : []));
  input.cases.forEach((c, k) => {
    if (c.status === "done" && !input.references.has(c.referenceId)) outcomes[k] = { status: "failed", message: "its reference run did not finish" };
  });
  const empty = (): SweepResults => ({
    values: input.values,
    outcomes,
    receivers: input.receivers,
    bands: [],
    insertionLoss: input.values.map(() => input.receivers.map(() => [])),
    overall: input.values.map(() => input.receivers.map(() => null)),
    excludedBands: [],
    completedAt: input.completedAt,
  });
  const first = finished[0]?.traces[0];
  if (!first) return empty();

  const all = finished.flatMap((f) => [...f.traces, ...f.reference]);
  const length = Math.max(...all.map((t) => t.pressure.length));
  const sampling = { bandsPerOctave: input.bandsPerOctave, highestResolvedFrequency: input.highestResolvedFrequency, weighting: input.weighting };
  const { bands, excluded } = selectBands(sampling, first.timeStep, length);
  const result = empty();
  result.bands = bands.map((band) => ({ index: band.index, nominal: band.nominal, lower: band.lower, upper: band.upper }));
  result.excludedBands = excluded.map((e) => `${e.band.nominal} Hz: ${e.message}`);
  result.insertionLoss = input.values.map(() => input.receivers.map(() => bands.map(() => null)));
  if (bands.length === 0) return result;

  for (const { k, traces, reference } of finished) {
    // Runs on another time step have another grid: their levels do not pair (nor would their bands).
    const offGrid = [...traces, ...reference].find((t) => t.timeStep !== first.timeStep);
    if (offGrid) {
      outcomes[k] = { status: "failed", message: `it cannot be compared with the other runs: receiver "${offGrid.id}" is sampled every ${offGrid.timeStep} s, not every ${first.timeStep} s` };
      continue;
    }
    try {
      const withTreatment = bandLevelTable(padTraces(pickTraces(traces, receiverIds), length), sampling);
      const without = bandLevelTable(padTraces(pickTraces(reference, receiverIds), length), sampling);
      const table = insertionLossTable(without, withTreatment);
      result.insertionLoss[k] = table.receivers.map((receiver) => Array.from(receiver.insertionLoss, decibelsOrNull));
      result.overall[k] = table.receivers.map((receiver) => decibelsOrNull(receiver.overall));
    } catch (error) {
      if (!(error instanceof RunMismatchError || error instanceof RangeError)) throw error;
      outcomes[k] = { status: "failed", message: `it cannot be compared with its reference: ${error.message}` };
    }
  }
  return result;
}
