// One saved verification record with its checks and curves, for any member of its team; to anyone
// else it does not exist.
import { getVerificationRecordById } from "@/db/queries/verifications";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ verificationId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const verificationId = parseWith(idSchema, (await params).verificationId, "verification");
  const caller = await requireCaller(request.headers);
  const record = await getVerificationRecordById({ id: verificationId });
  if (!record) throw new AppError("not_found:verification", "No such verification record.");
  await requireTeamAccess({ caller, teamId: record.teamId, action: "team:read" });
  return Response.json({ record });
});
