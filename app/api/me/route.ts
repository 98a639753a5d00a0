// Who is signed in, the teams they belong to (with their role) and the active team.
import { listMembershipsByUserId } from "@/db/queries/teams";
import { requireCaller } from "@/lib/server/access";
import { apiRoute } from "@/lib/server/route";

export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request.headers);
  const memberships = await listMembershipsByUserId({ userId: caller.userId });
  const activeTeamId = memberships.some((m) => m.teamId === caller.activeTeamId) ? caller.activeTeamId : (memberships[0]?.teamId ?? null);
  return Response.json({
    user: { id: caller.userId, name: caller.name, email: caller.email },
    memberships,
    activeTeamId,
  });
});
