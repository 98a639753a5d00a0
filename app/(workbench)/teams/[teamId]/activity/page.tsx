import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { TeamActivityView } from "@/components/activity/team-activity-view";
import { listMembershipsByUserId } from "@/db/queries/teams";
import { roleAllows } from "@/lib/access/roles";
import { requirePageCaller } from "@/lib/server/page-session";
import { idSchema } from "@/lib/validation/ids";

export const metadata: Metadata = { title: "Team activity" };

export default async function TeamActivityPage({ params }: { params: Promise<{ teamId: string }> }) {
  const { teamId } = await params;
  const caller = await requirePageCaller(`/teams/${teamId}/activity`);
  // Like the API: a team the caller is not on does not exist for them.
  if (!idSchema.safeParse(teamId).success) notFound();
  const membership = (await listMembershipsByUserId({ userId: caller.userId })).find((item) => item.teamId === teamId);
  if (!membership || !roleAllows(membership.role, "team:read")) notFound();
  return <TeamActivityView teamId={teamId} teamName={membership.teamName} />;
}
