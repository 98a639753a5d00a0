"use client";
// A chart of saved runs in the notebook: the runs' stored results loaded (once per session each), the
// chart drawn with the choices kept when it was added, and a caption naming every run with a link to it.
// A run deleted since is named from the label kept with the chart.
import { useQueries } from "@tanstack/react-query";
import Link from "next/link";
import { useMemo } from "react";

import { SectionCaution } from "@/components/analysis/analysis-controls";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { formatWhen } from "@/lib/client/format";
import { runQueryKeys, useStudyRuns } from "@/lib/client/run-queries";
import { fetchSavedRun } from "@/lib/client/run-records";
import type { BlockItem, RunListItem } from "@/lib/http/api-types";
import { chartContentSchema, type ChartContent } from "@/lib/validation/blocks";

import { chartQuantityLabels, chartRunRole, type RunChartQuantity } from "./chart-block-model";
import { BandLevelsChart, chartReceiverIds, InsertionLossChart, TimeOrSpectrumChart, type LoadedChartRun } from "./chart-block-views";

type RunChartContent = ChartContent & { quantity: RunChartQuantity };

/** One run of the chart as the caption lists it: still saved (with its record) or deleted. */
interface ChartRunEntry {
  runId: string;
  role: string;
  item: RunListItem | null;
  /** How the run was named when the chart was added, if the chart kept it. */
  keptLabel: string | null;
}

export function ChartBlock({ block, studyId }: { block: BlockItem; studyId: string }) {
  const parsed = useMemo(() => chartContentSchema.safeParse(block.content), [block.content]);
  const content = parsed.success && parsed.data.quantity !== "sweep" ? (parsed.data as RunChartContent) : null;
  const runs = useStudyRuns(studyId);

  const entries = useMemo((): ChartRunEntry[] => {
    if (!content || !runs.data) return [];
    const listed = new Map(runs.data.runs.map((item) => [item.id, item]));
    return content.runIds.map((runId, index) => ({ runId, role: chartRunRole(content.quantity, index), item: listed.get(runId) ?? null, keptLabel: content.runLabels?.[index] ?? null }));
  }, [content, runs.data]);
  // Only runs still saved are fetched: a deleted run's result is gone with it.
  const present = entries.filter((entry) => entry.item !== null);
  const payloads = useQueries({
    queries: present.map((entry) => ({ queryKey: runQueryKeys.payload(entry.runId), queryFn: () => fetchSavedRun(entry.runId), staleTime: Infinity, gcTime: 10 * 60_000 })),
  });
  // useQueries answers a new array each render, its data objects stay the same: key the loaded runs on them,
  // so the charts below do not recompute their spectra and band levels on every render.
  const dataKey = payloads.map((query) => `${query.status}:${query.dataUpdatedAt}`).join("|");
  const loaded = useMemo(
    (): LoadedChartRun[] => payloads.flatMap((query, i) => (query.data && present[i]?.item ? [{ runId: present[i].runId, item: present[i].item, run: query.data }] : [])),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- dataKey stands for the query results
    [dataKey, entries],
  );

  if (!content) {
    const problem = parsed.success ? "it is not a chart of saved runs" : `${parsed.error.issues[0]?.path.join(".") || "content"}: ${parsed.error.issues[0]?.message ?? "not valid"}`;
    return <p className="text-sm text-signal-error">This chart cannot be shown: {problem}.</p>;
  }
  if (runs.isPending) return <LoadingRows rows={1} label="Loading the chart's runs" />;
  if (runs.isError) return <ErrorState title="The chart's runs could not be loaded" message={runs.error.message} onRetry={() => void runs.refetch()} />;

  const deleted = entries.filter((entry) => entry.item === null);
  const failed = payloads.flatMap((query, i) => (query.isError ? [{ entry: present[i]!, message: query.error.message, retry: () => void query.refetch() }] : []));
  const loading = payloads.some((query) => query.isPending);

  return (
    <figure className="flex flex-col gap-3" data-testid="chart-block" data-quantity={content.quantity}>
      {content.title ? <h3 className="text-base font-semibold text-ink">{content.title}</h3> : null}
      <ChartSettings content={content} loaded={loaded} />
      {deleted.length > 0 ? (
        <div role="alert" className="rounded-md border border-signal-warn/40 bg-ember-50 px-3 py-2 text-[13px] text-ink-soft">
          {deleted.map((entry) => (
            <p key={entry.runId}>
              {entry.role} {entry.keptLabel ? `“${entry.keptLabel}”` : `(id ${entry.runId})`} has been deleted, so this chart cannot draw it.
            </p>
          ))}
        </div>
      ) : null}
      {failed.map(({ entry, message, retry }) => (
        <ErrorState key={entry.runId} title={`The stored result of ${entry.item ? runName(entry.item) : entry.runId} could not be read`} message={message} onRetry={retry} />
      ))}
      {loading ? <LoadingRows rows={1} label="Loading the runs' stored results" /> : failed.length === 0 ? <ChartBody content={content} entries={entries} loaded={loaded} /> : null}
      <ChartCaption studyId={studyId} entries={entries} />
      <SectionCaution />
    </figure>
  );
}

