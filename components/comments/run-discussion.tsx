"use client";
// The saved run's discussion: threads with replies, open ones first and newest activity first, a
// composer for a new thread (with a pin on the field or a trace), and the pins handed to the views
// through the pin board. Viewers read it; owners, editors and reviewers write.
import { useEffect, useMemo, useState } from "react";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { useCommentMutations, useRunComments } from "@/lib/client/comment-queries";
import { useTeamMembers } from "@/lib/client/queries";
import { commentExcerpt } from "@/lib/collaboration/mentions";
import type { RunRecord } from "@/lib/http/api-types";
import type { CommentItem, CommentThread } from "@/lib/http/comment-types";
import { CommentComposer } from "./comment-composer";
import { CommentThreadView } from "./comment-thread";
import { usePinBoard, type PlacedPin } from "./pin-context";

/** Pinned comments numbered in the order they were written, so a marker keeps its number as threads move. */
function numberPins(threads: readonly CommentThread[]): Map<string, number> {
  const pinned = threads.flatMap((thread) => [thread, ...thread.replies]).filter((comment) => comment.pin && !comment.deleted);
  pinned.sort((a, b) => (a.createdAt < b.createdAt ? -1 : a.createdAt > b.createdAt ? 1 : a.id < b.id ? -1 : 1));
  return new Map(pinned.map((comment, index) => [comment.id, index + 1]));
}

function useHashTarget(): string | null {
  const [target, setTarget] = useState<string | null>(null);
  useEffect(() => {
    const read = () => setTarget(window.location.hash.startsWith("#comment-") ? window.location.hash.slice("#comment-".length) : null);
    read();
    window.addEventListener("hashchange", read);
    return () => window.removeEventListener("hashchange", read);
  }, []);
  return target;
}

