// A case's checks: what was judged, the measured and expected figures, the error against its tolerance,
// and the verdict. Live outcomes and saved records (where a non-finite figure is null) read alike.
import type { SavedCheck } from "@/lib/validation/verification";

export function formatFigure(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "not measured";
  if (value === 0) return "0";
  return Math.abs(value) >= 1e5 || Math.abs(value) < 1e-3 ? value.toExponential(2) : String(Number(value.toPrecision(4)));
}

/**
 * A relative error reads better in percent, or in ppm when its tolerance is below 0.1%; the tolerance
 * decides, so a check's error and tolerance always share a unit.
 */
export function formatError(value: number | null | undefined, errorUnit: string, tolerance: number | null | undefined = value): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "not measured";
  if (errorUnit !== "relative") return `${formatFigure(value)}${errorUnit ? ` ${errorUnit}` : ""}`;
  if (tolerance !== null && tolerance !== undefined && Math.abs(tolerance) < 1e-3) return `${formatFigure(value * 1e6)} ppm`;
  return `${formatFigure(value * 100)} %`;
}

export function VerdictBadge({ pass, size = "sm" }: { pass: boolean; size?: "sm" | "xs" }) {
  return (
    <span
      className={`inline-flex items-center rounded-full font-medium ${size === "sm" ? "px-2 py-0.5 text-[12px]" : "px-1.5 text-[11px]"} ${pass ? "bg-tide-50 text-tide-700 ring-1 ring-tide-500/30" : "bg-signal-error-50 text-signal-error ring-1 ring-signal-error/30"}`}
    >
      {pass ? "Pass" : "Fail"}
    </span>
  );
}

const head = "border-b border-rule-strong px-2 py-1 text-left font-medium text-muted";
const numberHead = "border-b border-rule-strong px-2 py-1 text-right font-medium text-muted whitespace-nowrap";
const cell = "border-b border-rule px-2 py-1 align-top text-ink";
const numberCell = "border-b border-rule px-2 py-1 text-right align-top font-mono tabular whitespace-nowrap text-ink";

export function CheckTable({ checks, caption }: { checks: readonly SavedCheck[]; caption: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-[13px] print:text-[8.5pt] [&_tr]:break-inside-avoid">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr>
            <th scope="col" className={head}>
              Check
            </th>
            <th scope="col" className={numberHead}>
              Measured
            </th>
            <th scope="col" className={numberHead}>
              Expected
            </th>
            <th scope="col" className={numberHead}>
              Error
            </th>
            <th scope="col" className={numberHead}>
              Tolerance
            </th>
            <th scope="col" className={head}>
              Verdict
            </th>
          </tr>
        </thead>
        <tbody>
          {checks.map((check, k) => (
            <tr key={`${check.label}-${k}`}>
              <th scope="row" className={`${cell} text-left font-normal`}>
                {check.label}
              </th>
              <td className={numberCell}>
                {formatFigure(check.measured)} {check.unit}
              </td>
              <td className={numberCell}>
                {formatFigure(check.expected)} {check.unit}
              </td>
              <td className={numberCell}>{formatError(check.error, check.errorUnit, check.tolerance)}</td>
              <td className={numberCell}>{check.tolerance === 0 && check.errorUnit !== "relative" ? `≤ 0 ${check.errorUnit} (a ceiling)` : `± ${formatError(check.tolerance, check.errorUnit)}`}</td>
              <td className={cell}>
                <VerdictBadge pass={check.pass} size="xs" />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
