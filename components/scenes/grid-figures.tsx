// The numbers a scene implies before anything runs: grid, time step, resolved band, size, and
// the solver's warnings. Recomputed from the scene alone, so it is always current.
import { FigureList, SolverWarnings } from "@/components/ui/figure-list";
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
      <FigureList rows={rows} />
      <SolverWarnings warnings={grid.warnings} />
    </div>
  );
}
