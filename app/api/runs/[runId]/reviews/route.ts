// A saved run's review history, newest first: who decided what, when, with which note, for which
// run hash and scene version (any member).
import { listReviewsByRunId } from "@/db/queries/reviews";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ runId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  await requireRunAccess({ caller, runId, action: "study:read" });
  return Response.json({ reviews: await listReviewsByRunId({ runId }) });
});
