// What the comment routes share: finding a comment with the caller's access to its run, reading
// mentions against the run's team, checking a pin against the run's frozen scene, and e-mailing
// members newly mentioned (never the author; a failed e-mail never fails the comment).
import "server-only";
import { getCommentById, getRunSceneSnapshotById, type StoredComment } from "@/db/queries/comments";
import { getStudyById } from "@/db/queries/studies";
import { listMembersByTeamId } from "@/db/queries/teams";
import { findMentions, mentionsAsPlainText, newlyMentioned } from "@/lib/collaboration/mentions";
import type { TeamAction, TeamRole } from "@/lib/access/roles";
import { parseScene } from "@/lib/fdtd/scene";
import { AppError } from "@/lib/http/app-error";
import type { RunRecord, TeamMember } from "@/lib/http/api-types";
import { mentionMail } from "@/lib/mail-templates/mention";
import { requireRunAccess, type Caller } from "@/lib/server/access";
import { publicAppUrl, sendMail } from "@/lib/server/mail";
import { pinProblems, runPinFrame, type CommentPin } from "@/lib/validation/comment";

/** The comment, the run it is on and the caller's role there; 404 for a comment that does not exist or a run outside the caller's teams. */
export async function requireCommentAccess({ caller, commentId, action }: { caller: Caller; commentId: string; action: TeamAction }): Promise<{ comment: StoredComment; run: RunRecord; role: TeamRole }> {
  const comment = await getCommentById({ id: commentId });
  if (!comment) throw new AppError("not_found:comment", "No such comment.");
  const { run, role } = await requireRunAccess({ caller, runId: comment.runId, action });
  return { comment, run, role };
}

/** 400 naming the field when the pin lies outside the run's domain or duration, or names a receiver it lacks. */
export async function checkPinAgainstRun(pin: CommentPin, run: RunRecord): Promise<void> {
  const parsed = parseScene(await getRunSceneSnapshotById({ id: run.id }));
  if (!parsed.ok) throw new AppError("bad_request:comment", "pin: this run's frozen scene cannot be read, so nothing can be pinned to it.", [{ path: "pin", message: "the run's scene cannot be read" }]);
  const issues = pinProblems(pin, runPinFrame(parsed.scene, run.summary?.simulatedSeconds ?? null));
  const first = issues[0];
  if (first) throw new AppError("bad_request:comment", `${first.path}: ${first.message}`, issues);
}

/** The run's team members and the ones this body mentions (members only). */
export async function mentionsIn(body: string, teamId: string): Promise<{ members: TeamMember[]; mentions: string[] }> {
  const members = await listMembersByTeamId({ teamId });
  return { members, mentions: findMentions(body, members) };
}

/** E-mails each member newly mentioned; sendMail keeps a copy and never throws. */
export async function mailNewMentions({
  request,
  run,
  commentId,
  author,
  body,
  previous,
  next,
  members,
  reply,
}: {
  request: Request;
  run: RunRecord;
  commentId: string;
  author: Caller;
  body: string;
  previous: readonly string[];
  next: readonly string[];
  members: readonly TeamMember[];
  reply: boolean;
}): Promise<void> {
  const recipients = newlyMentioned({ previous, next, authorId: author.userId });
  if (recipients.length === 0) return;
  try {
    const study = await getStudyById({ id: run.studyId });
    const names = new Map(members.map((member) => [member.userId, member.name]));
    const content = mentionMail({
      authorName: author.name,
      studyTitle: study?.title ?? "a study",
      runLabel: `${run.sceneName ?? "a deleted scene"}, version ${run.sceneVersion}`,
      commentText: mentionsAsPlainText(body, names),
      link: `${publicAppUrl(`/studies/${run.studyId}/runs/${run.id}`, request)}#comment-${commentId}`,
      reply,
    });
    for (const userId of recipients) {
      const member = members.find((candidate) => candidate.userId === userId);
      if (!member) continue;
      await sendMail({ teamId: run.teamId, kind: "mention", to: { address: member.email, userId: member.userId, name: member.name }, ...content });
    }
  } catch (error) {
    // The comment is saved already; a failure to write the e-mail must not turn it into an error.
    console.error("[comments] could not send mention e-mails:", error);
  }
}
