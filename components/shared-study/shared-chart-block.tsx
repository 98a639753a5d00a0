"use client";
// A chart of saved runs in the shared notebook: the runs' payloads fetched through the link and drawn with
// the notebook's own chart views, so the chart reads as it does in the workbench.
import { useQueries } from "@tanstack/react-query";
import { useMemo } from "react";
import { SectionCaution } from "@/components/analysis/analysis-controls";
import { chartQuantityLabels, chartRunRole, type RunChartQuantity } from "@/components/notebook/chart-block-model";
import { BandLevelsChart, chartReceiverIds, InsertionLossChart, TimeOrSpectrumChart, type LoadedChartRun } from "@/components/notebook/chart-block-views";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { sharedPayloadQuery } from "@/lib/client/share-link-queries";
import type { BlockItem } from "@/lib/http/api-types";
import type { SharedRun } from "@/lib/http/share-link-types";
import { chartContentSchema, type ChartContent } from "@/lib/validation/blocks";

type RunChartContent = ChartContent & { quantity: RunChartQuantity };

export function SharedChartBlock({ token, block, runById }: { token: string; block: BlockItem; runById: ReadonlyMap<string, SharedRun> }) {
  const parsed = useMemo(() => chartContentSchema.safeParse(block.content), [block.content]);
  const content = parsed.success && parsed.data.quantity !== "sweep" ? (parsed.data as RunChartContent) : null;
  // Only runs of this study that are still saved: the link serves no other.
  const present = useMemo(() => (content ? content.runIds.flatMap((runId) => (runById.get(runId) ? [runById.get(runId)!] : [])) : []), [content, runById]);
  const payloads = useQueries({ queries: present.map((run) => sharedPayloadQuery(token, run.id)) });
  const dataKey = payloads.map((query) => `${query.status}:${query.dataUpdatedAt}`).join("|");
  const loaded = useMemo(
    (): LoadedChartRun[] => payloads.flatMap((query, i) => (query.data && present[i] ? [{ runId: present[i].id, item: present[i], run: query.data }] : [])),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- dataKey stands for the query results
    [dataKey, present],
  );
  const first = loaded[0];
  const receiverIds = useMemo(() => (first && content ? chartReceiverIds(first.run, content.receiverIds) : []), [first, content]);

  if (!content) return <p className="text-sm text-muted">This chart cannot be shown here.</p>;
  const failed = payloads.find((query) => query.isError);
  const missing = content.runIds.length - present.length;
  const bandsPerOctave = content.bandsPerOctave ?? 1;
  const weighting = content.weighting ?? "Z";

  let body: React.ReactNode;
  if (failed) body = <ErrorState title="A run's stored result could not be read" message={failed.error?.message ?? ""} onRetry={() => void failed.refetch()} />;
  else if (payloads.some((query) => query.isPending)) body = <LoadingRows rows={1} label="Loading the runs' stored results" />;
  else if (!first || missing > 0) body = <p className="text-sm text-muted">Some of this chart&apos;s runs have been deleted, so it cannot be drawn.</p>;
  else if (content.quantity === "trace" || content.quantity === "spectrum") body = <TimeOrSpectrumChart quantity={content.quantity} runs={loaded} receiverIds={receiverIds} />;
  else if (content.quantity === "band-levels") body = <BandLevelsChart runs={loaded} receiverIds={receiverIds} bandsPerOctave={bandsPerOctave} weighting={weighting} />;
  else if (loaded[1]) body = <InsertionLossChart run={first} reference={loaded[1]} receiverIds={receiverIds} bandsPerOctave={bandsPerOctave} weighting={weighting} />;
  else body = <p className="text-sm text-muted">An insertion loss needs both the run and its reference.</p>;

  return (
    <figure className="flex flex-col gap-3" data-testid="shared-chart-block" data-quantity={content.quantity}>
      {content.title ? <h3 className="text-base font-semibold text-ink">{content.title}</h3> : null}
      <p className="text-[13px] text-ink-soft">{chartQuantityLabels[content.quantity].replace(/^./, (letter) => letter.toUpperCase())}</p>
      {body}
      <figcaption>
        <ul className="flex flex-col gap-1 text-[13px]">
          {content.runIds.map((runId, index) => {
            const run = runById.get(runId);
            return (
              <li key={runId}>
                <span className="text-muted">{chartRunRole(content.quantity, index)}:</span>{" "}
                {run ? (
                  <span className="text-ink">
                    {run.sceneName ?? "Deleted scene"} version {run.sceneVersion}
                  </span>
                ) : (
                  <span className="text-muted">{content.runLabels?.[index] ?? "a run"} (deleted)</span>
                )}
              </li>
            );
          })}
        </ul>
      </figcaption>
      <SectionCaution />
    </figure>
  );
}
