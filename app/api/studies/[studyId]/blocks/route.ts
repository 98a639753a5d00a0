// A study's notebook: its blocks in order (any member), and adding a block (owners and editors).
// A run is shown once: adding a block for a run that already has one answers that block (200).
import { createBlock, findRunBlock, listBlocksByStudyId } from "@/db/queries/blocks";
import { getRunById } from "@/db/queries/runs";
import { getSceneById } from "@/db/queries/scenes";
import { recordActivity } from "@/db/queries/activity";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { blockCreateSchema } from "@/lib/validation/blocks";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  await requireStudyAccess({ caller, studyId, action: "study:read" });
  return Response.json({ blocks: await listBlocksByStudyId({ studyId }) });
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  const { study } = await requireStudyAccess({ caller, studyId, action: "study:edit" });
  const input = await parseJsonBody(request, blockCreateSchema, "block", 256 * 1024);
  if (input.kind === "scene") {
    const scene = await getSceneById({ id: input.content.sceneId });
    if (!scene || scene.studyId !== studyId) throw new AppError("bad_request:block", "content.sceneId: no such scene in this study.", [{ path: "content.sceneId", message: "No such scene in this study." }]);
  }
  if (input.kind === "run") {
    const run = await getRunById({ id: input.content.runId });
    if (!run || run.studyId !== studyId) throw new AppError("bad_request:block", "content.runId: no such saved run in this study.", [{ path: "content.runId", message: "No such saved run in this study." }]);
    const existing = await findRunBlock({ studyId, runId: run.id });
    if (existing) return Response.json({ block: existing }, { status: 200 });
  }
  const block = await createBlock({ studyId, authorId: caller.userId, kind: input.kind, content: input.content, afterBlockId: input.afterBlockId });
  await recordActivity({ teamId: study.teamId, studyId, actorId: caller.userId, action: "block.added", subjectType: "block", subjectId: block.id, detail: { kind: input.kind } });
  return Response.json({ block }, { status: 201 });
});
