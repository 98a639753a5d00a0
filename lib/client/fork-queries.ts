"use client";
// TanStack Query hooks for forks: where the caller may fork to, a scene's lineage, and the fork itself.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { SceneResponse } from "@/lib/http/api-types";
import type { ForkResponse, ForkTargetsResponse, LineageResponse } from "@/lib/http/fork-types";
import type { ForkRequest } from "@/lib/validation/fork";
import { fetchJson } from "./api";
import { queryKeys } from "./queries";

export const forkQueryKeys = {
  // Under ["scenes", id]: a change of the scene (or a live update about it) refreshes its lineage too.
  lineage: (sceneId: string) => ["scenes", sceneId, "lineage"] as const,
  targets: ["me", "fork-targets"] as const,
};

export function useLineage(sceneId: string | null) {
  return useQuery({
    queryKey: forkQueryKeys.lineage(sceneId ?? "none"),
    queryFn: () => fetchJson<LineageResponse>(`/api/scenes/${sceneId}/lineage`),
    enabled: sceneId !== null,
  });
}

export function useForkTargets() {
  return useQuery({ queryKey: forkQueryKeys.targets, queryFn: () => fetchJson<ForkTargetsResponse>("/api/me/fork-targets") });
}

/** Forks `sceneId`; the origin's lineage and both studies' pages refresh afterwards. */
export function useForkScene(sceneId: string, originStudyId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ForkRequest) => fetchJson<ForkResponse>(`/api/scenes/${sceneId}/fork`, { method: "POST", json: input }),
    onSuccess: ({ scene }) =>
      Promise.all([
        client.invalidateQueries({ queryKey: ["scenes", sceneId] }),
        client.invalidateQueries({ queryKey: ["studies", originStudyId] }),
        client.invalidateQueries({ queryKey: ["studies", scene.studyId] }),
      ]),
  });
}

/** A scene that may not be known yet (the origin of a scene still loading): fetched once its id is. */
export function useSceneWhenKnown(sceneId: string | null) {
  return useQuery({
    queryKey: queryKeys.scene(sceneId ?? "none"),
    queryFn: () => fetchJson<SceneResponse>(`/api/scenes/${sceneId}`),
    enabled: sceneId !== null,
  });
}
