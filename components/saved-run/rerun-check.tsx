"use client";
// "Run again": repeats a saved run from its frozen scene in a worker, then compares the receiver
// traces sample by sample with the stored ones. Nothing is saved; it checks that the stored result
// is what this solver gives for that input.
import { useEffect, useRef, useState } from "react";
import { runSceneInWorker } from "@/components/run/run-in-worker";
import { Button } from "@/components/ui/button";
import { parseScene } from "@/lib/fdtd/scene";
import type { ReceiverTrace } from "@/lib/fdtd/simulation";
import type { DecodedRun } from "@/lib/run-record/payload";
import { SOLVER_VERSION } from "@/lib/run-record/solver-version";
import { compareReceiverTraces, type TraceComparison } from "./trace-comparison";

type CheckState =
  | { kind: "idle" }
  | { kind: "running"; fraction: number }
  | { kind: "done"; comparison: TraceComparison; wallSeconds: number; threads: number }
  | { kind: "cancelled" }
  | { kind: "failed"; message: string };

const quantityUnits = { pressure: "Pa", velocityX: "m/s", velocityY: "m/s" } as const;
const quantityNames = { pressure: "pressure", velocityX: "x-velocity", velocityY: "y-velocity" } as const;

/** A cancelled saved run holds only its first samples: the repeat is compared over those. */
function trimmedTo(traces: readonly ReceiverTrace[], samples: number): ReceiverTrace[] {
  return traces.map((trace) => ({ ...trace, pressure: trace.pressure.subarray(0, samples), velocityX: trace.velocityX.subarray(0, samples), velocityY: trace.velocityY.subarray(0, samples) }));
}

export function RerunCheck({ saved }: { saved: DecodedRun }) {
  const [state, setState] = useState<CheckState>({ kind: "idle" });
  const abort = useRef<AbortController | null>(null);
  const frozen = parseScene(saved.header.scene);
  const solverDiffers = saved.header.solverVersion !== SOLVER_VERSION;
  useEffect(() => () => abort.current?.abort(), []);

  async function runAgain() {
    if (!frozen.ok) return;
    const controller = new AbortController();
    abort.current = controller;
    setState({ kind: "running", fraction: 0 });
    const started = performance.now();
    try {
      const { result, threads } = await runSceneInWorker(frozen.scene, { signal: controller.signal, onProgress: (progress) => setState({ kind: "running", fraction: progress.fraction }) });
      const savedSamples = saved.header.run.stepsRun + 1;
      const repeated = saved.header.run.stoppedBy === "cancelled" ? trimmedTo(result.receivers, savedSamples) : result.receivers;
      setState({ kind: "done", comparison: compareReceiverTraces(saved.receivers, repeated), wallSeconds: (performance.now() - started) / 1000, threads });
    } catch (error) {
      if (error instanceof DOMException && error.name === "AbortError") setState({ kind: "cancelled" });
      else setState({ kind: "failed", message: error instanceof Error ? error.message : "The run stopped." });
    } finally {
      abort.current = null;
    }
  }

  return (
    <section aria-labelledby="rerun-heading" className="flex flex-col gap-3 rounded-lg border border-rule bg-panel p-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="rerun-heading" className="text-base font-semibold text-ink">
          Run again and compare
        </h2>
        {state.kind === "running" ? (
          <Button size="sm" variant="secondary" onClick={() => abort.current?.abort()}>
            Cancel
          </Button>
        ) : (
          <Button size="sm" variant="secondary" onClick={() => void runAgain()} disabled={!frozen.ok}>
            {state.kind === "idle" ? "Run again" : "Run again once more"}
          </Button>
        )}
      </div>
      <p className="text-sm text-ink-soft">
        Repeats this run in your browser from the scene as it was run, then compares every receiver sample with the stored traces. Nothing is saved.
        {solverDiffers ? ` This run was made by solver "${saved.header.solverVersion}"; this browser runs "${SOLVER_VERSION}", so small differences are expected.` : " The solver version is the same, so the traces must be identical."}
      </p>
      {!frozen.ok ? <p className="text-sm text-signal-error">The stored scene does not validate with this version of Rarefact: {frozen.problems[0]?.message}</p> : null}
      {state.kind === "running" ? (
        <div role="progressbar" aria-label="Repeat progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(state.fraction * 100)} className="h-2 overflow-hidden rounded-full bg-rule">
          <div className="h-full rounded-full bg-tide-500 transition-[width]" style={{ width: `${Math.round(state.fraction * 1000) / 10}%` }} />
        </div>
      ) : null}
      {state.kind === "cancelled" ? <p className="text-sm text-muted">Cancelled; nothing was compared.</p> : null}
      {state.kind === "failed" ? (
        <p role="alert" className="text-sm text-signal-error">
          The repeat stopped: {state.message}
        </p>
      ) : null}
      {state.kind === "done" ? <ComparisonReport comparison={state.comparison} solverDiffers={solverDiffers} wallSeconds={state.wallSeconds} threads={state.threads} /> : null}
    </section>
  );
}

function ComparisonReport({ comparison, solverDiffers, wallSeconds, threads }: { comparison: TraceComparison; solverDiffers: boolean; wallSeconds: number; threads: number }) {
  const how = `Repeated in ${wallSeconds.toFixed(1)} s on ${threads} ${threads === 1 ? "thread" : "threads"}.`;
  if (comparison.kind === "identical") {
    return (
      <p data-testid="rerun-verdict" role="status" className="rounded-md border border-signal-ok/30 bg-[#e8f3ec] px-3 py-2 text-sm text-ink-soft">
        <span className="font-semibold text-signal-ok">Identical.</span> All {comparison.receivers} receivers × {comparison.samples.toLocaleString("en-GB")} samples of pressure and velocity match bit for bit. {how}
      </p>
    );
  }
  if (comparison.kind === "incomparable") {
    return (
      <p data-testid="rerun-verdict" role="alert" className="rounded-md border border-signal-error/30 bg-signal-error-50 px-3 py-2 text-sm text-ink-soft">
        <span className="font-semibold text-signal-error">Not comparable:</span> {comparison.reason}. {how}
      </p>
    );
  }
  const { largest } = comparison;
  return (
    <p data-testid="rerun-verdict" role="alert" className={`rounded-md border px-3 py-2 text-sm text-ink-soft ${solverDiffers ? "border-signal-warn/30 bg-[#fdf6e7]" : "border-signal-error/30 bg-signal-error-50"}`}>
      <span className={`font-semibold ${solverDiffers ? "text-signal-warn" : "text-signal-error"}`}>Different.</span> {comparison.differingSamples.toLocaleString("en-GB")} samples differ. The largest difference is{" "}
      {largest.difference.toExponential(3)} {quantityUnits[largest.quantity]} in the {quantityNames[largest.quantity]} at receiver &ldquo;{largest.receiverLabel || largest.receiverId}&rdquo;, sample {largest.sample} (
      {(largest.relativeToPeak * 100).toPrecision(3)}% of that trace&apos;s peak).{" "}
      {solverDiffers ? "The solver versions differ, which can explain it." : "The solver version is the same, so this should not happen: please report it with this run."} {how}
    </p>
  );
}
