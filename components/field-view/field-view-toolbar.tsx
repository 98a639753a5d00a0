"use client";
// Controls for the field view: which map to show, the colour range (automatic, or fixed at values the user
// types), and PNG export. Controlled: the parent holds mode and range and passes them to FieldView too.
import { useState } from "react";

import { buttonClasses } from "@/components/ui/button";

import { LEVEL_DIFFERENCE_SCALE, LEVEL_SCALE, PRESSURE_SCALE, cssGradient, type ColourScale } from "./colour-scales";
import type { FieldRange, FieldViewMode } from "./field-display";

const MODES: { mode: FieldViewMode; label: string; scale: ColourScale }[] = [
  { mode: "pressure", label: "Pressure", scale: PRESSURE_SCALE },
  { mode: "peak-level", label: "Peak level", scale: LEVEL_SCALE },
  { mode: "rms-level", label: "RMS level", scale: LEVEL_SCALE },
  { mode: "level-difference", label: "Insertion loss", scale: LEVEL_DIFFERENCE_SCALE },
];

export interface FieldViewToolbarProps {
  mode: FieldViewMode;
  onModeChange: (mode: FieldViewMode) => void;
  /** Modes that cannot be shown, with the reason as a tooltip (e.g. no reference run chosen). */
  unavailableModes?: Partial<Record<FieldViewMode, string>>;
  range: FieldRange;
  onRangeChange: (range: FieldRange) => void;
  /** The range the view draws with now (Pa or dB): "Fixed" starts from it, so the picture does not jump. */
  currentRange?: () => { low: number; high: number } | undefined;
  onExport: () => Promise<void> | void;
  className?: string;
}

/** Saves a blob as a download with the given file name. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement("a");
  link.href = url;
  link.download = fileName;
  link.click();
  // The download has started by the next task; the URL is no longer needed.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

const segment = "inline-flex items-center rounded-md border border-rule-strong bg-panel p-0.5";
const segmentButton = (active: boolean) =>
  `inline-flex h-7 items-center gap-1.5 rounded-[5px] px-2.5 text-[13px] font-medium transition-colors disabled:cursor-not-allowed disabled:text-muted/60 ${
    active ? "bg-night text-white shadow-sm" : "text-ink-soft hover:bg-ink/5 hover:text-ink"
  }`;

function isSymmetric(mode: FieldViewMode): boolean {
  return mode === "pressure" || mode === "level-difference";
}

function unitOf(mode: FieldViewMode): string {
  if (mode === "pressure") return "Pa";
  return mode === "level-difference" ? "dB" : "dB re 20 \u00b5Pa";
}

/** A number field that reports a valid value as it is typed and ignores anything else. */
function RangeNumber({ label, value, onValue, min }: { label: string; value: number; onValue: (value: number) => void; min?: number }) {
  const [text, setText] = useState(() => String(value));
  const [shown, setShown] = useState(value);
  // Follows a new value from outside (another mode, "Fixed" pressed again) without losing what is being typed.
  if (shown !== value) {
    setShown(value);
    setText(String(value));
  }
  return (
    <input
      aria-label={label}
      inputMode="decimal"
      className="tabular h-7 w-20 rounded-md border border-rule-strong bg-panel px-2 font-mono text-[13px] text-ink focus:border-tide-500 focus:outline-none"
      value={text}
      onChange={(event) => {
        setText(event.target.value);
        const parsed = Number(event.target.value);
        if (event.target.value.trim() !== "" && Number.isFinite(parsed) && (min === undefined || parsed > min)) {
          setShown(parsed);
          onValue(parsed);
        }
      }}
    />
  );
}

/** Rounds a range end to 3 significant figures for the input box. */
function tidy(value: number): number {
  return Number(value.toPrecision(3));
}

