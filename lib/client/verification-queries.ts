"use client";
// Verification records from the browser: the team's saved results, one record with its curves, saving
// the page's results, and a run's quality evidence (attach, detach). Keys sit under ["teams", id] and
// ["runs", id] so live updates of either refresh them.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { RunEvidenceResponse, VerificationRecordResponse, VerificationRecordsResponse } from "@/lib/http/verification-types";
import type { VerificationRecordInput } from "@/lib/validation/verification";
import { fetchJson } from "./api";

export const verificationQueryKeys = {
  records: (teamId: string) => ["teams", teamId, "verifications"] as const,
  record: (teamId: string, verificationId: string) => ["teams", teamId, "verifications", verificationId] as const,
  evidence: (runId: string) => ["runs", runId, "verifications"] as const,
};

export function useVerificationRecords(teamId: string | null) {
  return useQuery({
    queryKey: verificationQueryKeys.records(teamId ?? "none"),
    queryFn: () => fetchJson<VerificationRecordsResponse>(`/api/teams/${teamId}/verifications`),
    enabled: teamId !== null,
  });
}

/** A saved record never changes: once read it is kept for the page's life. */
export function useVerificationRecord(teamId: string | null, verificationId: string | null) {
  return useQuery({
    queryKey: verificationQueryKeys.record(teamId ?? "none", verificationId ?? "none"),
    queryFn: () => fetchJson<VerificationRecordResponse>(`/api/verifications/${verificationId}`),
    enabled: teamId !== null && verificationId !== null,
    staleTime: Infinity,
  });
}

export function useSaveVerificationRecord(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: VerificationRecordInput) => fetchJson<VerificationRecordResponse>(`/api/teams/${teamId}/verifications`, { method: "POST", json: input }),
    onSuccess: () => client.invalidateQueries({ queryKey: verificationQueryKeys.records(teamId) }),
  });
}

export function useRunEvidence(runId: string) {
  return useQuery({ queryKey: verificationQueryKeys.evidence(runId), queryFn: () => fetchJson<RunEvidenceResponse>(`/api/runs/${runId}/verifications`) });
}

/** The answer is the run's evidence after the change; it replaces the cached list at once. */
export function useAttachEvidence(runId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (verificationId: string) => fetchJson<RunEvidenceResponse>(`/api/runs/${runId}/verifications`, { method: "POST", json: { verificationId } }),
    onSuccess: (data) => client.setQueryData(verificationQueryKeys.evidence(runId), data),
    onSettled: () => client.invalidateQueries({ queryKey: verificationQueryKeys.evidence(runId) }),
  });
}

export function useDetachEvidence(runId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (verificationId: string) => fetchJson<RunEvidenceResponse>(`/api/runs/${runId}/verifications/${verificationId}`, { method: "DELETE" }),
    onSuccess: (data) => client.setQueryData(verificationQueryKeys.evidence(runId), data),
    onSettled: () => client.invalidateQueries({ queryKey: verificationQueryKeys.evidence(runId) }),
  });
}
