// A thin comlink adapter: runs one scene with lib/fdtd in this worker, reports progress and live
// frames to the page, and hands back the result with its buffers transferred, not copied.
import * as Comlink from "comlink";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parallelKernelProvider, type ParallelKernelProvider } from "@/lib/fdtd/parallel/parallel-kernel";
import { RunState, readRunState, waitWhilePaused, type RunControl } from "@/lib/fdtd/run-control";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { Simulation, SimulationInstabilityError, type FieldSnapshot, type ProgressReport, type SimulationResult } from "@/lib/fdtd/simulation";

export interface WorkerRunCallbacks {
  onStart: (info: { kernel: string; threads: number }) => void;
  onProgress: (progress: ProgressReport & { cellUpdatesPerSecond: number }) => void;
  onFrame: (frame: FieldSnapshot) => void;
}

export type WorkerRunOutcome = { ok: true; result: SimulationResult } | { ok: false; unstable: boolean; message: string };

function transferablesOf(result: SimulationResult): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>();
  const add = (array: { buffer: ArrayBufferLike }) => {
    if (array.buffer instanceof ArrayBuffer) buffers.add(array.buffer);
  };
  for (const trace of result.receivers) [trace.pressure, trace.velocityX, trace.velocityY].forEach(add);
  for (const snapshot of result.snapshots) add(snapshot.values);
  add(result.finalPressure.values);
  if (result.levelMaps) [result.levelMaps.peak.values, result.levelMaps.rms.values].forEach(add);
  add(result.solidMask);
  return [...buffers];
}

/** Below this many cells per thread the barrier costs more than the strip saves. */
const minimumCellsPerThread = 64 * 1024;

/** A kernel over helper workers (nested in this one), or undefined to step on this thread alone. */
function parallelKernel(scene: unknown, threads: number): { provider: ParallelKernelProvider; ready: Promise<void>; end: () => void } | undefined {
  const grid = deriveGrid(parseSceneOrThrow(scene));
  const useful = Math.min(threads, Math.floor(grid.cellCount / minimumCellsPerThread));
  if (!globalThis.crossOriginIsolated || useful < 2) return undefined;
  const helpers: Worker[] = [];
  const readiness: Promise<void>[] = [];
  const provider = parallelKernelProvider({
    threads: useful,
    rows: grid.ny,
    startHelper: (init) => {
      const helper = new Worker(new URL("./strip-helper.worker.ts", import.meta.url), { type: "module", name: "rarefact-strip" });
      readiness.push(
        new Promise((resolve, reject) => {
          helper.onmessage = () => resolve();
          helper.onerror = (event) => reject(new Error(`a helper worker failed to start: ${event.message}`));
        }),
      );
      helper.postMessage(init);
      helpers.push(helper);
    },
  });
  return {
    provider,
    ready: Promise.resolve().then(() => Promise.all(readiness)).then(() => undefined),
    end: () => {
      provider.release();
      // Helpers leave their loop on release; terminate is the backstop that frees them in any case.
      setTimeout(() => helpers.forEach((helper) => helper.terminate()), 1000);
    },
  };
}

/** The running simulation's control word as this worker sees it (a copy, when not shared). */
let activeControl: RunControl | null = null;

const api = {
  async run(scene: unknown, control: RunControl, callbacks: WorkerRunCallbacks, threads = 1, frameIntervalMs = 60): Promise<WorkerRunOutcome> {
    activeControl = control;
    const parallel = parallelKernel(scene, threads);
    try {
      const simulation = new Simulation(scene, parallel ? { kernel: parallel.provider } : {});
      // Nested workers start only while this one's event loop runs: wait for them before blocking.
      if (parallel) await parallel.ready;
      callbacks.onStart({ kernel: simulation.kernel.name, threads: parallel?.provider.threads ?? 1 });
      const started = performance.now();
      let lastFrame = 0;
      const options = {
        // Small chunks keep pause/cancel and the live view responsive; progress costs nothing per step.
        progressInterval: Math.max(1, Math.min(200, Math.ceil(simulation.grid.steps / 400))),
        isCancelled: () => waitWhilePaused(control),
        onProgress: (progress: ProgressReport) => {
          const elapsed = (performance.now() - started) / 1000;
          callbacks.onProgress({ ...progress, cellUpdatesPerSecond: elapsed > 0 ? (progress.step * simulation.grid.cellCount) / elapsed : 0 });
          const now = performance.now();
          if (now - lastFrame >= frameIntervalMs) {
            lastFrame = now;
            const frame = simulation.snapshot(1);
            callbacks.onFrame(Comlink.transfer(frame, [frame.values.buffer as ArrayBuffer]));
          }
        },
      };
      // Without a shared control word, pause/cancel arrive as messages: yield between chunks.
      const result = control.word.buffer instanceof ArrayBuffer ? await simulation.runAsync(options) : simulation.run(options);
      return Comlink.transfer({ ok: true as const, result }, transferablesOf(result));
    } catch (error) {
      const unstable = error instanceof SimulationInstabilityError;
      return { ok: false, unstable, message: error instanceof Error ? error.message : String(error) };
    } finally {
      parallel?.end();
      activeControl = null;
    }
  },

  /** For the plain-buffer fallback, where the page cannot write into the worker's copy of the control word. */
  setState(state: number): void {
    if (activeControl) activeControl.word[0] = state;
  },

  state(): number {
    return activeControl ? readRunState(activeControl) : RunState.running;
  },
};

export type SimulationWorkerApi = typeof api;
export { RunState };

Comlink.expose(api);
