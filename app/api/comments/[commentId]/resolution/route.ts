// Resolving or reopening a thread, on its first comment, by anyone who may comment on the run.
import { getCommentItemById, setCommentResolution } from "@/db/queries/comments";
import { commentExcerpt } from "@/lib/collaboration/mentions";
import { AppError } from "@/lib/http/app-error";
import type { CommentResponse } from "@/lib/http/comment-types";
import { requireCaller } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { commentResolutionSchema } from "@/lib/validation/comment";
import { idSchema } from "@/lib/validation/ids";
import { requireCommentAccess } from "@/app/api/comments/comment-support";

interface Context {
  params: Promise<{ commentId: string }>;
}

export const POST = apiRoute<Context>(async (request, { params }) => {
  const commentId = parseWith(idSchema, (await params).commentId, "comment");
  const caller = await requireCaller(request.headers);
  const { comment, run } = await requireCommentAccess({ caller, commentId, action: "run:comment" });
  const { resolved } = await parseJsonBody(request, commentResolutionSchema, "comment");
  if (comment.parentId !== null) throw new AppError("bad_request:comment", "A reply cannot be resolved on its own: resolve its thread's first comment.", [{ path: "commentId", message: "not a thread's first comment" }]);
  // Resolving a resolved thread (or reopening an open one) changes nothing and records nothing.
  if (resolved !== (comment.resolvedAt !== null)) {
    await setCommentResolution({ run, id: commentId, actorId: caller.userId, resolved, excerpt: commentExcerpt(comment.body) });
  }
  const updated = await getCommentItemById({ id: commentId });
  if (!updated) throw new AppError("not_found:comment", "No such comment.");
  const answer: CommentResponse = { comment: updated };
  return Response.json(answer);
});
