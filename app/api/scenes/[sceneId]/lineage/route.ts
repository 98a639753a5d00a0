// A scene's lineage: the scenes it was forked from and the forks made of it (any member). Scenes in
// teams the caller is not on show only as "in another team".
import { getSceneLineage } from "@/db/queries/forks";
import { listCallerMemberships, requireCaller, requireSceneAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ sceneId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  await requireSceneAccess({ caller, sceneId, action: "study:read" });
  const memberships = await listCallerMemberships(caller);
  const lineage = await getSceneLineage({ sceneId, teamIds: new Set(memberships.map((m) => m.teamId)) });
  return Response.json(lineage);
});
