// A saved run's discussion: every member reads the threads; owners, editors and reviewers start a
// thread or reply to one, optionally pinned to a place and time in the run.
import { createComment, getCommentById, getCommentItemById, listCommentThreadsByRunId } from "@/db/queries/comments";
import { AppError } from "@/lib/http/app-error";
import type { CommentResponse, CommentsResponse } from "@/lib/http/comment-types";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { newCommentSchema } from "@/lib/validation/comment";
import { idSchema } from "@/lib/validation/ids";
import { checkPinAgainstRun, mailNewMentions, mentionsIn } from "@/app/api/comments/comment-support";

interface Context {
  params: Promise<{ runId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  await requireRunAccess({ caller, runId, action: "study:read" });
  const answer: CommentsResponse = { threads: await listCommentThreadsByRunId({ runId }) };
  return Response.json(answer);
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  const { run } = await requireRunAccess({ caller, runId, action: "run:comment" });
  const input = await parseJsonBody(request, newCommentSchema, "comment");
  const parentId = input.parentId ?? null;
  if (parentId) {
    const parent = await getCommentById({ id: parentId });
    if (!parent || parent.runId !== runId) throw new AppError("bad_request:comment", "parentId: there is no such comment on this run.", [{ path: "parentId", message: "no such comment on this run" }]);
    if (parent.parentId !== null) throw new AppError("bad_request:comment", "parentId: reply to the thread's first comment; replies cannot be nested.", [{ path: "parentId", message: "replies cannot be nested" }]);
  }
  const pin = input.pin ?? null;
  if (pin) await checkPinAgainstRun(pin, run);
  const { members, mentions } = await mentionsIn(input.body, run.teamId);
  const id = await createComment({ run, parentId, authorId: caller.userId, body: input.body, pin, mentions });
  await mailNewMentions({ request, run, commentId: id, author: caller, body: input.body, previous: [], next: mentions, members, reply: parentId !== null });
  const comment = await getCommentItemById({ id });
  if (!comment) throw new AppError("internal:comment", "The comment was saved but could not be read back.");
  const answer: CommentResponse = { comment };
  return Response.json(answer, { status: 201 });
});
