// A thin comlink adapter: runs one verification case (lib/verification/cases) in this worker with the
// solver's default kernel and hands back its outcome and the kernel's name. The page cancels a case by
// ending the worker, so nothing here needs to listen while the case's loops run.
import * as Comlink from "comlink";
import { defaultKernelProvider } from "@/lib/fdtd/kernel-provider";
import { verificationCaseById, type VerificationOutcome, type VerificationProgress } from "@/lib/verification/cases";

export interface VerificationWorkerOutcome {
  outcome: VerificationOutcome;
  /** The kernel that stepped the case's simulations. */
  kernel: string;
}

/** Progress messages at most this often: a case's own reports can come every few milliseconds. */
const PROGRESS_INTERVAL_MS = 100;

const api = {
  run(caseId: string, onProgress: (progress: VerificationProgress) => void): VerificationWorkerOutcome {
    const verificationCase = verificationCaseById(caseId);
    if (!verificationCase) throw new Error(`No verification case "${caseId}".`);
    const kernel = defaultKernelProvider();
    let lastSent = -Infinity;
    let lastStage = "";
    const outcome = verificationCase.run({
      kernel,
      onProgress: (progress) => {
        const now = performance.now();
        if (progress.stage === lastStage && now - lastSent < PROGRESS_INTERVAL_MS) return;
        lastSent = now;
        lastStage = progress.stage;
        void onProgress(progress);
      },
    });
    return { outcome, kernel: kernel.name };
  },
};

export type VerificationWorkerApi = typeof api;

Comlink.expose(api);
