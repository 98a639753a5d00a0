"use client";
// The accuracy estimate as a section of the printed run report: octave bands rated, the basis, the warnings
// with what to do, and the distances; styled like the report's other sections.
import { useMemo } from "react";

import type { DecodedRun } from "@/lib/run-record/payload";

import { accuracyOfRun } from "./accuracy-of-run";
import { AccuracyBandTable, AccuracyBasis, AccuracyWarnings, ReceiverDistanceTable } from "./accuracy-panel";

export function ReportAccuracySection({ decoded }: { decoded: DecodedRun }) {
  const accuracy = useMemo(() => accuracyOfRun(decoded), [decoded]);
  return (
    <section aria-labelledby="report-accuracy" className="flex flex-col gap-3 border-t border-rule pt-5 print:pt-3" data-testid="report-accuracy">
      <h2 id="report-accuracy" className="text-base font-semibold text-ink break-after-avoid print:text-[13pt]">
        Accuracy
      </h2>
      {accuracy ? (
        <>
          <p className="text-sm text-ink-soft">Which octave bands to trust, estimated from the grid and the scene: the scheme&apos;s own error, not how well a 2D section models the site.</p>
          <div className="break-inside-avoid">
            <AccuracyBandTable bands={accuracy.octaveBands} />
          </div>
          <AccuracyBasis accuracy={accuracy} />
          <h3 className="text-sm font-semibold text-ink">Warnings</h3>
          <AccuracyWarnings accuracy={accuracy} />
          <h3 className="text-sm font-semibold text-ink">Receivers&apos; distance from the sources</h3>
          <ReceiverDistanceTable accuracy={accuracy} />
        </>
      ) : (
        <p className="text-sm text-muted">The run&apos;s frozen scene no longer validates, so its accuracy cannot be estimated.</p>
      )}
    </section>
  );
}
