// Revoking a read-only link (owners only): from this answer on, the link opens nothing. Revoking a link
// already revoked changes nothing and answers it as it is.
import { recordActivity } from "@/db/queries/activity";
import { getShareLinkById, revokeShareLinkById } from "@/db/queries/share-links";
import { AppError } from "@/lib/http/app-error";
import type { ShareLinkItem } from "@/lib/http/share-link-types";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ studyId: string; linkId: string }>;
}

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const { studyId: rawStudyId, linkId: rawLinkId } = await params;
  const studyId = parseWith(idSchema, rawStudyId, "study");
  const linkId = parseWith(idSchema, rawLinkId, "share_link");
  const caller = await requireCaller(request.headers);
  const { study } = await requireStudyAccess({ caller, studyId, action: "study:share" });
  const existing = await getShareLinkById({ id: linkId });
  // A link of another study is not found here, even for an owner of both.
  if (!existing || existing.studyId !== studyId) throw new AppError("not_found:share_link", "No such read-only link in this study.");
  const revoked = await revokeShareLinkById({ id: linkId, revokedBy: caller.userId });
  if (!revoked) throw new AppError("not_found:share_link", "No such read-only link in this study.");
  if (revoked.changed) {
    await recordActivity({ teamId: study.teamId, studyId, actorId: caller.userId, action: "share_link.revoked", subjectType: "share_link", subjectId: linkId, detail: { label: revoked.link.label } });
  }
  const body: { link: ShareLinkItem } = { link: revoked.link };
  return Response.json(body);
});
