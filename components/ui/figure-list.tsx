// The label–value list and the "Check:" warnings that the scene page, the saved run page and its
// frozen settings all show, so a figure and a solver warning look the same wherever they appear.
import type { ReactNode } from "react";

/** Label–value pairs; `figures` sets the values in monospaced digits, `text` as plain prose. */
export function FigureList({ rows, values = "figures" }: { rows: [string, ReactNode][]; values?: "figures" | "text" }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm">
      {rows.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-muted">{label}</dt>
          <dd className={values === "figures" ? "tabular font-mono text-[13px] text-ink" : "text-ink-soft"}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The solver's warnings, each marked as something to check; nothing when there are none. */
export function SolverWarnings({ warnings }: { warnings: readonly { code: string; message: string }[] }) {
  if (warnings.length === 0) return null;
  return (
    <ul aria-label="Warnings" className="flex flex-col gap-1.5">
      {warnings.map((warning, index) => (
        <li key={`${warning.code}-${index}`} className="rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-3 py-2 text-[13px] text-ink-soft">
          <span className="font-medium text-signal-warn">Check: </span>
          {warning.message}
        </li>
      ))}
    </ul>
  );
}
