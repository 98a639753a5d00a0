import type { ReactNode } from "react";

/** Shown while data loads: the shape of what is coming, not a spinner. */
export function LoadingRows({ rows = 3, label }: { rows?: number; label: string }) {
  return (
    <div role="status" aria-label={label} className="flex flex-col gap-3">
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className="h-24 animate-pulse rounded-lg border border-rule bg-panel/70" />
      ))}
      <span className="sr-only">{label}</span>
    </div>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-rule-strong bg-panel/60 px-6 py-12 text-center">
      <svg aria-hidden viewBox="0 0 48 48" className="size-10 text-tide-500">
        <circle cx="10" cy="38" r="3" fill="currentColor" />
        <path d="M10 26a12 12 0 0 1 12 12M10 16a22 22 0 0 1 22 22M10 6a32 32 0 0 1 32 32" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" opacity="0.8" />
      </svg>
      <h3 className="text-base font-semibold text-ink">{title}</h3>
      {children ? <div className="max-w-md text-sm text-muted">{children}</div> : null}
      {action}
    </div>
  );
}

export function ErrorState({ title, message, onRetry }: { title: string; message: string; onRetry?: () => void }) {
  return (
    <div role="alert" className="flex items-start gap-3 rounded-lg border border-signal-error/30 bg-signal-error-50 px-4 py-3 text-sm">
      <span aria-hidden className="mt-0.5 inline-flex size-5 shrink-0 items-center justify-center rounded-full bg-signal-error text-xs font-bold text-white">
        !
      </span>
      <div className="flex-1">
        <p className="font-semibold text-signal-error">{title}</p>
        <p className="text-ink-soft">{message}</p>
      </div>
      {onRetry ? (
        <button type="button" onClick={onRetry} className="font-medium text-signal-error underline underline-offset-2 hover:text-ember-700">
          Try again
        </button>
      ) : null}
    </div>
  );
}
