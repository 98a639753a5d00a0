// Join a team through an invitation link: signed in, with the invited address. The link works
// once (409 afterwards); the new team becomes the caller's active team.
import { recordActivity } from "@/db/queries/activity";
import { acceptInvitation } from "@/db/queries/invitations";
import { setSessionActiveTeam } from "@/db/queries/teams";
import type { AcceptedInvitationResponse } from "@/lib/http/team-types";
import { requireSessionCaller } from "@/lib/server/access";
import { getAuth } from "@/lib/server/auth";
import { apiRoute, parseWith } from "@/lib/server/route";
import { invitationTokenSchema } from "@/lib/validation/team";
import { invitationGoneResponse } from "../gone";

interface Context {
  params: Promise<{ token: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const token = parseWith(invitationTokenSchema, (await params).token, "token");
  // Joining a team is a person's decision, made in the browser: an API token reaches one team only.
  const caller = await requireSessionCaller(request.headers, "An API token cannot accept an invitation; open the link in the browser, signed in.");
  const result = await acceptInvitation({ token, userId: caller.userId, userEmail: caller.email });
  if (result.outcome === "expired") return invitationGoneResponse(result.message);
  await recordActivity({
    teamId: result.teamId,
    actorId: caller.userId,
    action: "member.joined",
    subjectType: "member",
    subjectId: caller.userId,
    detail: { memberName: caller.name, email: caller.email, role: result.role, invitationId: result.invitationId },
  });
  // Open the new team at once, the way the team switcher does; the membership stands even if this fails.
  try {
    const auth = await getAuth();
    const current = await auth.api.getSession({ headers: request.headers });
    if (current) await setSessionActiveTeam({ sessionId: current.session.id, userId: caller.userId, teamId: result.teamId });
  } catch (error) {
    console.error("[invitations] joined, but could not make the team active:", error);
  }
  const body: AcceptedInvitationResponse = { teamId: result.teamId, teamName: result.teamName, role: result.role };
  return Response.json(body);
});
