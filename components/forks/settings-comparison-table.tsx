"use client";
// The two scenes' settings side by side, grouped; rows that differ are marked (colour and a word,
// so the mark survives printing in grey), and the reader may hide the rows that agree.
import { useState } from "react";
import { countDifferences, type SettingGroup } from "@/lib/collaboration/scene-comparison";

export function SettingsComparisonTable({ groups, originTitle, forkTitle }: { groups: readonly SettingGroup[]; originTitle: string; forkTitle: string }) {
  const [onlyDifferences, setOnlyDifferences] = useState(false);
  const differences = countDifferences(groups);
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-ink-soft" data-testid="difference-count">
          {differences === 0 ? "The settings are the same." : `${differences} setting${differences === 1 ? "" : "s"} differ${differences === 1 ? "s" : ""}.`}
        </p>
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" checked={onlyDifferences} onChange={(event) => setOnlyDifferences(event.target.checked)} className="accent-tide-600" />
          Show only what differs
        </label>
      </div>
      <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
        <table className="w-full border-collapse text-[13px]">
          <thead>
            <tr className="border-b border-rule text-left text-muted">
              <th scope="col" className="w-1/4 px-3 py-2 font-medium">Setting</th>
              <th scope="col" className="px-3 py-2 font-medium">{originTitle}</th>
              <th scope="col" className="px-3 py-2 font-medium">{forkTitle}</th>
            </tr>
          </thead>
          {groups.map((group) => {
            const rows = onlyDifferences ? group.rows.filter((row) => row.differs) : group.rows;
            if (rows.length === 0) return null;
            return (
              <tbody key={group.title}>
                <tr>
                  <th scope="rowgroup" colSpan={3} className="bg-paper px-3 py-1.5 text-left text-[12px] font-semibold uppercase tracking-wide text-muted">
                    {group.title}
                  </th>
                </tr>
                {rows.map((row) => (
                  <tr key={row.key} className={`border-t border-rule align-top ${row.differs ? "bg-ember-50" : ""}`} data-differs={row.differs || undefined}>
                    <th scope="row" className="px-3 py-1.5 text-left font-medium text-ink-soft">
                      {row.label}
                      {row.differs ? <span className="ml-2 rounded bg-ember-100 px-1.5 py-0.5 text-[11px] font-semibold text-ember-700">differs</span> : null}
                    </th>
                    <td className="px-3 py-1.5 text-ink">{row.origin}</td>
                    <td className="px-3 py-1.5 text-ink">{row.fork}</td>
                  </tr>
                ))}
              </tbody>
            );
          })}
        </table>
      </div>
    </div>
  );
}
