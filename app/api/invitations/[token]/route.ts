// What an invitation link offers (team, role, who invited, until when), for the invitation page.
// Open to signed-out visitors, who need to know what they would join before making an account;
// the link's secret is the key, and an unknown, used or withdrawn link answers 404, an expired 410.
import { getInvitationByToken } from "@/db/queries/invitations";
import { getMembershipRole } from "@/db/queries/teams";
import { invitationUnavailableMessage, sameEmail } from "@/lib/collaboration/membership-rules";
import { AppError } from "@/lib/http/app-error";
import type { InvitationDescriptionResponse } from "@/lib/http/team-types";
import { getCaller } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { invitationTokenSchema } from "@/lib/validation/team";
import { invitationGoneResponse } from "./gone";

interface Context {
  params: Promise<{ token: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const token = parseWith(invitationTokenSchema, (await params).token, "token");
  const caller = await getCaller(request.headers);
  const found = await getInvitationByToken({ token });
  if (!found) throw new AppError("not_found:invitation", "This invitation link is not known. Check that the whole link was copied from the e-mail.");
  if (found.state === "expired") return invitationGoneResponse(invitationUnavailableMessage("expired"));
  if (found.state !== "pending") throw new AppError("not_found:invitation", invitationUnavailableMessage(found.state));
  const alreadyMember = caller ? (await getMembershipRole({ teamId: found.teamId, userId: caller.userId })) !== null : false;
  const body: InvitationDescriptionResponse = {
    invitation: {
      teamId: found.teamId,
      teamName: found.teamName,
      inviterName: found.inviterName,
      email: found.email,
      role: found.role,
      expiresAt: found.expiresAt.toISOString(),
      signedInEmail: caller?.email ?? null,
      emailMatches: caller ? sameEmail(caller.email, found.email) : false,
      alreadyMember,
    },
  };
  return Response.json(body);
});
