// A run's review state as a small label, the same in the run's header, the review panel and the
// study's run table. Signed off is the one green state; a revision asked is the one that wants work.
import { reviewStateLabels, reviewStateMeanings, type ReviewStateName } from "@/lib/review/review-states";

const tones: Record<ReviewStateName, string> = {
  unreviewed: "bg-paper text-muted ring-rule",
  awaiting_review: "bg-tide-50 text-tide-700 ring-tide-100",
  revision_asked: "bg-ember-50 text-ember-700 ring-ember-100",
  signed_off: "bg-[#e8f3ec] text-signal-ok ring-signal-ok/25",
};

export function ReviewStateBadge({ state, older = false }: { state: ReviewStateName; /** The sign-off belongs to an older scene version. */ older?: boolean }) {
  const olderSignOff = older && state === "signed_off";
  const label = olderSignOff ? `${reviewStateLabels[state]} (older version)` : reviewStateLabels[state];
  // A sign-off that belongs to an older scene version is not the all-clear green.
  const tone = olderSignOff ? "bg-[#fdf6e7] text-signal-warn ring-signal-warn/25" : tones[state];
  return (
    <span data-review-state={state} title={olderSignOff ? "Signed off for an older version of the scene." : reviewStateMeanings[state]} className={`inline-flex whitespace-nowrap rounded-full px-2 py-0.5 text-[11px] font-medium ring-1 ${tone}`}>
      {label}
    </span>
  );
}
