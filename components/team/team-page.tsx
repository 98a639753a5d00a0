"use client";
// The team page: who is on the team and in which role; for owners also the open invitations, the
// invite form and links to the kept e-mail. Everyone else sees the list read-only (and may leave).
import Link from "next/link";
import { RoleBadge } from "@/components/studies/role-badge";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { InvitationList } from "./invitation-list";
import { InviteForm } from "./invite-form";
import { MemberList } from "./member-list";

export function TeamPage({ teamId, teamName, callerRole, callerId }: { teamId: string; teamName: string; callerRole: TeamRole; callerId: string }) {
  const manages = roleAllows(callerRole, "team:manage-members");
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-2">
        <Breadcrumb links={[{ href: "/dashboard", label: "Studies" }]} current="Team" />
        <div className="flex flex-wrap items-end justify-between gap-4">
          <div>
            <p className="text-sm font-medium text-tide-600">Team</p>
            <div className="mt-1 flex items-center gap-3">
              <h1 className="text-[28px] font-semibold leading-tight text-ink">{teamName}</h1>
              <RoleBadge role={callerRole} />
            </div>
          </div>
          <nav aria-label="Team pages" className="flex items-center gap-4 text-sm font-medium">
            <Link href={`/teams/${teamId}/activity`} className="text-tide-600 hover:underline">
              Activity
            </Link>
            {roleAllows(callerRole, "team:read-mail") ? (
              <Link href={`/teams/${teamId}/mailbox`} className="text-tide-600 hover:underline">
                Mailbox
              </Link>
            ) : null}
          </nav>
        </div>
      </div>

      <div className={manages ? "grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]" : "max-w-3xl"}>
        <div className="flex flex-col gap-8">
          <MemberList teamId={teamId} callerId={callerId} callerRole={callerRole} />
          {manages ? <InvitationList teamId={teamId} /> : null}
        </div>
        {manages ? <InviteForm teamId={teamId} /> : null}
      </div>
    </div>
  );
}
