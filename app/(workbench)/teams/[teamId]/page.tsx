import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { TeamPage } from "@/components/team/team-page";
import { listMembershipsByUserId } from "@/db/queries/teams";
import { roleAllows } from "@/lib/access/roles";
import { requirePageCaller } from "@/lib/server/page-session";
import { idSchema } from "@/lib/validation/ids";

export const metadata: Metadata = { title: "Team" };

export default async function TeamMembersPage({ params }: { params: Promise<{ teamId: string }> }) {
  const { teamId } = await params;
  const caller = await requirePageCaller(`/teams/${teamId}`);
  // Like the API: a team the caller is not on does not exist for them.
  if (!idSchema.safeParse(teamId).success) notFound();
  const membership = (await listMembershipsByUserId({ userId: caller.userId })).find((item) => item.teamId === teamId);
  if (!membership || !roleAllows(membership.role, "team:read")) notFound();
  return <TeamPage teamId={teamId} teamName={membership.teamName} callerRole={membership.role} callerId={caller.userId} />;
}
