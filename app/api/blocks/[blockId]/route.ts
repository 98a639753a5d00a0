// One notebook block: edit its text or collapse it (409 on a stale version), or delete it.
import { deleteBlock, updateBlock } from "@/db/queries/blocks";
import { recordActivity } from "@/db/queries/activity";
import { AppError } from "@/lib/http/app-error";
import { requireBlockAccess, requireCaller } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { blockUpdateSchema } from "@/lib/validation/blocks";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ blockId: string }>;
}

export const PATCH = apiRoute<Context>(async (request, { params }) => {
  const blockId = parseWith(idSchema, (await params).blockId, "block");
  const caller = await requireCaller(request.headers);
  const { block } = await requireBlockAccess({ caller, blockId, action: "study:edit" });
  const input = await parseJsonBody(request, blockUpdateSchema, "block", 256 * 1024);
  if (input.markdown !== undefined && block.kind !== "notes") {
    throw new AppError("bad_request:block", "markdown: only a notes block holds text.", [{ path: "markdown", message: "Only a notes block holds text." }]);
  }
  return Response.json({ block: await updateBlock({ id: blockId, authorId: caller.userId, ...input }) });
});

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const blockId = parseWith(idSchema, (await params).blockId, "block");
  const caller = await requireCaller(request.headers);
  const { block, study } = await requireBlockAccess({ caller, blockId, action: "study:edit" });
  if (block.kind === "scene") {
    throw new AppError("bad_request:block", "A scene's block goes when the scene is deleted; collapse it instead.", [{ path: "kind", message: "Scene blocks cannot be removed on their own." }]);
  }
  await deleteBlock({ id: blockId });
  await recordActivity({ teamId: study.teamId, studyId: study.id, actorId: caller.userId, action: "block.deleted", subjectType: "block", subjectId: blockId, detail: { kind: block.kind } });
  return new Response(null, { status: 204 });
});
