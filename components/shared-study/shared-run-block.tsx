// A saved run in the shared notebook: status, review state, what was run, by whom and when, the figures
// that tell runs apart, and a link to the run's read-only page.
import Link from "next/link";
import { RunStatusBadge } from "@/components/runs/run-status-badge";
import { RunFigureList } from "@/components/runs/run-figure-list";
import type { SharedRun } from "@/lib/http/share-link-types";
import { SharedReviewBadge } from "./review-state-badge";
import { SharedWhen } from "./shared-when";

export function sharedRunHref(token: string, runId: string): string {
  return `/shared/${token}/runs/${runId}`;
}

export function SharedRunBlock({ token, run }: { token: string; run: SharedRun | undefined }) {
  if (!run) return <p className="text-sm text-muted">This run has been deleted.</p>;
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
      <RunFigureList figures={run.figures} />
    </div>
  );
}
