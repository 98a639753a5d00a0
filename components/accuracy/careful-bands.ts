"use client";
// The bands of a run's band table or chart that its accuracy estimate rates "use with care", for the mark on
// their headings: read from the same estimate the accuracy panel shows (accuracyOfRun), never decided anew.
import { useMemo } from "react";

import { bandsToUseWithCare, ratedBandsOf } from "@/lib/analysis/accuracy";
import type { FrequencyBand } from "@/lib/analysis/bands";
import type { DecodedRun } from "@/lib/run-record/payload";

import { accuracyOfRun } from "./accuracy-of-run";

const NONE: ReadonlyMap<number, string> = new Map();

export function useCarefulBands(run: Pick<DecodedRun, "header" | "receivers">, bands: readonly FrequencyBand[] | undefined, bandsPerOctave: 1 | 3): ReadonlyMap<number, string> {
  const accuracy = useMemo(() => accuracyOfRun(run), [run]);
  return useMemo(() => (accuracy && bands ? bandsToUseWithCare(bands, ratedBandsOf(accuracy, bandsPerOctave)) : NONE), [accuracy, bands, bandsPerOctave]);
}
