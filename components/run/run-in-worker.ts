// One scene run in a Web Worker without any React state: for work that runs several scenes in turn
// (a reference run made on request, the cases of a sweep). useBrowserRun is the interactive version
// with live frames, pause and resume.
import * as Comlink from "comlink";
import { createRunControl, RunState, setRunState } from "@/lib/fdtd/run-control";
import type { ProgressReport, SimulationResult } from "@/lib/fdtd/simulation";
import type { SimulationWorkerApi } from "@/workers/simulation.worker";

/** Threads for one run: the machine's cores, capped (the page and the browser need some too). */
export const MAXIMUM_RUN_THREADS = 8;

export function browserRunThreads(): number {
  return globalThis.crossOriginIsolated === true ? Math.max(1, Math.min(MAXIMUM_RUN_THREADS, navigator.hardwareConcurrency || 1)) : 1;
}

export interface WorkerRunOptions {
  onProgress?: (progress: ProgressReport & { cellUpdatesPerSecond: number }) => void;
  /** Aborting cancels the run at its next check; the promise then rejects with an AbortError. */
  signal?: AbortSignal;
}

export class RunFailedError extends Error {
  constructor(
    message: string,
    readonly unstable: boolean,
  ) {
    super(message);
    this.name = "RunFailedError";
  }
}

/** Runs `scene` to the end in a new worker, which is ended afterwards whatever happens. */
export async function runSceneInWorker(scene: unknown, options: WorkerRunOptions = {}): Promise<{ result: SimulationResult; threads: number }> {
  if (options.signal?.aborted) throw new DOMException("The run was cancelled before it started.", "AbortError");
  const isolated = globalThis.crossOriginIsolated === true;
  const worker = new Worker(new URL("../../workers/simulation.worker.ts", import.meta.url), { type: "module", name: "rarefact-simulation" });
  const api = Comlink.wrap<SimulationWorkerApi>(worker);
  const control = createRunControl(isolated);
  let threads = 1;
  const cancel = () => {
    if (control.word.buffer instanceof ArrayBuffer) void api.setState(RunState.cancelled);
    else setRunState(control, RunState.cancelled);
  };
  options.signal?.addEventListener("abort", cancel);
  try {
    const callbacks = Comlink.proxy({
      onStart: (engine: { kernel: string; threads: number }) => {
        threads = engine.threads;
      },
      onProgress: (progress: ProgressReport & { cellUpdatesPerSecond: number }) => options.onProgress?.(progress),
      onFrame: () => undefined,
    });
    // No live frames: nobody watches this run's field while it steps.
    const outcome = await api.run(scene, control, callbacks, browserRunThreads(), Infinity);
    if (!outcome.ok) throw new RunFailedError(outcome.message, outcome.unstable);
    if (outcome.result.stoppedBy === "cancelled") throw new DOMException("The run was cancelled.", "AbortError");
    return { result: outcome.result, threads };
  } finally {
    options.signal?.removeEventListener("abort", cancel);
    api[Comlink.releaseProxy]();
    worker.terminate();
  }
}
