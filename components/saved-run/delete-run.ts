"use client";
// Deleting a saved run: the study's run list and notebook refresh (its block stays, saying the run is gone).
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/queries";
import { runQueryKeys } from "@/lib/client/run-queries";

export function useDeleteRun({ runId, studyId }: { runId: string; studyId: string }) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => fetchJson<null>(`/api/runs/${runId}`, { method: "DELETE" }),
    onSuccess: () => {
      client.removeQueries({ queryKey: runQueryKeys.run(runId) });
      client.removeQueries({ queryKey: runQueryKeys.payload(runId) });
      return Promise.all([
        client.invalidateQueries({ queryKey: runQueryKeys.studyRuns(studyId) }),
        client.invalidateQueries({ queryKey: queryKeys.blocks(studyId) }),
        client.invalidateQueries({ queryKey: queryKeys.study(studyId), exact: true }),
      ]);
    },
  });
}