export function FieldViewToolbar({ mode, onModeChange, unavailableModes = {}, range, onRangeChange, currentRange, onExport, className = "" }: FieldViewToolbarProps) {
  const [exporting, setExporting] = useState(false);
  const symmetric = isSymmetric(mode);
  const fixed = range.kind === "fixed" ? range : undefined;
  const fixedMaxAbs = fixed && "maxAbs" in fixed ? fixed.maxAbs : undefined;
  const fixedSpan = fixed && "min" in fixed ? fixed : undefined;
  const fixedFits = symmetric ? fixedMaxAbs !== undefined : fixedSpan !== undefined;

  const chooseFixed = () => {
    const now = currentRange?.();
    if (symmetric) onRangeChange({ kind: "fixed", maxAbs: tidy(now ? Math.max(Math.abs(now.low), Math.abs(now.high)) : mode === "pressure" ? 1 : 10) });
    else onRangeChange({ kind: "fixed", min: tidy(now?.low ?? 40), max: tidy(now?.high ?? 100) });
  };

  return (
    <div className={`flex flex-wrap items-center gap-x-4 gap-y-2 ${className}`}>
      <div role="radiogroup" aria-label="Map" className={segment}>
        {MODES.map(({ mode: option, label, scale }) => {
          const reason = unavailableModes[option];
          return (
            <button
              key={option}
              type="button"
              role="radio"
              aria-checked={mode === option}
              disabled={reason !== undefined}
              title={reason ?? scale.description}
              className={segmentButton(mode === option)}
              onClick={() => onModeChange(option)}
            >
              <span aria-hidden className="h-2.5 w-4 rounded-[2px] ring-1 ring-ink/15" style={{ backgroundImage: cssGradient(scale) }} />
              {label}
            </button>
          );
        })}
      </div>

      <div className="flex items-center gap-2">
        <span className="text-[13px] text-muted">Range</span>
        <div role="radiogroup" aria-label="Colour range" className={segment}>
          <button type="button" role="radio" aria-checked={!fixedFits} className={segmentButton(!fixedFits)} onClick={() => onRangeChange({ kind: "auto" })}>
            Auto
          </button>
          <button type="button" role="radio" aria-checked={fixedFits} className={segmentButton(fixedFits)} onClick={chooseFixed}>
            Fixed
          </button>
        </div>
        {fixedFits && symmetric && fixedMaxAbs !== undefined ? (
          <label className="flex items-center gap-1.5 text-[13px] text-ink-soft">
            <span aria-hidden>{"\u00b1"}</span>
            <RangeNumber label={`Largest magnitude shown, ${unitOf(mode)}`} value={fixedMaxAbs} min={0} onValue={(maxAbs) => onRangeChange({ kind: "fixed", maxAbs })} />
            <span className="text-muted">{unitOf(mode)}</span>
          </label>
        ) : null}
        {fixedFits && !symmetric && fixedSpan ? (
          <span className="flex items-center gap-1.5 text-[13px] text-ink-soft">
            <RangeNumber label="Lowest level shown, dB" value={fixedSpan.min} onValue={(min) => min < fixedSpan.max && onRangeChange({ kind: "fixed", min, max: fixedSpan.max })} />
            <span className="text-muted">to</span>
            <RangeNumber label="Highest level shown, dB" value={fixedSpan.max} onValue={(max) => max > fixedSpan.min && onRangeChange({ kind: "fixed", min: fixedSpan.min, max })} />
            <span className="text-muted">{unitOf(mode)}</span>
          </span>
        ) : null}
      </div>

      <button
        type="button"
        className={`${buttonClasses("secondary", "sm")} ml-auto`}
        disabled={exporting}
        onClick={async () => {
          setExporting(true);
          try {
            await onExport();
          } finally {
            setExporting(false);
          }
        }}
      >
        <svg aria-hidden viewBox="0 0 16 16" className="size-3.5" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round">
          <path d="M8 2v8M4.5 6.5 8 10l3.5-3.5M3 13h10" />
        </svg>
        {exporting ? "Exporting\u2026" : "Export PNG"}
      </button>
    </div>
  );
}
