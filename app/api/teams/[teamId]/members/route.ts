// A team's members and their roles (any member may see who is on the team).
import { listMembersByTeamId } from "@/db/queries/teams";
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
  return Response.json({ members: await listMembersByTeamId({ teamId }) });
});
