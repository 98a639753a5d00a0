"use client";
// Results of the runs made in this tab, kept per scene until the page is closed, so that a variant
// can be compared with its reference (insertion-loss map) before runs are saved.
import { useSyncExternalStore } from "react";
import type { SimulationResult } from "@/lib/fdtd/simulation";

export interface SessionRun {
  sceneId: string;
  sceneName: string;
  isReference: boolean;
  result: SimulationResult;
  finishedAt: number;
}

let runs: ReadonlyMap<string, SessionRun> = new Map();
const listeners = new Set<() => void>();

export function rememberSessionRun(run: SessionRun): void {
  const next = new Map(runs);
  next.set(run.sceneId, run);
  runs = next;
  listeners.forEach((listener) => listener());
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

const empty: ReadonlyMap<string, SessionRun> = new Map();

export function useSessionRuns(): ReadonlyMap<string, SessionRun> {
  return useSyncExternalStore(
    subscribe,
    () => runs,
    () => empty,
  );
}

/** Two runs can be subtracted cell by cell only when their level maps cover the same grid. */
export function sameGrid(a: SimulationResult, b: SimulationResult): boolean {
  const pa = a.levelMaps?.peak;
  const pb = b.levelMaps?.peak;
  return !!pa && !!pb && pa.width === pb.width && pa.height === pb.height && Math.abs(pa.spacing - pb.spacing) < 1e-12;
}
