// Detaches a verification record from a run's quality evidence (those who edit or review runs).
import { recordActivity } from "@/db/queries/activity";
import { detachVerificationFromRun, listRunEvidenceByRunId } from "@/db/queries/verifications";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ runId: string; verificationId: string }>;
}

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const raw = await params;
  const runId = parseWith(idSchema, raw.runId, "run");
  const verificationId = parseWith(idSchema, raw.verificationId, "verification");
  const caller = await requireCaller(request.headers);
  const { run } = await requireRunAccess({ caller, runId, action: "run:attach-evidence" });
  const { changed } = await detachVerificationFromRun({ runId, verificationId });
  if (!changed) throw new AppError("not_found:verification", "That verification record is not attached to this run.");
  await recordActivity({
    teamId: run.teamId,
    studyId: run.studyId,
    actorId: caller.userId,
    action: "run.evidence_detached",
    subjectType: "run",
    subjectId: runId,
    runId,
    detail: { verificationId, sceneName: run.sceneName, sceneVersion: run.sceneVersion },
  });
  return Response.json({ evidence: await listRunEvidenceByRunId({ runId }) });
});
