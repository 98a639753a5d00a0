// Queue a parameter sweep of a saved scene version on the server (owners and editors): the server plans
// it (lib/sweeps/sweep-plan.ts) and queues one job per planned run; when the last ends, its insertion-loss
// chart is written into the study's notebook. 202: it is only queued.
import { queueSweep } from "@/db/queries/run-jobs";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { queueSweepSchema } from "@/lib/validation/jobs";

interface Context {
  params: Promise<{ sceneId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  const { scene } = await requireSceneAccess({ caller, sceneId, action: "run:create" });
  const { definition } = await parseJsonBody(request, queueSweepSchema, "job");
  if (definition.sceneId !== sceneId) {
    const path = "definition.sceneId";
    throw new AppError("bad_request:job", `${path}: the sweep names another scene than the one in the address.`, [{ path, message: "Must be the scene in the address." }]);
  }
  const queued = await queueSweep({ sceneRecord: scene, userId: caller.userId, definition });
  return Response.json(queued, { status: 202 });
});
