"use client";
// This computer's stepping rate for the run-time estimate: measured once per browser session in a
// Web Worker (a fraction of a second of stepping), then kept in sessionStorage. A small external
// store, so every editor on a page shares one measurement.
import { useMemo, useSyncExternalStore } from "react";

import type { StepRateMeasurement } from "./measure-step-rate";

const STORAGE_KEY = "rarefact.scene-editor.step-rate";

export type StepRateState =
  | { status: "given"; cellUpdatesPerSecond: number }
  | { status: "measuring" }
  | { status: "measured"; measurement: StepRateMeasurement }
  | { status: "unavailable"; reason: string };

const MEASURING: StepRateState = { status: "measuring" };
let snapshot: StepRateState = MEASURING;
let started = false;
const listeners = new Set<() => void>();

function publish(next: StepRateState): void {
  snapshot = next;
  for (const listener of listeners) listener();
}

function readStored(): StepRateMeasurement | null {
  try {
    const text = globalThis.sessionStorage?.getItem(STORAGE_KEY);
    if (!text) return null;
    const value = JSON.parse(text) as StepRateMeasurement;
    return value.cellUpdatesPerSecond > 0 ? value : null;
  } catch {
    return null;
  }
}

/** Starts the one measurement of this page, unless this session already has one. */
function start(): void {
  if (started) return;
  started = true;
  const stored = readStored();
  if (stored) {
    snapshot = { status: "measured", measurement: stored };
    return;
  }
  if (typeof Worker === "undefined") {
    snapshot = { status: "unavailable", reason: "this browser cannot run Web Workers" };
    return;
  }
  const worker = new Worker(new URL("./step-rate.worker.ts", import.meta.url), { type: "module", name: "rarefact-step-rate" });
  worker.onmessage = (event: MessageEvent<StepRateMeasurement>) => {
    worker.terminate();
    try {
      globalThis.sessionStorage?.setItem(STORAGE_KEY, JSON.stringify(event.data));
    } catch {
      // Storage may be disabled; the measurement still serves this page.
    }
    publish({ status: "measured", measurement: event.data });
  };
  worker.onerror = (event) => {
    worker.terminate();
    publish({ status: "unavailable", reason: event.message || "the measurement worker failed" });
  };
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  start();
  return () => listeners.delete(listener);
}

/** The rate to estimate with: `given` when the parent supplies one, otherwise measured here. */
export function useStepRate(given?: number): StepRateState {
  const measured = useSyncExternalStore(
    subscribe,
    () => snapshot,
    () => MEASURING,
  );
  const givenState = useMemo<StepRateState | null>(() => (given && given > 0 ? { status: "given", cellUpdatesPerSecond: given } : null), [given]);
  return givenState ?? measured;
}

export function rateOf(state: StepRateState): number | null {
  if (state.status === "given") return state.cellUpdatesPerSecond;
  if (state.status === "measured") return state.measurement.cellUpdatesPerSecond;
  return null;
}
