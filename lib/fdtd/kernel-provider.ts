// Which kernel steps a simulation, and where its state buffer comes from.
import { createTypeScriptKernel, type StepKernel } from "./kernel";
import { wasmKernelProvider, wasmKernelSupported } from "./wasm/wasm-kernel";

/** Allocates a state buffer and creates a kernel over it. */
export interface KernelProvider {
  readonly name: string;
  /** A zero-filled buffer of at least `byteLength` bytes. */
  allocate(byteLength: number): ArrayBufferLike;
  create(buffer: ArrayBufferLike): StepKernel;
}

/** The TypeScript reference kernel; state in an ArrayBuffer, or in a SharedArrayBuffer when `shared`. */
export function typeScriptKernelProvider(options: { shared?: boolean } = {}): KernelProvider {
  return {
    name: "typescript",
    allocate: (byteLength) => (options.shared ? new SharedArrayBuffer(byteLength) : new ArrayBuffer(byteLength)),
    create: (buffer) => createTypeScriptKernel(buffer),
  };
}

/**
 * The WebAssembly SIMD kernel where the runtime supports it (Node 20, current browsers' workers),
 * otherwise the TypeScript reference kernel. Both give bit-identical fields.
 */
export function defaultKernelProvider(): KernelProvider {
  return wasmKernelSupported() ? wasmKernelProvider() : typeScriptKernelProvider();
}
