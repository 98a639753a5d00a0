"use client";
// A thread: its first comment, the replies under it, a reply box, and resolve/reopen for those who
// may comment. A resolved thread folds to its first comment until opened.
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { formatWhen } from "@/lib/client/format";
import type { CommentThread } from "@/lib/http/comment-types";
import { CommentCard, type CommentCardProps } from "./comment-card";
import { CommentComposer } from "./comment-composer";

type SharedCardProps = Pick<CommentCardProps, "callerId" | "canModerate" | "members" | "names" | "receiverLabel">;

export interface CommentThreadViewProps extends SharedCardProps {
  thread: CommentThread;
  canComment: boolean;
  pinNumbers: ReadonlyMap<string, number>;
  highlightedId: string | null;
  onJump: (commentId: string) => void;
  onReply: (parentId: string, body: string) => Promise<unknown>;
  onEdit: (commentId: string, body: string) => Promise<unknown>;
  onDelete: (commentId: string) => Promise<unknown>;
  onResolve: (commentId: string, resolved: boolean) => Promise<unknown>;
}

export function CommentThreadView({ thread, canComment, pinNumbers, highlightedId, onJump, onReply, onEdit, onDelete, onResolve, ...shared }: CommentThreadViewProps) {
  const resolved = thread.resolvedAt !== null;
  const [replying, setReplying] = useState(false);
  const [expanded, setExpanded] = useState(!resolved);
  const [resolving, setResolving] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const showReplies = expanded || !resolved;

  async function toggleResolved() {
    setResolving(true);
    setFailure(null);
    try {
      await onResolve(thread.id, !resolved);
      setExpanded(resolved);
    } catch (error) {
      setFailure(error instanceof Error ? error.message : "The thread's state was not saved.");
    } finally {
      setResolving(false);
    }
  }

  const card = (comment: CommentThread | CommentThread["replies"][number]) => (
    <CommentCard
      key={comment.id}
      comment={comment}
      pinNumber={pinNumbers.get(comment.id)}
      highlighted={highlightedId === comment.id}
      onJump={comment.pin ? () => onJump(comment.id) : undefined}
      onEdit={(body) => onEdit(comment.id, body)}
      onDelete={() => onDelete(comment.id)}
      {...shared}
    />
  );

  return (
    <li className={`rounded-lg border bg-panel px-4 py-2 ${resolved ? "border-rule bg-paper/60" : "border-rule-strong"}`} data-testid="comment-thread" data-resolved={resolved || undefined}>
      {resolved ? (
        <p className="flex flex-wrap items-center gap-2 pt-1 text-xs text-signal-ok">
          <span aria-hidden>✓</span>
          Resolved by {thread.resolvedByName ?? "a former member"}, {formatWhen(thread.resolvedAt!)}
        </p>
      ) : null}
      {card(thread)}
      {showReplies && thread.replies.length > 0 ? (
        <ol className="ml-4 flex flex-col border-l-2 border-rule pl-4" aria-label="Replies">
          {thread.replies.map((reply) => (
            <li key={reply.id}>{card(reply)}</li>
          ))}
        </ol>
      ) : null}
      {replying && canComment ? (
        <div className="ml-4 border-l-2 border-tide-100 py-2 pl-4">
          <CommentComposer
            label="Your reply"
            placeholder="Reply to this thread"
            submitLabel="Reply"
            members={shared.members}
            autoFocus
            onSubmit={async (body) => {
              await onReply(thread.id, body);
              setReplying(false);
            }}
            onCancel={() => setReplying(false)}
          />
        </div>
      ) : null}
      {/* Readers without the right to comment see no controls, so no empty footer either. */}
      {canComment || failure || (resolved && thread.replies.length > 0) ? (
        <footer className="flex flex-wrap items-center gap-2 border-t border-rule/70 py-1.5">
          {resolved && thread.replies.length > 0 ? (
            <Button size="sm" variant="quiet" onClick={() => setExpanded((value) => !value)} aria-expanded={showReplies}>
              {showReplies ? "Hide replies" : `Show ${thread.replies.length} ${thread.replies.length === 1 ? "reply" : "replies"}`}
            </Button>
          ) : null}
          {canComment && !replying ? (
            <Button size="sm" variant="quiet" onClick={() => setReplying(true)}>
              Reply
            </Button>
          ) : null}
          {canComment ? (
            <Button size="sm" variant="quiet" onClick={() => void toggleResolved()} disabled={resolving}>
              {resolving ? "Saving…" : resolved ? "Reopen" : "Resolve"}
            </Button>
          ) : null}
          {failure ? (
            <span role="alert" className="text-xs text-signal-error">
              {failure}
            </span>
          ) : null}
        </footer>
      ) : null}
    </li>
  );
}
