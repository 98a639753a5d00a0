"use client";
// TanStack Query hooks over the API routes: one place names every query key.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { MeResponse, StudiesResponse, StudyRecord, StudyResponse, TeamMember } from "@/lib/http/api-types";
import type { StudyInput } from "@/lib/validation/study";
import { fetchJson } from "./api";

export const queryKeys = {
  me: ["me"] as const,
  studies: (teamId: string) => ["teams", teamId, "studies"] as const,
  study: (studyId: string) => ["studies", studyId] as const,
  members: (teamId: string) => ["teams", teamId, "members"] as const,
};

export function useMe() {
  return useQuery({ queryKey: queryKeys.me, queryFn: () => fetchJson<MeResponse>("/api/me") });
}

export function useStudies(teamId: string | null) {
  return useQuery({
    queryKey: queryKeys.studies(teamId ?? "none"),
    queryFn: () => fetchJson<StudiesResponse>(`/api/teams/${teamId}/studies`),
    enabled: teamId !== null,
  });
}

export function useStudy(studyId: string) {
  return useQuery({ queryKey: queryKeys.study(studyId), queryFn: () => fetchJson<StudyResponse>(`/api/studies/${studyId}`) });
}

export function useCreateStudy(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: StudyInput) => fetchJson<{ study: StudyRecord }>(`/api/teams/${teamId}/studies`, { method: "POST", json: input }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.studies(teamId) }),
  });
}

export function useTeamMembers(teamId: string | null) {
  return useQuery({
    queryKey: queryKeys.members(teamId ?? "none"),
    queryFn: () => fetchJson<{ members: TeamMember[] }>(`/api/teams/${teamId}/members`),
    enabled: teamId !== null,
  });
}
