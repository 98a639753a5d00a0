// Runs a verification case, prints its checks table for the CI log and asserts that every check passed.
import { expect } from "vitest";

import { MAX_CURVE_POINTS } from "@/lib/verification/cases/outcome";
import type { VerificationCase, VerificationOutcome } from "@/lib/verification/cases/types";

/** A figure with six significant digits, so that the table stays readable. */
const figure = (x: number) => (Number.isFinite(x) ? Number(x.toPrecision(6)) : x);

export function runAndReport(verificationCase: VerificationCase): VerificationOutcome {
  const outcome = verificationCase.run();
  console.log(`${verificationCase.title} (${verificationCase.resolution}): ${outcome.pass ? "pass" : "FAIL"} in ${outcome.seconds.toFixed(2)} s`);
  console.table(
    outcome.checks.map((check) => ({
      check: check.label,
      measured: figure(check.measured),
      expected: figure(check.expected),
      unit: check.unit,
      error: figure(check.error),
      tolerance: check.tolerance,
      "error unit": check.errorUnit,
      pass: check.pass,
    })),
  );
  return outcome;
}

export function expectEveryCheckToPass(outcome: VerificationOutcome): void {
  expect(outcome.checks.length).toBeGreaterThan(0);
  expect(outcome.checks.filter((check) => !check.pass).map((check) => `${check.label}: error ${check.error} > ${check.tolerance} ${check.errorUnit}`)).toEqual([]);
  expect(outcome.pass).toBe(true);
  for (const curve of outcome.curves) for (const series of curve.series) expect(series.x.length).toBeLessThanOrEqual(MAX_CURVE_POINTS + 1);
}
