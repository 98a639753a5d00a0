// The bands a table or chart leaves out and why, in one form wherever band values are shown. The decision
// itself is the accuracy estimate's (resolvedFrequencyLimit, passed as highestResolvedFrequency).
import { type BandsPerOctave, type ExcludedBand, selectBands } from "@/lib/analysis/band-levels";

import { formatHz } from "./band-bar-chart";

/** The bands a run's band table leaves out, with reasons: the same call the table makes. */
export function unresolvedBandsOf(run: { receivers: readonly { timeStep: number; pressure: ArrayLike<number> }[] }, bandsPerOctave: BandsPerOctave, highestResolvedFrequency: number): ExcludedBand[] {
  const first = run.receivers[0];
  if (!first || first.pressure.length < 2) return [];
  return selectBands({ bandsPerOctave, highestResolvedFrequency }, first.timeStep, first.pressure.length).excluded;
}

export function UnresolvedBandsNote({ excluded }: { excluded: readonly ExcludedBand[] }) {
  if (excluded.length === 0) return null;
  return (
    <details className="text-[12px] text-ink-soft" data-testid="unresolved-bands">
      <summary className="cursor-pointer text-muted">
        {excluded.length} band{excluded.length === 1 ? "" : "s"} left out as not resolved
      </summary>
      <ul className="mt-1 list-disc pl-5">
        {excluded.map((entry) => (
          <li key={entry.band.index}>
            {formatHz(entry.band.nominal)}: {entry.message}
          </li>
        ))}
      </ul>
    </details>
  );
}
