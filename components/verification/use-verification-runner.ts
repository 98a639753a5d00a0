"use client";
// Runs verification cases in Web Workers, one at a time and in the order asked, with progress per
// case. Each case gets a fresh worker that is ended afterwards; cancelling ends the running worker at
// once (a case's loops never yield, so a message could not stop them) and empties the queue.
import * as Comlink from "comlink";
import { useCallback, useEffect, useRef, useState } from "react";
import type { VerificationOutcome, VerificationProgress } from "@/lib/verification/cases";
import type { VerificationWorkerApi } from "@/workers/verification.worker";

export type CaseRunState =
  | { status: "idle" }
  | { status: "queued" }
  | { status: "running"; progress: VerificationProgress; startedAt: number }
  | { status: "done"; outcome: VerificationOutcome; kernel: string; wallSeconds: number }
  | { status: "failed"; message: string; wallSeconds: number }
  | { status: "cancelled" };

const IDLE: CaseRunState = { status: "idle" };

class CaseCancelled extends Error {}

interface Current {
  caseId: string;
  worker: Worker;
  cancel: () => void;
}

export function useVerificationRunner() {
  const [states, setStates] = useState<Readonly<Record<string, CaseRunState>>>({});
  const queue = useRef<string[]>([]);
  const current = useRef<Current | null>(null);
  const pumping = useRef(false);
  const set = useCallback((caseId: string, state: CaseRunState) => setStates((previous) => ({ ...previous, [caseId]: state })), []);

  /** Runs one case in a fresh worker to its end, its failure or its cancellation. */
  const runOne = useCallback(
    async (caseId: string): Promise<void> => {
      const worker = new Worker(new URL("../../workers/verification.worker.ts", import.meta.url), { type: "module", name: "rarefact-verification" });
      const api = Comlink.wrap<VerificationWorkerApi>(worker);
      let stop: () => void = () => {};
      const stopped = new Promise<never>((_, reject) => {
        stop = () => reject(new CaseCancelled());
        worker.addEventListener("error", (event) => reject(new Error(event.message || "The verification worker failed to start.")));
      });
      current.current = { caseId, worker, cancel: stop };
      const startedAt = performance.now();
      set(caseId, { status: "running", progress: { fraction: 0, stage: "starting the worker" }, startedAt });
      try {
        const onProgress = Comlink.proxy((progress: VerificationProgress) => {
          if (current.current?.worker === worker) set(caseId, { status: "running", progress, startedAt });
        });
        const { outcome, kernel } = await Promise.race([api.run(caseId, onProgress), stopped]);
        set(caseId, { status: "done", outcome, kernel, wallSeconds: (performance.now() - startedAt) / 1000 });
      } catch (error) {
        if (error instanceof CaseCancelled) set(caseId, { status: "cancelled" });
        else set(caseId, { status: "failed", message: error instanceof Error ? error.message : String(error), wallSeconds: (performance.now() - startedAt) / 1000 });
      } finally {
        worker.terminate();
        if (current.current?.worker === worker) current.current = null;
      }
    },
    [set],
  );

  /** Works through the queue; a second call while it runs only adds to what the first will reach. */
  const pump = useCallback(async (): Promise<void> => {
    if (pumping.current) return;
    pumping.current = true;
    try {
      for (let caseId = queue.current.shift(); caseId !== undefined; caseId = queue.current.shift()) await runOne(caseId);
    } finally {
      pumping.current = false;
    }
  }, [runOne]);

  /** Queues cases (those already queued or running stay where they are) and starts the queue. */
  const run = useCallback(
    (caseIds: readonly string[]) => {
      for (const caseId of caseIds) {
        if (current.current?.caseId === caseId || queue.current.includes(caseId)) continue;
        queue.current.push(caseId);
        set(caseId, { status: "queued" });
      }
      void pump();
    },
    [pump, set],
  );

  /** Stops the running case and drops the queued ones. */
  const cancel = useCallback(() => {
    const dropped = queue.current.splice(0);
    for (const caseId of dropped) set(caseId, { status: "cancelled" });
    const running = current.current;
    if (running) {
      current.current = null;
      running.worker.terminate();
      running.cancel();
    }
  }, [set]);

  // Leaving the page ends any running worker.
  useEffect(() => () => cancel(), [cancel]);

  const busy = Object.values(states).some((state) => state.status === "running" || state.status === "queued");
  const stateOf = useCallback((caseId: string): CaseRunState => states[caseId] ?? IDLE, [states]);
  return { states, stateOf, run, cancel, busy };
}
