"use client";
// Insertion loss of this run against a reference: a saved run of the study on the same grid with the same
// receivers (each other run listed with the reason it does not fit), or one made here. Per receiver and
// band (table and chart), as a map (reference RMS level minus this run's), and beside it the barrier
// estimates.
import { useMemo, useRef, useState } from "react";

import { useCarefulBands } from "@/components/accuracy/careful-bands";
import { FieldView, type FieldViewHandle } from "@/components/field-view/field-view";
import { downloadBlob } from "@/components/field-view/field-view-toolbar";
import { AddChartButton } from "@/components/notebook/add-chart-block";
import { Button } from "@/components/ui/button";
import { bandLevelTable, type BandsPerOctave } from "@/lib/analysis/band-levels";
import { insertionLossCsv } from "@/lib/analysis/csv";
import { UnresolvedBandsNote, unresolvedBandsOf } from "./unresolved-bands-note";
import { insertionLossTable, type InsertionLossTable } from "@/lib/analysis/insertion-loss";
import { levelMapCompatibility, referenceListCompatibility, referencePayloadCompatibility, type Compatibility } from "@/lib/analysis/run-compatibility";
import { useSavedRunPayload, useStudyRuns } from "@/lib/client/run-queries";
import type { Scene } from "@/lib/fdtd/scene";
import type { RunListItem } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";

import { AnalysisPanel, ExportButton, Note, Segmented } from "./analysis-controls";
import { receiverColour } from "./analysis-traces";
import { BandBarChart } from "./band-bar-chart";
import { BandTableHead, bandFileTag, ReceiverBandRow, UseWithCareLegend } from "./band-table";
import { BarrierComparison } from "./barrier-comparison";
import { downloadCsv, exportFileName, svgChartPng } from "./export-files";
import { ReferenceMaker } from "./reference-maker";

export interface InsertionLossPanelProps {
  runId: string;
  studyId: string;
  run: DecodedRun;
  /** The run's frozen scene, parsed; null when it could not be read (then no reference can be made). */
  scene: Scene | null;
  receiverIds: readonly string[];
  highestResolvedFrequency: number;
  canCreate: boolean;
}

export function runLabel(item: Pick<RunListItem, "sceneName" | "sceneVersion" | "createdAt">): string {
  const when = new Date(item.createdAt);
  const date = Number.isNaN(when.getTime()) ? item.createdAt : when.toISOString().slice(0, 16).replace("T", " ");
  return `${item.sceneName ?? "Deleted scene"} v${item.sceneVersion} · ${date}`;
}

/** Band levels of the chosen receivers in both runs and their difference; the reason when they do not pair. */
export function computeInsertionLoss(run: DecodedRun, reference: DecodedRun, receiverIds: readonly string[], bandsPerOctave: BandsPerOctave, weighting: "Z" | "A", highestResolvedFrequency: number): InsertionLossTable | string {
  const pick = (r: DecodedRun) => receiverIds.map((id) => r.receivers.find((receiver) => receiver.id === id)).filter((receiver) => receiver !== undefined);
  try {
    const options = { bandsPerOctave, weighting, highestResolvedFrequency };
    const ours = pick(run);
    // The reference's receivers under this run's labels: a renamed receiver is still the same place.
    const theirs = pick(reference).map((receiver) => ({ ...receiver, label: run.receivers.find((r) => r.id === receiver.id)?.label ?? receiver.label }));
    return insertionLossTable(bandLevelTable(theirs, options), bandLevelTable(ours, options));
  } catch (error) {
    return error instanceof Error ? error.message : String(error);
  }
}

