"use client";
// The activity feeds (study and team, a page at a time) and who has a study open. Keys sit under
// the study's and the team's prefixes, so that a live update of either refreshes them.
import { useInfiniteQuery, useQuery } from "@tanstack/react-query";
import type { FeedPage, PresenceResponse } from "@/lib/http/activity-types";
import { fetchJson } from "./api";

export const activityQueryKeys = {
  studyActivity: (studyId: string) => ["studies", studyId, "activity"] as const,
  teamActivity: (teamId: string) => ["teams", teamId, "activity"] as const,
  presence: (studyId: string) => ["studies", studyId, "presence"] as const,
};

/** Entries read per "Show older": fewer in the study page's narrow aside than on the team page. */
const studyFeedPageSize = 12;
const teamFeedPageSize = 25;

function feedUrl(base: string, before: string | null, limit: number): string {
  const query = new URLSearchParams({ limit: String(limit) });
  if (before) query.set("before", before);
  return `${base}?${query.toString()}`;
}

export function useStudyActivity(studyId: string) {
  return useInfiniteQuery({
    queryKey: activityQueryKeys.studyActivity(studyId),
    queryFn: ({ pageParam }) => fetchJson<FeedPage>(feedUrl(`/api/studies/${studyId}/activity`, pageParam, studyFeedPageSize)),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextBefore,
  });
}

export function useTeamActivity(teamId: string) {
  return useInfiniteQuery({
    queryKey: activityQueryKeys.teamActivity(teamId),
    queryFn: ({ pageParam }) => fetchJson<FeedPage>(feedUrl(`/api/teams/${teamId}/activity`, pageParam, teamFeedPageSize)),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextBefore,
  });
}

export function useStudyPresence(studyId: string) {
  return useQuery({
    queryKey: activityQueryKeys.presence(studyId),
    queryFn: () => fetchJson<PresenceResponse>(`/api/studies/${studyId}/presence`),
    // Live events announce arrivals and departures; the poll drops those whose tab died without a word.
    refetchInterval: 30_000,
  });
}
