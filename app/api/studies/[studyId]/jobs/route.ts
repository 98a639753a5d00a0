// A study's run queue (any member): its active jobs and those of the last days, its sweeps, the team's
// limits in use and the workers seen in the last minute.
import { listStudyQueue } from "@/db/queries/run-jobs";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { jobListQuerySchema } from "@/lib/validation/jobs";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const query = parseWith(jobListQuerySchema, Object.fromEntries(new URL(request.url).searchParams), "query");
  const caller = await requireCaller(request.headers);
  const { study } = await requireStudyAccess({ caller, studyId, action: "study:read" });
  return Response.json(await listStudyQueue({ studyId, teamId: study.teamId, days: query.days }));
});
