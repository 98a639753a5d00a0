// The per-band table that band levels and insertion loss both show: receivers down (with their chart
// colour), the overall figure, then one column per band the grid resolves.
import type { BandsPerOctave } from "@/lib/analysis/band-levels";
import type { FrequencyBand } from "@/lib/analysis/bands";

import { formatHz } from "./band-bar-chart";

const valueCell = "px-2 py-1 text-right tabular-nums";

/** The header row; hovering a band shows its exact edges (and, with `showCentre`, its exact centre). */
export function BandTableHead({ bands, showCentre = false }: { bands: readonly FrequencyBand[]; showCentre?: boolean }) {
  return (
    <thead>
      <tr className="border-b border-rule-strong text-ink-soft">
        <th className="px-2 py-1 text-left font-sans font-medium">Receiver</th>
        <th className={`${valueCell} font-medium`}>Overall</th>
        {bands.map((band) => (
          <th key={band.index} className={`${valueCell} font-medium`} title={`exact edges ${band.lower.toFixed(1)}–${band.upper.toFixed(1)} Hz${showCentre ? `, exact centre ${band.centre.toFixed(1)} Hz` : ""}`}>
            {formatHz(band.nominal)}
          </th>
        ))}
      </tr>
    </thead>
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
