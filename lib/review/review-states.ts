// The review states of a saved run and their names on screen. The stored names are db/schema.ts
// `reviewStates` (lib/ may not import db/; a unit test keeps the two lists equal).

export const reviewStateNames = ["unreviewed", "awaiting_review", "revision_asked", "signed_off"] as const;
export type ReviewStateName = (typeof reviewStateNames)[number];

export const reviewStateLabels: Record<ReviewStateName, string> = {
  unreviewed: "Not reviewed",
  awaiting_review: "Awaiting review",
  revision_asked: "Revision asked",
  signed_off: "Signed off",
};

/** One line on what each state means, for hints beside the badge. */
export const reviewStateMeanings: Record<ReviewStateName, string> = {
  unreviewed: "Nobody has asked for a review of this run yet.",
  awaiting_review: "Someone asked for a review; a reviewer or owner has yet to decide.",
  revision_asked: "A reviewer asked for a revision before this run can be relied on.",
  signed_off: "A reviewer signed this run off for use in a report.",
};

export function isReviewStateName(value: unknown): value is ReviewStateName {
  return typeof value === "string" && (reviewStateNames as readonly string[]).includes(value);
}
