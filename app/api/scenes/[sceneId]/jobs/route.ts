// Queue a server run of a saved scene version (owners and editors). The scene version and settings are
// frozen into the job; a worker runs it and stores the result as a saved run. 202: it is only queued.
import { queueRun } from "@/db/queries/run-jobs";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { queueRunSchema } from "@/lib/validation/jobs";

interface Context {
  params: Promise<{ sceneId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  const { scene } = await requireSceneAccess({ caller, sceneId, action: "run:create" });
  const body = await parseJsonBody(request, queueRunSchema, "job");
  const job = await queueRun({ sceneRecord: scene, userId: caller.userId, ...(body.sceneVersion !== undefined ? { sceneVersion: body.sceneVersion } : {}), ...(body.settings ? { settings: body.settings } : {}) });
  return Response.json({ job }, { status: 202 });
});
