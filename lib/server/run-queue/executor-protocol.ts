// What the main thread and the executor thread (scripts/run-queue-executor.thread.ts) say to each
// other. The main thread does every database write; the executor thread only steps the scene.
import type { RunSettings } from "@/lib/run-record/settings";

export interface ExecutorInput {
  /** The frozen scene of the job (parsed; parsed again in the thread). */
  scene: unknown;
  sceneVersion: number;
  settings: RunSettings;
  /** "run": the encoded payload of a plain run; "sweep": the chosen receivers' traces. */
  mode: "run" | "sweep";
  receiverIds: string[];
  /** Threads at most; fewer when the grid is too small for them to pay. */
  threads: number;
  /** One Int32 run-state word (lib/fdtd/run-control.ts) over a SharedArrayBuffer. */
  control: SharedArrayBuffer;
}

export type ExecutorMessage =
  | { type: "start"; kernel: string; threads: number }
  | { type: "progress"; fraction: number; step: number; cellUpdatesPerSecond: number }
  | { type: "done"; outcome: ExecutorOutcome };

export type ExecutorOutcome =
  | { kind: "payload"; bytes: Uint8Array; cellUpdatesPerSecond: number }
  | { kind: "traces"; bytes: Uint8Array; cellUpdatesPerSecond: number }
  | { kind: "cancelled" }
  /** retryable: false when running again would fail the same way (an unstable or unsavable run). */
  | { kind: "failed"; message: string; retryable: boolean };
