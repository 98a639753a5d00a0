// Benchmark: cell-updates per second of the solver (one cell-update: p, vx, vy of one cell for one step)
// on 256^2, 1024^2 and 2048^2 grids with a 20-cell PML on every side, single thread, next to the plain C
// reference in ../shared/bench built on this machine, and their ratio. Not a test: machines are noisy,
// so compare the ratio measured in one run. The two are run alternately, so that both see the same load;
// the median ratio is the headline, and the ratio of the two best repetitions (each program's least
// disturbed one) is printed beside it: on a shared machine the two can differ by 20% or more.
// Usage: npm run bench [-- --kernel wasm|typescript] [--sizes 256,1024] [--reps 5]
import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { parseArgs } from "node:util";

import { buildScene } from "@/lib/fdtd/builders";
import { RESERVED_BYTES } from "@/lib/fdtd/layout";
import { Simulation } from "@/lib/fdtd/simulation";

import { kernelByName } from "./fdtd-kernels";

const PML_CELLS = 20;
const CELL_SIZE = 0.01;
const COURANT = 0.5;
/** Steps per size: about a second of work each on a laptop. */
const STEPS: Record<number, number> = { 256: 2000, 1024: 200, 2048: 50 };

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const referenceScript = resolve(repoRoot, "../shared/bench/run-c-reference.sh");

function benchScene(n: number, steps: number) {
  const width = (n - 2 * PML_CELLS) * CELL_SIZE;
  const c = 343.2;
  return buildScene({
    domain: { width, height: width },
    medium: { kind: "fluid", soundSpeed: c, density: 1.2 },
    resolution: { kind: "cellSize", cellSize: CELL_SIZE, courantNumber: COURANT },
    boundary: { left: { kind: "pml", layerCells: PML_CELLS }, right: { kind: "pml", layerCells: PML_CELLS }, bottom: { kind: "pml", layerCells: PML_CELLS }, top: { kind: "pml", layerCells: PML_CELLS } },
    // As in the C reference: a Ricker line source at the centre, 20 cells per wavelength at its peak; a receiver n/8 to the right.
    sources: [{ id: "s", label: "source", position: { x: width / 2, y: width / 2 }, signal: { kind: "ricker", peakFrequency: c / (20 * CELL_SIZE) } }],
    receivers: [{ id: "r", label: "receiver", position: { x: width / 2 + (n / 8) * CELL_SIZE, y: width / 2 } }],
    duration: { kind: "time", seconds: (steps * COURANT * CELL_SIZE) / c },
    output: { levelMaps: false },
  });
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : 0.5 * (sorted[mid - 1]! + sorted[mid]!);
}

function referenceRate(n: number, steps: number): number | undefined {
  if (!existsSync(referenceScript)) return undefined;
  try {
    const out = execFileSync("bash", [referenceScript, String(n), String(n), String(steps), "1", String(COURANT)], { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
    const match = /median cell-updates\/s:\s*([0-9.eE+-]+)/.exec(out);
    return match ? Number(match[1]) : undefined;
  } catch {
    // No gcc, or the build failed: print the solver's figure alone.
    return undefined;
  }
}

/** One measured run of the solver (after `warm` unmeasured ones on the same size). */
function solverRun(n: number, steps: number, kernelName: string): { rate: number; bytesPerCell: number; kernel: string } {
  const simulation = new Simulation(benchScene(n, steps), { kernel: kernelByName(kernelName) });
  if (simulation.grid.nx !== n || simulation.grid.ny !== n) throw new Error(`bench grid is ${simulation.grid.nx} x ${simulation.grid.ny}, expected ${n}`);
  const result = simulation.run();
  return { rate: result.timings.cellUpdatesPerSecond, bytesPerCell: (simulation.layout.byteLength - RESERVED_BYTES) / (n * n), kernel: result.kernel };
}

function main(): void {
  const { values } = parseArgs({ options: { kernel: { type: "string", default: "wasm" }, sizes: { type: "string", default: "256,1024,2048" }, reps: { type: "string", default: "5" } } });
  const sizes = (values.sizes ?? "256,1024,2048").split(",").map(Number);
  const reps = Math.max(1, Number(values.reps));
  const haveReference = existsSync(referenceScript);
  process.stdout.write(`cell-updates per second, single thread, PML ${PML_CELLS} cells on every side, Courant ${COURANT}; median of ${reps} alternating runs (the C figure of each is itself a median of 3)\n`);
  process.stdout.write(`ratio: median of the per-repetition ratios; best/best: the solver's best repetition over the C reference's best\n`);
  if (!haveReference) process.stdout.write(`(no C reference at ${referenceScript}: solver figures only)\n`);
  const header = ["grid", "steps", "solver", "C reference", "ratio", "best/best", "state bytes/cell"];
  const rows: string[][] = [];
  for (const n of sizes) {
    const steps = STEPS[n] ?? Math.max(20, Math.round(2e8 / (n * n)));
    const kernelName = values.kernel ?? "wasm";
    // One unmeasured run first: the JavaScript engine compiles its optimised code while it runs.
    solverRun(n, steps, kernelName);
    // Alternate the two so that both see the same machine load; report medians and the median ratio.
    const solverRates: number[] = [];
    const referenceRates: number[] = [];
    const ratios: number[] = [];
    let last = { rate: 0, bytesPerCell: 0, kernel: "" };
    for (let r = 0; r < reps; r++) {
      const reference = haveReference ? referenceRate(n, steps) : undefined;
      last = solverRun(n, steps, kernelName);
      solverRates.push(last.rate);
      if (reference !== undefined) {
        referenceRates.push(reference);
        ratios.push(last.rate / reference);
      }
    }
    rows.push([
      `${n}^2`,
      String(steps),
      `${median(solverRates).toExponential(2)} (${last.kernel})`,
      referenceRates.length > 0 ? median(referenceRates).toExponential(2) : "-",
      ratios.length > 0 ? median(ratios).toFixed(2) : "-",
      referenceRates.length > 0 ? (Math.max(...solverRates) / Math.max(...referenceRates)).toFixed(2) : "-",
      last.bytesPerCell.toFixed(1),
    ]);
  }
  const widths = header.map((h, k) => Math.max(h.length, ...rows.map((r) => r[k]!.length)));
  const line = (cells: string[]) => cells.map((c, k) => c.padEnd(widths[k]!)).join("  ");
  process.stdout.write(`${line(header)}\n${rows.map(line).join("\n")}\n`);
  process.stdout.write(`state bytes/cell: the simulation's buffer less its fixed ${RESERVED_BYTES} reserved bytes, per cell\n`);
}

main();
