"use client";
// TanStack Query hooks for the team page, the mailbox and the invitation page. Team things live
// under ["teams", teamId, …] so that live updates can refresh them by prefix.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { TeamRole } from "@/lib/access/roles";
import type {
  AcceptedInvitationResponse,
  CreatedInvitationResponse,
  InvitationDescriptionResponse,
  TeamInvitationsResponse,
  TeamMailResponse,
  TeamMemberResponse,
  TeamMembersResponse,
} from "@/lib/http/team-types";
import type { InvitationInput } from "@/lib/validation/team";
import { fetchJson } from "./api";

export const teamQueryKeys = {
  /** The same key as the dashboard's team panel, so both refresh together. */
  members: (teamId: string) => ["teams", teamId, "members"] as const,
  invitations: (teamId: string) => ["teams", teamId, "invitations"] as const,
  mail: (teamId: string) => ["teams", teamId, "mail"] as const,
  invitation: (token: string) => ["invitations", token] as const,
};

export function useTeamMemberDetails(teamId: string) {
  return useQuery({ queryKey: teamQueryKeys.members(teamId), queryFn: () => fetchJson<TeamMembersResponse>(`/api/teams/${teamId}/members`) });
}

export function useTeamInvitations(teamId: string, enabled: boolean) {
  return useQuery({
    queryKey: teamQueryKeys.invitations(teamId),
    queryFn: () => fetchJson<TeamInvitationsResponse>(`/api/teams/${teamId}/invitations`),
    enabled,
  });
}

export function useTeamMail(teamId: string) {
  return useQuery({ queryKey: teamQueryKeys.mail(teamId), queryFn: () => fetchJson<TeamMailResponse>(`/api/teams/${teamId}/mail`) });
}

/** Role changes, removals, invitations and withdrawals; each refreshes the team's lists and "me". */
export function useTeamMutations(teamId: string) {
  const client = useQueryClient();
  const refresh = () => Promise.all([client.invalidateQueries({ queryKey: ["teams", teamId] }), client.invalidateQueries({ queryKey: ["me"] })]);
  return {
    changeRole: useMutation({
      mutationFn: (input: { userId: string; role: TeamRole }) =>
        fetchJson<TeamMemberResponse>(`/api/teams/${teamId}/members/${input.userId}`, { method: "PATCH", json: { role: input.role } }),
      onSettled: refresh,
    }),
    removeMember: useMutation({
      mutationFn: (userId: string) => fetchJson<TeamMemberResponse>(`/api/teams/${teamId}/members/${userId}`, { method: "DELETE" }),
      onSettled: refresh,
    }),
    invite: useMutation({
      mutationFn: (input: InvitationInput) => fetchJson<CreatedInvitationResponse>(`/api/teams/${teamId}/invitations`, { method: "POST", json: input }),
      onSuccess: refresh,
    }),
    revoke: useMutation({
      mutationFn: (invitationId: string) => fetchJson<unknown>(`/api/teams/${teamId}/invitations/${invitationId}`, { method: "DELETE" }),
      onSettled: refresh,
    }),
  };
}

export function useInvitation(token: string) {
  return useQuery({
    queryKey: teamQueryKeys.invitation(token),
    queryFn: () => fetchJson<InvitationDescriptionResponse>(`/api/invitations/${encodeURIComponent(token)}`),
    retry: false,
  });
}

export function useAcceptInvitation(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => fetchJson<AcceptedInvitationResponse>(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: "POST" }),
    onSuccess: () => client.invalidateQueries({ queryKey: ["me"] }),
  });
}
