"use client";
// One comment in a thread: author, time, an "edited" mark, its pin as a chip that jumps there, the
// Markdown, and for its author edit and delete (delete also for owners, who moderate).
import { useState } from "react";
import { formatWhen } from "@/lib/client/format";
import { mentionsAsPlainText } from "@/lib/collaboration/mentions";
import type { CommentItem } from "@/lib/http/comment-types";
import { CommentBody } from "./comment-body";
import { CommentComposer, PinGlyph } from "./comment-composer";
import type { MentionMember } from "./mention-textarea";
import { formatPin } from "./pin-format";

const whenFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export interface CommentCardProps {
  comment: CommentItem;
  /** The pin's number on the views, when it is pinned. */
  pinNumber?: number;
  callerId: string;
  canModerate: boolean;
  members: readonly MentionMember[];
  names: ReadonlyMap<string, string>;
  receiverLabel: (receiverId: string) => string;
  highlighted: boolean;
  onJump?: () => void;
  onEdit: (body: string) => Promise<unknown>;
  onDelete: () => Promise<unknown>;
}

export function CommentCard({ comment, pinNumber, callerId, canModerate, members, names, receiverLabel, highlighted, onJump, onEdit, onDelete }: CommentCardProps) {
  const [editing, setEditing] = useState(false);
  const [deleteFailure, setDeleteFailure] = useState<string | null>(null);
  const [deleting, setDeleting] = useState(false);
  const own = comment.authorId === callerId;

  if (comment.deleted) {
    return (
      <div id={`comment-${comment.id}`} className="py-2 text-sm italic text-muted" data-testid="comment" data-deleted>
        Comment deleted.
      </div>
    );
  }

  async function remove() {
    const whose = own ? "your comment" : `${comment.authorName ?? "this member"}'s comment`;
    if (!window.confirm(`Delete ${whose}? Its text is removed for everyone; replies stay.`)) return;
    setDeleting(true);
    setDeleteFailure(null);
    try {
      await onDelete();
    } catch (error) {
      setDeleteFailure(error instanceof Error ? error.message : "The comment was not deleted.");
    } finally {
      setDeleting(false);
    }
  }

  return (
    <article
      id={`comment-${comment.id}`}
      data-testid="comment"
      className={`scroll-mt-24 rounded-md py-2 transition-colors ${highlighted ? "bg-ember-50/70 ring-2 ring-ember-100" : ""}`}
      aria-label={`Comment by ${comment.authorName ?? "a former member"}`}
    >
      <header className="flex flex-wrap items-baseline gap-x-2 gap-y-1 text-sm">
        <span className="font-semibold text-ink">{comment.authorName ?? "A former member"}</span>
        <time dateTime={comment.createdAt} title={whenFormat.format(new Date(comment.createdAt))} className="text-xs text-muted">
          {formatWhen(comment.createdAt)}
        </time>
        {comment.editedAt ? (
          <span className="text-xs text-muted" title={`Edited ${whenFormat.format(new Date(comment.editedAt))}`}>
            (edited)
          </span>
        ) : null}
        {comment.pin ? (
          <button
            type="button"
            onClick={onJump}
            disabled={!onJump}
            title={onJump ? "Show this place and time in the run" : undefined}
            className="inline-flex items-center gap-1 rounded-full bg-ember-50 px-2 py-0.5 text-xs font-medium text-ember-700 ring-1 ring-ember-100 hover:bg-ember-100 disabled:cursor-default"
            data-testid="pin-chip"
          >
            <PinGlyph className="size-3" />
            {pinNumber !== undefined ? <span className="tabular">{pinNumber}</span> : null}
            <span className="tabular font-normal">{formatPin(comment.pin, receiverLabel)}</span>
          </button>
        ) : null}
        {!editing && (own || canModerate) ? (
          <span className="ml-auto flex gap-1">
            {own ? (
              <button type="button" onClick={() => setEditing(true)} className="rounded px-1.5 text-xs font-medium text-ink-soft hover:bg-ink/5 hover:text-ink">
                Edit
              </button>
            ) : null}
            <button type="button" onClick={() => void remove()} disabled={deleting} className="rounded px-1.5 text-xs font-medium text-ink-soft hover:bg-signal-error-50 hover:text-signal-error">
              {deleting ? "Deleting…" : "Delete"}
            </button>
          </span>
        ) : null}
      </header>
      <div className="mt-1">
        {editing ? (
          <CommentComposer
            label="Edit your comment"
            submitLabel="Save"
            members={members}
            initial={mentionsAsPlainText(comment.body, names)}
            autoFocus
            onSubmit={async (body) => {
              await onEdit(body);
              setEditing(false);
            }}
            onCancel={() => setEditing(false)}
          />
        ) : (
          <CommentBody body={comment.body} names={names} />
        )}
      </div>
      {deleteFailure ? (
        <p role="alert" className="mt-1 text-xs text-signal-error">
          Not deleted: {deleteFailure}
        </p>
      ) : null}
    </article>
  );
}
