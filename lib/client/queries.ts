"use client";
// TanStack Query hooks over the API routes: one place names every query key.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type {
  BlockItem,
  BlocksResponse,
  MeResponse,
  SceneRecord,
  SceneResponse,
  SceneVersionDataResponse,
  SceneVersionsResponse,
  StudiesResponse,
  StudyRecord,
  StudyResponse,
  TeamMember,
} from "@/lib/http/api-types";
import type { StudyInput } from "@/lib/validation/study";
import { fetchJson } from "./api";

export const queryKeys = {
  me: ["me"] as const,
  studies: (teamId: string) => ["teams", teamId, "studies"] as const,
  study: (studyId: string) => ["studies", studyId] as const,
  members: (teamId: string) => ["teams", teamId, "members"] as const,
  scene: (sceneId: string) => ["scenes", sceneId] as const,
  // Outside ["scenes", id]: refreshing a scene must not refetch every stored version, which never change.
  sceneVersions: (sceneId: string) => ["scene-versions", sceneId] as const,
  sceneVersion: (sceneId: string, version: number) => ["scene-versions", sceneId, version] as const,
  blocks: (studyId: string) => ["studies", studyId, "blocks"] as const,
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

export function useScene(sceneId: string) {
  return useQuery({ queryKey: queryKeys.scene(sceneId), queryFn: () => fetchJson<SceneResponse>(`/api/scenes/${sceneId}`) });
}

export function useSceneVersions(sceneId: string) {
  return useQuery({ queryKey: queryKeys.sceneVersions(sceneId), queryFn: () => fetchJson<SceneVersionsResponse>(`/api/scenes/${sceneId}/versions`) });
}

/** A saved version's JSON; kept for the page's life, since a saved version never changes. */
export function sceneVersionQuery(sceneId: string, version: number) {
  return {
    queryKey: queryKeys.sceneVersion(sceneId, version),
    queryFn: () => fetchJson<SceneVersionDataResponse>(`/api/scenes/${sceneId}/versions/${version}`),
    staleTime: Infinity,
  };
}

/** Restores an older version as a new one; the scene, its history and the study's activity refresh. */
export function useRestoreSceneVersion(record: { id: string; studyId: string }) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { version: number; baseVersion: number }) =>
      fetchJson<{ scene: SceneRecord }>(`/api/scenes/${record.id}/versions/${input.version}/restore`, { method: "POST", json: { baseVersion: input.baseVersion } }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.scene(record.id) }),
        client.invalidateQueries({ queryKey: queryKeys.sceneVersions(record.id), exact: true }),
        client.invalidateQueries({ queryKey: queryKeys.study(record.studyId) }),
        client.invalidateQueries({ queryKey: queryKeys.blocks(record.studyId) }),
      ]),
  });
}

export function useBlocks(studyId: string) {
  return useQuery({ queryKey: queryKeys.blocks(studyId), queryFn: () => fetchJson<BlocksResponse>(`/api/studies/${studyId}/blocks`) });
}

/** Notebook edits: each refreshes the block list (and the study, whose activity changes). */
export function useNotebookMutations(studyId: string) {
  const client = useQueryClient();
  const refresh = () => Promise.all([client.invalidateQueries({ queryKey: queryKeys.blocks(studyId) }), client.invalidateQueries({ queryKey: queryKeys.study(studyId) })]);
  return {
    addNotes: useMutation({
      mutationFn: (input: { markdown: string; afterBlockId: string | null }) =>
        fetchJson<{ block: BlockItem }>(`/api/studies/${studyId}/blocks`, { method: "POST", json: { kind: "notes", content: { markdown: input.markdown }, afterBlockId: input.afterBlockId } }),
      onSuccess: refresh,
    }),
    updateBlock: useMutation({
      mutationFn: (input: { blockId: string; baseVersion: number; markdown?: string; collapsed?: boolean }) =>
        fetchJson<{ block: BlockItem }>(`/api/blocks/${input.blockId}`, { method: "PATCH", json: { baseVersion: input.baseVersion, markdown: input.markdown, collapsed: input.collapsed } }),
      onSuccess: refresh,
    }),
    deleteBlock: useMutation({
      // 204 has no body: fetchJson reads it as null.
      mutationFn: (blockId: string) => fetchJson<null>(`/api/blocks/${blockId}`, { method: "DELETE" }),
      onSuccess: refresh,
    }),
    reorder: useMutation({
      mutationFn: (blockIds: string[]) => fetchJson<{ blocks: BlockItem[] }>(`/api/studies/${studyId}/blocks/order`, { method: "PUT", json: { blockIds } }),
      onSuccess: refresh,
    }),
    addScene: useMutation({
      mutationFn: (input: { name: string; templateId: string; isReference: boolean }) =>
        fetchJson<{ scene: SceneRecord }>(`/api/studies/${studyId}/scenes`, { method: "POST", json: input }),
      onSuccess: refresh,
    }),
  };
}
