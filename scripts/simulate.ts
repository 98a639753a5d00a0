// Command-line runner: npm run simulate -- scene.json --out DIR [--kernel wasm|typescript] [--threads N] [--quiet]
// Writes receiver traces (traces.csv, traces.json), summary.json (grid, timings, warnings) and
// final-pressure.png. A bad scene file gets one error line per problem, with its JSON path, and exit code 1.
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { basename, join, resolve } from "node:path";
import { parseArgs } from "node:util";

import cliProgress from "cli-progress";

import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
import { Simulation, type SimulationResult } from "@/lib/fdtd/simulation";

import { fieldToPng } from "./fdtd-png";
import { kernelByName } from "./fdtd-kernels";
import { nodeParallelKernel, type NodeParallelKernel } from "./fdtd-parallel-node";

const USAGE = "usage: npm run simulate -- scene.json --out DIR [--kernel wasm|typescript] [--threads N] [--quiet]";

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(1);
}

function formatBytes(bytes: number): string {
  const units = ["B", "KiB", "MiB", "GiB"];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return `${value.toFixed(unit === 0 ? 0 : 1)} ${units[unit]}`;
}

function tracesCsv(result: SimulationResult): string {
  const header = ["time_s"];
  for (const r of result.receivers) header.push(`${r.id}_p_Pa`, `${r.id}_vx_m_per_s`, `${r.id}_vy_m_per_s`);
  const lines = [header.map((h) => (/[",]/.test(h) ? `"${h.replace(/"/g, '""')}"` : h)).join(",")];
  const dt = result.grid.timeStep;
  for (let n = 0; n <= result.stepsRun; n++) {
    const row = [(n * dt).toExponential(9)];
    for (const r of result.receivers) row.push(r.pressure[n]!.toExponential(7), r.velocityX[n]!.toExponential(7), r.velocityY[n]!.toExponential(7));
    lines.push(row.join(","));
  }
  return `${lines.join("\n")}\n`;
}

function tracesJson(result: SimulationResult): string {
  return JSON.stringify({
    timeStep: result.grid.timeStep,
    samples: result.stepsRun + 1,
    units: { time: "s", pressure: "Pa", velocity: "m/s" },
    receivers: result.receivers.map((r) => ({
      id: r.id,
      label: r.label,
      ...(r.lineId !== undefined ? { lineId: r.lineId } : {}),
      position: r.position,
      pressure: Array.from(r.pressure),
      velocityX: Array.from(r.velocityX),
      velocityY: Array.from(r.velocityY),
    })),
  });
}

async function main(): Promise<void> {
  let parsed;
  try {
    parsed = parseArgs({
      allowPositionals: true,
      options: { out: { type: "string", short: "o" }, kernel: { type: "string", default: "wasm" }, threads: { type: "string", default: "1" }, quiet: { type: "boolean", default: false } },
    });
  } catch (error) {
    fail(`${(error as Error).message}\n${USAGE}`);
  }
  const [scenePath, ...extra] = parsed.positionals;
  if (!scenePath || extra.length > 0) fail(USAGE);
  const outDir = resolve(parsed.values.out ?? join("out", basename(scenePath).replace(/\.json$/i, "")));

  let text: string;
  try {
    text = readFileSync(scenePath, "utf8");
  } catch (error) {
    fail(`${scenePath}: cannot read the file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    fail(`${scenePath}: not valid JSON: ${(error as Error).message}`);
  }
  const parsedScene = parseScene(json);
  if (!parsedScene.ok) {
    for (const problem of parsedScene.problems) process.stderr.write(`${scenePath}: ${problem.path || "(root)"}: ${problem.message}\n`);
    process.stderr.write(`${parsedScene.problems.length} problem${parsedScene.problems.length === 1 ? "" : "s"}; nothing was simulated\n`);
    process.exit(1);
  }
  const scene = parsedScene.scene;
  const grid = deriveGrid(scene);
  const log = (line: string) => {
    if (!parsed.values.quiet) process.stdout.write(`${line}\n`);
  };
  log(`${scene.name || basename(scenePath)}: ${grid.nx} x ${grid.ny} cells (h = ${(grid.cellSize * 1000).toPrecision(4)} mm, PML included), dt = ${(grid.timeStep * 1e6).toPrecision(4)} us, Courant ${grid.courantNumber}`);
  log(`resolved up to ${grid.maxResolvedFrequency.toFixed(0)} Hz at ${grid.pointsPerWavelength} cells per wavelength; ${grid.steps} steps (${(grid.simulatedSeconds * 1000).toPrecision(4)} ms); about ${formatBytes(grid.memoryBytes)}`);
  for (const warning of grid.warnings) process.stderr.write(`warning: ${warning.path ? `${warning.path}: ` : ""}${warning.message}\n`);

  const threads = Number(parsed.values.threads);
  if (!Number.isInteger(threads) || threads < 1 || threads > 64) fail(`--threads: a whole number from 1 to 64, not "${parsed.values.threads}"\n${USAGE}`);
  const kernelName = parsed.values.kernel ?? "wasm";
  const kernel = kernelByName(kernelName);
  // Several threads step strips of the grid over shared memory, bit-identical to one thread.
  const pool: NodeParallelKernel | undefined =
    threads > 1 ? nodeParallelKernel({ threads, rows: grid.ny, kernelKind: kernelName === "typescript" ? "typescript" : "wasm-simd" }) : undefined;
  const simulation = new Simulation(scene, { kernel: pool?.provider ?? kernel });
  const bar = parsed.values.quiet
    ? undefined
    : new cliProgress.SingleBar({ format: "simulating [{bar}] {percentage}% | {value}/{total} steps | {energy} dB | ETA {eta_formatted}", hideCursor: true }, cliProgress.Presets.shades_classic);
  bar?.start(grid.steps, 0, { energy: "0.0" });
  let result: SimulationResult;
  try {
    result = simulation.run({ onProgress: (p) => bar?.update(p.step, { energy: p.energyDb.toFixed(1) }) });
  } catch (error) {
    bar?.stop();
    await pool?.close();
    fail(`${scenePath}: ${(error as Error).message}`);
  }
  await pool?.close();
  bar?.update(result.stepsRun);
  bar?.stop();

  mkdirSync(outDir, { recursive: true });
  writeFileSync(join(outDir, "traces.csv"), tracesCsv(result));
  writeFileSync(join(outDir, "traces.json"), tracesJson(result));
  writeFileSync(join(outDir, "final-pressure.png"), fieldToPng(result.finalPressure, result.solidMask, grid.domainCells.nx));
  const summary = {
    scene: { name: scene.name, file: resolve(scenePath) },
    kernel: result.kernel,
    grid: result.grid,
    stoppedBy: result.stoppedBy,
    stepsRun: result.stepsRun,
    simulatedSeconds: result.simulatedSeconds,
    timings: result.timings,
    warnings: result.warnings,
    sources: result.sources,
    receivers: result.receivers.map((r) => ({ id: r.id, label: r.label, position: r.position, peakPressure: r.pressure.reduce((m, v) => Math.max(m, Math.abs(v)), 0) })),
    finalEnergyJoulesPerMetre: result.energy.length > 0 ? result.energy[result.energy.length - 1]!.joulesPerMetre : 0,
  };
  writeFileSync(join(outDir, "summary.json"), `${JSON.stringify(summary, null, 2)}\n`);
  log(`${result.stoppedBy === "decay" ? "decayed" : "done"} after ${result.stepsRun} steps in ${result.timings.runSeconds.toFixed(2)} s (${(result.timings.cellUpdatesPerSecond / 1e6).toFixed(0)} M cell-updates/s, ${result.kernel} kernel)`);
  log(`wrote traces.csv, traces.json, summary.json and final-pressure.png to ${outDir}`);
}

void main();
