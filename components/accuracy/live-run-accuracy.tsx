"use client";
// The accuracy estimate of the scene page's browser run once it has finished or been cancelled, saved or not:
// collapsed to one line (the page is busy with the run and the field), the full panel when opened.
import { useMemo } from "react";

import { accuracySummary } from "@/lib/analysis/accuracy";
import type { Scene } from "@/lib/fdtd/scene";
import type { SimulationResult } from "@/lib/fdtd/simulation";

import { accuracyOfResult } from "./accuracy-of-run";
import { AccuracyPanel } from "./accuracy-panel";

export function LiveRunAccuracy({ scene, result }: { scene: Scene; result: SimulationResult }) {
  const accuracy = useMemo(() => accuracyOfResult(scene, result), [scene, result]);
  return (
    <details className="group" data-testid="live-run-accuracy">
      <summary className="cursor-pointer rounded-md border border-rule px-3 py-2 text-[13px] text-ink-soft hover:text-ink">
        <span className="font-medium text-ink">{accuracySummary(accuracy)}</span>
        <span className="ml-2 text-muted group-open:hidden">Show why</span>
      </summary>
      <div className="mt-2">
        <AccuracyPanel accuracy={accuracy} />
      </div>
    </details>
  );
}
