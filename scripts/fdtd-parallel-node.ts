// Several threads on one simulation in Node (command line, benchmark, tests): worker_threads run the
// helper strips over the shared state, the calling thread coordinates (lib/fdtd/parallel).
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { parallelKernelProvider, type ParallelKernelProvider, type StripKernelKind } from "@/lib/fdtd/parallel/parallel-kernel";

const helperScript = fileURLToPath(new URL("./fdtd-strip-helper.bootstrap.mjs", import.meta.url));

export interface NodeParallelKernel {
  provider: ParallelKernelProvider;
  /** Releases and ends the helper threads. */
  close(): Promise<void>;
}

export function nodeParallelKernel({ threads, rows, kernelKind }: { threads: number; rows: number; kernelKind?: StripKernelKind }): NodeParallelKernel {
  const workers: Worker[] = [];
  const provider = parallelKernelProvider({
    threads,
    rows,
    ...(kernelKind ? { kernelKind } : {}),
    startHelper: (init) => {
      const worker = new Worker(helperScript);
      worker.postMessage(init);
      workers.push(worker);
    },
  });
  return {
    provider,
    close: async () => {
      provider.release();
      await Promise.all(workers.map((worker) => new Promise<void>((resolve) => (worker.threadId < 0 ? resolve() : worker.once("exit", () => resolve())))));
    },
  };
}
