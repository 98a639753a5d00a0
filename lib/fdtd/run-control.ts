// Pause, resume and cancel for a run stepping in another thread. The controlling thread writes a
// state word; the stepping thread polls it between chunks of steps. Over a SharedArrayBuffer the
// stepping thread can block while paused (Atomics.wait) instead of spinning; over a plain buffer
// (no cross-origin isolation) the caller must yield between chunks so that messages get through.

export const RunState = { running: 0, paused: 1, cancelled: 2 } as const;
export type RunStateValue = (typeof RunState)[keyof typeof RunState];

export interface RunControl {
  /** One Int32 state word; shared between threads when it lives in a SharedArrayBuffer. */
  readonly word: Int32Array;
}

export function createRunControl(shared: boolean): RunControl {
  const buffer = shared ? new SharedArrayBuffer(4) : new ArrayBuffer(4);
  return { word: new Int32Array(buffer) };
}

export function isShared(control: RunControl): boolean {
  return typeof SharedArrayBuffer !== "undefined" && control.word.buffer instanceof SharedArrayBuffer;
}

export function setRunState(control: RunControl, state: RunStateValue): void {
  if (isShared(control)) {
    Atomics.store(control.word, 0, state);
    Atomics.notify(control.word, 0);
  } else {
    control.word[0] = state;
  }
}

export function readRunState(control: RunControl): RunStateValue {
  return (isShared(control) ? Atomics.load(control.word, 0) : control.word[0]!) as RunStateValue;
}

/**
 * For RunOptions.isCancelled in the stepping thread: blocks while paused (shared control only;
 * a thread that may block, i.e. a worker), then reports whether the run was cancelled.
 */
export function waitWhilePaused(control: RunControl): boolean {
  if (isShared(control)) {
    while (Atomics.load(control.word, 0) === RunState.paused) Atomics.wait(control.word, 0, RunState.paused, 500);
  }
  return readRunState(control) === RunState.cancelled;
}
