// A team's invitations: owners list them (pending, expired, accepted, withdrawn) and invite someone
// by e-mail with a role. The link travels only in the e-mail; the answer says whether it went out.
import { recordActivity } from "@/db/queries/activity";
import { createInvitation, listInvitationsByTeamId } from "@/db/queries/invitations";
import { getTeamById } from "@/db/queries/teams";
import { invitationDays, invitationExpiry } from "@/lib/collaboration/membership-rules";
import { AppError } from "@/lib/http/app-error";
import type { CreatedInvitationResponse, TeamInvitationsResponse } from "@/lib/http/team-types";
import { invitationMail } from "@/lib/mail-templates/invitation";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { publicAppUrl, sendMail } from "@/lib/server/mail";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { invitationInputSchema } from "@/lib/validation/team";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:manage-members" });
  const body: TeamInvitationsResponse = { invitations: await listInvitationsByTeamId({ teamId }) };
  return Response.json(body);
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:manage-members" });
  const { email, role } = await parseJsonBody(request, invitationInputSchema, "invitation");
  const team = await getTeamById({ id: teamId });
  if (!team) throw new AppError("not_found:team", "No such team.");
  const now = new Date();
  const expiresAt = invitationExpiry(now, invitationDays(process.env.RAREFACT_INVITATION_DAYS));
  const { invitation, token } = await createInvitation({ teamId, email, role, inviterId: caller.userId, expiresAt, now });
  await recordActivity({ teamId, actorId: caller.userId, action: "member.invited", subjectType: "invitation", subjectId: invitation.id, detail: { email, role } });
  // The invitation stands whatever happens to its e-mail (sendMail never throws and keeps a copy).
  const content = invitationMail({ teamName: team.name, inviterName: caller.name, role, link: publicAppUrl(`/invitations/${token}`, request), expiresAt });
  const mail = await sendMail({ teamId, kind: "invitation", to: { address: email }, ...content });
  const body: CreatedInvitationResponse = { invitation, mail };
  return Response.json(body, { status: 201 });
});
