"use client";
// Other saved runs of the study drawn over this one in the trace and spectrum charts: listed when they are
// sampled alike and have as many receivers, checked again once loaded (the same receiver ids), each with
// the reason when it cannot be drawn.
import { useQueries } from "@tanstack/react-query";
import { useMemo } from "react";

import { overlayListCompatibility, overlayPayloadCompatibility } from "@/lib/analysis/run-compatibility";
import { runQueryKeys, useStudyRuns } from "@/lib/client/run-queries";
import { fetchSavedRun } from "@/lib/client/run-records";
import type { DecodedRun } from "@/lib/run-record/payload";

import type { OverlayRun } from "./analysis-traces";
import { runLabel } from "./insertion-loss-panel";

/** At most this many other runs at once: each adds a line per receiver. */
export const MAX_OVERLAY_RUNS = 3;

export interface OverlayState {
  overlays: OverlayRun[];
  /** Chosen runs still loading, or that failed to load or to fit, with the reason. */
  pending: { runId: string; label: string; message: string; failed: boolean }[];
}

/** Loads the chosen runs and keeps those that fit. */
export function useOverlayRuns(run: DecodedRun, chosen: readonly string[], labels: ReadonlyMap<string, string>): OverlayState {
  const queries = useQueries({
    queries: chosen.map((id) => ({ queryKey: runQueryKeys.payload(id), queryFn: () => fetchSavedRun(id), staleTime: Infinity, gcTime: 10 * 60_000 })),
  });
  // useQueries returns a new array each render; its data objects are stable, so key the result on them.
  const dataKey = queries.map((q) => q.dataUpdatedAt + q.status).join("|");
  return useMemo(() => {
    const state: OverlayState = { overlays: [], pending: [] };
    queries.forEach((query, i) => {
      const runId = chosen[i]!;
      const label = labels.get(runId) ?? runId;
      if (query.isPending) state.pending.push({ runId, label, message: "loading…", failed: false });
      else if (query.isError) state.pending.push({ runId, label, message: `could not be loaded: ${query.error.message}`, failed: true });
      else {
        const fit = overlayPayloadCompatibility(run.header, query.data.header);
        if (fit.ok) state.overlays.push({ runId, label, run: query.data });
        else state.pending.push({ runId, label, message: `cannot be drawn over this run: ${fit.reason}`, failed: true });
      }
    });
    return state;
    // eslint-disable-next-line react-hooks/exhaustive-deps -- dataKey stands for the query results
  }, [dataKey, chosen, labels, run.header]);
}

export interface OverlayRunPickerProps {
  studyId: string;
  runId: string;
  run: DecodedRun;
  chosen: readonly string[];
  onChange: (ids: string[]) => void;
  state: OverlayState;
}

export function OverlayRunPicker({ studyId, runId, run, chosen, onChange, state }: OverlayRunPickerProps) {
  const runs = useStudyRuns(studyId);
  const listed = useMemo(() => (runs.data?.runs ?? []).filter((item) => item.id !== runId).map((item) => ({ item, fit: overlayListCompatibility(run.header, runId, item) })), [runs.data, run.header, runId]);
  const fitting = listed.filter((entry) => entry.fit.ok);
  const unfit = listed.filter((entry) => !entry.fit.ok);
  const full = chosen.length >= MAX_OVERLAY_RUNS;

  return (
    <fieldset className="flex min-w-0 flex-col gap-1.5" data-testid="overlay-runs">
      <legend className="mb-1 text-xs font-medium text-ink-soft">Draw other runs of the study over this one (dashed, same receivers)</legend>
      {runs.isPending ? <p className="text-[13px] text-muted">Loading the study&apos;s runs…</p> : null}
      {runs.isError ? (
        <p role="alert" className="text-[13px] text-signal-error">
          The study&apos;s runs could not be loaded: {runs.error.message}
        </p>
      ) : null}
      {runs.isSuccess && fitting.length === 0 ? <p className="text-[13px] text-muted">No other saved run of this study has the same receivers and sampling.</p> : null}
      <div className="flex max-h-28 flex-col gap-1 overflow-y-auto text-[13px]">
        {fitting.map(({ item }) => {
          const checked = chosen.includes(item.id);
          return (
            <label key={item.id} className={`flex items-center gap-1.5 ${!checked && full ? "text-muted" : "text-ink"}`}>
              <input type="checkbox" checked={checked} disabled={!checked && full} onChange={(event) => onChange(event.target.checked ? [...chosen, item.id] : chosen.filter((id) => id !== item.id))} />
              {runLabel(item)}
            </label>
          );
        })}
      </div>
      {state.pending.map((entry) => (
        <p key={entry.runId} role={entry.failed ? "alert" : "status"} className={`text-[12px] ${entry.failed ? "text-signal-error" : "text-muted"}`}>
          {entry.label}: {entry.message}
        </p>
      ))}
      {unfit.length > 0 ? (
        <details className="text-[12px] text-ink-soft">
          <summary className="cursor-pointer text-muted">{unfit.length} run{unfit.length === 1 ? "" : "s"} cannot be drawn over this one</summary>
          <ul className="mt-1 list-disc pl-5">
            {unfit.map(({ item, fit }) => (
              <li key={item.id}>
                {runLabel(item)}: {fit.ok ? "" : fit.reason}.
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </fieldset>
  );
}
