// One server run, stepped off the worker's main event loop: parses the job's scene, steps it with
// lib/fdtd (over several threads when the grid is large enough), reports progress, obeys the shared
// cancel word, and hands back the encoded payload (plain runs) or the chosen receivers' traces (sweeps).
import { parentPort, workerData } from "node:worker_threads";
import { deriveGrid } from "@/lib/fdtd/grid";
import { waitWhilePaused, type RunControl } from "@/lib/fdtd/run-control";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { Simulation, SimulationInstabilityError, type SimulationResult } from "@/lib/fdtd/simulation";
import type { ExecutorInput, ExecutorMessage, ExecutorOutcome } from "@/lib/server/run-queue/executor-protocol";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { pickTraces } from "@/lib/sweeps/sweep-insertion-loss";
import { packTraces } from "@/lib/sweeps/trace-pack";
import { nodeParallelKernel, type NodeParallelKernel } from "./fdtd-parallel-node";

/** Below this many cells per thread the barrier costs more than the strip saves (as in the browser's worker). */
const minimumCellsPerThread = 64 * 1024;

const input = workerData as ExecutorInput;
const send = (message: ExecutorMessage, transfer: ArrayBuffer[] = []) => parentPort!.postMessage(message, transfer);

function outcomeOf(result: SimulationResult, threads: number): ExecutorOutcome {
  if (result.stoppedBy === "cancelled") return { kind: "cancelled" };
  const rate = result.timings.cellUpdatesPerSecond;
  if (input.mode === "sweep") {
    try {
      return { kind: "traces", bytes: packTraces(pickTraces(result.receivers, input.receiverIds)), cellUpdatesPerSecond: rate };
    } catch (error) {
      return { kind: "failed", message: error instanceof Error ? error.message : String(error), retryable: false };
    }
  }
  const scene = parseSceneOrThrow(input.scene);
  const encoded = encodeRunPayload({ result, scene, sceneVersion: input.sceneVersion, settings: input.settings, threads });
  return encoded.ok ? { kind: "payload", bytes: encoded.bytes, cellUpdatesPerSecond: rate } : { kind: "failed", message: encoded.message, retryable: false };
}

async function main(): Promise<void> {
  const control: RunControl = { word: new Int32Array(input.control) };
  let pool: NodeParallelKernel | undefined;
  try {
    const scene = parseSceneOrThrow(input.scene);
    const grid = deriveGrid(scene);
    const useful = Math.min(input.threads, Math.floor(grid.cellCount / minimumCellsPerThread));
    pool = useful >= 2 ? nodeParallelKernel({ threads: useful, rows: grid.ny }) : undefined;
    const simulation = new Simulation(scene, pool ? { kernel: pool.provider } : {});
    const threads = pool?.provider.threads ?? 1;
    send({ type: "start", kernel: simulation.kernel.name, threads });
    const started = performance.now();
    const result = simulation.run({
      // A few hundred reports per run: cancel is seen within a fraction of a percent of the run.
      progressInterval: Math.max(1, Math.min(200, Math.ceil(grid.steps / 400))),
      isCancelled: () => waitWhilePaused(control),
      onProgress: (progress) => {
        const elapsed = (performance.now() - started) / 1000;
        send({ type: "progress", fraction: progress.fraction, step: progress.step, cellUpdatesPerSecond: elapsed > 0 ? (progress.step * grid.cellCount) / elapsed : 0 });
      },
    });
    const outcome = outcomeOf(result, threads);
    send({ type: "done", outcome }, "bytes" in outcome ? [outcome.bytes.buffer as ArrayBuffer] : []);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    send({ type: "done", outcome: { kind: "failed", message, retryable: !(error instanceof SimulationInstabilityError) } });
  } finally {
    await pool?.close();
  }
}

void main();
