// The few figures of a saved run that lists and tables show without fetching its payload: the
// grid, how long it ran, and per receiver the peak and the energy-equivalent level. Computed on the
// server from the decoded payload, so they always agree with what is stored.
import type { ReceiverTrace } from "@/lib/fdtd/simulation";
import type { RunPayloadHeader } from "./header";
import { MAX_SUMMARY_RECEIVERS } from "./limits";

/** Reference sound pressure for levels in air, Pa (20 µPa). */
export const REFERENCE_PRESSURE = 20e-6;

export interface ReceiverSummary {
  id: string;
  label: string;
  /** Largest |p| over the run, Pa. */
  peakPressure: number;
  /** 20 log10(peak / 20 µPa), dB; null for a silent receiver. */
  peakLevelDb: number | null;
  /**
   * Energy-equivalent level over the simulated time, 10 log10(mean p^2 / (20 µPa)^2), dB; null for a
   * silent receiver. A transient's Leq depends on the window: compare runs of equal duration.
   */
  leqDb: number | null;
}

export interface RunSummary {
  grid: { nx: number; ny: number; cells: number; domainNx: number; domainNy: number; cellSize: number; timeStep: number };
  steps: { planned: number; run: number };
  simulatedSeconds: number;
  stoppedBy: RunPayloadHeader["run"]["stoppedBy"];
  /** Set-up plus stepping, s, as measured in the browser that ran it. */
  wallSeconds: number;
  cellUpdatesPerSecond: number;
  engine: { kernel: string; threads: number };
  /** The first MAX_SUMMARY_RECEIVERS receivers; receiverCount says how many there are. */
  receivers: ReceiverSummary[];
  receiverCount: number;
  /** Largest peak level over every receiver, dB; null when all are silent or there are none. */
  loudestPeakLevelDb: number | null;
  snapshotFrames: number;
  warnings: { code: string; message: string }[];
}

function levelDb(ratioSquared: number): number | null {
  return ratioSquared > 0 ? 10 * Math.log10(ratioSquared) : null;
}

export function summariseReceiver(trace: Pick<ReceiverTrace, "id" | "label" | "pressure">): ReceiverSummary {
  let peak = 0;
  let sumOfSquares = 0;
  for (let n = 0; n < trace.pressure.length; n++) {
    const p = trace.pressure[n]!;
    peak = Math.max(peak, Math.abs(p));
    sumOfSquares += p * p;
  }
  const meanSquare = trace.pressure.length > 0 ? sumOfSquares / trace.pressure.length : 0;
  return {
    id: trace.id,
    label: trace.label,
    peakPressure: peak,
    peakLevelDb: levelDb((peak / REFERENCE_PRESSURE) ** 2),
    leqDb: levelDb(meanSquare / REFERENCE_PRESSURE ** 2),
  };
}

export function summariseRun({ header, receivers }: { header: RunPayloadHeader; receivers: readonly Pick<ReceiverTrace, "id" | "label" | "pressure">[] }): RunSummary {
  const all = receivers.map(summariseReceiver);
  // A loop, not Math.max(...levels): a long receiver line would overflow the argument list.
  let loudest: number | null = null;
  for (const receiver of all) if (receiver.peakLevelDb !== null && (loudest === null || receiver.peakLevelDb > loudest)) loudest = receiver.peakLevelDb;
  const { grid, run } = header;
  return {
    grid: { nx: grid.nx, ny: grid.ny, cells: grid.nx * grid.ny, domainNx: grid.domainNx, domainNy: grid.domainNy, cellSize: grid.cellSize, timeStep: grid.timeStep },
    steps: { planned: grid.plannedSteps, run: run.stepsRun },
    simulatedSeconds: run.simulatedSeconds,
    stoppedBy: run.stoppedBy,
    wallSeconds: run.setupSeconds + run.runSeconds,
    cellUpdatesPerSecond: run.cellUpdatesPerSecond,
    engine: header.engine,
    receivers: all.slice(0, MAX_SUMMARY_RECEIVERS),
    receiverCount: all.length,
    loudestPeakLevelDb: loudest,
    snapshotFrames: header.snapshots.frames.length,
    warnings: header.warnings.map((w) => ({ code: w.code, message: w.message })),
  };
}
