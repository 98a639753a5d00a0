"use client";
// The review commands this person may give on this run, as buttons; one opens a small form (a note,
// and for a sign-off the run hash being signed). A button the person may not use stays visible,
// disabled, with the reason beside it. The same rules decide on the server.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextAreaField } from "@/components/ui/text-field";
import type { TeamRole } from "@/lib/access/roles";
import { ApiError } from "@/lib/client/api";
import { useReviewDecision } from "@/lib/client/review-queries";
import type { RunRecord } from "@/lib/http/api-types";
import { decideReviewTransition, reviewCommandOptions, type ReviewCommand } from "@/lib/review/review-rules";
import { reviewNoteMaxLength } from "@/lib/validation/review";

interface CommandWords {
  button: string;
  noteLabel: string;
  submit: string;
  variant: "primary" | "secondary";
}

const words: Record<ReviewCommand, CommandWords> = {
  request_review: { button: "Ask for review", noteLabel: "Note for the reviewer (optional)", submit: "Ask for review", variant: "primary" },
  ask_revision: { button: "Ask for a revision", noteLabel: "What should be revised?", submit: "Send the revision request", variant: "secondary" },
  sign_off: { button: "Sign off", noteLabel: "Note with the sign-off (optional)", submit: "Sign off this run", variant: "primary" },
  withdraw_sign_off: { button: "Withdraw sign-off", noteLabel: "Why is the sign-off withdrawn?", submit: "Withdraw the sign-off", variant: "secondary" },
};

export function ReviewActions({ run, role, callerId }: { run: RunRecord; role: TeamRole; callerId: string }) {
  const actor = { userId: callerId, role };
  const options = reviewCommandOptions({ actor, run });
  const [open, setOpen] = useState<ReviewCommand | null>(null);
  // Kept across failed attempts and across switching forms, so nothing typed is lost.
  const [note, setNote] = useState("");
  const [noteError, setNoteError] = useState<string | null>(null);
  const decision = useReviewDecision({ runId: run.id, studyId: run.studyId });
  const noteId = useId();

  if (options.length === 0) return null;
  const openOption = options.find((option) => option.command === open && option.available) ?? null;
  const refusals = [...new Set(options.filter((option) => !option.available && option.reason).map((option) => option.reason!))];

  const submit = (command: ReviewCommand) => {
    const toState = options.find((option) => option.command === command)!.toState;
    const verdict = decideReviewTransition({ actor, run, toState, note });
    if (!verdict.ok) {
      setNoteError(verdict.reason);
      return;
    }
    setNoteError(null);
    decision.mutate(
      { toState, note: note.trim(), fromState: run.reviewState },
      {
        onSuccess: () => {
          setOpen(null);
          setNote("");
        },
      },
    );
  };

  const serverError = decision.error instanceof ApiError ? decision.error : null;
  const serverNoteIssue = serverError?.issues.find((issue) => issue.path === "note")?.message;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-2">
        {options.map((option) => (
          <Button
            key={option.command}
            size="sm"
            variant={words[option.command].variant}
            disabled={!option.available || decision.isPending}
            title={option.reason ?? undefined}
            aria-expanded={option.available ? open === option.command : undefined}
            onClick={() => {
              decision.reset();
              setNoteError(null);
              setOpen((current) => (current === option.command ? null : option.command));
            }}
          >
            {words[option.command].button}
          </Button>
        ))}
      </div>
      {refusals.length > 0 ? (
        <ul className="flex flex-col gap-0.5 text-[13px] text-muted">
          {refusals.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      ) : null}
      {openOption ? (
        <form
          // The rules' own words ("Say what should be revised.") instead of the browser's bubble.
          noValidate
          className="flex flex-col gap-3 rounded-md border border-rule bg-paper/60 p-3"
          onSubmit={(event) => {
            event.preventDefault();
            submit(openOption.command);
          }}
        >
          {openOption.command === "sign_off" ? <SignOffConfirmation run={run} /> : null}
          <TextAreaField
            id={noteId}
            label={words[openOption.command].noteLabel}
            value={note}
            maxLength={reviewNoteMaxLength}
            required={openOption.noteRequired}
            onChange={(event) => setNote(event.target.value)}
            error={noteError ?? serverNoteIssue}
            className="min-h-20 text-sm"
          />
          {serverError && !serverNoteIssue ? <DecisionError error={serverError} /> : null}
          <div className="flex gap-2">
            <Button type="submit" size="sm" variant={openOption.command === "withdraw_sign_off" ? "danger" : "primary"} disabled={decision.isPending}>
              {decision.isPending ? "Saving…" : words[openOption.command].submit}
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setOpen(null)} disabled={decision.isPending}>
              Cancel
            </Button>
          </div>
        </form>
      ) : open !== null && (note.trim() || serverError) ? (
        // The run moved on (someone else decided) and this command no longer applies: keep what was typed.
        <div className="flex flex-col gap-2 rounded-md border border-rule bg-paper/60 p-3 text-[13px] text-ink-soft">
          {serverError ? <DecisionError error={serverError} /> : <p>The review state has changed; this command no longer applies.</p>}
          {note.trim() ? (
            <>
              <p className="font-medium text-ink">Your note, not sent:</p>
              <p className="whitespace-pre-wrap rounded border border-rule bg-panel px-2 py-1.5">{note}</p>
            </>
          ) : null}
          <div>
            <Button size="sm" variant="quiet" onClick={() => setOpen(null)}>
              Close
            </Button>
          </div>
        </div>
      ) : null}
    </div>
  );
}

/** Says exactly what is being signed: this run's hash and the scene version it was run from. */
function SignOffConfirmation({ run }: { run: RunRecord }) {
  return (
    <div className="flex flex-col gap-1 text-[13px] leading-snug text-ink-soft">
      <p>
        You sign off the run with hash <code className="break-all font-mono text-[12px] text-ink">{run.inputHash}</code>, made from version {run.sceneVersion} of {run.sceneName ? `“${run.sceneName}”` : "a deleted scene"}.
      </p>
      <p>The sign-off stays with this run. If the scene is changed later, the sign-off is shown as belonging to version {run.sceneVersion}.</p>
    </div>
  );
}

function DecisionError({ error }: { error: ApiError }) {
  const stale = error.status === 409;
  return (
    <p role="alert" className="rounded-md border border-signal-error/30 bg-signal-error-50 px-3 py-2 text-[13px] text-ink-soft">
      <span className="font-medium text-signal-error">{stale ? "Not saved: " : "The decision was not saved: "}</span>
      {error.message}
      {stale ? " Your note is kept here." : ""}
    </p>
  );
}
