"use client";
// Small controls shared by the analysis panels: a two-or-three-way switch, an export button that reports
// its own failure, a panel frame with a title and actions, and the 2D caution.
import { useState, type ReactNode } from "react";

import { Button } from "@/components/ui/button";

export function Segmented<T extends string | number>({ label, value, options, onChange }: { label: string; value: T; options: readonly { value: T; label: string; title?: string }[]; onChange: (value: T) => void }) {
  return (
    <div role="radiogroup" aria-label={label} className="inline-flex items-center rounded-md border border-rule-strong bg-panel p-0.5">
      {options.map((option) => (
        <button
          key={String(option.value)}
          type="button"
          role="radio"
          aria-checked={option.value === value}
          title={option.title}
          onClick={() => onChange(option.value)}
          className={`inline-flex h-7 items-center rounded-[5px] px-2.5 text-[13px] font-medium transition-colors ${option.value === value ? "bg-night text-white shadow-sm" : "text-ink-soft hover:bg-ink/5 hover:text-ink"}`}
        >
          {option.label}
        </button>
      ))}
    </div>
  );
}

/** A button that runs an export and shows why it failed, beside itself. */
export function ExportButton({ label, onExport, disabled, title }: { label: string; onExport: () => Promise<void> | void; disabled?: boolean; title?: string }) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <span className="inline-flex items-center gap-2">
      <Button
        variant="secondary"
        size="sm"
        disabled={disabled || busy}
        title={title}
        onClick={async () => {
          setBusy(true);
          setProblem(null);
          try {
            await onExport();
          } catch (error) {
            setProblem(error instanceof Error ? error.message : String(error));
          } finally {
            setBusy(false);
          }
        }}
      >
        {busy ? "Preparing\u2026" : label}
      </Button>
      {problem ? (
        <span role="alert" className="text-xs text-signal-error">
          {problem}
        </span>
      ) : null}
    </span>
  );
}

export function AnalysisPanel({ title, description, actions, children, testId }: { title: string; description?: ReactNode; actions?: ReactNode; children: ReactNode; testId?: string }) {
  return (
    <section className="flex flex-col gap-3 rounded-lg border border-rule bg-panel p-4" data-testid={testId} aria-label={title}>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <h3 className="text-base font-semibold text-ink">{title}</h3>
          {description ? <div className="mt-0.5 max-w-3xl text-[13px] text-muted">{description}</div> : null}
        </div>
        {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
      </header>
      {children}
    </section>
  );
}

/** Where a result could be read as more than it is: what a 2D section is and is not. */
export function SectionCaution({ className = "" }: { className?: string }) {
  return (
    <aside role="note" aria-label="About these results" className={`rounded-md border border-signal-warn/40 bg-ember-50 px-3 py-2 text-[13px] text-ink-soft ${className}`}>
      <strong className="font-semibold text-ink">A 2D section, not an assessment.</strong> These results come from a vertical section: it models a coherent line source and a barrier
      that are both infinitely long, so levels and insertion losses differ from those of a real, finite source and barrier. They are not a statutory noise assessment; local
      regulations and licensed practice govern any decision.
    </aside>
  );
}

/** A short muted note under a chart or table. */
export function Note({ children }: { children: ReactNode }) {
  return <p className="text-[12px] text-muted">{children}</p>;
}
