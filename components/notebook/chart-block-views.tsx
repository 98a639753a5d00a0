"use client";
// The four charts a notebook chart block draws from loaded saved runs, each with the analysis's own
// pieces (trace and spectrum charts, band tables and bars, the insertion-loss computation), so a chart in
// the notebook reads exactly as it did on the run's page when it was added.
import { UnresolvedBandsNote, unresolvedBandsOf } from "@/components/analysis/unresolved-bands-note";
import type { ExcludedBand } from "@/lib/analysis/band-levels";
import { useMemo } from "react";

import { Note } from "@/components/analysis/analysis-controls";
import { receiverColour } from "@/components/analysis/analysis-traces";
import { BandTableHead, ReceiverBandRow } from "@/components/analysis/band-table";
import { computeInsertionLoss, runLabel } from "@/components/analysis/insertion-loss-panel";
import { analysisTraces, BandBarChart, sceneFacts, SpectrumChart, TraceChart, type OverlayRun } from "@/components/analysis/run-analysis";
import { bandLevelTable, sumLevels, type BandsPerOctave } from "@/lib/analysis/band-levels";
import type { FrequencyBand } from "@/lib/analysis/bands";
import { overlayPayloadCompatibility, referencePayloadCompatibility } from "@/lib/analysis/run-compatibility";
import type { RunListItem } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";

/** A run of the chart that is still saved, with its record and decoded payload. */
export interface LoadedChartRun {
  runId: string;
  item: RunListItem;
  run: DecodedRun;
}

/** The receivers a chart draws: those it names, or the first three of the run as the analysis starts with. */
export function chartReceiverIds(run: DecodedRun, named: readonly string[] | undefined): string[] {
  return named ? [...named] : run.receivers.slice(0, 3).map((receiver) => receiver.id);
}

function MissingReceivers({ run, receiverIds }: { run: DecodedRun; receiverIds: readonly string[] }) {
  const missing = receiverIds.filter((id) => !run.receivers.some((receiver) => receiver.id === id));
  if (missing.length === 0) return null;
  return <Note>Not in this run, so not drawn: {missing.join(", ")}.</Note>;
}

/** Pressure traces or spectra of the first run, with the same receivers of the others drawn dashed over it. */
export function TimeOrSpectrumChart({ quantity, runs, receiverIds }: { quantity: "trace" | "spectrum"; runs: readonly LoadedChartRun[]; receiverIds: readonly string[] }) {
  const main = runs[0]!;
  const { overlays, unfit } = useMemo(() => {
    const fitting: OverlayRun[] = [];
    const problems: string[] = [];
    for (const other of runs.slice(1)) {
      const fit = overlayPayloadCompatibility(main.run.header, other.run.header);
      if (fit.ok) fitting.push({ runId: other.runId, label: runLabel(other.item), run: other.run });
      else problems.push(`${runLabel(other.item)} cannot be drawn over it: ${fit.reason}.`);
    }
    return { overlays: fitting, unfit: problems };
  }, [main, runs]);
  const traces = useMemo(() => analysisTraces(main.run, main.runId, receiverIds, overlays), [main, receiverIds, overlays]);
  const facts = useMemo(() => sceneFacts(main.run), [main.run]);
  return (
    <div className="flex flex-col gap-2">
      {quantity === "trace" ? <TraceChart traces={traces} runId={main.runId} /> : <SpectrumChart traces={traces} runId={main.runId} highestResolvedFrequency={facts.highestResolvedFrequency} />}
      <MissingReceivers run={main.run} receiverIds={receiverIds} />
      {unfit.map((problem) => (
        <p key={problem} role="alert" className="text-[13px] text-signal-error">
          {problem}
        </p>
      ))}
    </div>
  );
}

interface BandRows {
  bands: readonly FrequencyBand[];
  rows: { receiverId: string; label: string; colour: string; overall: number; values: Float64Array }[];
  /** Bands left out as not resolved, with the reason (the accuracy estimate's decision). */
  excluded?: readonly ExcludedBand[];
}

/** A band table and its bars: the layout the band-level and insertion-loss panels share. */
function BandValues({ table, unit, quantity, fromZero, ariaLabel, showCentre }: { table: BandRows; unit: string; quantity: string; fromZero?: boolean; ariaLabel: string; showCentre?: boolean }) {
  if (table.bands.length === 0)
    return (
      <>
        <Note>No band in this range is resolved by the grid.</Note>
        <UnresolvedBandsNote excluded={table.excluded ?? []} />
      </>
    );
  return (
    <>
      <UnresolvedBandsNote excluded={table.excluded ?? []} />
      <div className="overflow-x-auto">
        <table className="min-w-full border-collapse font-mono text-[12px]">
          <BandTableHead bands={table.bands} showCentre={showCentre} />
          <tbody>
            {table.rows.map((row) => (
              <ReceiverBandRow key={row.receiverId} label={row.label} colour={row.colour} overall={row.overall} values={row.values} />
            ))}
          </tbody>
        </table>
      </div>
      <BandBarChart bands={table.bands} groups={table.rows.map((row) => ({ label: row.label, colour: row.colour, values: row.values }))} unit={unit} quantity={quantity} fromZero={fromZero} ariaLabel={ariaLabel} />
    </>
  );
}

