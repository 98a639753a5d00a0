// Restore an older version of a scene: its data becomes a new, latest version (owners and editors;
// 409 when the caller has not seen the current version, 404 for a version the scene never had).
import { getSceneById, restoreSceneVersion } from "@/db/queries/scenes";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { requireValidScene } from "@/lib/server/scene-check";
import { idSchema } from "@/lib/validation/ids";
import { sceneRestoreSchema, versionNumberSchema } from "@/lib/validation/scene-version";

interface Context {
  params: Promise<{ sceneId: string; version: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const raw = await params;
  const sceneId = parseWith(idSchema, raw.sceneId, "scene");
  const version = parseWith(versionNumberSchema, raw.version, "version");
  const caller = await requireCaller(request.headers);
  const { scene } = await requireSceneAccess({ caller, sceneId, action: "scene:edit" });
  const input = await parseJsonBody(request, sceneRestoreSchema, "version");
  await restoreSceneVersion({
    teamId: scene.teamId,
    sceneId,
    authorId: caller.userId,
    version,
    baseVersion: input.baseVersion,
    // An old version passes the same checks as a save: migrated to the current schema, within the limits.
    prepareData: requireValidScene,
  });
  return Response.json({ scene: await getSceneById({ id: sceneId }) }, { status: 201 });
});
