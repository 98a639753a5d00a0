// A saved run's summary as stored with it: the grid it ran on, how far it ran, the receivers'
// levels and the solver's warnings. Read from the summary, never recomputed.
import { formatGrid, formatLevel } from "@/components/runs/run-table-model";
import { FigureList, SolverWarnings } from "@/components/ui/figure-list";
import type { RunSummary } from "@/lib/run-record/summary";

const figure = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });
const compact = new Intl.NumberFormat("en-GB", { notation: "compact", maximumSignificantDigits: 3 });
const stopReasons: Record<RunSummary["stoppedBy"], string> = { duration: "at the set duration", decay: "when the energy had decayed", cancelled: "cancelled" };

export function SavedRunFigures({ summary }: { summary: RunSummary }) {
  const { grid } = summary;
  const rows: [string, string][] = [
    ["Grid incl. PML", `${grid.nx} × ${grid.ny} (${formatGrid(grid.cells, grid.cellSize)})`],
    ["Domain cells", `${grid.domainNx} × ${grid.domainNy}`],
    ["Time step", `${figure.format(grid.timeStep * 1e6)} µs`],
    ["Steps", `${summary.steps.run.toLocaleString("en-GB")} of ${summary.steps.planned.toLocaleString("en-GB")}, ${stopReasons[summary.stoppedBy]}`],
    ["Simulated", `${figure.format(summary.simulatedSeconds * 1000)} ms`],
    ["Cell updates/s", compact.format(summary.cellUpdatesPerSecond)],
    ["Snapshots kept", String(summary.snapshotFrames)],
  ];
  return (
    <div className="flex flex-col gap-4">
      <FigureList rows={rows} />
      {summary.warnings.length > 0 ? (
        <SolverWarnings warnings={summary.warnings} />
      ) : (
        <p className="text-sm text-muted">The solver raised no warnings for this run.</p>
      )}
      {summary.receivers.length > 0 ? (
        <div className="overflow-x-auto">
          <table className="w-full text-sm" aria-label="Receiver levels">
            <thead className="text-left text-xs text-muted">
              <tr>
                <th className="py-1 pr-3 font-medium">Receiver</th>
                <th className="py-1 pr-3 text-right font-medium">Peak level</th>
                <th className="py-1 text-right font-medium" title="Energy-equivalent level over the simulated time; compare runs of equal duration">
                  Leq over the run
                </th>
              </tr>
            </thead>
            <tbody>
              {summary.receivers.map((receiver) => (
                <tr key={receiver.id} className="border-t border-rule">
                  <td className="py-1 pr-3 text-ink-soft">{receiver.label || receiver.id}</td>
                  <td className="tabular whitespace-nowrap py-1 pr-3 text-right font-mono text-[13px]">{formatLevel(receiver.peakLevelDb)}</td>
                  <td className="tabular whitespace-nowrap py-1 text-right font-mono text-[13px]">{formatLevel(receiver.leqDb)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {summary.receiverCount > summary.receivers.length ? (
            <p className="mt-1 text-xs text-muted">
              The first {summary.receivers.length} of {summary.receiverCount} receivers; levels re 20 µPa.
            </p>
          ) : (
            <p className="mt-1 text-xs text-muted">Levels re 20 µPa.</p>
          )}
        </div>
      ) : null}
    </div>
  );
}
