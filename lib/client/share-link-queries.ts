"use client";
// Read-only links from the browser: the owner's list, making and revoking a link; and, for whoever holds
// a link, a shared run's stored payload fetched and decoded through the link.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { isErrorBody } from "@/lib/http/app-error";
import type { ShareLinkCreatedResponse, ShareLinkItem, ShareLinksResponse } from "@/lib/http/share-link-types";
import { decodeRunPayload, type DecodedRun } from "@/lib/run-record/payload";
import type { ShareLinkCreateInput } from "@/lib/validation/share-link";
import { ApiError, fetchJson } from "./api";

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

/** Downloads a shared run's payload through the link and decodes it. */
export async function fetchSharedRun(token: string, runId: string): Promise<DecodedRun> {
  let response: Response;
  try {
    response = await fetch(`/api/shared/${encodeURIComponent(token)}/runs/${encodeURIComponent(runId)}/result`, { credentials: "omit" });
  } catch {
    throw new ApiError(0, "network", "The server could not be reached. Check your connection and try again.");
  }
  if (!response.ok) {
    const body: unknown = await response.json().catch(() => null);
    if (isErrorBody(body)) throw new ApiError(response.status, body.error.code, body.error.message, body.error.issues ?? []);
    throw new ApiError(response.status, "unknown", `The server answered ${response.status}.`);
  }
  const decoded = decodeRunPayload(new Uint8Array(await response.arrayBuffer()));
  if (!decoded.ok) throw new ApiError(response.status, "corrupt:run", `The saved run could not be read: ${decoded.path}: ${decoded.message}`);
  return decoded.run;
}

/** A saved run never changes: once decoded it is kept for the page's life (the server sends no-store). */
export function sharedPayloadQuery(token: string, runId: string) {
  return { queryKey: shareLinkQueryKeys.sharedPayload(token, runId), queryFn: () => fetchSharedRun(token, runId), staleTime: Infinity, gcTime: 10 * 60_000, retry: false };
}

export function useSharedRunPayload(token: string, runId: string) {
  return useQuery(sharedPayloadQuery(token, runId));
}
