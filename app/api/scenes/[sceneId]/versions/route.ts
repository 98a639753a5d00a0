// A scene's saved versions, newest first: who changed it, when, and with what note.
import { listSceneVersionsBySceneId } from "@/db/queries/scenes";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ sceneId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  await requireSceneAccess({ caller, sceneId, action: "study:read" });
  return Response.json({ versions: await listSceneVersionsBySceneId({ sceneId }) });
});
