// Which saved runs can be set beside this one. An insertion-loss reference must share the grid, the
// duration and the receivers (same ids at the same places): otherwise IL mixes a change of treatment with
// a change of grid, averaging time or position. An overlay (traces, spectra) only needs the same sampling
// and the same receiver ids. The list check uses the figures a run list carries; the payload check, made
// once the other run is loaded, the full headers.
import type { RunListItem } from "@/lib/http/api-types";
import type { RunPayloadHeader } from "@/lib/run-record/header";

export type Compatibility = { ok: true } | { ok: false; reason: string };

const OK: Compatibility = { ok: true };
const no = (reason: string): Compatibility => ({ ok: false, reason });

/** Equal to a part in a billion: the same scene derives bit-identical figures, JSON keeps them exact. */
const same = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));

const describeGrid = (g: { nx: number; ny: number; cellSize: number; timeStep: number }) => `${g.nx} x ${g.ny} cells of ${g.cellSize.toPrecision(4)} m, time step ${(g.timeStep * 1e6).toPrecision(4)} us`;

function gridProblem(current: RunPayloadHeader["grid"], other: { nx: number; ny: number; cellSize: number; timeStep: number }): string | undefined {
  if (current.nx !== other.nx || current.ny !== other.ny || !same(current.cellSize, other.cellSize) || !same(current.timeStep, other.timeStep)) {
    return `its grid differs (${describeGrid(other)}; this run: ${describeGrid(current)})`;
  }
  return undefined;
}

/** Problems that rule a listed run out whatever the purpose. */
function listedRunProblem(currentRunId: string, candidate: RunListItem): string | undefined {
  if (candidate.id === currentRunId) return "it is this run";
  if (candidate.status !== "completed") return `it is ${candidate.status}, not completed`;
  if (!candidate.figures) return "it has no summary to compare";
  return undefined;
}

/** Can `candidate`, from the study's run list, serve as the insertion-loss reference of the current run? */
export function referenceListCompatibility(current: RunPayloadHeader, currentRunId: string, candidate: RunListItem): Compatibility {
  const problem = listedRunProblem(currentRunId, candidate);
  if (problem) return no(problem);
  const figures = candidate.figures!;
  const grid = gridProblem(current.grid, figures.grid);
  if (grid) return no(grid);
  if (figures.steps.run !== current.run.stepsRun) return no(`it ran ${figures.steps.run} steps; this run ran ${current.run.stepsRun} (band levels average over the run, so durations must match)`);
  if (figures.receiverCount !== current.receivers.length) return no(`it has ${figures.receiverCount} receivers; this run has ${current.receivers.length}`);
  return OK;
}

/** Receivers by id; says which ids are missing on either side or which moved by more than half a cell. */
function receiverProblem(current: RunPayloadHeader, other: RunPayloadHeader, checkPositions: boolean): string | undefined {
  const theirs = new Map(other.receivers.map((receiver) => [receiver.id, receiver]));
  const ours = new Set(current.receivers.map((receiver) => receiver.id));
  const missing = current.receivers.filter((receiver) => !theirs.has(receiver.id)).map((receiver) => receiver.id);
  const extra = other.receivers.filter((receiver) => !ours.has(receiver.id)).map((receiver) => receiver.id);
  const list = (ids: string[]) => (ids.length > 3 ? `${ids.slice(0, 3).join(", ")} and ${ids.length - 3} more` : ids.join(", "));
  if (missing.length > 0) return `it has no receiver ${list(missing)}`;
  if (extra.length > 0) return `it has receivers this run lacks (${list(extra)})`;
  if (!checkPositions) return undefined;
  const tolerance = current.grid.cellSize / 2;
  for (const receiver of current.receivers) {
    const partner = theirs.get(receiver.id)!;
    const moved = Math.hypot(partner.x - receiver.x, partner.y - receiver.y);
    if (moved > tolerance) return `receiver ${receiver.id} is ${moved.toPrecision(3)} m from where it is in this run`;
  }
  return undefined;
}

/** The full check once the reference's payload is loaded: grid, duration, receivers and their positions. */
export function referencePayloadCompatibility(current: RunPayloadHeader, reference: RunPayloadHeader): Compatibility {
  const grid = gridProblem(current.grid, reference.grid);
  if (grid) return no(grid);
  if (reference.run.stepsRun !== current.run.stepsRun) return no(`it ran ${reference.run.stepsRun} steps; this run ran ${current.run.stepsRun}`);
  const receivers = receiverProblem(current, reference, true);
  return receivers ? no(receivers) : OK;
}

/** Whether the two runs' level maps lie on one grid, so an IL map can be taken cell by cell. */
export function levelMapCompatibility(current: RunPayloadHeader, reference: RunPayloadHeader): Compatibility {
  if (!current.levelMaps) return no("this run kept no level maps");
  if (!reference.levelMaps) return no("the reference kept no level maps");
  const a = current.levelMaps.field;
  const b = reference.levelMaps.field;
  if (a.width !== b.width || a.height !== b.height) return no(`the level maps differ in size (${b.width} x ${b.height} values; this run ${a.width} x ${a.height})`);
  const tolerance = 1e-6 * Math.max(a.spacing, b.spacing);
  if (Math.abs(a.spacing - b.spacing) > tolerance || Math.abs(a.x0 - b.x0) > tolerance || Math.abs(a.y0 - b.y0) > tolerance) {
    return no("the level maps lie on different grids (spacing or origin differ)");
  }
  return OK;
}

/** Can a listed run's traces be drawn over this run's? Same time step and the same number of receivers. */
export function overlayListCompatibility(current: RunPayloadHeader, currentRunId: string, candidate: RunListItem): Compatibility {
  const problem = listedRunProblem(currentRunId, candidate);
  if (problem) return no(problem);
  const figures = candidate.figures!;
  if (!same(figures.grid.timeStep, current.grid.timeStep)) return no(`it is sampled every ${(figures.grid.timeStep * 1e6).toPrecision(4)} us; this run every ${(current.grid.timeStep * 1e6).toPrecision(4)} us`);
  if (figures.receiverCount !== current.receivers.length) return no(`it has ${figures.receiverCount} receivers; this run has ${current.receivers.length}`);
  return OK;
}

/** The overlay check once the other run is loaded: same sampling and the same receiver ids (positions may differ). */
export function overlayPayloadCompatibility(current: RunPayloadHeader, other: RunPayloadHeader): Compatibility {
  if (!same(other.grid.timeStep, current.grid.timeStep)) return no("it is sampled at a different time step");
  const receivers = receiverProblem(current, other, false);
  return receivers ? no(receivers) : OK;
}
