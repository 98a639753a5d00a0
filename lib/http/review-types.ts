// The API's answers about review: one decision in a run's history, the sign-off a run record
// carries, and the answers of /api/runs/[runId]/review(s). Dates travel as ISO strings.
import type { ReviewStateName } from "@/lib/review/review-states";
import type { RunRecord } from "./api-types";

/** One entry of a run's review history. */
export interface RunReviewItem {
  id: string;
  fromState: ReviewStateName;
  toState: ReviewStateName;
  actorId: string | null;
  /** Null once the person's account is deleted. */
  actorName: string | null;
  note: string;
  /** The run's input hash and the scene version it was run from, at the time of the decision. */
  runInputHash: string;
  sceneVersion: number;
  createdAt: string;
}

/** The sign-off in force on a run: who, when, and for which run hash and scene version. */
export interface RunSignOff {
  signedOffById: string | null;
  signedOffByName: string | null;
  signedOffAt: string;
  runInputHash: string;
  sceneVersion: number;
  note: string;
}

export interface RunReviewsResponse {
  reviews: RunReviewItem[];
}

export interface RunReviewDecisionResponse {
  run: RunRecord;
  review: RunReviewItem;
}
