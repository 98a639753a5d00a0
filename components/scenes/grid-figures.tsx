// The numbers a scene implies before anything runs: grid, time step, resolved band, size, and
// the solver's warnings. Recomputed from the scene alone, so it is always current.
import type { GridPlan } from "@/lib/fdtd/grid";

const number = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });

export function formatBytes(bytes: number): string {
  if (bytes >= 1e9) return `${number.format(bytes / 1e9)} GB`;
  if (bytes >= 1e6) return `${number.format(bytes / 1e6)} MB`;
  return `${number.format(bytes / 1e3)} kB`;
}

export function GridFigures({ grid }: { grid: GridPlan }) {
  const rows: [string, string][] = [
    ["Cell size", `${number.format(grid.cellSize * 1000)} mm`],
    ["Time step", `${number.format(grid.timeStep * 1e6)} µs`],
    ["Courant number", grid.courantNumber.toFixed(3)],
    ["Resolved up to", `${number.format(grid.maxResolvedFrequency)} Hz at ${grid.pointsPerWavelength} cells per wavelength`],
    ["Grid incl. PML", `${grid.nx} × ${grid.ny} = ${grid.cellCount.toLocaleString("en-GB")} cells`],
    ["Steps", `${grid.steps.toLocaleString("en-GB")} (${number.format(grid.simulatedSeconds * 1000)} ms${grid.stopRule === "decay" ? ", or until decayed" : ""})`],
    ["Memory", formatBytes(grid.memoryBytes)],
  ];
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-muted">{label}</dt>
            <dd className="tabular font-mono text-[13px] text-ink">{value}</dd>
          </div>
        ))}
      </dl>
      {grid.warnings.length > 0 ? (
        <ul aria-label="Warnings" className="flex flex-col gap-1.5">
          {grid.warnings.map((warning) => (
            <li key={warning.code + (warning.path ?? "")} className="rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-3 py-2 text-[13px] text-ink-soft">
              <span className="font-medium text-signal-warn">Check: </span>
              {warning.message}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
