// A study's saved runs, newest first, with their key figures but not their payloads (any member).
import { listRunsByStudyId } from "@/db/queries/runs";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  await requireStudyAccess({ caller, studyId, action: "study:read" });
  return Response.json({ runs: await listRunsByStudyId({ studyId }) });
});
