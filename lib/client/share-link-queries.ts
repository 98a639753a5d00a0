"use client";
// Read-only links from the browser: the owner's list, making and revoking a link; and, for whoever holds
// a link, a shared run's stored payload fetched and decoded through the link.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ShareLinkCreatedResponse, ShareLinkItem, ShareLinksResponse } from "@/lib/http/share-link-types";
import type { DecodedRun } from "@/lib/run-record/payload";
import type { ShareLinkCreateInput } from "@/lib/validation/share-link";
import { fetchJson } from "./api";
import { fetchRunPayload } from "./run-records";

export const shareLinkQueryKeys = {
  links: (studyId: string) => ["studies", studyId, "share-links"] as const,
  // The link's secret names the shared study; nothing in it is shared with the workbench's own keys.
  sharedPayload: (token: string, runId: string) => ["shared", token, "runs", runId, "payload"] as const,
};

/** After a change: the links, and the study's activity, which names it (not the notebook or the runs). */
function refreshAfterChange(client: ReturnType<typeof useQueryClient>, studyId: string) {
  return Promise.all([
    client.invalidateQueries({ queryKey: shareLinkQueryKeys.links(studyId) }),
    client.invalidateQueries({ queryKey: ["studies", studyId], exact: true }),
    client.invalidateQueries({ queryKey: ["studies", studyId, "activity"] }),
  ]);
}

export function useShareLinks(studyId: string, enabled = true) {
  return useQuery({ queryKey: shareLinkQueryKeys.links(studyId), queryFn: () => fetchJson<ShareLinksResponse>(`/api/studies/${studyId}/share-links`), enabled });
}

/** Makes a link; the answer holds its URL, the only time it is shown. The list (and the activity) refresh. */
export function useCreateShareLink(studyId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ShareLinkCreateInput) => fetchJson<ShareLinkCreatedResponse>(`/api/studies/${studyId}/share-links`, { method: "POST", json: input }),
    onSuccess: () => refreshAfterChange(client, studyId),
  });
}

export function useRevokeShareLink(studyId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => fetchJson<{ link: ShareLinkItem }>(`/api/studies/${studyId}/share-links/${linkId}`, { method: "DELETE" }),
    onSettled: () => refreshAfterChange(client, studyId),
  });
}

/** Downloads a shared run's payload through the link (no cookies sent) and decodes it. */
export function fetchSharedRun(token: string, runId: string): Promise<DecodedRun> {
  return fetchRunPayload(`/api/shared/${encodeURIComponent(token)}/runs/${encodeURIComponent(runId)}/result`, "omit");
}

/** A saved run never changes: once decoded it is kept for the page's life (the server sends no-store). */
export function sharedPayloadQuery(token: string, runId: string) {
  return { queryKey: shareLinkQueryKeys.sharedPayload(token, runId), queryFn: () => fetchSharedRun(token, runId), staleTime: Infinity, gcTime: 10 * 60_000, retry: false };
}

export function useSharedRunPayload(token: string, runId: string) {
  return useQuery(sharedPayloadQuery(token, runId));
}
