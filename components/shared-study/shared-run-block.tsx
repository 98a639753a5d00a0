// A saved run in the shared notebook: status, review state, what was run, by whom and when, the figures
// that tell runs apart, and a link to the run's read-only page.
import Link from "next/link";
import { RunStatusBadge } from "@/components/runs/run-status-badge";
import { formatGrid, formatLevel, formatWallTime } from "@/components/runs/run-table-model";
import type { SharedRun } from "@/lib/http/share-link-types";
import { SharedReviewBadge } from "./review-state-badge";
import { SharedWhen } from "./shared-when";

export function sharedRunHref(token: string, runId: string): string {
  return `/shared/${token}/runs/${runId}`;
}

export function SharedRunBlock({ token, run }: { token: string; run: SharedRun | undefined }) {
  if (!run) return <p className="text-sm text-muted">This run has been deleted.</p>;
  const figures = run.figures;
  const rows: [string, string][] = figures
    ? [
        ["Loudest receiver (peak)", formatLevel(figures.loudestPeakLevelDb)],
        ["Simulated", `${(figures.simulatedSeconds * 1000).toFixed(1)} ms in ${figures.steps.run.toLocaleString("en-GB")} steps`],
        ["Grid", formatGrid(figures.grid.cells, figures.grid.cellSize)],
        ["Wall time", formatWallTime(figures.wallSeconds)],
        ["Warnings", String(figures.warningCount)],
      ]
    : [];
  return (
    <div className="flex flex-col gap-3" data-testid="shared-run-block">
      <div className="flex flex-wrap items-center gap-3">
        <RunStatusBadge status={run.status} />
        <SharedReviewBadge state={run.reviewState} />
        <span className="font-medium text-ink">
          {run.sceneName ?? "Deleted scene"} <span className="font-normal text-muted">version {run.sceneVersion}</span>
        </span>
        <span className="text-sm text-muted">
          {run.createdByName ?? "A former member"}, <SharedWhen iso={run.createdAt} />
        </span>
        <Link href={sharedRunHref(token, run.id)} className="ml-auto text-sm font-medium text-tide-700 hover:underline">
          Open run
        </Link>
      </div>
      {run.statusMessage ? <p className="text-sm text-ink-soft">{run.statusMessage}</p> : null}
      {rows.length > 0 ? (
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-xs sm:grid-cols-5">
          {rows.map(([label, value]) => (
            <div key={label}>
              <dt className="text-muted">{label}</dt>
              <dd className="tabular font-mono text-[13px] text-ink">{value}</dd>
            </div>
          ))}
        </dl>
      ) : (
        <p className="text-sm text-muted">This run has no summary figures.</p>
      )}
    </div>
  );
}
