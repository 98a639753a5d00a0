// Reorders a study's notebook (owners and editors): the body names every block once, in order.
import { reorderBlocks } from "@/db/queries/blocks";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { blockOrderSchema } from "@/lib/validation/blocks";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const PUT = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  await requireStudyAccess({ caller, studyId, action: "study:edit" });
  const { blockIds } = await parseJsonBody(request, blockOrderSchema, "block");
  return Response.json({ blocks: await reorderBlocks({ studyId, blockIds }) });
});
