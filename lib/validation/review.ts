// A review decision as the route and the review panel's form read it.
import { z } from "zod";
import { reviewTargetStates } from "@/lib/review/review-rules";
import { reviewStateNames } from "@/lib/review/review-states";

export const reviewNoteMaxLength = 2000;

export const reviewDecisionSchema = z.object({
  toState: z.enum(reviewTargetStates, { error: "toState must be awaiting_review, revision_asked or signed_off." }),
  note: z.string({ error: "A note is text." }).trim().max(reviewNoteMaxLength, `A note can be at most ${reviewNoteMaxLength} characters.`).default(""),
  /** The state the person saw when deciding; if it has changed since, the decision is refused. */
  fromState: z.enum(reviewStateNames, { error: "fromState is not a review state." }).optional(),
});
export type ReviewDecisionInput = z.infer<typeof reviewDecisionSchema>;
