// A study's read-only links (owners only): the list, revoked ones included, and making a new one. The
// new link's URL, which holds its secret, is answered once and kept nowhere.
import { recordActivity } from "@/db/queries/activity";
import { createShareLink, listShareLinksByStudyId } from "@/db/queries/share-links";
import type { ShareLinkCreatedResponse, ShareLinksResponse } from "@/lib/http/share-link-types";
import { requireCaller, requireStudyAccess } from "@/lib/server/access";
import { publicAppUrl } from "@/lib/server/mail";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { shareLinkCreateSchema } from "@/lib/validation/share-link";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  await requireStudyAccess({ caller, studyId, action: "study:share" });
  const body: ShareLinksResponse = { links: await listShareLinksByStudyId({ studyId }) };
  return Response.json(body);
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  const { study } = await requireStudyAccess({ caller, studyId, action: "study:share" });
  const input = await parseJsonBody(request, shareLinkCreateSchema, "share_link", 8 * 1024);
  const { link, token } = await createShareLink({ studyId, label: input.label, createdBy: caller.userId });
  await recordActivity({ teamId: study.teamId, studyId, actorId: caller.userId, action: "share_link.created", subjectType: "share_link", subjectId: link.id, detail: { label: link.label } });
  const body: ShareLinkCreatedResponse = { link, url: publicAppUrl(`/shared/${token}`, request) };
  // The answer holds the secret: no cache may keep it.
  return Response.json(body, { status: 201, headers: { "cache-control": "no-store" } });
});
