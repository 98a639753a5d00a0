// Which of the bands a table or chart shows the accuracy estimate rates "use with care", and the one-line
// summary of a run's estimate. Both read the ratings the estimate already made (bandAccuracy through
// runAccuracy), so the marks in the band tables and the panel can never disagree.
import type { FrequencyBand } from "../bands";
import type { BandAccuracy } from "./band-accuracy";
import type { RunAccuracy } from "./run-accuracy";
import { CAREFUL_PHASE_ERROR_DEGREES } from "./thresholds";

/** The mark beside a band rated "use with care" in band tables and charts. */
export const USE_WITH_CARE_MARK = "†";

/** The legend under a table whose headings carry the mark. */
export const USE_WITH_CARE_LEGEND = `use with care: the grid delays these bands by more than ${CAREFUL_PHASE_ERROR_DEGREES}° of phase over the longest source-receiver distance; their levels hold, but interference dips and peaks may sit at the wrong frequency or place.`;

/** The estimate's ratings in the band width a table shows. */
export function ratedBandsOf(accuracy: Pick<RunAccuracy, "octaveBands" | "thirdOctaveBands">, bandsPerOctave: 1 | 3): readonly BandAccuracy[] {
  return bandsPerOctave === 1 ? accuracy.octaveBands : accuracy.thirdOctaveBands;
}

/**
 * The shown bands rated "use with care", by band index, with the estimate's reason. `rated` must be of the
 * same band width as `shown` (band indices count from 1 kHz in steps of that width). A shown band the
 * estimate did not rate (outside 20 Hz to 20 kHz) gets no mark.
 */
export function bandsToUseWithCare(shown: readonly FrequencyBand[], rated: readonly BandAccuracy[]): ReadonlyMap<number, string> {
  const byIndex = new Map(rated.map((entry) => [entry.band.index, entry]));
  const careful = new Map<number, string>();
  for (const band of shown) {
    const entry = byIndex.get(band.index);
    // Same index and same edges: guards against ratings of the other band width being passed by mistake.
    if (entry && entry.rating === "use with care" && Math.abs(entry.band.upper - band.upper) <= 1e-9 * band.upper) careful.set(band.index, entry.reason);
  }
  return careful;
}

const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

/** One line for a collapsed panel: "Accuracy: 5 octave bands reliable, 1 to use with care, 4 not resolved; 1 warning". */
export function accuracySummary(accuracy: Pick<RunAccuracy, "octaveBands" | "warnings">): string {
  const count = (rating: BandAccuracy["rating"]) => accuracy.octaveBands.filter((entry) => entry.rating === rating).length;
  const reliable = count("reliable");
  const careful = count("use with care");
  const unresolved = count("not resolved");
  const parts = [`${plural(reliable, "octave band", "octave bands")} reliable`];
  if (careful > 0) parts.push(`${careful} to use with care`);
  if (unresolved > 0) parts.push(`${unresolved} not resolved`);
  const warnings = accuracy.warnings.length === 0 ? "no warnings" : plural(accuracy.warnings.length, "warning", "warnings");
  return `Accuracy: ${parts.join(", ")}; ${warnings}`;
}
