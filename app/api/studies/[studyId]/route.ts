// One study with its scenes and recent activity, for the study page.
import { listActivityByStudyId } from "@/db/queries/activity";
import { listScenesByStudyId } from "@/db/queries/scenes";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  const { study, role } = await requireStudyAccess({ caller, studyId, action: "study:read" });
  const [scenes, activity] = await Promise.all([listScenesByStudyId({ studyId }), listActivityByStudyId({ studyId, limit: 20 })]);
  return Response.json({ study, role, scenes, activity });
});
