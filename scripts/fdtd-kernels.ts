// Picks the solver kernel for the command-line scripts by name: the WebAssembly SIMD kernel, or the
// TypeScript reference kernel (also the fallback where WebAssembly SIMD is missing).
import { typeScriptKernelProvider, type KernelProvider } from "@/lib/fdtd/simulation";
import { wasmKernelProvider, wasmKernelSupported } from "@/lib/fdtd/wasm/wasm-kernel";

export const KERNEL_NAMES = ["wasm", "typescript"] as const;

export function kernelByName(name: string): KernelProvider {
  if (name === "typescript") return typeScriptKernelProvider();
  if (name === "wasm") {
    if (wasmKernelSupported()) return wasmKernelProvider();
    process.stderr.write("warning: this runtime lacks WebAssembly SIMD; using the TypeScript kernel\n");
    return typeScriptKernelProvider();
  }
  throw new Error(`unknown kernel "${name}"; use ${KERNEL_NAMES.join(" or ")}`);
}
