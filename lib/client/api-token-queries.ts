"use client";
// The signed-in person's API tokens: list, make (the answer holds the secret, shown once) and revoke.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ApiTokenCreatedResponse, ApiTokenResponse, ApiTokensResponse } from "@/lib/http/api-token-types";
import type { ApiTokenCreateInput } from "@/lib/validation/api-token";
import { fetchJson } from "./api";

export const apiTokenQueryKeys = {
  tokens: ["me", "api-tokens"] as const,
};

export function useApiTokens() {
  return useQuery({ queryKey: apiTokenQueryKeys.tokens, queryFn: () => fetchJson<ApiTokensResponse>("/api/me/tokens") });
}

export function useCreateApiToken() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: ApiTokenCreateInput) => fetchJson<ApiTokenCreatedResponse>("/api/me/tokens", { method: "POST", json: input }),
    onSuccess: () => client.invalidateQueries({ queryKey: apiTokenQueryKeys.tokens }),
  });
}

export function useRevokeApiToken() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (tokenId: string) => fetchJson<ApiTokenResponse>(`/api/me/tokens/${tokenId}`, { method: "DELETE" }),
    onSettled: () => client.invalidateQueries({ queryKey: apiTokenQueryKeys.tokens }),
  });
}
