"use client";
// The team's members. Owners change roles with a select and remove people after a confirmation;
// anyone may leave. The server keeps one owner on the team; its 409 message is shown as it is.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { RoleBadge } from "@/components/studies/role-badge";
import { LoadFailure } from "@/components/ui/load-failure";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, teamRoles, type TeamRole } from "@/lib/access/roles";
import { countOwners } from "@/lib/collaboration/membership-rules";
import { formatWhen } from "@/lib/client/format";
import { useTeamMemberDetails, useTeamMutations } from "@/lib/client/team-queries";
import type { TeamMemberDetail } from "@/lib/http/team-types";
import { RemoveMemberButton } from "./remove-member-button";

export function MemberList({ teamId, callerId, callerRole }: { teamId: string; callerId: string; callerRole: TeamRole }) {
  const members = useTeamMemberDetails(teamId);
  const mutations = useTeamMutations(teamId);
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const manages = roleAllows(callerRole, "team:manage-members");

  if (members.isPending) return <LoadingRows rows={2} label="Loading members" />;
  if (members.isError) return <LoadFailure subject="team" error={members.error} onRetry={() => members.refetch()} />;

  const list = members.data.members;
  const owners = countOwners(list);

  async function changeRole(member: TeamMemberDetail, role: TeamRole) {
    setProblem(null);
    try {
      await mutations.changeRole.mutateAsync({ userId: member.userId, role });
    } catch (error) {
      setProblem(error instanceof Error ? error.message : "The role could not be changed.");
    }
  }

  async function remove(member: TeamMemberDetail) {
    setProblem(null);
    try {
      await mutations.removeMember.mutateAsync(member.userId);
      if (member.userId === callerId) {
        router.push("/dashboard");
        router.refresh();
      }
    } catch (error) {
      setProblem(error instanceof Error ? error.message : "The member could not be removed.");
    }
  }

  return (
    <section aria-labelledby="members-heading" className="flex flex-col gap-3">
      <div className="flex items-baseline justify-between gap-3">
        <h2 id="members-heading" className="text-lg font-semibold text-ink">
          Members <span className="text-sm font-normal text-muted">({list.length})</span>
        </h2>
        {!manages ? <p className="text-sm text-muted">Only owners change roles and invite people.</p> : null}
      </div>
      {problem ? <ErrorState title="Not changed" message={problem} /> : null}
      <ul aria-label="Team members" className="divide-y divide-rule rounded-lg border border-rule bg-panel">
        {list.map((member) => {
          const isCaller = member.userId === callerId;
          const lastOwner = member.role === "owner" && owners === 1;
          // While a change is on its way, the select shows the role asked for, not the stored one.
          const pending = mutations.changeRole.isPending ? mutations.changeRole.variables : undefined;
          const shownRole = pending?.userId === member.userId ? pending.role : member.role;
          return (
            <li key={member.userId} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
              <div className="min-w-0 flex-1">
                <p className="truncate text-sm font-medium text-ink">
                  {member.name}
                  {isCaller ? <span className="font-normal text-muted"> (you)</span> : null}
                </p>
                <p className="truncate text-xs text-muted">
                  {member.email} · joined {formatWhen(member.joinedAt)}
                </p>
              </div>
              {manages ? (
                <label className="flex items-center gap-2 text-sm">
                  <span className="sr-only">Role of {member.name}</span>
                  <select
                    value={shownRole}
                    disabled={mutations.changeRole.isPending || lastOwner}
                    title={lastOwner ? "The team's only owner: make someone else an owner first." : undefined}
                    onChange={(event) => changeRole(member, event.target.value as TeamRole)}
                    className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-sm capitalize text-ink focus:outline-none focus:ring-2 focus:ring-tide-500/25 disabled:text-muted"
                  >
                    {teamRoles.map((role) => (
                      <option key={role} value={role}>
                        {role}
                      </option>
                    ))}
                  </select>
                </label>
              ) : (
                <RoleBadge role={member.role} />
              )}
              {(manages || isCaller) && !lastOwner ? (
                <RemoveMemberButton
                  name={member.name}
                  leaving={isCaller}
                  busy={mutations.removeMember.isPending || mutations.changeRole.isPending}
                  onConfirm={() => remove(member)}
                />
              ) : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
