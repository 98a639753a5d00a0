"use client";
// Runs a scene in a Web Worker and exposes its progress, live frames and result to React.
// The page never steps the solver itself, so typing, scrolling and drawing stay responsive.
import * as Comlink from "comlink";
import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from "react";
import { createRunControl, RunState, setRunState, type RunControl } from "@/lib/fdtd/run-control";
import type { FieldSnapshot, ProgressReport, SimulationResult } from "@/lib/fdtd/simulation";
import type { SimulationWorkerApi } from "@/workers/simulation.worker";
import { browserRunThreads } from "./run-in-worker";

export type RunPhase = "idle" | "starting" | "running" | "paused" | "finished" | "cancelled" | "failed";

export interface RunProgress extends ProgressReport {
  cellUpdatesPerSecond: number;
  /** Wall-clock seconds since the start, pauses excluded. */
  elapsedSeconds: number;
  /** Estimated wall-clock seconds to the end at the current rate. */
  remainingSeconds: number | null;
}

export interface BrowserRunState {
  phase: RunPhase;
  progress: RunProgress | null;
  frame: FieldSnapshot | null;
  result: SimulationResult | null;
  error: { message: string; unstable: boolean } | null;
  /** False when the page is not cross-origin isolated: one worker, pause/cancel between chunks. */
  isolated: boolean;
  /** The kernel and thread count the run uses, once it has started. */
  engine: { kernel: string; threads: number } | null;
}

const initialState = (isolated: boolean): BrowserRunState => ({ phase: "idle", progress: null, frame: null, result: null, error: null, isolated, engine: null });

export function useBrowserRun() {
  const [state, setState] = useState<BrowserRunState>(() => initialState(true));
  const worker = useRef<Worker | null>(null);
  const api = useRef<Comlink.Remote<SimulationWorkerApi> | null>(null);
  const control = useRef<RunControl | null>(null);
  const pendingFrame = useRef<FieldSnapshot | null>(null);
  const frameRequest = useRef<number | null>(null);
  const timing = useRef({ started: 0, pausedAt: 0, pausedTotal: 0 });

  // Known only in the browser; the server render assumes isolation so the notice does not flash.
  const isolated = useSyncExternalStore(
    () => () => {},
    () => globalThis.crossOriginIsolated === true,
    () => true,
  );

  const release = useCallback(() => {
    api.current?.[Comlink.releaseProxy]();
    worker.current?.terminate();
    worker.current = null;
    api.current = null;
    control.current = null;
    if (frameRequest.current !== null) cancelAnimationFrame(frameRequest.current);
    frameRequest.current = null;
  }, []);

  useEffect(() => release, [release]);

  const start = useCallback(
    async (scene: unknown) => {
      release();
      const isolated = globalThis.crossOriginIsolated === true;
      setState({ ...initialState(isolated), phase: "starting" });
      const created = new Worker(new URL("../../workers/simulation.worker.ts", import.meta.url), { type: "module", name: "rarefact-simulation" });
      worker.current = created;
      api.current = Comlink.wrap<SimulationWorkerApi>(created);
      control.current = createRunControl(isolated);
      timing.current = { started: performance.now(), pausedAt: 0, pausedTotal: 0 };

      const showFrame = () => {
        frameRequest.current = null;
        const frame = pendingFrame.current;
        pendingFrame.current = null;
        if (frame) setState((previous) => ({ ...previous, frame }));
      };
      const callbacks = Comlink.proxy({
        onStart: (engine: { kernel: string; threads: number }) => setState((previous) => ({ ...previous, engine })),
        onProgress: (progress: ProgressReport & { cellUpdatesPerSecond: number }) => {
          const { started, pausedTotal } = timing.current;
          const elapsedSeconds = (performance.now() - started - pausedTotal) / 1000;
          const remainingSeconds = progress.fraction > 0.005 ? (elapsedSeconds * (1 - progress.fraction)) / progress.fraction : null;
          setState((previous) => ({
            ...previous,
            phase: previous.phase === "starting" ? "running" : previous.phase,
            progress: { ...progress, elapsedSeconds, remainingSeconds },
          }));
        },
        onFrame: (frame: FieldSnapshot) => {
          // Several frames may arrive between two paints: draw only the newest.
          pendingFrame.current = frame;
          frameRequest.current ??= requestAnimationFrame(showFrame);
        },
      });

      const outcome = await api.current.run(scene, control.current, callbacks, browserRunThreads());
      release();
      if (outcome.ok) {
        const phase: RunPhase = outcome.result.stoppedBy === "cancelled" ? "cancelled" : "finished";
        setState((previous) => ({ ...previous, phase, result: outcome.result, frame: outcome.result.finalPressure }));
      } else {
        setState((previous) => ({ ...previous, phase: "failed", error: { message: outcome.message, unstable: outcome.unstable } }));
      }
    },
    [release],
  );

  const sendState = useCallback((runState: (typeof RunState)[keyof typeof RunState]) => {
    const current = control.current;
    if (!current) return;
    if (current.word.buffer instanceof ArrayBuffer) void api.current?.setState(runState);
    else setRunState(current, runState);
  }, []);

  const pause = useCallback(() => {
    sendState(RunState.paused);
    timing.current.pausedAt = performance.now();
    setState((previous) => (previous.phase === "running" ? { ...previous, phase: "paused" } : previous));
  }, [sendState]);

  const resume = useCallback(() => {
    sendState(RunState.running);
    if (timing.current.pausedAt) timing.current.pausedTotal += performance.now() - timing.current.pausedAt;
    timing.current.pausedAt = 0;
    setState((previous) => (previous.phase === "paused" ? { ...previous, phase: "running" } : previous));
  }, [sendState]);

  const cancel = useCallback(() => {
    sendState(RunState.cancelled);
  }, [sendState]);

  return { state: { ...state, isolated }, start, pause, resume, cancel };
}
