// One scene: read it (any member), save a new version of it (owners and editors; 409 when the
// version you edited is no longer the latest).
import { getSceneById, saveSceneVersion } from "@/db/queries/scenes";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { requireValidScene } from "@/lib/server/scene-check";
import { idSchema } from "@/lib/validation/ids";
import { sceneSaveSchema } from "@/lib/validation/scene-save";

interface Context {
  params: Promise<{ sceneId: string }>;
}

const sceneBodyLimitBytes = 9 * 1024 * 1024;

export const GET = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  const { scene, role } = await requireSceneAccess({ caller, sceneId, action: "study:read" });
  return Response.json({ scene, role });
});

export const PUT = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  const { scene } = await requireSceneAccess({ caller, sceneId, action: "scene:edit" });
  const input = await parseJsonBody(request, sceneSaveSchema, "scene", sceneBodyLimitBytes);
  const data = requireValidScene(input.data);
  await saveSceneVersion({
    teamId: scene.teamId,
    sceneId,
    authorId: caller.userId,
    baseVersion: input.baseVersion,
    name: input.name,
    description: input.description,
    data,
    note: input.note,
  });
  return Response.json({ scene: await getSceneById({ id: sceneId }) });
});
