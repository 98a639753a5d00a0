// Benchmark of parallel stepping: cell-updates per second of one simulation on 1 and on 2 threads
// (strips over shared memory, worker_threads), 1024^2 and 2048^2 with a 20-cell PML on every side,
// beside the C reference on 2 threads where it builds. Checks that both give the same final field.
// Not a test: on a shared machine compare the ratios of one run. Goal: 2 threads >= 1.7 x 1 thread on 1024^2.
// Usage: npm run bench:parallel [-- --threads 2] [--sizes 1024,2048] [--reps 3]
import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { parseArgs } from "node:util";

import { buildScene } from "@/lib/fdtd/builders";
import { Simulation } from "@/lib/fdtd/simulation";

import { nodeParallelKernel } from "./fdtd-parallel-node";

const PML_CELLS = 20;
const CELL_SIZE = 0.01;
const COURANT = 0.5;
const STEPS: Record<number, number> = { 1024: 300, 2048: 80 };
const referenceScript = resolve(dirname(fileURLToPath(import.meta.url)), "..", "../shared/bench/run-c-reference.sh");

function benchScene(n: number, steps: number) {
  const width = (n - 2 * PML_CELLS) * CELL_SIZE;
  const c = 343.2;
  const pml = { kind: "pml" as const, layerCells: PML_CELLS };
  return buildScene({
    domain: { width, height: width },
    medium: { kind: "fluid", soundSpeed: c, density: 1.2 },
    resolution: { kind: "cellSize", cellSize: CELL_SIZE, courantNumber: COURANT },
    boundary: { left: pml, right: pml, bottom: pml, top: pml },
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

/** One timed run; returns cell-updates per second and the final pressure field. */
async function timedRun(scene: ReturnType<typeof benchScene>, threads: number): Promise<{ rate: number; field: Float32Array }> {
  const pool = threads > 1 ? nodeParallelKernel({ threads, rows: new Simulation(scene).grid.ny }) : undefined;
  try {
    const simulation = new Simulation(scene, pool ? { kernel: pool.provider } : {});
    // The first phase waits for the helper threads to start: step once before the clock starts.
    simulation.advance();
    const steps = simulation.grid.steps - 1;
    const started = performance.now();
    for (let k = 0; k < steps; k++) simulation.advance();
    const seconds = (performance.now() - started) / 1000;
    return { rate: (simulation.grid.cellCount * steps) / seconds, field: simulation.fields().pressure.slice() };
  } finally {
    await pool?.close();
  }
}

function referenceRate(n: number, steps: number, threads: number): number | undefined {
  if (!existsSync(referenceScript)) return undefined;
  try {
    const out = execFileSync("bash", [referenceScript, String(n), String(n), String(steps), String(threads), String(COURANT)], { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
    const match = /median cell-updates\/s:\s*([0-9.eE+-]+)/.exec(out);
    return match ? Number(match[1]) : undefined;
  } catch {
    return undefined;
  }
}

async function main(): Promise<void> {
  const { values } = parseArgs({ options: { threads: { type: "string", default: "2" }, sizes: { type: "string", default: "1024,2048" }, reps: { type: "string", default: "3" } } });
  const threads = Number(values.threads);
  const reps = Number(values.reps);
  const sizes = values.sizes!.split(",").map(Number);
  console.log(`parallel stepping, ${threads} threads vs 1 (WebAssembly kernel, 20-cell PML), median of ${reps}`);
  console.log("grid      1 thread    " + `${threads} threads`.padEnd(12) + "speed-up   identical   C x" + threads);
  for (const n of sizes) {
    const steps = STEPS[n] ?? 100;
    const scene = benchScene(n, steps);
    const single: number[] = [];
    const parallel: number[] = [];
    let identical = true;
    for (let r = 0; r < reps; r++) {
      const a = await timedRun(scene, 1);
      const b = await timedRun(scene, threads);
      single.push(a.rate);
      parallel.push(b.rate);
      identical &&= Buffer.from(a.field.buffer).equals(Buffer.from(b.field.buffer));
    }
    const c = referenceRate(n, steps, threads);
    const one = median(single);
    const many = median(parallel);
    console.log(
      `${`${n}^2`.padEnd(9)} ${one.toExponential(2).padEnd(11)} ${many.toExponential(2).padEnd(11)} ${(many / one).toFixed(2).padEnd(10)} ${String(identical).padEnd(11)} ${c ? c.toExponential(2) : "(no C reference here)"}`,
    );
  }
}

void main();
