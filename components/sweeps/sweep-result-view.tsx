"use client";
// A sweep's result, on the sweeps page and in the notebook alike: what was swept and against which
// reference, one chart per receiver (insertion loss per band against the parameter), the numbers in a
// table, and a CSV download.
import { useMemo } from "react";
import { UPlotChart, type ChartSeries } from "@/components/charts/uplot-chart";
import { Button } from "@/components/ui/button";
import type { SweepDefinition, SweepResults } from "@/lib/validation/blocks";
import { bandColour } from "./model/band-colours";
import { bandHeading, receiverChartData, sweepCsv, sweepFileName, sweepTableRows } from "./model/sweep-table";

export const SWEEP_CAUTION =
  "A 2D section models a coherent line source and infinitely long elements, so these insertion losses need not match a 3D situation. " +
  "They support design choices; they are not a statutory noise assessment, which local regulations and licensed practice govern.";

function downloadCsv(definition: SweepDefinition, results: SweepResults): void {
  const blob = new Blob([sweepCsv(definition, results)], { type: "text/csv;charset=utf-8" });
  const url = URL.createObjectURL(blob);
  const link = document.createElement("a");
  link.href = url;
  link.download = sweepFileName(definition);
  link.click();
  // Revoked after the click has been handled: revoking at once can cancel the download in some browsers.
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function referenceWords(definition: SweepDefinition, labelOf: (id: string) => string = (id) => id): string {
  return definition.reference.kind === "free-field" ? "the free field (no geometry, absorbing sides)" : `the scene without ${definition.reference.removedIds.map(labelOf).join(", ")}`;
}

const formatDb = (value: number | null) => (value === null ? "–" : value.toFixed(1));

function ReceiverResult({ definition, results, receiverIndex }: { definition: SweepDefinition; results: SweepResults; receiverIndex: number }) {
  const receiver = results.receivers[receiverIndex]!;
  const data = useMemo(() => receiverChartData(results, receiverIndex), [results, receiverIndex]);
  const series = useMemo<ChartSeries[]>(() => results.bands.map((band, b) => ({ label: bandHeading(band.nominal), colour: bandColour(b, results.bands.length), width: 1.75 })), [results.bands]);
  const rows = useMemo(() => sweepTableRows(results).filter((row) => row.receiverId === receiver.id), [results, receiver.id]);
  const unit = definition.unit;
  return (
    <section aria-label={`Receiver ${receiver.label || receiver.id}`} className="flex min-w-0 flex-col gap-3 rounded-lg border border-rule bg-panel p-4 break-inside-avoid">
      <h4 className="text-sm font-semibold text-ink">{receiver.label || receiver.id}</h4>
      <UPlotChart
        data={data}
        series={series}
        x={{ label: definition.parameterLabel, ...(unit ? { unit } : {}) }}
        y={{ label: "Insertion loss", unit: "dB" }}
        height={200}
        ariaLabel={`Insertion loss at ${receiver.label || receiver.id} per band against ${definition.parameterLabel}`}
      />
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-right text-[13px]">
          <caption className="sr-only">Insertion loss in dB at {receiver.label || receiver.id}</caption>
          <thead>
            <tr className="border-b border-rule text-muted">
              <th scope="col" className="px-2 py-1 text-left font-medium">
                {definition.parameterLabel}
                {unit ? ` (${unit})` : ""}
              </th>
              {results.bands.map((band) => (
                <th key={band.index} scope="col" className="px-2 py-1 font-medium whitespace-nowrap">
                  {bandHeading(band.nominal)}
                </th>
              ))}
              <th scope="col" className="px-2 py-1 font-medium">
                Overall
              </th>
            </tr>
          </thead>
          <tbody className="tabular font-mono text-ink">
            {rows.map((row) => (
              <tr key={row.value} className="border-b border-rule/60 last:border-0">
                <th scope="row" className="px-2 py-1 text-left font-normal">
                  {row.value}
                </th>
                {row.status === "done" ? (
                  <>
                    {row.insertionLoss.map((value, b) => (
                      <td key={b} className="px-2 py-1">
                        {formatDb(value)}
                      </td>
                    ))}
                    <td className="px-2 py-1 font-medium">{formatDb(row.overall)}</td>
                  </>
                ) : (
                  <td colSpan={results.bands.length + 1} className="px-2 py-1 text-left font-sans text-muted">
                    {row.status === "failed" ? `Failed: ${row.message ?? "no reason given"}` : "Not run"}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

export function SweepResultView({ definition, results, elementLabel }: { definition: SweepDefinition; results: SweepResults; elementLabel?: (id: string) => string }) {
  const done = results.outcomes.filter((outcome) => outcome.status === "done").length;
  const failed = results.outcomes.filter((outcome) => outcome.status === "failed").length;
  return (
    <div className="flex flex-col gap-4" data-testid="sweep-result">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="text-sm leading-relaxed text-ink-soft">
          <p>
            <span className="font-medium text-ink">{definition.sceneName || "Scene"}</span> (version {definition.sceneVersion}): {definition.parameterLabel} from {definition.range.from} to {definition.range.to} in steps of {definition.range.step}
            {definition.unit ? ` ${definition.unit}` : ""}.
          </p>
          <p>
            Insertion loss against {referenceWords(definition, elementLabel)}; {definition.bandsPerOctave === 1 ? "octave" : "one-third-octave"} bands, {definition.weighting === "A" ? "A-weighted" : "unweighted"}. {done} of {results.values.length} cases computed
            {failed > 0 ? `, ${failed} failed` : ""}.
          </p>
        </div>
        <Button variant="secondary" size="sm" onClick={() => downloadCsv(definition, results)} disabled={done === 0}>
          Download CSV
        </Button>
      </div>
      {results.bands.length === 0 ? (
        <p className="rounded-md border border-rule bg-paper px-3 py-2 text-sm text-muted">
          {done === 0 ? "No case has finished yet." : "No band lies within the frequencies the grid resolves and the runs' length can tell apart."}
        </p>
      ) : (
        <div className="grid gap-4 xl:grid-cols-2">
          {results.receivers.map((receiver, r) => (
            <ReceiverResult key={receiver.id} definition={definition} results={results} receiverIndex={r} />
          ))}
        </div>
      )}
      {results.excludedBands.length > 0 ? (
        <details className="text-[13px] text-muted">
          <summary className="cursor-pointer">Bands left out ({results.excludedBands.length})</summary>
          <ul className="mt-1 list-disc pl-5">
            {results.excludedBands.map((text) => (
              <li key={text}>{text}</li>
            ))}
          </ul>
        </details>
      ) : null}
      <p className="text-[13px] leading-relaxed text-muted">{SWEEP_CAUTION}</p>
    </div>
  );
}
