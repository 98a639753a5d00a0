// One server sweep and its jobs in plan order (any member of its study's team).
import { requireCaller } from "@/lib/server/access";
import { requireSweepAccess } from "@/lib/server/run-queue/job-access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ sweepId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const sweepId = parseWith(idSchema, (await params).sweepId, "sweep");
  const caller = await requireCaller(request.headers);
  const { sweep, jobs } = await requireSweepAccess({ caller, sweepId, action: "study:read" });
  return Response.json({ sweep, jobs });
});
