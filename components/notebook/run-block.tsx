"use client";
// A saved run in the notebook: its status, what was run, who ran it and when, the figures that
// tell runs apart, and a link to the run. Removing the block leaves the run in the run table.
import Link from "next/link";
import { RunStatusBadge } from "@/components/runs/run-status-badge";
import { RunFigureList } from "@/components/runs/run-figure-list";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { formatWhen } from "@/lib/client/format";
import { useStudyRuns } from "@/lib/client/run-queries";
import type { BlockItem, RunListItem } from "@/lib/http/api-types";

export function runIdOfBlock(block: BlockItem): string | null {
  const runId = (block.content as { runId?: unknown } | null)?.runId;
  return typeof runId === "string" ? runId : null;
}

/** The block's title when folded: which run it is, from the study's run list once loaded. */
export function runBlockTitle(run: RunListItem | undefined): string {
  return run ? `${run.sceneName ?? "Deleted scene"} v${run.sceneVersion}, ${run.createdByName ?? "former member"}` : "Run";
}

export function RunBlock({ block, studyId }: { block: BlockItem; studyId: string }) {
  const runs = useStudyRuns(studyId);
  const runId = runIdOfBlock(block);
  if (runs.isPending) return <LoadingRows rows={1} label="Loading the run" />;
  if (runs.isError) return <ErrorState title="The run could not be loaded" message={runs.error.message} onRetry={() => void runs.refetch()} />;
  const run = runs.data.runs.find((item) => item.id === runId);
  if (!run) return <p className="text-sm text-muted">This run has been deleted. The block can be removed.</p>;
  return (
    <div className="flex flex-col gap-3" data-testid="run-block">
      <div className="flex flex-wrap items-center gap-3">
        <RunStatusBadge status={run.status} />
        <span className="font-medium text-ink">
          {run.sceneName ?? "Deleted scene"} <span className="font-normal text-muted">version {run.sceneVersion}</span>
        </span>
        <span className="text-sm text-muted">
          {run.createdByName ?? "A former member"}, <time dateTime={run.createdAt}>{formatWhen(run.createdAt)}</time>
        </span>
        <Link href={`/studies/${studyId}/runs/${run.id}`} className="ml-auto text-sm font-medium text-tide-700 hover:underline">
          Open run
        </Link>
      </div>
      {run.statusMessage ? <p className="text-sm text-ink-soft">{run.statusMessage}</p> : null}
      <RunFigureList figures={run.figures} />
    </div>
  );
}
