"use client";
// How far to trust a run (issue #9): per band the cells per wavelength at the upper edge, the phase error of
// the scheme's dispersion, a rating and its reason; each receiver's distance from each source in wavelengths;
// and the warnings with what to do about each. Shown on the saved run page and the printed report.
import { useState } from "react";

import { type AccuracyWarning, type BandAccuracy, CAREFUL_PHASE_ERROR_DEGREES, distanceInWavelengths, RESOLVED_POINTS_PER_WAVELENGTH, type RunAccuracy } from "@/lib/analysis/accuracy";

import { formatHz } from "@/components/analysis/band-bar-chart";
import { Segmented } from "@/components/analysis/analysis-controls";
import { RatingBadge } from "./rating-badge";

/** Unresolved bands listed after the last resolved one before the rest is summed up in a line. */
const UNRESOLVED_SHOWN = 2;
/** Receivers listed in the distance table; a long receiver line is summarised. */
const RECEIVERS_SHOWN = 12;

const degrees = (value: number) => (Number.isFinite(value) ? `${value < 10 ? value.toFixed(1) : value.toFixed(0)}°` : "—");
const cell = "px-2 py-1 text-right tabular-nums";

/** The bands worth a row: up to the last resolved one and a couple above it. */
export function shownBands(bands: readonly BandAccuracy[]): { rows: BandAccuracy[]; hiddenAbove: number; hiddenFrom?: number } {
  let last = -1;
  bands.forEach((entry, b) => {
    if (entry.rating !== "not resolved") last = b;
  });
  const end = Math.min(bands.length, Math.max(last + 1 + UNRESOLVED_SHOWN, UNRESOLVED_SHOWN));
  const rest = bands.slice(end);
  return { rows: bands.slice(0, end), hiddenAbove: rest.length, hiddenFrom: rest[0]?.band.nominal };
}

