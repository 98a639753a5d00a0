// One queued job (any member of its study's team): state, position, progress, failures, the run it saved.
import { requireCaller } from "@/lib/server/access";
import { requireJobAccess } from "@/lib/server/run-queue/job-access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ jobId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const jobId = parseWith(idSchema, (await params).jobId, "job");
  const caller = await requireCaller(request.headers);
  const job = await requireJobAccess({ caller, jobId, action: "study:read" });
  return Response.json({ job });
});
