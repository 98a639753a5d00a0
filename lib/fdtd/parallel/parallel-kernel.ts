// A kernel provider that steps one simulation on several threads: the state lives in shared
// memory, the grid is split into horizontal strips, and the sweep and flush phases of a step run on
// all strips at once with a barrier after each (strip-sync.ts); the one-row finishing phase runs on
// this thread alone. Helper threads are started by the platform (browser Workers or Node
// worker_threads) through `startHelper`. Fields are bit-identical to a single-thread run: the same
// operations on the same rows.
import type { StepKernel } from "../kernel";
import { createTypeScriptKernel } from "../kernel";
import type { KernelProvider } from "../kernel-provider";
import { splitRows } from "../simulation";
import { createKernelMemory, createWasmKernel, wasmKernelSupported } from "../wasm/wasm-kernel";
import { awaitHelpersReady, createStripSync, releaseHelpers, runPhase, StripCommand } from "./strip-sync";

export type StripKernelKind = "wasm-simd" | "typescript";

/** What a helper thread needs to step its strip; every member can be posted to a worker. */
export interface StripHelperInit {
  kernelKind: StripKernelKind;
  /** The shared WebAssembly memory (wasm kernel) ... */
  memory?: WebAssembly.Memory;
  /** ... or the shared state buffer (TypeScript kernel). */
  buffer?: SharedArrayBuffer;
  sync: Int32Array;
  strip: [number, number];
}

export interface ParallelKernelOptions {
  /** Threads in all, the coordinating one included (at least 1). */
  threads: number;
  /** Rows of the grid, to split into strips. */
  rows: number;
  /** Starts one helper thread with its init message (e.g. posts it to a new Worker). */
  startHelper: (init: StripHelperInit) => void;
  /** Which kernel every thread runs; the WebAssembly one where the runtime supports shared memory. */
  kernelKind?: StripKernelKind;
}

export interface ParallelKernelProvider extends KernelProvider {
  /** Tells the helper threads to stop; call when the run is over (the platform then ends them). */
  release(): void;
  readonly threads: number;
}

/** A strip helper: builds its kernel over the shared state (call from the helper thread). */
export function createStripKernel(init: StripHelperInit): StepKernel {
  if (init.kernelKind === "wasm-simd") return createWasmKernel(init.memory!, true);
  return createTypeScriptKernel(init.buffer!);
}

export function parallelKernelProvider(options: ParallelKernelOptions): ParallelKernelProvider {
  const kernelKind: StripKernelKind = options.kernelKind ?? (wasmKernelSupported(true) ? "wasm-simd" : "typescript");
  const strips = splitRows(options.rows, Math.max(1, Math.min(options.threads, Math.floor(options.rows / 8) || 1)));
  const helperCount = strips.length - 1;
  const sync = createStripSync();
  const memories = new WeakMap<ArrayBufferLike, WebAssembly.Memory>();
  let released = false;

  const release = () => {
    if (released) return;
    released = true;
    releaseHelpers(sync);
  };

  return {
    name: `${kernelKind} x${strips.length}`,
    threads: strips.length,
    release,
    allocate(byteLength) {
      if (kernelKind === "wasm-simd") {
        const memory = createKernelMemory(byteLength, true);
        memories.set(memory.buffer, memory);
        return memory.buffer;
      }
      return new SharedArrayBuffer(byteLength);
    },
    create(buffer) {
      const memory = memories.get(buffer);
      const own = kernelKind === "wasm-simd" ? createWasmKernel(memory!, true) : createTypeScriptKernel(buffer);
      const [ownStrip, ...helperStrips] = strips as [[number, number], ...[number, number][]];
      for (const strip of helperStrips) {
        options.startHelper({
          kernelKind,
          ...(kernelKind === "wasm-simd" ? { memory: memory! } : { buffer: buffer as SharedArrayBuffer }),
          sync,
          strip,
        });
      }
      let ready = helperCount === 0;
      const phase = (command: (typeof StripCommand)["sweep" | "flush"], runOwn: () => void) => {
        if (!ready) {
          awaitHelpersReady(sync, helperCount);
          ready = true;
        }
        runPhase(sync, helperCount, command, runOwn);
      };
      // Simulation.advance calls each phase once for the whole grid; the strips are this kernel's business.
      return {
        name: `${own.name} x${strips.length}`,
        sweepStrip: () => phase(StripCommand.sweep, () => own.sweepStrip(ownStrip[0], ownStrip[1])),
        // Finishing is one pressure row per strip: cheaper for this thread to do them all than to
        // pay a second barrier every step (the helpers are idle at the barrier after the sweep anyway).
        finishStrip: () => {
          for (const [y0, y1] of strips) own.finishStrip(y0, y1);
        },
        flushStrip: () => phase(StripCommand.flush, () => own.flushStrip(ownStrip[0], ownStrip[1])),
      };
    },
  };
}
