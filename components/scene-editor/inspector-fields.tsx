"use client";
// Compact form controls for the inspector. A field keeps what is typed as a draft and commits it on
// Enter or when focus leaves; Escape puts the scene's value back. A value the scene refuses stays in
// the field with the reason beneath, so nothing typed is silently lost.
import { useId, useState, type ChangeEvent, type KeyboardEvent, type ReactNode } from "react";

/** Returns why a value was refused, or null when it was applied. */
export type Commit<T> = (value: T) => string | null;

const inputClasses = (invalid: boolean) =>
  `h-8 w-full min-w-0 rounded-md border bg-panel px-2 text-[13px] text-ink transition-colors focus:outline-none focus:ring-2 disabled:cursor-default disabled:bg-paper/60 disabled:text-ink-soft ${
    invalid ? "border-signal-error focus:ring-signal-error/25" : "border-rule-strong hover:border-ink-soft/50 focus:border-tide-500 focus:ring-tide-500/20"
  }`;

/** A number as the inspector shows it: no float noise (0.30000000000000004 reads 0.3). */
export function formatNumber(value: number | undefined): string {
  if (value === undefined || !Number.isFinite(value)) return "";
  return String(Number(value.toPrecision(12)));
}

/** Reads a typed number; accepts a decimal comma and a leading "−" (U+2212). */
export function readNumber(text: string): number | null {
  const cleaned = text.trim().replace(",", ".").replace("\u2212", "-");
  if (cleaned === "" || !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(cleaned)) return null;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : null;
}

interface NumberFieldProps {
  /** Visible label; empty for a field whose meaning the layout shows, which then needs `ariaLabel`. */
  label: string;
  ariaLabel?: string;
  value: number | undefined;
  unit?: string;
  /** Inclusive bounds; `exclusiveMin` makes the lower one strict (a positive quantity). */
  min?: number;
  max?: number;
  exclusiveMin?: boolean;
  integer?: boolean;
  /** The field may be emptied (an optional value); commits undefined. */
  optional?: boolean;
  placeholder?: string;
  hint?: ReactNode;
  disabled?: boolean;
  onCommit: Commit<number | undefined>;
  testId?: string;
}

function rangeProblem(value: number, props: NumberFieldProps): string | null {
  if (props.integer && !Number.isInteger(value)) return "a whole number, please";
  if (props.min !== undefined && (props.exclusiveMin ? value <= props.min : value < props.min)) {
    return props.exclusiveMin ? `must be above ${formatNumber(props.min)}` : `at least ${formatNumber(props.min)}`;
  }
  if (props.max !== undefined && value > props.max) return `at most ${formatNumber(props.max)}`;
  return null;
}

/**
 * The text of a field while someone types in it: what is typed and not yet taken by the scene (with the
 * reason when the scene refused it), following the scene's own value whenever the field is not being
 * edited (a drag on the canvas, undo, the code view). Enter commits, Escape drops the draft, leaving commits.
 */
function useDraftText(shown: string) {
  const [pending, setPending] = useState<{ text: string; error: string | null } | null>(null);
  const [focused, setFocused] = useState(false);
  const [seen, setSeen] = useState(shown);
  if (seen !== shown && !focused) {
    setSeen(shown);
    setPending(null);
  }
  const inputEvents = (commit: () => void) => ({
    onFocus: () => setFocused(true),
    onChange: (event: ChangeEvent<HTMLInputElement>) => setPending({ text: event.target.value, error: null }),
    onBlur: () => {
      commit();
      setFocused(false);
    },
    onKeyDown: (event: KeyboardEvent<HTMLInputElement>) => {
      if (event.key === "Enter") {
        event.preventDefault();
        commit();
      } else if (event.key === "Escape") {
        event.preventDefault();
        setPending(null);
        event.currentTarget.blur();
      }
    },
  });
  return { pending, setPending, draft: pending?.text ?? shown, error: pending?.error ?? null, inputEvents };
}

