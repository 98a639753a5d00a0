"use client";
// TanStack Query hooks for saved runs: the study's run list, one run's record, and its decoded
// payload (cached for the session: a saved run never changes).
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { RunResponse, RunsResponse } from "@/lib/http/api-types";
import { fetchJson } from "./api";
import { fetchSavedRun, saveRunRecord, type SaveRunInput } from "./run-records";

export const runQueryKeys = {
  studyRuns: (studyId: string) => ["studies", studyId, "runs"] as const,
  run: (runId: string) => ["runs", runId] as const,
  // Apart from ["runs", id]: refreshing a run's record (e.g. its review status) must not download its payload again.
  payload: (runId: string) => ["run-payloads", runId] as const,
};

export function useStudyRuns(studyId: string) {
  return useQuery({ queryKey: runQueryKeys.studyRuns(studyId), queryFn: () => fetchJson<RunsResponse>(`/api/studies/${studyId}/runs`) });
}

export function useRun(runId: string) {
  return useQuery({ queryKey: runQueryKeys.run(runId), queryFn: () => fetchJson<RunResponse>(`/api/runs/${runId}`) });
}

export function useSavedRunPayload(runId: string | null) {
  return useQuery({
    queryKey: runQueryKeys.payload(runId ?? "none"),
    queryFn: () => fetchSavedRun(runId!),
    enabled: runId !== null,
    staleTime: Infinity,
    gcTime: 10 * 60_000,
  });
}

/** Uploads a finished run; the study's run list refreshes afterwards. */
export function useSaveRun(studyId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveRunInput) => saveRunRecord(input),
    onSuccess: () => client.invalidateQueries({ queryKey: runQueryKeys.studyRuns(studyId) }),
  });
}
