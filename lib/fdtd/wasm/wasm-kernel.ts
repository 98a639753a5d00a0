// Loads the WebAssembly SIMD kernel (built by scripts/fdtd-build-wasm.ts, embedded as base64) and wraps
// it as a StepKernel over a WebAssembly memory that holds the whole simulation state. Works in Node and
// in a Web Worker; nothing is fetched.
import type { StepKernel } from "../kernel";
import type { KernelProvider } from "../kernel-provider";
import { KERNEL_SHARED_WASM_BASE64, KERNEL_WASM_BASE64 } from "./build/kernel-base64";

interface KernelExports {
  sweepStrip(y0: number, y1: number): void;
  finishStrip(y0: number, y1: number): void;
  flushStrip(y0: number, y1: number): void;
  parameterSlot(k: number): number;
}

const PAGE_BYTES = 65_536;
/** wasm32 memories hold at most 65536 pages (4 GiB). */
const MAX_PAGES = 65_536;

function decodeBase64(text: string): Uint8Array<ArrayBuffer> {
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let k = 0; k < binary.length; k++) bytes[k] = binary.charCodeAt(k);
  return bytes;
}

const modules: { plain?: WebAssembly.Module; shared?: WebAssembly.Module } = {};

const support: { plain?: boolean; shared?: boolean } = {};

/** Whether this runtime has WebAssembly with 128-bit SIMD (and, for `shared`, threads). Checked once. */
export function wasmKernelSupported(shared = false): boolean {
  const key = shared ? "shared" : "plain";
  if (support[key] === undefined) {
    try {
      support[key] = typeof WebAssembly !== "undefined" && WebAssembly.validate(decodeBase64(shared ? KERNEL_SHARED_WASM_BASE64 : KERNEL_WASM_BASE64));
    } catch {
      support[key] = false;
    }
  }
  return support[key];
}

/** Compiles the module once, asynchronously (needed on a browser's main thread, where sync compiles are limited). */
export async function loadWasmKernelModule(shared = false): Promise<WebAssembly.Module> {
  const key = shared ? "shared" : "plain";
  modules[key] ??= await WebAssembly.compile(decodeBase64(shared ? KERNEL_SHARED_WASM_BASE64 : KERNEL_WASM_BASE64));
  return modules[key]!;
}

function moduleSync(shared: boolean): WebAssembly.Module {
  const key = shared ? "shared" : "plain";
  modules[key] ??= new WebAssembly.Module(decodeBase64(shared ? KERNEL_SHARED_WASM_BASE64 : KERNEL_WASM_BASE64));
  return modules[key]!;
}

/** A memory large enough for `byteLength` bytes of state; shared memories can be posted to other workers. */
export function createKernelMemory(byteLength: number, shared = false): WebAssembly.Memory {
  const pages = Math.ceil(byteLength / PAGE_BYTES);
  if (pages > MAX_PAGES) throw new RangeError(`the state needs ${byteLength} bytes, more than a 4 GiB WebAssembly memory holds`);
  return new WebAssembly.Memory({ initial: pages, maximum: pages, shared });
}

/** The kernel's exports bound to a memory whose parameter block is written. */
export function instantiateWasmKernel(memory: WebAssembly.Memory, shared = false): KernelExports {
  const instance = new WebAssembly.Instance(moduleSync(shared), { env: { memory } });
  return instance.exports as unknown as KernelExports;
}

/** A StepKernel running the WebAssembly kernel on `memory`. */
export function createWasmKernel(memory: WebAssembly.Memory, shared = false): StepKernel {
  const exports = instantiateWasmKernel(memory, shared);
  return {
    name: "wasm-simd",
    sweepStrip: (y0, y1) => exports.sweepStrip(y0, y1),
    finishStrip: (y0, y1) => exports.finishStrip(y0, y1),
    flushStrip: (y0, y1) => exports.flushStrip(y0, y1),
  };
}

/**
 * Kernel provider for `Simulation`: the state lives in a WebAssembly memory (a shared one when `shared`,
 * whose buffer is a SharedArrayBuffer other workers can step strips of).
 */
export function wasmKernelProvider(options: { shared?: boolean } = {}): KernelProvider {
  const shared = options.shared ?? false;
  const memories = new WeakMap<ArrayBufferLike, WebAssembly.Memory>();
  return {
    name: "wasm-simd",
    allocate(byteLength) {
      const memory = createKernelMemory(byteLength, shared);
      memories.set(memory.buffer, memory);
      return memory.buffer;
    },
    create(buffer) {
      const memory = memories.get(buffer);
      if (!memory) throw new Error("the WebAssembly kernel steps only state it allocated itself (pass no buffer, or use createWasmKernel with your memory)");
      return createWasmKernel(memory, shared);
    },
  };
}
