// A job's or a server sweep's state as a small label; finished is the one green state, failed the one red.
import type { RunJobState } from "@/lib/http/job-types";
import { stateLabels } from "./model/queue-words";

const tones: Record<RunJobState, string> = {
  queued: "bg-paper text-ink-soft ring-rule-strong",
  running: "bg-tide-50 text-tide-700 ring-tide-100",
  completed: "bg-[#e8f3ec] text-signal-ok ring-signal-ok/25",
  failed: "bg-signal-error-50 text-signal-error ring-signal-error/25",
  cancelled: "bg-ember-50 text-ember-700 ring-ember-100",
};

export function JobStateBadge({ state }: { state: RunJobState }) {
  return (
    <span data-job-state={state} className={`inline-flex whitespace-nowrap rounded-full px-2 py-0.5 text-[11px] font-medium ring-1 ${tones[state]}`}>
      {stateLabels[state]}
    </span>
  );
}
