// A saved run's status as a small coloured label, the same in the table, the notebook and the run page.
import type { RunStatusName } from "@/lib/http/api-types";
import { runStatusLabels } from "./run-table-model";

const tones: Record<RunStatusName, string> = {
  completed: "bg-[#e8f3ec] text-signal-ok ring-signal-ok/25",
  cancelled: "bg-[#fdf6e7] text-signal-warn ring-signal-warn/25",
  failed: "bg-signal-error-50 text-signal-error ring-signal-error/25",
  queued: "bg-paper text-muted ring-rule",
  running: "bg-tide-50 text-tide-700 ring-tide-100",
};

export function RunStatusBadge({ status }: { status: RunStatusName }) {
  return <span className={`inline-flex rounded-full px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide ring-1 ${tones[status]}`}>{runStatusLabels[status]}</span>;
}
