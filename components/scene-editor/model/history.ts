// Undo and redo over whole scenes. Scenes are immutable and share unchanged parts, so keeping a
// bounded list of them is cheap. A run of edits with the same `mergeKey` (one drag, one burst of
// typing in the code view) becomes a single step to undo.
import type { Scene } from "@/lib/fdtd/scene";

/** Steps kept for undo by default. */
export const DEFAULT_HISTORY_LIMIT = 200;

export interface History {
  readonly past: readonly Scene[];
  readonly present: Scene;
  readonly future: readonly Scene[];
  /** Most steps `past` may hold; the oldest are dropped beyond it. */
  readonly limit: number;
  /** Key of the edit that made `present`, while further edits with the same key may merge into it. */
  readonly mergeKey: string | null;
}

export function createHistory(present: Scene, limit = DEFAULT_HISTORY_LIMIT): History {
  return { past: [], present, future: [], limit: Math.max(1, Math.floor(limit)), mergeKey: null };
}

export interface RecordOptions {
  /**
   * Edits with the same non-null key in a row replace the present instead of adding a step, so the
   * whole run undoes at once. Use a key unique to one gesture (e.g. `drag-17`).
   */
  mergeKey?: string | null;
}

/** Records `next` as the new present. Identical scenes (same object) record nothing. Clears redo. */
export function record(history: History, next: Scene, options: RecordOptions = {}): History {
  if (next === history.present) return history;
  const mergeKey = options.mergeKey ?? null;
  if (mergeKey !== null && mergeKey === history.mergeKey && history.past.length > 0) {
    return { ...history, present: next, future: [] };
  }
  const past = [...history.past, history.present];
  if (past.length > history.limit) past.splice(0, past.length - history.limit);
  return { ...history, past, present: next, future: [], mergeKey };
}

export function canUndo(history: History): boolean {
  return history.past.length > 0;
}

export function canRedo(history: History): boolean {
  return history.future.length > 0;
}

export function undo(history: History): History {
  if (history.past.length === 0) return history;
  const previous = history.past[history.past.length - 1]!;
  return {
    ...history,
    past: history.past.slice(0, -1),
    present: previous,
    future: [history.present, ...history.future],
    mergeKey: null,
  };
}

export function redo(history: History): History {
  if (history.future.length === 0) return history;
  const [next, ...rest] = history.future;
  return {
    ...history,
    past: [...history.past, history.present],
    present: next!,
    future: rest,
    mergeKey: null,
  };
}

/** Ends any merging run: the next edit starts a new step even if it reuses the key. */
export function closeMergeRun(history: History): History {
  return history.mergeKey === null ? history : { ...history, mergeKey: null };
}

/** Starts over from `present` (a scene loaded from elsewhere); nothing to undo or redo. */
export function resetHistory(history: History, present: Scene): History {
  return createHistory(present, history.limit);
}