export function NumberField(props: NumberFieldProps) {
  const { label, ariaLabel, value, unit, hint, disabled, testId, placeholder } = props;
  const id = useId();
  const shown = formatNumber(value);
  const { pending, setPending, draft, error, inputEvents } = useDraftText(shown);

  const commit = () => {
    if (pending === null) return;
    const refuse = (reason: string | null) => setPending(reason === null ? null : { text: draft, error: reason });
    if (draft.trim() === "" && props.optional) {
      refuse(value === undefined ? null : props.onCommit(undefined));
      return;
    }
    const parsed = readNumber(draft);
    if (parsed === null) return refuse("not a number");
    const problem = rangeProblem(parsed, props);
    if (problem) return refuse(problem);
    if (parsed === value) return refuse(null);
    refuse(props.onCommit(parsed));
  };

  return (
    <div className="flex min-w-0 flex-col gap-1">
      {label ? (
        <label htmlFor={id} className="text-[12px] font-medium text-ink-soft">
          {label}
        </label>
      ) : null}
      <div className="relative">
        <input
          id={id}
          aria-label={label ? undefined : ariaLabel}
          data-testid={testId}
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          disabled={disabled}
          placeholder={placeholder}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          className={`${inputClasses(Boolean(error))} font-mono tabular ${unit ? "pr-9" : ""}`}
          value={draft}
          {...inputEvents(commit)}
        />
        {unit ? <span className="pointer-events-none absolute inset-y-0 right-2 flex items-center text-[11.5px] text-muted">{unit}</span> : null}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-[11.5px] leading-snug text-signal-error">
          {error}
        </p>
      ) : hint ? (
        <p className="text-[11.5px] leading-snug text-muted">{hint}</p>
      ) : null}
    </div>
  );
}

export function TextInputField({ label, value, onCommit, placeholder, testId }: { label: string; value: string; onCommit: Commit<string>; placeholder?: string; testId?: string }) {
  const id = useId();
  const { pending, setPending, draft, error, inputEvents } = useDraftText(value);
  const commit = () => {
    if (pending === null) return;
    const refused = draft === value ? null : onCommit(draft);
    setPending(refused === null ? null : { text: draft, error: refused });
  };
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-[12px] font-medium text-ink-soft">
        {label}
      </label>
      <input
        id={id}
        data-testid={testId}
        autoComplete="off"
        placeholder={placeholder}
        className={inputClasses(Boolean(error))}
        value={draft}
        {...inputEvents(commit)}
      />
      {error ? <p className="text-[11.5px] text-signal-error">{error}</p> : null}
    </div>
  );
}

export interface Choice<T extends string> {
  value: T;
  label: string;
}

export function SelectField<T extends string>({
  label,
  value,
  choices,
  onChange,
  testId,
  hint,
}: {
  label: string;
  value: T;
  choices: readonly Choice<T>[];
  onChange: (value: T) => void;
  testId?: string;
  hint?: ReactNode;
}) {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-[12px] font-medium text-ink-soft">
        {label}
      </label>
      <select id={id} data-testid={testId} className={`${inputClasses(false)} pr-7`} value={value} onChange={(event) => onChange(event.target.value as T)}>
        {choices.map((choice) => (
          <option key={choice.value} value={choice.value}>
            {choice.label}
          </option>
        ))}
      </select>
      {hint ? <p className="text-[11.5px] leading-snug text-muted">{hint}</p> : null}
    </div>
  );
}

/** A row of mutually exclusive buttons for two to five short choices. */
export function SegmentedChoice<T extends string>({ label, value, choices, onChange }: { label: string; value: T; choices: readonly Choice<T>[]; onChange: (value: T) => void }) {
  return (
    <div className="flex flex-col gap-1">
      <span className="text-[12px] font-medium text-ink-soft">{label}</span>
      <div role="radiogroup" aria-label={label} className="flex rounded-md border border-rule-strong bg-paper p-0.5">
        {choices.map((choice) => {
          const active = choice.value === value;
          return (
            <button
              key={choice.value}
              type="button"
              role="radio"
              aria-checked={active}
              onClick={() => onChange(choice.value)}
              className={`flex-1 rounded-[5px] px-2 py-1 text-[12.5px] font-medium transition-colors ${active ? "bg-panel text-ink shadow-sm ring-1 ring-rule-strong" : "text-muted hover:text-ink"}`}
            >
              {choice.label}
            </button>
          );
        })}
      </div>
    </div>
  );
}

export function CheckboxField({ label, checked, onChange, hint }: { label: string; checked: boolean; onChange: (checked: boolean) => void; hint?: ReactNode }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="flex items-center gap-2 text-[13px] text-ink">
        <input id={id} type="checkbox" className="size-4 accent-tide-600" checked={checked} onChange={(event) => onChange(event.target.checked)} />
        {label}
      </label>
      {hint ? <p className="pl-6 text-[11.5px] text-muted">{hint}</p> : null}
    </div>
  );
}

/** A titled group of fields in the inspector. */
export function Section({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <section className="flex flex-col gap-3 border-t border-rule px-4 py-4 first:border-t-0">
      <div className="flex items-baseline justify-between gap-2">
        <h3 className="text-[11px] font-semibold uppercase tracking-[0.08em] text-muted">{title}</h3>
        {aside}
      </div>
      {children}
    </section>
  );
}

/** A read-only figure beside the fields (a derived length, an area). */
export function Readout({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 text-[12.5px]">
      <span className="text-muted">{label}</span>
      <span className="font-mono tabular text-ink">{value}</span>
    </div>
  );
}
