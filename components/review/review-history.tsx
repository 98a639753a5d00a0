"use client";
// A run's review decisions, newest first: who moved it from which state to which, when, with what
// note, and the run hash and scene version the decision was made on.
import { formatWhen } from "@/lib/client/format";
import { useRunReviews } from "@/lib/client/review-queries";
import { reviewStateLabels } from "@/lib/review/review-states";
import { shortHash } from "@/lib/review/sign-off-standing";

export function ReviewHistory({ runId }: { runId: string }) {
  const reviews = useRunReviews(runId);
  if (reviews.isPending) return <p className="text-[13px] text-muted">Loading the review history…</p>;
  if (reviews.isError)
    return (
      <p role="alert" className="text-[13px] text-signal-error">
        The review history could not be loaded: {reviews.error.message}{" "}
        <button type="button" className="underline" onClick={() => void reviews.refetch()}>
          Try again
        </button>
      </p>
    );
  const list = reviews.data.reviews;
  if (list.length === 0) return <p className="text-[13px] text-muted">No review steps yet.</p>;
  return (
    <ol aria-label="Review history" className="flex flex-col gap-2.5">
      {list.map((review) => (
        <li key={review.id} className="border-l-2 border-rule pl-3 text-[13px]">
          <p className="text-ink">
            <span className="font-medium">{review.actorName ?? "A former member"}</span>: {reviewStateLabels[review.fromState]} → <span className="font-medium">{reviewStateLabels[review.toState]}</span>
          </p>
          <p className="text-muted">
            <time dateTime={review.createdAt} title={new Date(review.createdAt).toLocaleString("en-GB")}>
              {formatWhen(review.createdAt)}
            </time>
            {" · "}run <abbr title={review.runInputHash} className="font-mono no-underline">{shortHash(review.runInputHash, 8)}</abbr>
            {" · "}scene v{review.sceneVersion}
          </p>
          {review.note ? <p className="mt-1 whitespace-pre-wrap text-ink-soft">{review.note}</p> : null}
        </li>
      ))}
    </ol>
  );
}
