"use client";
// TanStack Query hooks for review: a run's review history and the decision that changes its state.
// Keys sit under ["runs", runId] so that live updates about the run refresh them with the record.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { RunReviewDecisionResponse, RunReviewsResponse } from "@/lib/http/review-types";
import type { ReviewDecisionInput } from "@/lib/validation/review";
import { fetchJson } from "./api";
import { runQueryKeys } from "./run-queries";

export const reviewQueryKeys = {
  reviews: (runId: string) => ["runs", runId, "reviews"] as const,
};

export function useRunReviews(runId: string) {
  return useQuery({ queryKey: reviewQueryKeys.reviews(runId), queryFn: () => fetchJson<RunReviewsResponse>(`/api/runs/${runId}/reviews`) });
}

/** Posts a decision; afterwards the run (record and history) and the study (run table, activity) refresh. */
export function useReviewDecision({ runId, studyId }: { runId: string; studyId: string }) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewDecisionInput) => fetchJson<RunReviewDecisionResponse>(`/api/runs/${runId}/review`, { method: "POST", json: input }),
    onSettled: () =>
      Promise.all([client.invalidateQueries({ queryKey: runQueryKeys.run(runId) }), client.invalidateQueries({ queryKey: ["studies", studyId] })]),
  });
}