export function InsertionLossPanel({ runId, studyId, run, scene, receiverIds, highestResolvedFrequency, canCreate }: InsertionLossPanelProps) {
  const runs = useStudyRuns(studyId);
  const [referenceId, setReferenceId] = useState<string | null>(null);
  const [bandsPerOctave, setBandsPerOctave] = useState<BandsPerOctave>(1);
  const [weighting, setWeighting] = useState<"Z" | "A">("Z");
  const reference = useSavedRunPayload(referenceId);
  const svg = useRef<SVGSVGElement>(null);
  const map = useRef<FieldViewHandle>(null);

  const listed = useMemo(() => (runs.data?.runs ?? []).map((item) => ({ item, fit: referenceListCompatibility(run.header, runId, item) })), [runs.data, run.header, runId]);
  const fitting = listed.filter((entry) => entry.fit.ok);
  const unfit = listed.filter((entry): entry is { item: RunListItem; fit: Extract<Compatibility, { ok: false }> } => !entry.fit.ok && entry.item.id !== runId);

  const loaded = reference.data ?? null;
  const fit = loaded ? referencePayloadCompatibility(run.header, loaded.header) : null;
  const table = useMemo(
    () => (loaded && fit?.ok ? computeInsertionLoss(run, loaded, receiverIds, bandsPerOctave, weighting, highestResolvedFrequency) : null),
    [loaded, fit?.ok, run, receiverIds, bandsPerOctave, weighting, highestResolvedFrequency],
  );
  const octaveTable = useMemo(() => {
    if (!loaded || !fit?.ok) return undefined;
    const octave = computeInsertionLoss(run, loaded, receiverIds, 1, "Z", highestResolvedFrequency);
    return typeof octave === "string" ? undefined : octave;
  }, [loaded, fit?.ok, run, receiverIds, highestResolvedFrequency]);
  // Marks from this run's own accuracy estimate: the reference shares its grid (a condition of fitting).
  const careful = useCarefulBands(run, table && typeof table !== "string" ? table.bands : undefined, bandsPerOctave);
  const mapFit = loaded && fit?.ok ? levelMapCompatibility(run.header, loaded.header) : null;
  const indexOf = (id: string) => run.receivers.findIndex((receiver) => receiver.id === id);
  const referenceItem = runs.data?.runs.find((item) => item.id === referenceId);

  return (
    <AnalysisPanel
      title="Insertion loss"
      testId="insertion-loss"
      description="IL = level of the reference run minus level of this run, per receiver and band (positive: this run is quieter). The reference must share the grid, the duration and the receivers."
      actions={
        <>
          <Segmented label="Bands" value={bandsPerOctave} onChange={setBandsPerOctave} options={[{ value: 1, label: "Octave" }, { value: 3, label: "1/3 octave" }]} />
          <Segmented label="Frequency weighting" value={weighting} onChange={setWeighting} options={[{ value: "Z", label: "Unweighted" }, { value: "A", label: "A-weighted" }]} />
          <AddChartButton
            studyId={studyId}
            runId={runId}
            choices={{ quantity: "insertion-loss", runIds: referenceId ? [runId, referenceId] : [runId], receiverIds, bandsPerOctave, weighting }}
            unavailableReason={receiverIds.length === 0 ? "Choose at least one receiver first." : !table || typeof table === "string" ? "Choose a reference that fits this run first." : undefined}
          />
        </>
      }
    >
      <div className="flex flex-wrap items-center gap-3 text-[13px] text-ink-soft">
        <label className="flex items-center gap-2">
          Reference run
          <select
            value={referenceId ?? ""}
            disabled={runs.isPending}
            onChange={(event) => setReferenceId(event.target.value || null)}
            className="h-8 max-w-md rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink"
            data-testid="reference-select"
          >
            <option value="">{runs.isPending ? "Loading the study's runs…" : fitting.length === 0 ? "No saved run fits" : "Choose a reference…"}</option>
            {fitting.map(({ item }) => (
              <option key={item.id} value={item.id}>
                {runLabel(item)}
              </option>
            ))}
            {referenceItem && !fitting.some((entry) => entry.item.id === referenceItem.id) ? <option value={referenceItem.id}>{runLabel(referenceItem)}</option> : null}
          </select>
        </label>
        {runs.isError ? (
          <span role="alert" className="text-signal-error">
            The study&apos;s runs could not be loaded: {runs.error.message}{" "}
            <button type="button" className="underline" onClick={() => void runs.refetch()}>
              Try again
            </button>
          </span>
        ) : null}
      </div>
      {unfit.length > 0 ? (
        <details className="text-[12px] text-ink-soft">
          <summary className="cursor-pointer text-muted">
            {unfit.length} other run{unfit.length === 1 ? "" : "s"} of the study cannot be the reference
          </summary>
          <ul className="mt-1 list-disc pl-5">
            {unfit.map(({ item, fit: reason }) => (
              <li key={item.id}>
                {runLabel(item)}: {reason.reason}.
              </li>
            ))}
          </ul>
        </details>
      ) : null}
      {canCreate && scene ? (
        <ReferenceMaker
          studyId={studyId}
          scene={scene}
          settings={run.header.settings}
          onReady={(record) => {
            setReferenceId(record.id);
          }}
        />
      ) : !canCreate ? (
        <Note>Making a new reference needs the editor or owner role in this team.</Note>
      ) : null}

      {referenceId && reference.isPending ? <p role="status" className="text-sm text-muted">Loading the reference run…</p> : null}
      {reference.isError ? (
        <p role="alert" className="text-sm text-signal-error">
          The reference run could not be loaded: {reference.error.message}{" "}
          <Button size="sm" variant="quiet" onClick={() => void reference.refetch()}>
            Try again
          </Button>
        </p>
      ) : null}
      {fit && !fit.ok ? (
        <p role="alert" className="text-sm text-signal-error">
          This run cannot be the reference: {fit.reason}.
        </p>
      ) : null}
      {typeof table === "string" ? (
        <p role="alert" className="text-sm text-signal-error">
          The insertion loss could not be computed: {table}
        </p>
      ) : null}
      {table && typeof table !== "string" && table.bands.length === 0 ? <Note>No band in this range is resolved by the grid.</Note> : null}
      {table && typeof table !== "string" && table.bands.length > 0 ? (
        <>
          <div className="overflow-x-auto">
            <table className="min-w-full border-collapse font-mono text-[12px]" data-testid="insertion-loss-table">
              <BandTableHead bands={table.bands} careful={careful} />
              <tbody>
                {table.receivers.map((receiver) => (
                  <ReceiverBandRow key={receiver.receiverId} label={receiver.label} colour={receiverColour(indexOf(receiver.receiverId))} overall={receiver.overall} values={receiver.insertionLoss} />
                ))}
              </tbody>
            </table>
          </div>
          <BandBarChart
            svgRef={svg}
            bands={table.bands}
            groups={table.receivers.map((receiver) => ({ label: receiver.label, colour: receiverColour(indexOf(receiver.receiverId)), values: receiver.insertionLoss }))}
            unit={weighting === "A" ? "dB(A)" : "dB"}
            quantity="Insertion loss"
            fromZero
            ariaLabel="Insertion loss per band"
            careful={careful}
          />
          <UseWithCareLegend careful={careful} />
          <div className="flex flex-wrap justify-end gap-2">
            <ExportButton label="CSV" onExport={() => downloadCsv(insertionLossCsv(table, unresolvedBandsOf(run, bandsPerOctave, highestResolvedFrequency)), exportFileName(runId, `insertion-loss-${bandFileTag(bandsPerOctave, weighting)}`, "csv"))} />
            <ExportButton label="PNG" onExport={async () => downloadBlob(await svgChartPng(svg.current!), exportFileName(runId, "insertion-loss", "png"))} />
          </div>
          <UnresolvedBandsNote excluded={unresolvedBandsOf(run, bandsPerOctave, highestResolvedFrequency)} />
        </>
      ) : null}

      {loaded && fit?.ok ? (
        <div className="flex flex-col gap-4">
          <div className="flex flex-col gap-2">
            <h4 className="text-sm font-semibold text-ink">Insertion-loss map (RMS level of the reference minus this run)</h4>
            {mapFit && !mapFit.ok ? (
              <Note>No map: {mapFit.reason}.</Note>
            ) : scene ? (
              <>
                <div className="flex h-[380px] flex-col">
                  <FieldView ref={map} scene={scene} field={null} mode="level-difference" levelMaps={run.levelMaps} comparison={loaded.levelMaps} differenceOf="rms" range={{ kind: "auto" }} className="h-full" />
                </div>
                <div className="flex justify-end">
                  <ExportButton label="PNG" onExport={async () => downloadBlob(await map.current!.exportPng(), exportFileName(runId, "insertion-loss-map", "png"))} />
                </div>
              </>
            ) : (
              <Note>The run&apos;s frozen scene could not be read, so the map cannot be drawn over it.</Note>
            )}
          </div>
          <div className="flex flex-col gap-2">
            <h4 className="text-sm font-semibold text-ink">Beside it: textbook barrier estimates</h4>
            {scene ? <BarrierComparison scene={scene} run={run} receiverIds={receiverIds} octaveInsertionLoss={octaveTable} /> : <Note>The run&apos;s frozen scene could not be read.</Note>}
          </div>
        </div>
      ) : scene ? (
        <div className="flex flex-col gap-2">
          <h4 className="text-sm font-semibold text-ink">Textbook barrier estimates</h4>
          <BarrierComparison scene={scene} run={run} receiverIds={receiverIds} />
        </div>
      ) : null}
    </AnalysisPanel>
  );
}
