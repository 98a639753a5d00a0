// Who has a study open right now, once each (any member).
import { listPresentUsersByStudyId } from "@/db/queries/presence";
import type { PresenceResponse } from "@/lib/http/activity-types";
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
  const answer: PresenceResponse = { present: await listPresentUsersByStudyId({ studyId }) };
  return Response.json(answer);
});
