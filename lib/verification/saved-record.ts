// Turning a case's outcome into what a verification record keeps (curves thinned so a record of every
// case stays small, figures to six significant digits), the verdict and counts the server stores, and
// a short name for the browser that ran the cases.
import type { SavedCaseOutcome, SavedCheck, SavedSeries } from "../validation/verification";
import { MAX_SAVED_SERIES_POINTS } from "../validation/verification";
import type { CurveSeries, VerificationCheck, VerificationOutcome } from "./cases/types";

/** Six significant digits: far finer than any tolerance judged, and a third of the text of a full double. */
function kept(value: number): number | null {
  return Number.isFinite(value) ? Number(value.toPrecision(6)) : null;
}

/**
 * At most `maxPoints` points: the smallest and the largest y of each run of consecutive points, in x order,
 * so a waveform's extremes and a spectrum's narrow peaks and notches survive.
 */
export function thinSeries(series: CurveSeries, maxPoints = MAX_SAVED_SERIES_POINTS): SavedSeries {
  const count = Math.min(series.x.length, series.y.length);
  const style = series.style ? { style: series.style } : {};
  if (count <= maxPoints) return { name: series.name, kind: series.kind, x: series.x.slice(0, count).map(kept), y: series.y.slice(0, count).map(kept), ...style };
  const buckets = Math.max(1, Math.floor(maxPoints / 2));
  const x: (number | null)[] = [];
  const y: (number | null)[] = [];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * count) / buckets);
    const to = Math.floor(((b + 1) * count) / buckets);
    let low = from;
    let high = from;
    for (let k = from + 1; k < to; k++) {
      if ((series.y[k] ?? Infinity) < (series.y[low] ?? Infinity)) low = k;
      if ((series.y[k] ?? -Infinity) > (series.y[high] ?? -Infinity)) high = k;
    }
    for (const k of low === high ? [low] : [Math.min(low, high), Math.max(low, high)]) {
      x.push(kept(series.x[k]!));
      y.push(kept(series.y[k]!));
    }
  }
  return { name: series.name, kind: series.kind, x, y, ...style };
}

function savedCheck(check: VerificationCheck): SavedCheck {
  return { ...check, measured: kept(check.measured), expected: kept(check.expected), error: kept(check.error), tolerance: kept(check.tolerance) };
}

/** A case passes when it has checks and every one of them passed (the rule of makeOutcome). */
export function casePassed(checks: readonly { pass: boolean }[]): boolean {
  return checks.length > 0 && checks.every((check) => check.pass);
}

export function savedCaseOutcome(verificationCase: { id: string; title: string }, outcome: VerificationOutcome): SavedCaseOutcome {
  return {
    caseId: verificationCase.id,
    title: verificationCase.title,
    pass: casePassed(outcome.checks),
    seconds: Math.max(0, outcome.seconds),
    checks: outcome.checks.map(savedCheck),
    curves: outcome.curves.map((curve) => ({ title: curve.title, xLabel: curve.xLabel, yLabel: curve.yLabel, series: curve.series.map((series) => thinSeries(series)) })),
  };
}

/** Cases passed and failed, each judged again from its checks so the counts never contradict them. */
export function recordCounts(outcomes: readonly { checks: readonly { pass: boolean }[] }[]): { passedCount: number; failedCount: number } {
  const passedCount = outcomes.filter((outcome) => casePassed(outcome.checks)).length;
  return { passedCount, failedCount: outcomes.length - passedCount };
}

/**
 * "Chrome 139 on Linux x86_64" from the user agent and platform a page reports; the whole user agent is
 * kept beside it in the record. Only the engines' own tokens are read (Edge and Opera name themselves).
 */
export function browserLabel(browser: string): string {
  const [platformPart, ...rest] = browser.split(" | ");
  const agent = rest.join(" | ") || platformPart || "";
  const platform = rest.length > 0 ? platformPart : "";
  const named = [
    [/Edg\/(\d+)/, "Edge"],
    [/OPR\/(\d+)/, "Opera"],
    [/Firefox\/(\d+)/, "Firefox"],
    [/HeadlessChrome\/(\d+)/, "Headless Chrome"],
    [/Chrome\/(\d+)/, "Chrome"],
    [/Version\/(\d+)[.\d]* Safari\//, "Safari"],
  ] as const;
  for (const [pattern, name] of named) {
    const match = agent.match(pattern);
    if (match) return `${name} ${match[1]}${platform ? ` on ${platform}` : ""}`;
  }
  return (platform ? `${agent.slice(0, 60)} on ${platform}` : agent.slice(0, 80)) || "unknown browser";
}

/** What the page records as its browser: "<platform> | <user agent>". */
export function describeBrowser(platform: string, userAgent: string): string {
  return `${platform || "unknown platform"} | ${userAgent || "unknown user agent"}`.slice(0, 500);
}
