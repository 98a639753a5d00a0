// A saved run's key figures in a notebook block, for members and for read-only links alike.
import type { RunListFigures } from "@/lib/http/api-types";
import { formatGrid, formatLevel, formatWallTime } from "./run-table-model";

export function RunFigureList({ figures }: { figures: RunListFigures | null }) {
  if (!figures) return <p className="text-sm text-muted">This run has no summary figures.</p>;
  const rows: [string, string][] = [
    ["Loudest receiver (peak)", formatLevel(figures.loudestPeakLevelDb)],
    ["Simulated", `${(figures.simulatedSeconds * 1000).toFixed(1)} ms in ${figures.steps.run.toLocaleString("en-GB")} steps`],
    ["Grid", formatGrid(figures.grid.cells, figures.grid.cellSize)],
    ["Wall time", formatWallTime(figures.wallSeconds)],
    ["Warnings", String(figures.warningCount)],
  ];
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-xs sm:grid-cols-5">
      {rows.map(([label, value]) => (
        <div key={label}>
          <dt className="text-muted">{label}</dt>
          <dd className="tabular font-mono text-[13px] text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
