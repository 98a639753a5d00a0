// The per-band table that band levels and insertion loss both show: receivers down (with their chart
// colour), the overall figure, then one column per band the grid resolves, those the accuracy estimate rates
// "use with care" marked.
import { USE_WITH_CARE_LEGEND, USE_WITH_CARE_MARK } from "@/lib/analysis/accuracy";
import type { BandsPerOctave } from "@/lib/analysis/band-levels";
import type { FrequencyBand } from "@/lib/analysis/bands";

import { formatHz } from "./band-bar-chart";

const valueCell = "px-2 py-1 text-right tabular-nums";

/**
 * The header row; hovering a band shows its exact edges (and, with `showCentre`, its exact centre). Bands in
 * `careful` (from bandsToUseWithCare: band index to the estimate's reason) carry the mark and the reason.
 */
export function BandTableHead({ bands, showCentre = false, careful }: { bands: readonly FrequencyBand[]; showCentre?: boolean; careful?: ReadonlyMap<number, string> }) {
  return (
    <thead>
      <tr className="border-b border-rule-strong text-ink-soft">
        <th className="px-2 py-1 text-left font-sans font-medium">Receiver</th>
        <th className={`${valueCell} font-medium`}>Overall</th>
        {bands.map((band) => {
          const reason = careful?.get(band.index);
          return (
            <th
              key={band.index}
              className={`${valueCell} font-medium`}
              title={`exact edges ${band.lower.toFixed(1)}–${band.upper.toFixed(1)} Hz${showCentre ? `, exact centre ${band.centre.toFixed(1)} Hz` : ""}${reason ? `. Use with care: ${reason}` : ""}`}
            >
              {formatHz(band.nominal)}
              {reason ? (
                <>
                  <span aria-hidden className="ml-0.5 text-signal-warn">
                    {USE_WITH_CARE_MARK}
                  </span>
                  <span className="sr-only"> (use with care)</span>
                </>
              ) : null}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}

/** The legend under a table or chart whose bands carry the mark; nothing when no band does. */
export function UseWithCareLegend({ careful }: { careful: ReadonlyMap<number, string> }) {
  if (careful.size === 0) return null;
  return (
    <p className="text-[12px] text-ink-soft" data-testid="use-with-care-legend">
      <span aria-hidden className="mr-1 text-signal-warn">
        {USE_WITH_CARE_MARK}
      </span>
      {USE_WITH_CARE_LEGEND.charAt(0).toUpperCase()}
      {USE_WITH_CARE_LEGEND.slice(1)} Hover a marked band for its figures; the accuracy section explains each rating.
    </p>
  );
}

/** One receiver's row: its label behind a swatch of its chart colour, the overall figure in bold, then every band. */
export function ReceiverBandRow({ label, colour, overall, values }: { label: string; colour: string; overall: number; values: ArrayLike<number> }) {
  return (
    <tr className="border-b border-rule">
      <th scope="row" className="px-2 py-1 text-left font-sans font-normal text-ink">
        <span className="mr-1.5 inline-block size-2.5 rounded-sm align-middle" style={{ background: colour }} />
        {label}
      </th>
      <td className={`${valueCell} font-semibold`}>{overall.toFixed(1)}</td>
      {Array.from(values, (value, b) => (
        <td key={b} className={valueCell}>
          {Number.isFinite(value) ? value.toFixed(1) : "–"}
        </td>
      ))}
    </tr>
  );
}

/** The part of an export's file name that says which bands and weighting it holds: "octave", "third-octave-A". */
export function bandFileTag(bandsPerOctave: BandsPerOctave, weighting: "Z" | "A"): string {
  return `${bandsPerOctave === 1 ? "octave" : "third-octave"}${weighting === "A" ? "-A" : ""}`;
}
