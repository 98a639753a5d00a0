// The lock-step protocol between one coordinating thread and the helper threads that step the
// other strips of the same grid. One small Int32Array in shared memory carries it:
//   [COMMAND]    what to do next (sweep, flush, quit)
//   [GENERATION] bumped by the coordinator for every phase; helpers wait for it to change
//   [DONE]       helpers that finished the current phase
//   [READY]      helpers that have built their kernel
//   [FAILED]     1 when a helper threw; the coordinator then stops with an error
// A phase: the coordinator writes the command, bumps the generation and wakes the helpers, steps its
// own strip, then waits until DONE equals the helper count. That barrier is what keeps the halo rows
// of neighbouring strips consistent.

export const StripCommand = { sweep: 1, flush: 3, quit: 4 } as const;
export type StripCommandValue = (typeof StripCommand)[keyof typeof StripCommand];

const COMMAND = 0;
const GENERATION = 1;
const DONE = 2;
const READY = 3;
const FAILED = 4;
const WORDS = 5;

export function createStripSync(): Int32Array {
  return new Int32Array(new SharedArrayBuffer(WORDS * 4));
}

/** Waits (blocking) until sync[index] reaches `target`; throws after `timeoutMs` or when a helper failed. */
function waitForCount(sync: Int32Array, index: number, target: number, timeoutMs: number): void {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = Atomics.load(sync, index);
    if (Atomics.load(sync, FAILED) !== 0) throw new Error("a helper thread of the parallel run failed; see its error above");
    if (value >= target) return;
    if (Date.now() > deadline) throw new Error(`the helper threads did not answer within ${Math.round(timeoutMs / 1000)} s`);
    Atomics.wait(sync, index, value, 100);
  }
}

/** Coordinator: blocks until every helper has built its kernel. */
export function awaitHelpersReady(sync: Int32Array, helperCount: number, timeoutMs = 60_000): void {
  waitForCount(sync, READY, helperCount, timeoutMs);
}

/** Coordinator: runs one phase on every strip (its own by `runOwnStrip`) and returns when all are done. */
export function runPhase(sync: Int32Array, helperCount: number, command: StripCommandValue, runOwnStrip: () => void): void {
  Atomics.store(sync, DONE, 0);
  Atomics.store(sync, COMMAND, command);
  Atomics.add(sync, GENERATION, 1);
  Atomics.notify(sync, GENERATION);
  runOwnStrip();
  if (helperCount > 0) waitForCount(sync, DONE, helperCount, 600_000);
}

/** Coordinator: tells the helpers to leave their loop. */
export function releaseHelpers(sync: Int32Array): void {
  Atomics.store(sync, COMMAND, StripCommand.quit);
  Atomics.add(sync, GENERATION, 1);
  Atomics.notify(sync, GENERATION);
}

export interface StripOperations {
  sweep(): void;
  flush(): void;
}

/** Helper: announces readiness, then steps its strip for every phase until told to quit. */
export function serveStrip(sync: Int32Array, operations: StripOperations): void {
  let seen = Atomics.load(sync, GENERATION);
  Atomics.add(sync, READY, 1);
  Atomics.notify(sync, READY);
  for (;;) {
    Atomics.wait(sync, GENERATION, seen);
    const generation = Atomics.load(sync, GENERATION);
    if (generation === seen) continue;
    seen = generation;
    const command = Atomics.load(sync, COMMAND);
    if (command === StripCommand.quit) return;
    try {
      if (command === StripCommand.sweep) operations.sweep();
      else if (command === StripCommand.flush) operations.flush();
    } catch (error) {
      Atomics.store(sync, FAILED, 1);
      Atomics.notify(sync, DONE);
      throw error;
    }
    Atomics.add(sync, DONE, 1);
    Atomics.notify(sync, DONE);
  }
}
