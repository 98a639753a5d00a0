// A review decision on a saved run: ask for review (owners, editors), ask for a revision, sign off
// or withdraw a sign-off (owners, reviewers; nobody signs off a run they made). The rules are
// lib/review/review-rules.ts; the refusal's reason is the message.
import { recordActivity } from "@/db/queries/activity";
import { applyReviewDecision } from "@/db/queries/reviews";
import { getRunById } from "@/db/queries/runs";
import { AppError } from "@/lib/http/app-error";
import { decideReviewTransition, type ReviewVerdict } from "@/lib/review/review-rules";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { reviewDecisionSchema } from "@/lib/validation/review";
import { sendReviewMail } from "./review-mail";

interface Context {
  params: Promise<{ runId: string }>;
}

const staleState = "The review state changed meanwhile; reload the run to see the latest decision.";

function refusal(verdict: Extract<ReviewVerdict, { ok: false }>): AppError {
  if (verdict.kind === "forbidden") return new AppError("forbidden:review", verdict.reason);
  if (verdict.kind === "conflict") return new AppError("conflict:review", verdict.reason);
  return new AppError("bad_request:review", verdict.reason, [{ path: verdict.field ?? "", message: verdict.reason }]);
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  // Any member may reach the rules, which answer 403 with the reason when the role cannot act.
  const { run, role } = await requireRunAccess({ caller, runId, action: "study:read" });
  const input = await parseJsonBody(request, reviewDecisionSchema, "review");
  if (input.fromState !== undefined && input.fromState !== run.reviewState) throw new AppError("conflict:review", staleState);
  const verdict = decideReviewTransition({ actor: { userId: caller.userId, role }, run, toState: input.toState, note: input.note });
  if (!verdict.ok) throw refusal(verdict);

  const review = await applyReviewDecision({
    runId,
    fromState: run.reviewState,
    toState: input.toState,
    actorId: caller.userId,
    note: input.note,
    runInputHash: run.inputHash,
    sceneVersion: run.sceneVersion,
  });
  // The decision is committed: what follows informs people and must not turn it into an error.
  try {
    await recordActivity({
      teamId: run.teamId,
      studyId: run.studyId,
      actorId: caller.userId,
      action: "run.reviewed",
      subjectType: "run",
      subjectId: runId,
      runId,
      detail: { fromState: run.reviewState, toState: input.toState, note: input.note, sceneName: run.sceneName, sceneVersion: run.sceneVersion },
    });
  } catch (error) {
    console.error(`[review] the decision on run ${runId} was kept, but its activity entry was not:`, error);
  }
  await sendReviewMail({ command: verdict.command, run, actor: caller, note: input.note, request });
  const updated = await getRunById({ id: runId });
  return Response.json({ run: updated, review }, { status: 201 });
});
