// A case's result: the simulated and exact curves overlaid, every check with its error and tolerance,
// and how long it took. Live outcomes and saved records share it.
import type { SavedCheck } from "@/lib/validation/verification";
import { CheckTable, VerdictBadge } from "./check-table";
import { CurveChart, type ChartableCurve } from "./curve-chart";

export function formatSeconds(seconds: number): string {
  if (!Number.isFinite(seconds)) return "–";
  if (seconds < 1) return `${Math.round(seconds * 1000)} ms`;
  if (seconds < 120) return `${seconds.toFixed(1)} s`;
  return `${Math.floor(seconds / 60)} min ${Math.round(seconds % 60)} s`;
}

export function CaseResult({ title, checks, curves, seconds, timing }: { title: string; checks: readonly SavedCheck[]; curves: readonly ChartableCurve[]; seconds: number; timing?: string }) {
  const passed = checks.filter((check) => check.pass).length;
  const pass = checks.length > 0 && passed === checks.length;
  return (
    <div className="flex flex-col gap-4">
      <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
        <VerdictBadge pass={pass} />
        <span>
          {passed} of {checks.length} checks within tolerance; the case took {formatSeconds(seconds)}
          {timing ? ` ${timing}` : ""}.
        </span>
      </p>
      {curves.length > 0 ? (
        <div className="grid gap-4 md:grid-cols-2">
          {curves.map((curve, k) => (
            <CurveChart key={`${curve.title}-${k}`} curve={curve} />
          ))}
        </div>
      ) : null}
      <CheckTable checks={checks} caption={`Checks of ${title}`} />
    </div>
  );
}
