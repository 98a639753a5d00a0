// The accuracy estimate of one run (issue #9): from the scene and its grid, every octave and one-third-octave
// band rated, each receiver's distance from each source, and the warnings; with a stored run also whether it
// ran long enough.
import type { GridPlan } from "@/lib/fdtd/grid";
import { type ReceiverSpec, receiverSpecs } from "@/lib/fdtd/receivers";
import type { Scene } from "@/lib/fdtd/scene";

import { type BandAccuracy, bandAccuracyTable } from "./band-accuracy";
import { geometryWarnings } from "./geometry-warnings";
import { receiverWarnings } from "./receiver-warnings";
import { resolvedFrequencyLimit } from "./resolved-range";
import { arrivalWarning, decayWarning, type RunEnding } from "./run-warnings";
import type { AccuracyWarning } from "./warning";

export interface SourceDistance {
  sourceId: string;
  sourceLabel: string;
  /** Straight-line distance, m. */
  distance: number;
}

export interface ReceiverDistances {
  receiverId: string;
  label: string;
  sources: SourceDistance[];
}

export interface RunAccuracy {
  cellSize: number;
  timeStep: number;
  courantNumber: number;
  /** Sound speed the figures use: the slowest of the scene, m/s. */
  soundSpeed: number;
  /** Highest frequency a band's upper edge may reach and count as resolved, Hz (the shared decision). */
  resolvedUpTo: number;
  /** Longest source-receiver distance, m (0 without receivers). */
  longestDistance: number;
  octaveBands: BandAccuracy[];
  thirdOctaveBands: BandAccuracy[];
  receivers: ReceiverDistances[];
  warnings: AccuracyWarning[];
}

/** Distance in wavelengths at frequency f (Hz) for sound speed c (m/s). */
export function distanceInWavelengths(distance: number, frequency: number, soundSpeed: number): number {
  return (distance * frequency) / soundSpeed;
}

function receiverDistances(scene: Scene, receivers: readonly ReceiverSpec[]): ReceiverDistances[] {
  return receivers.map((receiver) => ({
    receiverId: receiver.id,
    label: receiver.label || receiver.id,
    sources: scene.sources.map((source) => ({
      sourceId: source.id,
      sourceLabel: source.label || source.id,
      distance: Math.hypot(source.position.x - receiver.position.x, source.position.y - receiver.position.y),
    })),
  }));
}

/**
 * The estimate. `ending` (a stored run) adds the warnings about the run's length and decay, and lets the
 * band ratings take the trace's frequency resolution into account, as the band tables do.
 */
export function runAccuracy(scene: Scene, grid: GridPlan, ending?: RunEnding & { timeStep?: number; sampleCount?: number }): RunAccuracy {
  const receivers = receiverSpecs(scene);
  const distances = receiverDistances(scene, receivers);
  let longestDistance = 0;
  for (const receiver of distances) for (const source of receiver.sources) longestDistance = Math.max(longestDistance, source.distance);
  const sampling = { timeStep: ending?.timeStep ?? grid.timeStep, sampleCount: ending?.sampleCount };
  const bandGrid = { cellSize: grid.cellSize, minSoundSpeed: grid.minSoundSpeed, timeStep: grid.timeStep };

  const warnings = [...geometryWarnings(scene, grid.cellSize), ...receiverWarnings(scene, grid, receivers)];
  if (ending) {
    const late = arrivalWarning(scene, grid.timeStep, grid.maxSoundSpeed, receivers, ending);
    if (late) warnings.push(late);
    const undecayed = decayWarning(scene, grid.timeStep, ending);
    if (undecayed) warnings.push(undecayed);
  }
  return {
    cellSize: grid.cellSize,
    timeStep: grid.timeStep,
    courantNumber: grid.courantNumber,
    soundSpeed: grid.minSoundSpeed,
    resolvedUpTo: resolvedFrequencyLimit(grid),
    longestDistance,
    octaveBands: bandAccuracyTable(1, bandGrid, longestDistance, sampling),
    thirdOctaveBands: bandAccuracyTable(3, bandGrid, longestDistance, sampling),
    receivers: distances,
    warnings,
  };
}
