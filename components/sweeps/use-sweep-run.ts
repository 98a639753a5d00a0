"use client";
// Runs a planned sweep in this browser, one scene at a time in its own worker: each reference before
// the cases that need it, then the cases in order. The result is recomputed after every run, so a
// cancelled sweep keeps what finished. Leaving the page cancels the run in progress.
import { useCallback, useEffect, useRef, useState } from "react";
import type { PressureTrace } from "@/lib/analysis/band-levels";
import type { SweepDefinition, SweepResults } from "@/lib/validation/blocks";
import { runSceneInWorker } from "@/components/run/run-in-worker";
import { pickTraces, sweepInsertionLoss, type CaseState } from "@/lib/sweeps/sweep-insertion-loss";
import type { PlannedRun, SweepPlan } from "@/lib/sweeps/sweep-plan";

export interface SweepJob {
  plan: SweepPlan;
  definition: SweepDefinition;
  receivers: { id: string; label: string }[];
  highestResolvedFrequency: number;
}

export type SweepRunPhase =
  | { phase: "idle" }
  | {
      phase: "running";
      /** Index in plan.runs of the run stepping now. */
      runIndex: number;
      run: PlannedRun;
      /** Of the whole sweep, 0..1. */
      fraction: number;
      /** Latest stepping rate, cell updates per second (from the running worker). */
      cellUpdatesPerSecond: number | null;
      startedAt: number;
    }
  | { phase: "finished" | "cancelled"; seconds: number }
  | { phase: "failed"; message: string };

export interface SweepRunState {
  status: SweepRunPhase;
  job: SweepJob | null;
  results: SweepResults | null;
  /** Rate measured by the last finished run, for the next estimate. */
  measuredRate: number | null;
}

function isAbort(error: unknown): boolean {
  return error instanceof DOMException && error.name === "AbortError";
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

export function useSweepRun() {
  const [state, setState] = useState<SweepRunState>({ status: { phase: "idle" }, job: null, results: null, measuredRate: null });
  const controller = useRef<AbortController | null>(null);

  useEffect(() => () => controller.current?.abort(), []);

  const start = useCallback(async (job: SweepJob) => {
    controller.current?.abort();
    const abort = new AbortController();
    controller.current = abort;
    const { plan, definition, receivers } = job;
    const values = plan.runs.flatMap((run) => (run.kind === "case" ? [run.value!] : []));
    const cases: CaseState[] = values.map(() => ({ status: "not-run" }));
    const references = new Map<string, PressureTrace[]>();
    const failedReferences = new Map<string, string>();
    const startedAt = performance.now();
    const analyse = () =>
      sweepInsertionLoss({
        values,
        cases,
        references,
        receivers,
        bandsPerOctave: definition.bandsPerOctave,
        weighting: definition.weighting,
        highestResolvedFrequency: job.highestResolvedFrequency,
        completedAt: new Date().toISOString(),
      });
    setState((previous) => ({ ...previous, job, results: null, status: { phase: "running", runIndex: 0, run: plan.runs[0]!, fraction: 0, cellUpdatesPerSecond: null, startedAt } }));

    let cancelled = false;
    for (const [runIndex, run] of plan.runs.entries()) {
      if (abort.signal.aborted) {
        cancelled = true;
        break;
      }
      const caseIndex = run.caseIndex ?? -1;
      const referenceProblem = run.referenceId ? failedReferences.get(run.referenceId) : undefined;
      if (run.kind === "case" && referenceProblem !== undefined) {
        cases[caseIndex] = { status: "failed", message: `its reference run failed: ${referenceProblem}` };
        continue;
      }
      setState((previous) => ({ ...previous, status: { phase: "running", runIndex, run, fraction: runIndex / plan.runs.length, cellUpdatesPerSecond: previous.status.phase === "running" ? previous.status.cellUpdatesPerSecond : null, startedAt } }));
      try {
        const { result } = await runSceneInWorker(run.scene, {
          signal: abort.signal,
          onProgress: (progress) =>
            setState((previous) =>
              previous.status.phase === "running" && previous.status.runIndex === runIndex
                ? { ...previous, status: { ...previous.status, fraction: (runIndex + progress.fraction) / plan.runs.length, cellUpdatesPerSecond: progress.cellUpdatesPerSecond || previous.status.cellUpdatesPerSecond } }
                : previous,
            ),
        });
        const traces = pickTraces(result.receivers, definition.receiverIds);
        if (run.kind === "reference") references.set(run.id, traces);
        else cases[caseIndex] = { status: "done", referenceId: run.referenceId!, traces };
        const rate = result.timings.cellUpdatesPerSecond;
        setState((previous) => ({ ...previous, results: analyse(), measuredRate: rate > 0 ? rate : previous.measuredRate }));
      } catch (error) {
        if (isAbort(error)) {
          cancelled = true;
          break;
        }
        if (run.kind === "reference") failedReferences.set(run.id, messageOf(error));
        else cases[caseIndex] = { status: "failed", message: messageOf(error) };
        setState((previous) => ({ ...previous, results: analyse() }));
      }
    }
    if (controller.current === abort) controller.current = null;
    const seconds = (performance.now() - startedAt) / 1000;
    const results = analyse();
    const anyDone = results.outcomes.some((outcome) => outcome.status === "done");
    if (!anyDone && !cancelled) {
      const reason = [...failedReferences.values()][0] ?? results.outcomes.find((o) => o.message)?.message ?? "no case finished";
      setState((previous) => ({ ...previous, results, status: { phase: "failed", message: `No case of the sweep could be computed: ${reason}` } }));
      return;
    }
    setState((previous) => ({ ...previous, results, status: { phase: cancelled ? "cancelled" : "finished", seconds } }));
  }, []);

  const cancel = useCallback(() => controller.current?.abort(), []);

  return { state, start, cancel };
}