export function AccuracyBandTable({ bands }: { bands: readonly BandAccuracy[] }) {
  const { rows, hiddenAbove, hiddenFrom } = shownBands(bands);
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full border-collapse text-[12px]" data-testid="accuracy-band-table">
        <thead>
          <tr className="border-b border-rule-strong text-left text-ink-soft">
            <th className="px-2 py-1 font-medium">Band</th>
            <th className={`${cell} font-medium`} title="Upper band edge (IEC 61260-1), where the grid is least accurate in the band">Upper edge</th>
            <th className={`${cell} font-medium`} title="Cells per wavelength at the upper edge, in the slowest medium">Cells / λ</th>
            <th className={`${cell} font-medium`} title="Phase lag per wavelength travelled along a grid axis (the worst direction), from the scheme's dispersion relation">Phase error / λ</th>
            <th className={`${cell} font-medium`} title="Phase lag over the longest source-receiver distance">Over the path</th>
            <th className="px-2 py-1 font-medium">Rating</th>
            <th className="px-2 py-1 font-medium">Why</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((entry) => (
            <tr key={entry.band.index} className={`border-b border-rule align-top ${entry.rating === "not resolved" ? "text-muted" : "text-ink"}`}>
              <th scope="row" className="whitespace-nowrap px-2 py-1 text-left font-mono font-normal">
                {formatHz(entry.band.nominal)}
              </th>
              <td className={`${cell} font-mono`}>{entry.band.upper.toFixed(0)} Hz</td>
              <td className={`${cell} font-mono`}>{entry.pointsPerWavelength.toFixed(1)}</td>
              <td className={`${cell} font-mono`}>{degrees(entry.phaseErrorPerWavelength)}</td>
              <td className={`${cell} font-mono`}>{degrees(entry.phaseErrorOverPath)}</td>
              <td className="px-2 py-1">
                <RatingBadge rating={entry.rating} />
              </td>
              <td className="px-2 py-1 text-ink-soft">{entry.reason}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {hiddenAbove > 0 && hiddenFrom !== undefined ? (
        <p className="mt-1 text-[12px] text-muted">
          {hiddenAbove} more band{hiddenAbove === 1 ? "" : "s"} from {formatHz(hiddenFrom)} up: not resolved (fewer than {RESOLVED_POINTS_PER_WAVELENGTH} cells per wavelength).
        </p>
      ) : null}
    </div>
  );
}

export function ReceiverDistanceTable({ accuracy }: { accuracy: RunAccuracy }) {
  // Wavelengths at the upper edge of each octave band the run resolves.
  const resolved = accuracy.octaveBands.filter((entry) => entry.rating !== "not resolved");
  const receivers = accuracy.receivers.slice(0, RECEIVERS_SHOWN);
  if (accuracy.receivers.length === 0) return <p className="text-[12px] text-muted">The scene has no receiver.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full border-collapse text-[12px]" data-testid="accuracy-distance-table">
        <thead>
          <tr className="border-b border-rule-strong text-left text-ink-soft">
            <th className="px-2 py-1 font-medium">Receiver</th>
            <th className="px-2 py-1 font-medium">Source</th>
            <th className={`${cell} font-medium`}>Distance</th>
            {resolved.map((entry) => (
              <th key={entry.band.index} className={`${cell} font-medium`} title={`wavelengths at the upper edge, ${entry.band.upper.toFixed(0)} Hz`}>
                λ at {formatHz(entry.band.nominal)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {receivers.flatMap((receiver) =>
            receiver.sources.map((source, s) => (
              <tr key={`${receiver.receiverId}:${source.sourceId}`} className="border-b border-rule">
                <th scope="row" className="px-2 py-1 text-left font-normal text-ink">
                  {s === 0 ? receiver.label : ""}
                </th>
                <td className="px-2 py-1 text-ink-soft">{source.sourceLabel}</td>
                <td className={`${cell} font-mono`}>{source.distance.toFixed(2)} m</td>
                {resolved.map((entry) => (
                  <td key={entry.band.index} className={`${cell} font-mono`}>
                    {distanceInWavelengths(source.distance, entry.band.upper, accuracy.soundSpeed).toFixed(1)}
                  </td>
                ))}
              </tr>
            )),
          )}
        </tbody>
      </table>
      {accuracy.receivers.length > RECEIVERS_SHOWN ? <p className="mt-1 text-[12px] text-muted">The first {RECEIVERS_SHOWN} of {accuracy.receivers.length} receivers.</p> : null}
    </div>
  );
}

/** A warning as one sentence: messages that start with a capital stand alone, others follow their subject. */
export function warningSentence(warning: AccuracyWarning): string {
  if (/^[A-Z]/.test(warning.message)) return warning.message;
  return `${warning.subject.charAt(0).toUpperCase()}${warning.subject.slice(1)} ${warning.message}`;
}

export function AccuracyWarnings({ accuracy }: { accuracy: RunAccuracy }) {
  if (accuracy.warnings.length === 0) {
    return <p className="text-[13px] text-ink-soft">No warnings: no geometry thinner than two cells, no receiver near a surface or a PML, the run lasted past every direct arrival and its energy decayed.</p>;
  }
  return (
    <ul className="flex flex-col gap-2" data-testid="accuracy-warnings">
      {accuracy.warnings.map((warning, w) => (
        <li key={`${warning.code}:${w}`} className="rounded-md border border-signal-warn/40 bg-ember-50 px-3 py-2 text-[13px]">
          <p className="text-ink">{warningSentence(warning)}</p>
          <p className="mt-0.5 text-ink-soft">What to do: {warning.remedy}</p>
        </li>
      ))}
    </ul>
  );
}

/** What the figures rest on, in one paragraph. */
export function AccuracyBasis({ accuracy }: { accuracy: RunAccuracy }) {
  return (
    <p className="text-[12px] text-muted">
      Cells of {(accuracy.cellSize * 1000).toPrecision(3)} mm, Courant number {accuracy.courantNumber.toFixed(3)}, sound speed {accuracy.soundSpeed.toFixed(1)} m/s (the slowest in the scene), longest
      source-receiver distance {accuracy.longestDistance.toFixed(2)} m. Phase error from the staggered scheme&apos;s own dispersion relation along a grid axis, its worst direction (Taflove &amp;
      Hagness, ch. 4). A band is resolved with {RESOLVED_POINTS_PER_WAVELENGTH} or more cells per wavelength at its upper edge (common practice for levels; at that resolution this scheme was
      measured within 0.4 dB of the exact thin-screen insertion loss), and reliable while the phase error over the path stays within {CAREFUL_PHASE_ERROR_DEGREES}°. Bands up to{" "}
      {accuracy.resolvedUpTo.toFixed(0)} Hz are resolved; the others are left out of every band table, chart and export.
    </p>
  );
}

/** The whole panel, with a choice of octave or one-third-octave bands. */
export function AccuracyPanel({ accuracy }: { accuracy: RunAccuracy }) {
  const [bandsPerOctave, setBandsPerOctave] = useState<1 | 3>(1);
  return (
    <section className="flex flex-col gap-3 rounded-lg border border-rule bg-panel p-4" aria-label="Accuracy" data-testid="accuracy-panel">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <h3 className="text-base font-semibold text-ink">Accuracy of this run</h3>
          <p className="mt-0.5 max-w-3xl text-[13px] text-muted">Which bands to trust, from the grid and the scene alone; an estimate of the scheme&apos;s own error, not of how well a 2D section models the real site.</p>
        </div>
        <Segmented label="Bands" value={bandsPerOctave} onChange={setBandsPerOctave} options={[{ value: 1, label: "Octave" }, { value: 3, label: "1/3 octave" }]} />
      </header>
      <AccuracyBandTable bands={bandsPerOctave === 1 ? accuracy.octaveBands : accuracy.thirdOctaveBands} />
      <AccuracyBasis accuracy={accuracy} />
      <h4 className="text-sm font-semibold text-ink">Warnings</h4>
      <AccuracyWarnings accuracy={accuracy} />
      <h4 className="text-sm font-semibold text-ink">Receivers&apos; distance from the sources</h4>
      <ReceiverDistanceTable accuracy={accuracy} />
    </section>
  );
}
