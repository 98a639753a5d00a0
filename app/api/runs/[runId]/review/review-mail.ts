// E-mail about a review step, sent after the decision is committed. Best effort: a failure is
// logged and never undoes or fails the decision (sendMail itself never throws; the look-ups here
// might, so they are caught too).
import "server-only";
import { getReviewRequesterIdByRunId } from "@/db/queries/reviews";
import { getStudyById } from "@/db/queries/studies";
import { listMembersByTeamId } from "@/db/queries/teams";
import type { RunRecord } from "@/lib/http/api-types";
import { reviewDecisionMail, type ReviewDecisionKind } from "@/lib/mail-templates/review-decision";
import { reviewRequestMail } from "@/lib/mail-templates/review-request";
import { reviewMailRecipients } from "@/lib/review/review-recipients";
import type { ReviewCommand } from "@/lib/review/review-rules";
import type { Caller } from "@/lib/server/access";
import { publicAppUrl, sendMail } from "@/lib/server/mail";

const decisionKinds: Record<Exclude<ReviewCommand, "request_review">, ReviewDecisionKind> = {
  sign_off: "signed_off",
  ask_revision: "revision_asked",
  withdraw_sign_off: "sign_off_withdrawn",
};

export async function sendReviewMail({ command, run, actor, note, request }: { command: ReviewCommand; run: RunRecord; actor: Caller; note: string; request: Request }): Promise<void> {
  try {
    const [members, study, requesterId] = await Promise.all([
      listMembersByTeamId({ teamId: run.teamId }),
      getStudyById({ id: run.studyId }),
      command === "request_review" ? Promise.resolve(null) : getReviewRequesterIdByRunId({ runId: run.id }),
    ]);
    const recipients = reviewMailRecipients({ command, actorId: actor.userId, runCreatorId: run.createdById, requesterId, members });
    if (recipients.length === 0) return;
    const common = {
      studyTitle: study?.title ?? "a study",
      runLabel: `${run.sceneName ?? "Deleted scene"}, version ${run.sceneVersion}`,
      runInputHash: run.inputHash,
      note,
      link: publicAppUrl(`/studies/${run.studyId}/runs/${run.id}`, request),
    };
    const content =
      command === "request_review"
        ? reviewRequestMail({ ...common, requesterName: actor.name })
        : reviewDecisionMail({ ...common, decision: decisionKinds[command], reviewerName: actor.name, sceneVersion: run.sceneVersion });
    const kind = command === "request_review" ? "review_request" : "review_decision";
    for (const recipient of recipients) {
      await sendMail({ teamId: run.teamId, kind, to: { address: recipient.email, userId: recipient.userId, name: recipient.name }, ...content });
    }
  } catch (error) {
    console.error(`[review] could not send the e-mail about run ${run.id}:`, error);
  }
}
