// Starts one job's executor thread and follows it. The thread file is found from process.cwd() at run
// time (not imported), so Next's bundler leaves it alone and tsx loads it in the thread.
import "server-only";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { RunState, createRunControl, setRunState } from "@/lib/fdtd/run-control";
import type { ExecutorInput, ExecutorMessage, ExecutorOutcome } from "./executor-protocol";

export interface ExecutionHandle {
  /** Settles once the thread has ended, whatever happened in it. */
  outcome: Promise<ExecutorOutcome>;
  /** Asks the thread to stop at its next chunk of steps (it answers "cancelled"). */
  cancel(): void;
}

export interface ExecutionCallbacks {
  onStart?: (info: { kernel: string; threads: number }) => void;
  onProgress?: (progress: { fraction: number; cellUpdatesPerSecond: number }) => void;
}

function executorScript(): string {
  return path.join(/*turbopackIgnore: true*/ process.cwd(), "scripts", "run-queue-executor.bootstrap.mjs");
}

export function executeInThread(input: Omit<ExecutorInput, "control">, callbacks: ExecutionCallbacks = {}): ExecutionHandle {
  const control = createRunControl(true);
  const workerData: ExecutorInput = { ...input, control: control.word.buffer as SharedArrayBuffer };
  const worker = new Worker(executorScript(), { workerData, name: "rarefact-run" });
  const outcome = new Promise<ExecutorOutcome>((resolve) => {
    let settled = false;
    const settle = (value: ExecutorOutcome) => {
      if (settled) return;
      settled = true;
      resolve(value);
    };
    worker.on("message", (message: ExecutorMessage) => {
      if (message.type === "start") callbacks.onStart?.({ kernel: message.kernel, threads: message.threads });
      else if (message.type === "progress") callbacks.onProgress?.({ fraction: message.fraction, cellUpdatesPerSecond: message.cellUpdatesPerSecond });
      else settle(message.outcome);
    });
    worker.on("error", (error) => settle({ kind: "failed", message: `the run's thread failed: ${error.message}`, retryable: true }));
    worker.on("exit", (code) => settle({ kind: "failed", message: `the run's thread ended (exit code ${code}) before it answered`, retryable: true }));
  });
  return {
    outcome,
    cancel: () => setRunState(control, RunState.cancelled),
  };
}
