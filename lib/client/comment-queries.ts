"use client";
// TanStack Query hooks for a run's discussion. Everything lives under ["runs", runId, "comments"], so
// a live update about the run refreshes it by prefix.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CommentResponse, CommentsResponse } from "@/lib/http/comment-types";
import type { CommentPin } from "@/lib/validation/comment";
import { fetchJson } from "./api";

export const commentQueryKeys = {
  comments: (runId: string) => ["runs", runId, "comments"] as const,
};

export function useRunComments(runId: string) {
  return useQuery({ queryKey: commentQueryKeys.comments(runId), queryFn: () => fetchJson<CommentsResponse>(`/api/runs/${runId}/comments`) });
}

export interface NewComment {
  body: string;
  parentId?: string;
  pin?: CommentPin | null;
}

/** Posting, editing, deleting and resolving; each refreshes the run's threads when it settles. */
export function useCommentMutations(runId: string) {
  const client = useQueryClient();
  const refresh = () => client.invalidateQueries({ queryKey: commentQueryKeys.comments(runId) });
  return {
    add: useMutation({
      mutationFn: (input: NewComment) => fetchJson<CommentResponse>(`/api/runs/${runId}/comments`, { method: "POST", json: input }),
      onSettled: refresh,
    }),
    edit: useMutation({
      mutationFn: ({ commentId, body }: { commentId: string; body: string }) => fetchJson<CommentResponse>(`/api/comments/${commentId}`, { method: "PATCH", json: { body } }),
      onSettled: refresh,
    }),
    remove: useMutation({
      // 204 answers no body; fetchJson reads that as null and still carries a refusal's message.
      mutationFn: (commentId: string) => fetchJson<null>(`/api/comments/${commentId}`, { method: "DELETE" }),
      onSettled: refresh,
    }),
    resolve: useMutation({
      mutationFn: ({ commentId, resolved }: { commentId: string; resolved: boolean }) => fetchJson<CommentResponse>(`/api/comments/${commentId}/resolution`, { method: "POST", json: { resolved } }),
      onSettled: refresh,
    }),
  };
}
