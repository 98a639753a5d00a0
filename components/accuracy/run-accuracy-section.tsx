"use client";
// The saved run page's accuracy section: the estimate of the stored run, or why there is none.
import { useMemo } from "react";

import type { DecodedRun } from "@/lib/run-record/payload";

import { accuracyOfRun } from "./accuracy-of-run";
import { AccuracyPanel } from "./accuracy-panel";

export function RunAccuracySection({ run }: { run: DecodedRun }) {
  const accuracy = useMemo(() => accuracyOfRun(run), [run]);
  if (!accuracy) return <p className="text-sm text-muted">The run&apos;s frozen scene no longer validates, so its accuracy cannot be estimated.</p>;
  return <AccuracyPanel accuracy={accuracy} />;
}
