// Fork a scene: copy one of its versions into this study or another the caller may edit (any member
// may fork what they can read; the target needs scene:edit). The fork remembers its origin.
import { forkScene } from "@/db/queries/forks";
import { getSceneById } from "@/db/queries/scenes";
import { requireCaller, requireSceneAccess, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { requireValidScene } from "@/lib/server/scene-check";
import { defaultForkName, forkRequestSchema } from "@/lib/validation/fork";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ sceneId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  const { scene: origin } = await requireSceneAccess({ caller, sceneId, action: "study:read" });
  const input = await parseJsonBody(request, forkRequestSchema, "fork");
  const { study: target } = await requireStudyAccess({ caller, studyId: input.targetStudyId ?? origin.studyId, action: "scene:edit" });
  const id = await forkScene({
    origin,
    target,
    authorId: caller.userId,
    name: input.name ?? defaultForkName(origin.name),
    fromVersion: input.fromVersion ?? origin.version,
    // An old version passes the same checks as a save: migrated to the current schema, within the limits.
    prepareData: requireValidScene,
  });
  return Response.json({ scene: await getSceneById({ id }) }, { status: 201 });
});