const colourIn = (run: DecodedRun, receiverId: string) => receiverColour(run.receivers.findIndex((receiver) => receiver.id === receiverId));

/** Band levels of one run's chosen receivers (no air absorption: that stays an option on the run's page). */
function RunBandLevels({ entry, receiverIds, bandsPerOctave, weighting, showName }: { entry: LoadedChartRun; receiverIds: readonly string[]; bandsPerOctave: BandsPerOctave; weighting: "Z" | "A"; showName: boolean }) {
  const outcome = useMemo((): BandRows | string => {
    const chosen = entry.run.receivers.filter((receiver) => receiverIds.includes(receiver.id));
    if (chosen.length === 0) return "none of the chart's receivers is in this run";
    try {
      const table = bandLevelTable(chosen, { bandsPerOctave, weighting, highestResolvedFrequency: sceneFacts(entry.run).highestResolvedFrequency });
      return {
        bands: table.bands,
        excluded: table.excluded,
        rows: table.receivers.map((receiver) => ({ receiverId: receiver.receiverId, label: receiver.label, colour: colourIn(entry.run, receiver.receiverId), overall: sumLevels(receiver.levels), values: receiver.levels })),
      };
    } catch (error) {
      return error instanceof Error ? error.message : String(error);
    }
  }, [entry.run, receiverIds, bandsPerOctave, weighting]);
  return (
    <div className="flex flex-col gap-2">
      {showName ? <h4 className="text-sm font-semibold text-ink">{runLabel(entry.item)}</h4> : null}
      {typeof outcome === "string" ? (
        <p role="alert" className="text-sm text-signal-error">
          The band levels could not be computed: {outcome}.
        </p>
      ) : (
        <BandValues table={outcome} unit={weighting === "A" ? "dB(A) re 20 µPa" : "dB re 20 µPa"} quantity="Band level" showCentre ariaLabel={`Band levels of ${runLabel(entry.item)}`} />
      )}
    </div>
  );
}

export function BandLevelsChart({ runs, receiverIds, bandsPerOctave, weighting }: { runs: readonly LoadedChartRun[]; receiverIds: readonly string[]; bandsPerOctave: BandsPerOctave; weighting: "Z" | "A" }) {
  return (
    <div className="flex flex-col gap-4">
      {runs.map((entry) => (
        <RunBandLevels key={entry.runId} entry={entry} receiverIds={receiverIds} bandsPerOctave={bandsPerOctave} weighting={weighting} showName={runs.length > 1} />
      ))}
      <Note>Equivalent levels over the whole trace, from the FFT of each receiver&apos;s pressure (IEC 61260-1 band edges), without air absorption. Only bands the grid resolves are shown.</Note>
    </div>
  );
}

/** Insertion loss of the first run against the second (the reference), per receiver and band. */
export function InsertionLossChart({ run, reference, receiverIds, bandsPerOctave, weighting }: { run: LoadedChartRun; reference: LoadedChartRun; receiverIds: readonly string[]; bandsPerOctave: BandsPerOctave; weighting: "Z" | "A" }) {
  const outcome = useMemo((): BandRows | string => {
    const fit = referencePayloadCompatibility(run.run.header, reference.run.header);
    if (!fit.ok) return `the reference does not fit this run: ${fit.reason}`;
    const table = computeInsertionLoss(run.run, reference.run, receiverIds, bandsPerOctave, weighting, sceneFacts(run.run).highestResolvedFrequency);
    if (typeof table === "string") return table;
    return {
      bands: table.bands,
      excluded: unresolvedBandsOf(run.run, bandsPerOctave, sceneFacts(run.run).highestResolvedFrequency),
      rows: table.receivers.map((receiver) => ({ receiverId: receiver.receiverId, label: receiver.label, colour: colourIn(run.run, receiver.receiverId), overall: receiver.overall, values: receiver.insertionLoss })),
    };
  }, [run.run, reference.run, receiverIds, bandsPerOctave, weighting]);
  if (typeof outcome === "string") {
    return (
      <p role="alert" className="text-sm text-signal-error">
        The insertion loss could not be computed: {outcome}.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      <BandValues table={outcome} unit={weighting === "A" ? "dB(A)" : "dB"} quantity="Insertion loss" fromZero ariaLabel="Insertion loss per band" />
      <MissingReceivers run={run.run} receiverIds={receiverIds} />
      <Note>IL = level of the reference minus level of the run, per receiver and band (positive: the run is quieter).</Note>
    </div>
  );
}
