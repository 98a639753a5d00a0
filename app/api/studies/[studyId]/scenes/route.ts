// Add a scene to a study, from a template or from scene JSON (owners and editors).
import { countScenesByStudyId, createScene, getSceneById } from "@/db/queries/scenes";
import { AppError } from "@/lib/http/app-error";
import { findSceneTemplate } from "@/lib/scene-templates";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { requireValidScene } from "@/lib/server/scene-check";
import { idSchema } from "@/lib/validation/ids";
import { sceneCreateSchema } from "@/lib/validation/scene-save";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  const { study } = await requireStudyAccess({ caller, studyId, action: "scene:edit" });
  const input = await parseJsonBody(request, sceneCreateSchema, "scene", 9 * 1024 * 1024);
  let sceneJson = input.data;
  if (input.templateId !== undefined) {
    const template = findSceneTemplate(input.templateId);
    if (!template) throw new AppError("bad_request:scene", `templateId: no template "${input.templateId}".`, [{ path: "templateId", message: "No such template." }]);
    sceneJson = { ...template.scene, name: input.name };
  }
  const data = requireValidScene(sceneJson);
  const id = await createScene({
    teamId: study.teamId,
    studyId,
    authorId: caller.userId,
    name: input.name,
    description: input.description,
    isReference: input.isReference,
    data,
    position: await countScenesByStudyId({ studyId }),
  });
  return Response.json({ scene: await getSceneById({ id }) }, { status: 201 });
});
