// Warnings that need the run's length and what it recorded: it stopped before the direct sound of every
// source (and the whole source pulse) had passed a receiver, or before the energy had decayed.
import type { ReceiverSpec } from "@/lib/fdtd/receivers";
import type { Scene } from "@/lib/fdtd/scene";
import { prepareSignal } from "@/lib/fdtd/signals";

import { DECAYED_DB, TAIL_FRACTION } from "./thresholds";
import { listNames } from "./receiver-warnings";
import type { AccuracyWarning } from "./warning";

/** What a stored run says about how it ended. */
export interface RunEnding {
  simulatedSeconds: number;
  stoppedBy: "duration" | "decay" | "cancelled";
  /** Acoustic energy at each energy check (the payload header's `energy`), when kept. */
  energy?: readonly { time: number; joulesPerMetre: number }[];
  /** Receiver pressure, used for the tail level when there is no energy history. */
  traces?: readonly { id: string; label: string; pressure: ArrayLike<number> }[];
}

/**
 * How long a source's pulse lasts from t = 0, s: the time after which its signal is negligible; for a
 * continuous sine, its fade-in (the level is steady from then on).
 */
export function sourcePulseLength(signal: Scene["sources"][number]["signal"], timeStep: number): number {
  const { endTime } = prepareSignal(signal, timeStep);
  if (Number.isFinite(endTime)) return endTime;
  return signal.kind === "sine" ? signal.rampCycles / signal.frequency : 0;
}

/** Whether some source never stops (a sine): its energy is not expected to decay. */
export function hasContinuousSource(scene: Scene, timeStep: number): boolean {
  return scene.sources.some((source) => !Number.isFinite(prepareSignal(source.signal, timeStep).endTime));
}

const ms = (seconds: number) => `${(seconds * 1000).toPrecision(3)} ms`;

/**
 * Receivers whose direct sound had not fully passed when the run stopped: for each source, the straight-line
 * distance at the fastest sound speed of the scene (the earliest any sound can arrive) plus the pulse length.
 */
export function arrivalWarning(scene: Scene, timeStep: number, maxSoundSpeed: number, receivers: readonly ReceiverSpec[], ending: Pick<RunEnding, "simulatedSeconds">): AccuracyWarning | undefined {
  const pulses = scene.sources.map((source) => ({ source, pulse: sourcePulseLength(source.signal, timeStep) }));
  const late: { receiver: ReceiverSpec; needed: number }[] = [];
  for (const receiver of receivers) {
    let needed = 0;
    for (const { source, pulse } of pulses) {
      const distance = Math.hypot(source.position.x - receiver.position.x, source.position.y - receiver.position.y);
      needed = Math.max(needed, distance / maxSoundSpeed + pulse);
    }
    if (needed > ending.simulatedSeconds) late.push({ receiver, needed });
  }
  if (late.length === 0) return undefined;
  const longest = Math.max(...late.map((entry) => entry.needed));
  return {
    code: "run-too-short",
    subject: late.length === 1 ? `receiver "${late[0]!.receiver.label || late[0]!.receiver.id}"` : `${late.length} receivers`,
    message: `The run stopped at ${ms(ending.simulatedSeconds)}, before the direct sound and the whole source pulse had passed ${late.length === 1 ? "receiver" : "receivers"} ${listNames(late.map((entry) => `"${entry.receiver.label || entry.receiver.id}"`))} (up to ${ms(longest)} needed: distance over the sound speed plus the pulse length). Its levels miss part of the sound.`,
    remedy: `Run for at least ${ms(longest)}, more for reflections and diffracted sound.`,
  };
}

/** Final energy relative to its peak, dB (energy history), or the loudest receiver's tail level relative to its peak. */
export function finalEnergyRelativeToPeak(ending: RunEnding): { decibels: number; from: "energy" | "traces" } | undefined {
  const energy = ending.energy ?? [];
  if (energy.length >= 2) {
    let peak = 0;
    for (const entry of energy) peak = Math.max(peak, entry.joulesPerMetre);
    const last = energy[energy.length - 1]!.joulesPerMetre;
    if (peak <= 0) return undefined;
    return { decibels: 10 * Math.log10(Math.max(last, Number.MIN_VALUE) / peak), from: "energy" };
  }
  let worst = -Infinity;
  for (const trace of ending.traces ?? []) {
    const n = trace.pressure.length;
    const tail = Math.max(1, Math.floor(TAIL_FRACTION * n));
    let peak = 0;
    let tailSum = 0;
    for (let k = 0; k < n; k++) {
      const p = trace.pressure[k] ?? 0;
      peak = Math.max(peak, p * p);
      if (k >= n - tail) tailSum += p * p;
    }
    if (peak > 0) worst = Math.max(worst, 10 * Math.log10(Math.max(tailSum / tail, Number.MIN_VALUE) / peak));
  }
  return Number.isFinite(worst) ? { decibels: worst, from: "traces" } : undefined;
}

export function decayWarning(scene: Scene, timeStep: number, ending: RunEnding): AccuracyWarning | undefined {
  if (ending.stoppedBy === "decay" || hasContinuousSource(scene, timeStep)) return undefined;
  const final = finalEnergyRelativeToPeak(ending);
  if (!final || final.decibels <= -DECAYED_DB) return undefined;
  const what = final.from === "energy" ? "the acoustic energy in the domain" : "the loudest receiver's level over the last tenth of its trace";
  return {
    code: "energy-not-decayed",
    subject: "the run",
    message: `When the run stopped, ${what} was only ${(-final.decibels).toFixed(1)} dB below its peak (${DECAYED_DB} dB counts as decayed): band levels miss the tail and the cut smears the spectrum.`,
    remedy: `Run longer, or let the run stop on decay (duration "until decayed" by ${DECAYED_DB} dB or more).`,
  };
}
