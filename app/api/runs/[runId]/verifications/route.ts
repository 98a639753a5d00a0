// A run's quality evidence: the team's saved verification records attached to it. Any member reads
// them; those who edit or review runs attach one (a record of another team does not exist here).
import { recordActivity } from "@/db/queries/activity";
import { attachVerificationToRun, getVerificationRecordById, listRunEvidenceByRunId } from "@/db/queries/verifications";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { runEvidenceAttachSchema } from "@/lib/validation/verification";

interface Context {
  params: Promise<{ runId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  await requireRunAccess({ caller, runId, action: "study:read" });
  return Response.json({ evidence: await listRunEvidenceByRunId({ runId }) });
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  const { run } = await requireRunAccess({ caller, runId, action: "run:attach-evidence" });
  const { verificationId } = await parseJsonBody(request, runEvidenceAttachSchema, "verification");
  const record = await getVerificationRecordById({ id: verificationId });
  if (!record || record.teamId !== run.teamId) throw new AppError("not_found:verification", "No such verification record in this run's team.");
  const { changed } = await attachVerificationToRun({ runId, verificationId, attachedBy: caller.userId });
  if (changed) {
    await recordActivity({
      teamId: run.teamId,
      studyId: run.studyId,
      actorId: caller.userId,
      action: "run.evidence_attached",
      subjectType: "run",
      subjectId: runId,
      runId,
      detail: { verificationId, sceneName: run.sceneName, sceneVersion: run.sceneVersion, passedCount: record.passedCount, failedCount: record.failedCount },
    });
  }
  return Response.json({ evidence: await listRunEvidenceByRunId({ runId }) }, { status: changed ? 201 : 200 });
});
