// The band-level table of a saved run, as the run page's band-level panel computes it: every receiver,
// octave or one-third-octave bands the grid resolves, Z or A weighting, rectangular window. Shared by
// the CSV route so that a script gets the same figures the page shows.
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
import type { DecodedRun } from "@/lib/run-record/payload";
import { bandLevelTable, type BandLevelTable, type BandsPerOctave } from "./band-levels";
import { bandLevelsCsv } from "./csv";
import { resolvedFrequencyLimit } from "./accuracy/resolved-range";

export type RunBandLevelsOutcome = { ok: true; table: BandLevelTable } | { ok: false; message: string };

/** Highest frequency the run's grid resolves, from its frozen scene; null when that scene cannot be read. */
export function runHighestResolvedFrequency(run: DecodedRun): number | null {
  const parsed = parseScene(run.header.scene);
  return parsed.ok ? resolvedFrequencyLimit(deriveGrid(parsed.scene)) : null;
}

export function runBandLevels(run: DecodedRun, options: { bandsPerOctave: BandsPerOctave; weighting: "Z" | "A" }): RunBandLevelsOutcome {
  if (run.receivers.length === 0) return { ok: false, message: "This run recorded no receivers, so it has no band levels." };
  const highestResolvedFrequency = runHighestResolvedFrequency(run);
  if (highestResolvedFrequency === null) return { ok: false, message: "This run's frozen scene cannot be read, so the bands its grid resolves are unknown." };
  try {
    return { ok: true, table: bandLevelTable(run.receivers, { ...options, highestResolvedFrequency }) };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/** The table as CSV, with the averaging time and the 2D caution on a closing comment line. */
export function runBandLevelsCsv(table: BandLevelTable): string {
  const note = `equivalent levels over ${table.averagingTime.toPrecision(4)} s of trace; 2D prediction (coherent line source), not a statutory noise assessment`;
  return bandLevelsCsv(table, { note });
}
