// A team's members, their roles and when they joined (any member may see who is on the team).
import { getTeamById, listMemberDetailsByTeamId } from "@/db/queries/teams";
import { AppError } from "@/lib/http/app-error";
import type { TeamMembersResponse } from "@/lib/http/team-types";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:read" });
  const team = await getTeamById({ id: teamId });
  if (!team) throw new AppError("not_found:team", "No such team.");
  const body: TeamMembersResponse = { team, members: await listMemberDetailsByTeamId({ teamId }) };
  return Response.json(body);
});