function runName(item: RunListItem): string {
  return `${item.sceneName ?? "Deleted scene"} version ${item.sceneVersion}`;
}

/** The chart itself, once every run still saved is loaded; what cannot be drawn without a deleted run says so. */
function ChartBody({ content, entries, loaded }: { content: RunChartContent; entries: readonly ChartRunEntry[]; loaded: readonly LoadedChartRun[] }) {
  const first = loaded[0];
  const receiverIds = useMemo(() => (first ? chartReceiverIds(first.run, content.receiverIds) : []), [first, content.receiverIds]);
  if (entries.length === 0) return <p className="text-sm text-muted">This chart names no saved run, so it draws nothing; the block can be removed.</p>;
  if (!first) return <p className="text-sm text-muted">None of this chart&apos;s runs is saved any more; the block can be removed.</p>;
  const bandsPerOctave = content.bandsPerOctave ?? 1;
  const weighting = content.weighting ?? "Z";
  switch (content.quantity) {
    case "trace":
    case "spectrum":
      // The others are drawn over the first run: without it there is nothing to draw them on.
      if (first.runId !== entries[0]?.runId) return <p className="text-sm text-muted">The run the others were drawn over has been deleted.</p>;
      return <TimeOrSpectrumChart quantity={content.quantity} runs={loaded} receiverIds={receiverIds} />;
    case "band-levels":
      return <BandLevelsChart runs={loaded} receiverIds={receiverIds} bandsPerOctave={bandsPerOctave} weighting={weighting} />;
    case "insertion-loss": {
      const reference = loaded[1];
      if (loaded.length < 2 || !reference) return <p className="text-sm text-muted">An insertion loss needs both the run and its reference.</p>;
      return <InsertionLossChart run={first} reference={reference} receiverIds={receiverIds} bandsPerOctave={bandsPerOctave} weighting={weighting} />;
    }
  }
}

/** The choices kept with the chart, in words: quantity, bands, weighting, receivers. */
function ChartSettings({ content, loaded }: { content: RunChartContent; loaded: readonly LoadedChartRun[] }) {
  const first = loaded[0]?.run;
  const receiverNames = first
    ? chartReceiverIds(first, content.receiverIds).map((id) => first.receivers.find((receiver) => receiver.id === id)?.label || id)
    : (content.receiverIds ?? []);
  const banded = content.quantity === "band-levels" || content.quantity === "insertion-loss";
  const parts = [
    chartQuantityLabels[content.quantity].replace(/^./, (letter) => letter.toUpperCase()),
    ...(banded ? [(content.bandsPerOctave ?? 1) === 1 ? "octave bands" : "one-third-octave bands", (content.weighting ?? "Z") === "A" ? "A-weighted" : "unweighted"] : []),
  ];
  return (
    <p className="text-[13px] text-ink-soft">
      {parts.join(", ")}
      {receiverNames.length > 0 ? ` · receivers: ${receiverNames.join(", ")}` : ""}
    </p>
  );
}

/** Every run of the chart: its part, scene and version, who ran it and when, and a link to it. */
function ChartCaption({ studyId, entries }: { studyId: string; entries: readonly ChartRunEntry[] }) {
  return (
    <figcaption>
      <ul className="flex flex-col gap-1 text-[13px]">
        {entries.map((entry) => (
          <li key={entry.runId} className="flex flex-wrap items-baseline gap-x-2">
            <span className="text-muted">{entry.role}:</span>
            {entry.item ? (
              <>
                <span className="font-medium text-ink">{runName(entry.item)}</span>
                <span className="text-muted">
                  run by {entry.item.createdByName ?? "a former member"}, <time dateTime={entry.item.createdAt}>{formatWhen(entry.item.createdAt)}</time>
                </span>
                <Link href={`/studies/${studyId}/runs/${entry.runId}`} className="font-medium text-tide-700 hover:underline">
                  Open run
                </Link>
              </>
            ) : (
              <span className="text-signal-error">{entry.keptLabel ?? entry.runId} (deleted)</span>
            )}
          </li>
        ))}
      </ul>
    </figcaption>
  );
}
