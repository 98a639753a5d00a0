// Who is signed in, the teams they belong to (with their role) and the active team. Called with an
// API token: its owner, its one team and the role the token acts with there.
import { listCallerMemberships, requireCaller } from "@/lib/server/access";
import { apiRoute } from "@/lib/server/route";

export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request.headers);
  const memberships = await listCallerMemberships(caller);
  const activeTeamId = memberships.some((m) => m.teamId === caller.activeTeamId) ? caller.activeTeamId : (memberships[0]?.teamId ?? null);
  return Response.json({
    user: { id: caller.userId, name: caller.name, email: caller.email },
    memberships,
    activeTeamId,
  });
});
