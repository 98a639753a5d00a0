"use client";
// After a run is saved, the study notebook gets a block for it under its scene's block. The server
// answers an existing block when the run already has one, so a retry never shows a run twice.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/queries";
import type { BlockItem, BlocksResponse, RunsResponse } from "@/lib/http/api-types";
import { hasRunBlock, runBlockAnchor } from "./run-block-placement";

export async function addRunBlock({ studyId, sceneId, runId }: { studyId: string; sceneId: string; runId: string }): Promise<BlockItem | null> {
  const [{ blocks }, { runs }] = await Promise.all([
    fetchJson<BlocksResponse>(`/api/studies/${studyId}/blocks`),
    fetchJson<RunsResponse>(`/api/studies/${studyId}/runs`),
  ]);
  if (hasRunBlock(blocks, runId)) return null;
  const runSceneIds = new Map(runs.flatMap((run) => (run.sceneId ? [[run.id, run.sceneId] as const] : [])));
  const afterBlockId = runBlockAnchor(blocks, sceneId, runSceneIds);
  const { block } = await fetchJson<{ block: BlockItem }>(`/api/studies/${studyId}/blocks`, { method: "POST", json: { kind: "run", content: { runId }, afterBlockId } });
  return block;
}

export function useAddRunBlock(studyId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { sceneId: string; runId: string }) => addRunBlock({ studyId, ...input }),
    onSettled: () => Promise.all([client.invalidateQueries({ queryKey: queryKeys.blocks(studyId) }), client.invalidateQueries({ queryKey: queryKeys.study(studyId), exact: true })]),
  });
}
