// A team's saved verification results: list them (any member) and save the page's results (those who
// edit or review runs). The body is size-limited, and every array in it capped (lib/validation/verification.ts).
import { recordActivity } from "@/db/queries/activity";
import { createVerificationRecord, listVerificationRecordsByTeamId } from "@/db/queries/verifications";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { VERIFICATION_BODY_LIMIT_BYTES, verificationRecordInputSchema } from "@/lib/validation/verification";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:read" });
  return Response.json({ records: await listVerificationRecordsByTeamId({ teamId }) });
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "verification:record" });
  const input = await parseJsonBody(request, verificationRecordInputSchema, "verification", VERIFICATION_BODY_LIMIT_BYTES);
  const record = await createVerificationRecord({ teamId, createdBy: caller.userId, input });
  await recordActivity({
    teamId,
    actorId: caller.userId,
    action: "verification.recorded",
    subjectType: "verification",
    subjectId: record.id,
    detail: { passedCount: record.passedCount, failedCount: record.failedCount, solverVersion: record.solverVersion },
  });
  return Response.json({ record }, { status: 201 });
});
