// A team's activity feed across its studies, newest first, a page at a time (any member).
import { listActivityPageByTeamId } from "@/db/queries/activity";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { feedPageQuerySchema, searchParamsObject } from "@/lib/validation/activity";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const query = parseWith(feedPageQuerySchema, searchParamsObject(request.url), "activity");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:read" });
  return Response.json(await listActivityPageByTeamId({ teamId, before: query.before, limit: query.limit }));
});
