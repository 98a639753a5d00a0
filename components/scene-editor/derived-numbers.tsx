"use client";
// The numbers a scene implies, kept current as it is edited: grid, time step, resolved band, size,
// an estimate of the run time on this computer, and every concern (server limits, browser size,
// the solver's warnings), each linked to the field it concerns.
import { useMemo } from "react";

import type { Scene } from "@/lib/fdtd/scene";
import { COURANT_LIMIT_2D } from "@/lib/fdtd/scene";
import type { SceneLimits } from "@/lib/validation/scene-limits";

import { deriveFigures, formatBytes, formatRunTime, type Concern, type ConcernLevel } from "./model/derived-figures";
import { rateOf, useStepRate, type StepRateState } from "./step-rate/use-step-rate";

const significant = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });
const whole = new Intl.NumberFormat("en-GB");
/** A large count with an SI prefix: "116 k", "22.0 M", "1.93 G". */
export function formatCount(value: number): string {
  const prefixes: [number, string][] = [
    [1e9, "G"],
    [1e6, "M"],
    [1e3, "k"],
  ];
  for (const [size, prefix] of prefixes) if (value >= size) return `${(value / size).toPrecision(3)} ${prefix}`;
  return String(Math.round(value));
}

function formatLength(metres: number): string {
  if (metres < 0.01) return `${significant.format(metres * 1000)} mm`;
  if (metres < 1) return `${significant.format(metres * 100)} cm`;
  return `${significant.format(metres)} m`;
}

function formatTime(seconds: number): string {
  if (seconds < 1e-3) return `${significant.format(seconds * 1e6)} µs`;
  if (seconds < 1) return `${significant.format(seconds * 1e3)} ms`;
  return `${significant.format(seconds)} s`;
}

const concernStyles: Record<ConcernLevel, { frame: string; tag: string; label: string }> = {
  limit: { frame: "border-signal-error/30 bg-signal-error-50", tag: "text-signal-error", label: "Server limit" },
  browser: { frame: "border-signal-error/25 bg-signal-error-50/70", tag: "text-signal-error", label: "Too big for a browser" },
  check: { frame: "border-signal-warn/30 bg-[#fdf6e7]", tag: "text-signal-warn", label: "Check" },
};

/** A short note on where the run-time estimate comes from, and the full story for its tooltip. */
function rateNote(state: StepRateState): { short: string; full: string } {
  switch (state.status) {
    case "given":
      return { short: `estimate, ${formatCount(state.cellUpdatesPerSecond)}/s`, full: `An estimate at ${formatCount(state.cellUpdatesPerSecond)} cell updates per second.` };
    case "measuring":
      return { short: "measuring this computer…", full: "Measuring how fast this computer steps the solver." };
    case "measured": {
      const m = state.measurement;
      return {
        short: `estimate, ${formatCount(m.cellUpdatesPerSecond)}/s here`,
        full: `An estimate: the run's cell updates divided by this browser's measured rate, ${formatCount(m.cellUpdatesPerSecond)} cell updates per second (${m.steps} steps of a ${whole.format(m.cells)}-cell grid in ${m.seconds.toFixed(2)} s, ${m.kernel} kernel). Setup time is not included.`,
      };
    }
    case "unavailable":
      return { short: "no estimate", full: `No run-time estimate: ${state.reason}.` };
  }
}

export interface DerivedNumbersProps {
  scene: Scene;
  /** Cell updates per second to estimate with; measured in a worker when absent. */
  cellUpdatesPerSecond?: number;
  limits?: SceneLimits;
  /** Called with a concern's scene path (e.g. `sources[0].signal`) when a person asks to see it. */
  onShowPath?: (path: string) => void;
}

export function DerivedNumbers({ scene, cellUpdatesPerSecond, limits, onShowPath }: DerivedNumbersProps) {
  const rate = useStepRate(cellUpdatesPerSecond);
  const figures = useMemo(() => deriveFigures(scene, rateOf(rate), limits), [scene, rate, limits]);
  const { grid, estimatedRunSeconds, concerns } = figures;

  const figureRows: { label: string; value: string; note?: string; testId: string }[] = [
    { label: "Cell size", value: formatLength(grid.cellSize), testId: "figure-cell-size" },
    { label: "Time step", value: formatTime(grid.timeStep), testId: "figure-time-step" },
    { label: "Courant number", value: grid.courantNumber.toFixed(3), note: `≤ ${COURANT_LIMIT_2D.toFixed(3)}`, testId: "figure-courant" },
    { label: "Resolved to", value: `${significant.format(grid.maxResolvedFrequency)} Hz`, note: `${grid.pointsPerWavelength} cells/λ`, testId: "figure-resolved" },
    { label: "Grid incl. PML", value: `${grid.nx} × ${grid.ny}`, note: `${formatCount(grid.cellCount)} cells`, testId: "figure-grid" },
    { label: "Time steps", value: whole.format(grid.steps), note: formatTime(grid.simulatedSeconds) + (grid.stopRule === "decay" ? " at most" : ""), testId: "figure-steps" },
    { label: "Memory", value: formatBytes(grid.memoryBytes), testId: "figure-memory" },
  ];

  const note = rateNote(rate);
  return (
    <section aria-label="Derived numbers" data-testid="derived-numbers" className="flex flex-col border-t border-rule bg-paper/60">
      <dl className="grid grid-cols-4 xl:grid-cols-8">
        {figureRows.map((figure) => (
          <div key={figure.label} className="min-w-0 border-b border-r border-rule/70 px-3 py-2 xl:border-b-0">
            <dt className="truncate text-[11px] text-muted">{figure.label}</dt>
            <dd className="truncate font-mono tabular text-[13px] text-ink" data-testid={figure.testId} title={figure.note ? `${figure.value} · ${figure.note}` : figure.value}>
              {figure.value}
            </dd>
            <dd className="truncate text-[10.5px] text-muted">{figure.note ?? "\u00a0"}</dd>
          </div>
        ))}
        <div className="min-w-0 border-b border-rule/70 bg-panel/70 px-3 py-2 xl:border-b-0" title={note.full}>
          <dt className="truncate text-[11px] text-muted">Run time here</dt>
          <dd className="truncate font-mono tabular text-[13px] font-medium text-ink" data-testid="figure-run-time">
            {estimatedRunSeconds === null ? "–" : `≈ ${formatRunTime(estimatedRunSeconds)}`}
          </dd>
          <dd className="truncate text-[10.5px] text-muted">{note.short}</dd>
        </div>
      </dl>
      {concerns.length > 0 ? (
        <ul aria-label="Concerns" className="flex max-h-[6.5rem] flex-col gap-1 overflow-y-auto border-t border-rule/70 px-2 py-1.5" data-testid="concerns">
          {concerns.map((concern: Concern, index) => {
            const style = concernStyles[concern.level];
            return (
              <li key={`${concern.level}-${concern.path ?? ""}-${index}`} className={`flex items-baseline gap-2 rounded-md border px-2.5 py-1 text-[12px] leading-snug text-ink-soft ${style.frame}`}>
                <span className={`shrink-0 font-semibold ${style.tag}`}>{style.label}</span>
                <span className="min-w-0 flex-1">{concern.message}</span>
                {concern.path && onShowPath ? (
                  <button type="button" onClick={() => onShowPath(concern.path!)} className="shrink-0 font-medium text-tide-700 underline-offset-2 hover:underline">
                    Show
                  </button>
                ) : null}
              </li>
            );
          })}
        </ul>
      ) : null}
    </section>
  );
}
