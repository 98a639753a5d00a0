// How a report sums up an attached verification record: per case, the check that came closest to (or
// furthest past) its tolerance, and whether the record's solver version is the run's.
import type { SavedCheck } from "@/lib/validation/verification";

/** |error| as a fraction of the tolerance; a ceiling check (tolerance 0) is 0 below its limit, infinite above. */
export function toleranceUsed(check: Pick<SavedCheck, "error" | "tolerance">): number {
  if (check.error === null || check.tolerance === null) return Infinity;
  if (check.tolerance === 0) return check.error <= 0 ? 0 : Infinity;
  return Math.abs(check.error) / Math.abs(check.tolerance);
}

/** A failed check if there is one, else the one that used most of its tolerance; undefined for no checks. */
export function decisiveCheck<Check extends Pick<SavedCheck, "error" | "tolerance" | "pass">>(checks: readonly Check[]): Check | undefined {
  let best: Check | undefined;
  for (const check of checks) {
    if (!best) best = check;
    else if (best.pass !== check.pass) best = check.pass ? best : check;
    else if (toleranceUsed(check) > toleranceUsed(best)) best = check;
  }
  return best;
}

/** The sentence a report prints when the evidence was made with another solver than the run. */
export function solverMismatch(recordVersion: string, runVersion: string): string | null {
  if (recordVersion === runVersion) return null;
  return `These results were made with solver version ${recordVersion}; this run used ${runVersion}. They may not hold for this run's solver.`;
}
