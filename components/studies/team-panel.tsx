"use client";
import Link from "next/link";
import { ErrorState } from "@/components/ui/states";
import { roleDescriptions } from "@/lib/access/roles";
import { useTeamMembers } from "@/lib/client/queries";
import { RoleBadge } from "./role-badge";

/** Who is on the active team and what each may do. */
export function TeamPanel({ teamId, currentUserEmail }: { teamId: string; currentUserEmail: string }) {
  const members = useTeamMembers(teamId);
  return (
    <section aria-labelledby="team-heading" className="flex flex-col gap-3">
      <div className="flex items-baseline justify-between gap-3">
        <h2 id="team-heading" className="text-lg font-semibold text-ink">
          Team
        </h2>
        <Link href={`/teams/${teamId}`} className="text-sm font-medium text-tide-600 hover:underline">
          Members and invitations
        </Link>
      </div>
      <div className="rounded-lg border border-rule bg-panel">
        {members.isPending ? (
          <p className="p-4 text-sm text-muted">Loading members…</p>
        ) : members.isError ? (
          <div className="p-3">
            <ErrorState title="Members could not be loaded" message={members.error.message} onRetry={() => members.refetch()} />
          </div>
        ) : (
          <ul aria-label="Team members" className="divide-y divide-rule">
            {members.data.members.map((member) => (
              <li key={member.userId} className="flex items-center justify-between gap-3 px-4 py-3" title={roleDescriptions[member.role]}>
                <div className="min-w-0">
                  <p className="truncate text-sm font-medium text-ink">
                    {member.name}
                    {member.email === currentUserEmail ? <span className="font-normal text-muted"> (you)</span> : null}
                  </p>
                  <p className="truncate text-xs text-muted">{member.email}</p>
                </div>
                <RoleBadge role={member.role} />
              </li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}
