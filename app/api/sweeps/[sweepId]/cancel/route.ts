// Cancel a server sweep (anyone who may queue runs in the team): its queued jobs at once, its running
// ones at their next progress write. Cases that finished still make the sweep's chart. 409 when finished.
import { cancelSweep } from "@/db/queries/run-jobs";
import { requireCaller } from "@/lib/server/access";
import { requireSweepAccess } from "@/lib/server/run-queue/job-access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ sweepId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const sweepId = parseWith(idSchema, (await params).sweepId, "sweep");
  const caller = await requireCaller(request.headers);
  await requireSweepAccess({ caller, sweepId, action: "run:create" });
  return Response.json(await cancelSweep({ id: sweepId, userId: caller.userId }));
});
