import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MailboxView } from "@/components/mailbox/mailbox-view";
import { listMembershipsByUserId } from "@/db/queries/teams";
import { roleAllows } from "@/lib/access/roles";
import { requirePageCaller } from "@/lib/server/page-session";
import { idSchema } from "@/lib/validation/ids";

export const metadata: Metadata = { title: "Team mailbox" };

export default async function TeamMailboxPage({ params }: { params: Promise<{ teamId: string }> }) {
  const { teamId } = await params;
  const caller = await requirePageCaller(`/teams/${teamId}/mailbox`);
  if (!idSchema.safeParse(teamId).success) notFound();
  const membership = (await listMembershipsByUserId({ userId: caller.userId })).find((item) => item.teamId === teamId);
  if (!membership) notFound();
  return <MailboxView teamId={teamId} teamName={membership.teamName} allowed={roleAllows(membership.role, "team:read-mail")} />;
}
