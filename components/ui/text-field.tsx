import { forwardRef, type InputHTMLAttributes, type TextareaHTMLAttributes } from "react";

interface FieldFrameProps {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: React.ReactNode;
}

/** Label, control, and the message beside it: a hint, or the error that replaces it. */
export function FieldFrame({ id, label, hint, error, children }: FieldFrameProps) {
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-medium text-ink-soft">
        {label}
      </label>
      {children}
      {error ? (
        <p id={`${id}-message`} role="alert" className="flex items-start gap-1.5 text-sm text-signal-error">
          <span aria-hidden className="mt-[3px] inline-block size-2.5 shrink-0 rounded-full bg-signal-error" />
          {error}
        </p>
      ) : hint ? (
        <p id={`${id}-message`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

const controlClasses = (invalid: boolean) =>
  `w-full rounded-md border bg-panel px-3 text-[15px] text-ink placeholder:text-muted/70 transition-colors focus:outline-none focus:ring-2 ${
    invalid ? "border-signal-error focus:ring-signal-error/25" : "border-rule-strong focus:border-tide-500 focus:ring-tide-500/20"
  }`;

type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & { id: string; label: string; hint?: string; error?: string };

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField({ id, label, hint, error, className = "", ...props }, ref) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error}>
      <input
        ref={ref}
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error || hint ? `${id}-message` : undefined}
        className={`${controlClasses(Boolean(error))} h-10 ${className}`}
        {...props}
      />
    </FieldFrame>
  );
});

type TextAreaFieldProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { id: string; label: string; hint?: string; error?: string };

export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaFieldProps>(function TextAreaField(
  { id, label, hint, error, className = "", ...props },
  ref,
) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error}>
      <textarea
        ref={ref}
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error || hint ? `${id}-message` : undefined}
        className={`${controlClasses(Boolean(error))} min-h-24 py-2 ${className}`}
        {...props}
      />
    </FieldFrame>
  );
});
