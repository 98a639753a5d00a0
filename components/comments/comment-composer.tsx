"use client";
// Writing a comment, a reply or an edit: Markdown with @mentions, and for a new thread a pin picked
// on the field or on a trace. The text stays in the box until the server has kept it; a refusal is
// shown beside it with the server's words.
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/client/api";
import { plainMentionsToTokens } from "@/lib/collaboration/mentions";
import { MAX_COMMENT_LENGTH, type CommentPin } from "@/lib/validation/comment";
import { MentionTextarea, type MentionMember } from "./mention-textarea";
import { usePinBoard } from "./pin-context";
import { formatPin } from "./pin-format";

export interface ComposerProps {
  label: string;
  placeholder?: string;
  submitLabel: string;
  members: readonly MentionMember[];
  /** Text to start from (an edit). */
  initial?: string;
  /** Offer "Pin to the field" and "Pin to a trace" (new threads). */
  pinnable?: boolean;
  receiverLabel?: (receiverId: string) => string;
  autoFocus?: boolean;
  onSubmit: (body: string, pin: CommentPin | null) => Promise<unknown>;
  onCancel?: () => void;
}

function failureMessage(error: unknown): string {
  if (error instanceof ApiError) {
    const issue = error.issues[0];
    return issue && !error.message.includes(issue.message) ? `${error.message} (${issue.path}: ${issue.message})` : error.message;
  }
  return error instanceof Error ? error.message : "The comment was not saved.";
}

export function CommentComposer({ label, placeholder, submitLabel, members, initial = "", pinnable = false, receiverLabel, autoFocus, onSubmit, onCancel }: ComposerProps) {
  const board = usePinBoard();
  const [text, setText] = useState(initial);
  const [sending, setSending] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const pin = pinnable ? (board?.picked ?? null) : null;
  const tooLong = text.length > MAX_COMMENT_LENGTH;
  const empty = text.trim().length === 0;

  async function submit() {
    if (empty || tooLong || sending) return;
    setSending(true);
    setFailure(null);
    try {
      await onSubmit(plainMentionsToTokens(text, members), pin);
      setText("");
      if (pinnable) board?.clearPicked();
    } catch (error) {
      // Keep every character typed, and the pin: the user fixes what the server named and posts again.
      setFailure(failureMessage(error));
    } finally {
      setSending(false);
    }
  }

  function startPicking(kind: CommentPin["kind"]) {
    if (!board) return;
    if (board.picking === kind) {
      board.stopPicking();
      return;
    }
    board.startPicking(kind);
    const target = document.querySelector(kind === "field" ? '[data-testid="field-view"]' : '[data-testid="traces"]');
    target?.scrollIntoView({ behavior: "smooth", block: "center" });
  }

  const messageId = `${label.replace(/\W+/g, "-")}-message`;
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        void submit();
      }}
    >
      <MentionTextarea
        value={text}
        onChange={(value) => {
          setText(value);
          if (failure) setFailure(null);
        }}
        members={members}
        label={label}
        placeholder={placeholder}
        invalid={Boolean(failure) || tooLong}
        autoFocus={autoFocus}
        onSubmitShortcut={() => void submit()}
        describedBy={messageId}
      />
      {pinnable && board ? (
        <div className="flex flex-wrap items-center gap-2 text-sm">
          {pin ? (
            <span className="inline-flex items-center gap-2 rounded-full bg-ember-50 py-0.5 pl-2.5 pr-1 text-ember-700 ring-1 ring-ember-100" data-testid="composer-pin">
              <PinGlyph />
              {formatPin(pin, receiverLabel)}
              <button type="button" onClick={() => board.clearPicked()} className="rounded-full px-1.5 text-xs font-medium hover:bg-ember-100" aria-label="Remove the pin">
                ✕
              </button>
            </span>
          ) : (
            <>
              <Button size="sm" variant={board.picking === "field" ? "primary" : "secondary"} onClick={() => startPicking("field")} aria-pressed={board.picking === "field"}>
                <PinGlyph />
                {board.picking === "field" ? "Click a point on the field…" : "Pin to the field"}
              </Button>
              <Button size="sm" variant={board.picking === "trace" ? "primary" : "secondary"} onClick={() => startPicking("trace")} aria-pressed={board.picking === "trace"}>
                <PinGlyph />
                {board.picking === "trace" ? "Click a point on a trace…" : "Pin to a trace"}
              </Button>
              {board.picking ? <span className="text-muted">Esc to stop.</span> : null}
            </>
          )}
        </div>
      ) : null}
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p id={messageId} role={failure ? "alert" : undefined} className={`text-xs ${failure || tooLong ? "text-signal-error" : "text-muted"}`}>
          {failure
            ? `Not saved: ${failure} Your text is kept.`
            : tooLong
              ? `${text.length.toLocaleString("en-GB")} of ${MAX_COMMENT_LENGTH.toLocaleString("en-GB")} characters: shorten it to post.`
              : "Markdown; type @ to mention a team member. Ctrl+Enter posts."}
        </p>
        <div className="flex gap-2">
          {onCancel ? (
            <Button size="sm" variant="quiet" onClick={onCancel} disabled={sending}>
              Cancel
            </Button>
          ) : null}
          <Button size="sm" type="submit" disabled={empty || tooLong || sending}>
            {sending ? "Posting…" : submitLabel}
          </Button>
        </div>
      </div>
    </form>
  );
}

export function PinGlyph({ className = "size-3.5" }: { className?: string }) {
  return (
    <svg aria-hidden viewBox="0 0 16 16" className={className}>
      <path d="M8 1.5a4.5 4.5 0 0 0-4.5 4.5c0 3.2 4.5 8.5 4.5 8.5s4.5-5.3 4.5-8.5A4.5 4.5 0 0 0 8 1.5Z" fill="currentColor" opacity="0.9" />
      <circle cx="8" cy="6" r="1.7" fill="white" />
    </svg>
  );
}
