// The shared study's saved runs, newest first: what was run, its status and review state, who ran it and
// when, and the figures that tell runs apart; each row opens the run's read-only page.
import Link from "next/link";
import { RunStatusBadge } from "@/components/runs/run-status-badge";
import { formatGrid, formatLevel, formatWallTime, toRunTableRow } from "@/components/runs/run-table-model";
import type { SharedRun } from "@/lib/http/share-link-types";
import { SharedReviewBadge } from "./review-state-badge";
import { sharedRunHref } from "./shared-run-block";
import { SharedWhen } from "./shared-when";

const headings = ["Variant", "Status", "Review", "Who", "When", "Wall time", "Grid", "Warnings", "Loudest peak"];
const numericFrom = 5;

export function SharedRunsTable({ token, runs }: { token: string; runs: SharedRun[] }) {
  if (runs.length === 0) return <p className="text-sm text-muted">No runs have been saved in this study.</p>;
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
      <table className="w-full text-sm" aria-label="Saved runs">
        <thead className="border-b border-rule bg-paper/70 text-left text-xs text-muted">
          <tr>
            {headings.map((heading, index) => (
              <th key={heading} scope="col" className={`whitespace-nowrap px-2.5 py-2 font-medium ${index >= numericFrom ? "text-right" : ""}`}>
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {runs.map((run) => {
            const row = toRunTableRow(run);
            return (
              <tr key={run.id} data-testid="shared-run-row" className="border-b border-rule last:border-0 hover:bg-paper/60">
                <td className="whitespace-nowrap px-2.5 py-2">
                  <Link href={sharedRunHref(token, run.id)} className="font-medium text-ink hover:text-tide-700 hover:underline">
                    {row.sceneName} <span className="font-normal text-muted">v{row.sceneVersion}</span>
                  </Link>
                </td>
                <td className="px-2.5 py-2">
                  <RunStatusBadge status={run.status} />
                </td>
                <td className="px-2.5 py-2">
                  <SharedReviewBadge state={run.reviewState} />
                </td>
                <td className="whitespace-nowrap px-2.5 py-2 text-ink-soft">{row.who}</td>
                <td className="whitespace-nowrap px-2.5 py-2 text-ink-soft">
                  <SharedWhen iso={run.createdAt} />
                </td>
                <td className="tabular whitespace-nowrap px-2.5 py-2 text-right font-mono text-[13px]">{formatWallTime(row.wallSeconds)}</td>
                <td className="tabular whitespace-nowrap px-2.5 py-2 text-right font-mono text-[13px]">{formatGrid(row.cells, row.cellSize)}</td>
                <td className="tabular whitespace-nowrap px-2.5 py-2 text-right font-mono text-[13px]">{row.warningCount === null ? "–" : String(row.warningCount)}</td>
                <td className="tabular whitespace-nowrap px-2.5 py-2 text-right font-mono text-[13px]">{formatLevel(row.loudestPeakLevelDb)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
