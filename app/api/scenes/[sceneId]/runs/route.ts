// Saving a run made in the browser (owners and editors). The body is the run's binary payload
// (lib/run-record/payload.ts) as application/octet-stream: it carries the frozen scene, the saved
// scene version it came from, the settings and the input hash, so nothing else is sent. The size
// is limited before the body is read (RAREFACT_MAX_RUN_UPLOAD_BYTES, default 64 MiB, answers 413);
// the payload is decoded and checked whole before anything is stored (400 naming what is wrong).
import { createRun } from "@/db/queries/runs";
import { requireCaller, requireSceneAccess } from "@/lib/server/access";
import { readBinaryBody } from "@/lib/server/binary-body";
import { apiRoute, parseWith } from "@/lib/server/route";
import { checkRunUpload, runUploadLimitBytes } from "@/lib/server/run-upload";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ sceneId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const sceneId = parseWith(idSchema, (await params).sceneId, "scene");
  const caller = await requireCaller(request.headers);
  const { scene } = await requireSceneAccess({ caller, sceneId, action: "run:create" });
  const bytes = await readBinaryBody(request, { limitBytes: runUploadLimitBytes(), subject: "run" });
  const checked = await checkRunUpload({ sceneId, bytes });
  const { header } = checked.run;
  const cancelled = header.run.stoppedBy === "cancelled";
  const run = await createRun({
    teamId: scene.teamId,
    studyId: scene.studyId,
    sceneId,
    sceneVersion: header.sceneVersion,
    sceneSnapshot: checked.scene,
    settings: header.settings,
    inputHash: header.inputHash,
    solverVersion: header.solverVersion,
    status: cancelled ? "cancelled" : "completed",
    statusMessage: cancelled ? `Cancelled after ${header.run.stepsRun} of ${header.grid.plannedSteps} steps.` : "",
    summary: checked.summary,
    resultData: bytes,
    createdBy: caller.userId,
    sceneName: scene.name,
  });
  return Response.json({ run }, { status: 201 });
});
