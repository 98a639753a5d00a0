// The scene JSON of one saved version (to show a difference or restore it).
import { getSceneVersionData } from "@/db/queries/scenes";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { versionNumberSchema } from "@/lib/validation/scene-version";

interface Context {
  params: Promise<{ sceneId: string; version: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const raw = await params;
  const sceneId = parseWith(idSchema, raw.sceneId, "scene");
  const version = parseWith(versionNumberSchema, raw.version, "version");
  const caller = await requireCaller(request.headers);
  await requireSceneAccess({ caller, sceneId, action: "study:read" });
  const data = await getSceneVersionData({ sceneId, version });
  if (data === null) throw new AppError("not_found:version", `This scene has no version ${version}.`);
  return Response.json({ version, data });
});
