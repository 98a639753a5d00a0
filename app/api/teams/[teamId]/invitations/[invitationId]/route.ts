// Withdraw an invitation: its link stops working at once (owners only).
import { recordActivity } from "@/db/queries/activity";
import { revokeInvitation } from "@/db/queries/invitations";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ teamId: string; invitationId: string }>;
}

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const { teamId: rawTeamId, invitationId: rawInvitationId } = await params;
  const teamId = parseWith(idSchema, rawTeamId, "team");
  const invitationId = parseWith(idSchema, rawInvitationId, "invitation");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:manage-members" });
  const invitation = await revokeInvitation({ teamId, id: invitationId });
  await recordActivity({ teamId, actorId: caller.userId, action: "invitation.revoked", subjectType: "invitation", subjectId: invitation.id, detail: { email: invitation.email, role: invitation.role } });
  return Response.json({ invitation });
});
