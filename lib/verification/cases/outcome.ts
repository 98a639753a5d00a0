// Building blocks of a case's outcome: judged checks, decimated curves, the pass verdict and timing.
import type { CurveSeries, VerificationCheck, VerificationCurve, VerificationOutcome } from "./types";

/** Most points a curve series keeps for plotting. */
export const MAX_CURVE_POINTS = 1000;

/** Seconds on a monotonic clock (performance.now exists in Node 20, browsers and workers). */
export function clockSeconds(): number {
  return performance.now() / 1000;
}

/** Passes when |error| <= tolerance; NaN never passes (a figure that could not be measured is a failure). */
function judged(label: string, measured: number, expected: number, error: number, tolerance: number, unit: string, errorUnit: string): VerificationCheck {
  return { label, measured, expected, error, tolerance, unit, errorUnit, pass: Number.isFinite(error) && Math.abs(error) <= tolerance };
}

/** |measured - expected| <= tolerance, all in `unit`. */
export function makeCheck(label: string, measured: number, expected: number, tolerance: number, unit: string): VerificationCheck {
  return judged(label, measured, expected, measured - expected, tolerance, unit, unit);
}

/** |measured / expected - 1| <= tolerance. */
export function makeRelativeCheck(label: string, measured: number, expected: number, tolerance: number, unit: string): VerificationCheck {
  return judged(label, measured, expected, measured / expected - 1, tolerance, unit, "relative");
}

/** A derived error (e.g. the modulus of a complex difference) judged against its tolerance, in `errorUnit`. */
export function makeDerivedCheck(label: string, measured: number, expected: number, error: number, tolerance: number, unit: string, errorUnit: string): VerificationCheck {
  return judged(label, measured, expected, error, tolerance, unit, errorUnit);
}

/** Passes when measured <= limit (a level that must stay below a ceiling, e.g. a reflection in dB). */
export function makeCeilingCheck(label: string, measured: number, limit: number, unit: string): VerificationCheck {
  const excess = measured - limit;
  return { label, measured, expected: limit, error: excess, tolerance: 0, unit, errorUnit: unit, pass: Number.isFinite(measured) && excess <= 0 };
}

/** A short series drawn as separate points (no thinning needed below MAX_CURVE_POINTS). */
export function pointSeries(name: string, kind: CurveSeries["kind"], x: ArrayLike<number>, y: ArrayLike<number>): CurveSeries {
  return { ...decimateSeries(name, kind, x, y), style: "points" };
}

/** Keeps every k-th point so that at most `maxPoints` remain (the last point is always kept). */
export function decimateSeries(name: string, kind: CurveSeries["kind"], x: ArrayLike<number>, y: ArrayLike<number>, maxPoints = MAX_CURVE_POINTS): CurveSeries {
  const count = Math.min(x.length, y.length);
  const step = Math.max(1, Math.ceil(count / maxPoints));
  const xs: number[] = [];
  const ys: number[] = [];
  for (let k = 0; k < count; k += step) {
    xs.push(x[k] ?? NaN);
    ys.push(y[k] ?? NaN);
  }
  if (count > 0 && (count - 1) % step !== 0) {
    xs.push(x[count - 1] ?? NaN);
    ys.push(y[count - 1] ?? NaN);
  }
  return { name, kind, x: xs, y: ys };
}

/**
 * Keeps, of every run of consecutive points, the one with the largest y, so that at most `maxPoints`
 * remain: narrow spectral peaks survive the thinning.
 */
export function decimateSeriesKeepingPeaks(name: string, kind: CurveSeries["kind"], x: ArrayLike<number>, y: ArrayLike<number>, maxPoints = MAX_CURVE_POINTS): CurveSeries {
  const count = Math.min(x.length, y.length);
  const step = Math.max(1, Math.ceil(count / maxPoints));
  const xs: number[] = [];
  const ys: number[] = [];
  for (let start = 0; start < count; start += step) {
    let best = start;
    for (let k = start + 1; k < Math.min(count, start + step); k++) if ((y[k] ?? -Infinity) > (y[best] ?? -Infinity)) best = k;
    xs.push(x[best] ?? NaN);
    ys.push(y[best] ?? NaN);
  }
  return { name, kind, x: xs, y: ys };
}

export function makeCurve(title: string, xLabel: string, yLabel: string, series: CurveSeries[]): VerificationCurve {
  return { title, xLabel, yLabel, series };
}

export function makeOutcome(checks: VerificationCheck[], curves: VerificationCurve[], startedAt: number): VerificationOutcome {
  return { checks, curves, pass: checks.length > 0 && checks.every((c) => c.pass), seconds: clockSeconds() - startedAt };
}
