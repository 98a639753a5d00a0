// One comment: its author edits the text (while it is not deleted); its author, or an owner
// (comment:moderate), deletes it. Deletion is soft: the comment keeps its place and its replies.
import { getCommentItemById, softDeleteComment, updateCommentBody } from "@/db/queries/comments";
import { roleAllows } from "@/lib/access/roles";
import { AppError } from "@/lib/http/app-error";
import type { CommentResponse } from "@/lib/http/comment-types";
import { requireCaller } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { commentEditSchema } from "@/lib/validation/comment";
import { idSchema } from "@/lib/validation/ids";
import { mailNewMentions, mentionsIn, requireCommentAccess } from "@/app/api/comments/comment-support";

interface Context {
  params: Promise<{ commentId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const commentId = parseWith(idSchema, (await params).commentId, "comment");
  const caller = await requireCaller(request.headers);
  await requireCommentAccess({ caller, commentId, action: "study:read" });
  const comment = await getCommentItemById({ id: commentId });
  if (!comment) throw new AppError("not_found:comment", "No such comment.");
  const answer: CommentResponse = { comment };
  return Response.json(answer);
});

export const PATCH = apiRoute<Context>(async (request, { params }) => {
  const commentId = parseWith(idSchema, (await params).commentId, "comment");
  const caller = await requireCaller(request.headers);
  // Authors edit their own words whatever their role now; any member may reach the check. A token
  // must also be scoped to comment: a read-only token writes nothing.
  const { comment, run } = await requireCommentAccess({ caller, commentId, action: caller.token ? "run:comment" : "study:read" });
  if (comment.authorId !== caller.userId) throw new AppError("forbidden:comment", "Only its author can edit a comment.");
  if (comment.deletedAt) throw new AppError("conflict:comment", "This comment has been deleted; it can no longer be edited.");
  const input = await parseJsonBody(request, commentEditSchema, "comment");
  const { members, mentions } = await mentionsIn(input.body, run.teamId);
  await updateCommentBody({ run, id: commentId, actorId: caller.userId, body: input.body, mentions });
  await mailNewMentions({ request, run, commentId, author: caller, body: input.body, previous: comment.mentions, next: mentions, members, reply: comment.parentId !== null });
  const updated = await getCommentItemById({ id: commentId });
  if (!updated) throw new AppError("not_found:comment", "No such comment.");
  const answer: CommentResponse = { comment: updated };
  return Response.json(answer);
});

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const commentId = parseWith(idSchema, (await params).commentId, "comment");
  const caller = await requireCaller(request.headers);
  const { comment, run, role } = await requireCommentAccess({ caller, commentId, action: caller.token ? "run:comment" : "study:read" });
  const isAuthor = comment.authorId === caller.userId;
  if (!isAuthor && !roleAllows(role, "comment:moderate")) throw new AppError("forbidden:comment", "Only its author or a team owner can delete a comment.");
  if (comment.deletedAt) throw new AppError("conflict:comment", "This comment has already been deleted.");
  await softDeleteComment({ run, id: commentId, actorId: caller.userId, byModerator: !isAuthor });
  return new Response(null, { status: 204 });
});
