// Where the caller may put a fork: every study, over all their teams, where their role edits scenes.
import { listForkTargetsByUserId } from "@/db/queries/forks";
import { roleAllows } from "@/lib/access/roles";
import { listCallerMemberships, requireCaller } from "@/lib/server/access";
import { apiRoute } from "@/lib/server/route";

export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request.headers);
  const targets = await listForkTargetsByUserId({ userId: caller.userId });
  if (!caller.token) return Response.json({ targets });
  // A token reaches its own team only, with its capped role.
  const editable = new Set((await listCallerMemberships(caller)).filter((m) => roleAllows(m.role, "scene:edit")).map((m) => m.teamId));
  return Response.json({ targets: targets.filter((target) => editable.has(target.teamId)) });
});
