"use client";
// The foot of every import panel: what the import will add, or why it cannot, and the buttons. The
// import button stays disabled while there is a reason; nothing reaches the scene until it is pressed.
import type { ImportResult } from "@/lib/scene-import/geometry";

import type { PlannedImport } from "./import-edits";

/** A refusal from the editor, kept with the plan it refused so it disappears once the choices change. */
export interface Refusal {
  plan: PlannedImport;
  message: string;
}

export function ImportFooter({
  plan,
  refusal,
  onApply,
  onCancel,
}: {
  plan: ImportResult<PlannedImport>;
  refusal: Refusal | null;
  onApply: (plan: PlannedImport) => void;
  onCancel: () => void;
}) {
  const message = !plan.ok ? plan.message : refusal && refusal.plan === plan ? refusal.message : null;
  return (
    <div className="flex flex-col gap-3 border-t border-rule pt-3">
      {message ? (
        <p role="alert" data-testid="import-problem" className="rounded-md bg-signal-error-50 px-3 py-2 text-[12.5px] leading-snug text-signal-error">
          {message}
        </p>
      ) : plan.ok ? (
        <p data-testid="import-preview" className="rounded-md bg-tide-50 px-3 py-2 text-[12.5px] leading-snug text-ink-soft">
          Adds {plan.added}. One undo takes it back.
        </p>
      ) : null}
      <div className="flex justify-end gap-2">
        <button type="button" onClick={onCancel} className="h-8 rounded-md border border-rule-strong bg-panel px-3 text-[13px] font-medium text-ink hover:border-ink-soft hover:bg-paper">
          Cancel
        </button>
        <button
          type="button"
          disabled={!plan.ok || message !== null}
          data-testid="import-apply"
          onClick={() => plan.ok && onApply(plan)}
          className="h-8 rounded-md bg-tide-600 px-3.5 text-[13px] font-medium text-white shadow-sm hover:bg-tide-700 disabled:cursor-not-allowed disabled:bg-tide-300"
        >
          Import
        </button>
      </div>
    </div>
  );
}