export function RunDiscussion({ run, role, callerId }: { run: RunRecord; role: TeamRole; callerId: string }) {
  const comments = useRunComments(run.id);
  const team = useTeamMembers(run.teamId);
  const mutations = useCommentMutations(run.id);
  const board = usePinBoard();
  const [showResolved, setShowResolved] = useState(false);
  const hashTarget = useHashTarget();
  const canComment = roleAllows(role, "run:comment");
  const canModerate = roleAllows(role, "comment:moderate");

  const members = useMemo(() => (team.data?.members ?? []).map((member) => ({ userId: member.userId, name: member.name, role: member.role })), [team.data]);
  const threads = useMemo(() => comments.data?.threads ?? [], [comments.data]);
  const names = useMemo(() => {
    const map = new Map<string, string>();
    for (const thread of threads) for (const comment of [thread, ...thread.replies]) for (const mention of comment.mentions) map.set(mention.userId, mention.name);
    for (const member of members) map.set(member.userId, member.name);
    return map;
  }, [threads, members]);
  const receiverLabels = useMemo(() => new Map((run.summary?.receivers ?? []).map((receiver) => [receiver.id, receiver.label || receiver.id])), [run.summary]);
  const receiverLabel = (receiverId: string) => receiverLabels.get(receiverId) ?? receiverId;

  const open = threads.filter((thread) => thread.resolvedAt === null);
  const resolved = threads.filter((thread) => thread.resolvedAt !== null);

  // A marker on a view, or a link ending in #comment-<id>, brings its comment into view (opening the
  // resolved threads if it is in one) and marks it for a moment. Each request has its own key.
  const selected = board?.selected ?? null;
  const target = selected?.commentId ?? hashTarget;
  const requestKey = selected ? `marker:${selected.nonce}` : hashTarget ? `link:${hashTarget}` : null;
  const [expiredKey, setExpiredKey] = useState<string | null>(null);
  const [dismissedKey, setDismissedKey] = useState<string | null>(null);
  const targetInResolved = target !== null && resolved.some((thread) => thread.id === target || thread.replies.some((reply) => reply.id === target));
  const resolvedOnShow = showResolved || (targetInResolved && requestKey !== dismissedKey);
  const highlightedId = requestKey !== null && requestKey !== expiredKey ? target : null;
  const shown = resolvedOnShow ? [...open, ...resolved] : open;
  const hasThreads = threads.length > 0;
  useEffect(() => {
    if (!target || !requestKey || !hasThreads) return;
    document.getElementById(`comment-${target}`)?.scrollIntoView({ behavior: "smooth", block: "center" });
    const timer = setTimeout(() => setExpiredKey(requestKey), 2400);
    return () => clearTimeout(timer);
  }, [target, requestKey, hasThreads]);
  const pinNumbers = useMemo(() => numberPins(threads), [threads]);

  // Hand the pins of the threads on show to the field view and the trace chart.
  const publishPins = board?.publishPins;
  useEffect(() => {
    if (!publishPins) return;
    const placed: PlacedPin[] = [];
    for (const thread of shown) {
      for (const comment of [thread, ...thread.replies] as CommentItem[]) {
        const number = pinNumbers.get(comment.id);
        if (!comment.pin || number === undefined) continue;
        placed.push({ commentId: comment.id, number, pin: comment.pin, title: `${comment.authorName ?? "A former member"}: ${commentExcerpt(comment.body, 80)}`, resolved: thread.resolvedAt !== null });
      }
    }
    placed.sort((a, b) => a.number - b.number);
    publishPins(placed);
    // `shown` is derived from threads and the toggle.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [publishPins, threads, resolvedOnShow, pinNumbers]);
  useEffect(() => () => publishPins?.([]), [publishPins]);

  const shared = { callerId, canModerate, members, names, receiverLabel };
  return (
    <div className="flex flex-col gap-4" data-testid="run-discussion">
      {canComment ? (
        <div className="rounded-lg border border-rule bg-panel p-4">
          <CommentComposer
            label="New comment"
            placeholder="Start a thread about this run: what you checked, what looks wrong, what should change."
            submitLabel="Post comment"
            members={members}
            pinnable
            receiverLabel={receiverLabel}
            onSubmit={(body, pin) => mutations.add.mutateAsync({ body, pin })}
          />
        </div>
      ) : (
        <p className="text-sm text-muted">You can read the discussion; your role in this team does not include commenting.</p>
      )}
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <p className="text-ink-soft" aria-live="polite">
          {comments.isSuccess ? `${open.length} open ${open.length === 1 ? "thread" : "threads"}${resolved.length ? `, ${resolved.length} resolved` : ""}` : ""}
        </p>
        {resolved.length > 0 ? (
          <label className="flex items-center gap-2 text-ink-soft">
            <input
              type="checkbox"
              checked={resolvedOnShow}
              onChange={(event) => {
                setShowResolved(event.target.checked);
                if (!event.target.checked) setDismissedKey(requestKey);
              }}
              className="accent-tide-600"
            />
            Show resolved threads ({resolved.length})
          </label>
        ) : null}
      </div>
      {comments.isPending ? (
        <LoadingRows rows={1} label="Loading the discussion" />
      ) : comments.isError ? (
        <ErrorState title="The discussion could not be loaded" message={comments.error.message} onRetry={() => void comments.refetch()} />
      ) : shown.length === 0 ? (
        <p className="rounded-lg border border-dashed border-rule-strong px-4 py-6 text-center text-sm text-muted">
          {threads.length === 0 ? "No comments on this run yet." : "Every thread is resolved."}
        </p>
      ) : (
        <ol className="flex flex-col gap-3" aria-label="Threads">
          {shown.map((thread) => (
            <CommentThreadView
              key={thread.id}
              thread={thread}
              canComment={canComment}
              pinNumbers={pinNumbers}
              highlightedId={highlightedId}
              onJump={(commentId) => board?.jumpTo(commentId)}
              onReply={(parentId, body) => mutations.add.mutateAsync({ body, parentId })}
              onEdit={(commentId, body) => mutations.edit.mutateAsync({ commentId, body })}
              onDelete={(commentId) => mutations.remove.mutateAsync(commentId)}
              onResolve={(commentId, value) => mutations.resolve.mutateAsync({ commentId, resolved: value })}
              {...shared}
            />
          ))}
        </ol>
      )}
    </div>
  );
}

/** The page section: a full-width "Discussion" after the analysis. */
export function RunDiscussionSection(props: { run: RunRecord; role: TeamRole; callerId: string }) {
  return (
    <section aria-labelledby="discussion-heading" className="flex flex-col gap-3">
      <h2 id="discussion-heading" className="text-base font-semibold text-ink">
        Discussion
      </h2>
      <RunDiscussion {...props} />
    </section>
  );
}
