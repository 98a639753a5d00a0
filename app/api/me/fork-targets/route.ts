// Where the caller may put a fork: every study, over all their teams, where their role edits scenes.
import { listForkTargetsByUserId } from "@/db/queries/forks";
import { requireCaller } from "@/lib/server/access";
import { apiRoute } from "@/lib/server/route";

export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request.headers);
  return Response.json({ targets: await listForkTargetsByUserId({ userId: caller.userId }) });
});
