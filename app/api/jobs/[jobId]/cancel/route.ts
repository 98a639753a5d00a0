// Cancel a job (anyone who may queue runs in the team): a queued job at once, a running one at its
// worker's next progress write (the answer then says cancelRequested). 409 when it has already finished.
import { cancelRunJob } from "@/db/queries/run-jobs";
import { requireCaller } from "@/lib/server/access";
import { requireJobAccess } from "@/lib/server/run-queue/job-access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ jobId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const jobId = parseWith(idSchema, (await params).jobId, "job");
  const caller = await requireCaller(request.headers);
  await requireJobAccess({ caller, jobId, action: "run:create" });
  return Response.json({ job: await cancelRunJob({ id: jobId, userId: caller.userId }) });
});
