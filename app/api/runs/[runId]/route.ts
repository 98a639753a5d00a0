// One saved run: its metadata and summary (any member); deleting it (an owner, or the editor who
// saved it).
import { deleteRunById } from "@/db/queries/runs";
import { mayDeleteRun } from "@/lib/access/run-deletion";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ runId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  const { run, role } = await requireRunAccess({ caller, runId, action: "study:read" });
  return Response.json({ run, role });
});

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  const { run, role } = await requireRunAccess({ caller, runId, action: "run:create" });
  if (!mayDeleteRun({ role, callerId: caller.userId, createdById: run.createdById })) {
    throw new AppError("forbidden:run", "Only a team owner, or the editor who saved this run, can delete it.");
  }
  await deleteRunById({ id: runId, teamId: run.teamId, studyId: run.studyId, actorId: caller.userId, sceneName: run.sceneName });
  return new Response(null, { status: 204 });
});
