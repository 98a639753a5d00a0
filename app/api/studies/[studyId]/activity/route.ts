// A study's activity feed, newest first, a page at a time (any member).
import { listActivityPageByStudyId } from "@/db/queries/activity";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { feedPageQuerySchema, searchParamsObject } from "@/lib/validation/activity";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const query = parseWith(feedPageQuerySchema, searchParamsObject(request.url), "activity");
  const caller = await requireCaller(request.headers);
  await requireStudyAccess({ caller, studyId, action: "study:read" });
  return Response.json(await listActivityPageByStudyId({ studyId, before: query.before, limit: query.limit }));
});
