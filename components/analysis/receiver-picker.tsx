"use client";
// Which receivers the charts and tables show: a checklist with each receiver's colour, a filter when the
// run has many (receiver lines), and quick choices for none and the first few.
import { useState } from "react";

import type { DecodedRun } from "@/lib/run-record/payload";

import { receiverColour } from "./analysis-traces";

export interface ReceiverPickerProps {
  run: DecodedRun;
  selected: readonly string[];
  onChange: (ids: string[]) => void;
  /** More than this many chosen make the charts unreadable and the spectra slow. */
  limit?: number;
}

export const DEFAULT_RECEIVER_LIMIT = 8;

export function ReceiverPicker({ run, selected, onChange, limit = DEFAULT_RECEIVER_LIMIT }: ReceiverPickerProps) {
  const [filter, setFilter] = useState("");
  const shown = run.receivers.map((receiver, index) => ({ receiver, index })).filter(({ receiver }) => (receiver.label + " " + receiver.id).toLowerCase().includes(filter.trim().toLowerCase()));
  const full = selected.length >= limit;

  return (
    <fieldset className="flex min-w-0 flex-col gap-1.5" data-testid="receiver-picker">
      <legend className="mb-1 text-xs font-medium text-ink-soft">
        Receivers ({selected.length} of {run.receivers.length} shown{full ? `; at most ${limit}` : ""})
      </legend>
      {run.receivers.length > 12 ? (
        <input
          type="search"
          placeholder="Filter receivers"
          value={filter}
          onChange={(event) => setFilter(event.target.value)}
          className="h-7 w-56 rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink"
          aria-label="Filter receivers"
        />
      ) : null}
      <div className="flex max-h-32 flex-wrap gap-x-4 gap-y-1 overflow-y-auto text-[13px]">
        {shown.map(({ receiver, index }) => {
          const checked = selected.includes(receiver.id);
          return (
            <label key={receiver.id} className={`flex items-center gap-1.5 ${!checked && full ? "text-muted" : "text-ink"}`} title={`${receiver.id} at (${receiver.position.x.toFixed(2)}, ${receiver.position.y.toFixed(2)}) m`}>
              <input type="checkbox" checked={checked} disabled={!checked && full} onChange={(event) => onChange(event.target.checked ? [...selected, receiver.id] : selected.filter((id) => id !== receiver.id))} />
              <span aria-hidden className="inline-block size-2.5 rounded-sm" style={{ background: receiverColour(index) }} />
              {receiver.label || receiver.id}
            </label>
          );
        })}
        {shown.length === 0 ? <span className="text-muted">No receiver matches.</span> : null}
      </div>
      <div className="flex gap-3 text-xs">
        <button type="button" className="text-tide-700 underline-offset-2 hover:underline" onClick={() => onChange([])}>
          None
        </button>
        <button type="button" className="text-tide-700 underline-offset-2 hover:underline" onClick={() => onChange(run.receivers.slice(0, Math.min(3, limit)).map((r) => r.id))}>
          First three
        </button>
      </div>
    </fieldset>
  );
}
