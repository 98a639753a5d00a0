// Where a shared run stands in review, in the same words the workbench uses (lib/review/review-states.ts).
import { reviewStateLabels, reviewStateMeanings, type ReviewStateName } from "@/lib/review/review-states";

const tones: Record<ReviewStateName, string> = {
  unreviewed: "bg-paper text-muted ring-rule",
  awaiting_review: "bg-tide-50 text-tide-700 ring-tide-100",
  revision_asked: "bg-[#fdf6e7] text-signal-warn ring-signal-warn/25",
  signed_off: "bg-[#e8f3ec] text-signal-ok ring-signal-ok/25",
};

export function SharedReviewBadge({ state }: { state: ReviewStateName }) {
  return (
    <span title={reviewStateMeanings[state]} className={`inline-flex whitespace-nowrap rounded-full px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide ring-1 ${tones[state]}`}>
      {reviewStateLabels[state]}
    </span>
  );
}
