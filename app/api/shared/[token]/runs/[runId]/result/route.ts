// The stored payload of one saved run of the study a read-only link opens. A run of any other study
// answers the same 404 as a run that does not exist.
import { getSharedRunResult } from "@/db/queries/share-links";
import { AppError } from "@/lib/http/app-error";
import { requireSharedStudy, sharedRoute } from "@/lib/server/shared-access";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ token: string; runId: string }>;
}

export const GET = sharedRoute<Context>(async (_request, { params }) => {
  const { token, runId } = await params;
  const access = await requireSharedStudy(token);
  const parsedRunId = idSchema.safeParse(runId);
  const bytes = parsedRunId.success ? await getSharedRunResult({ studyId: access.studyId, runId: parsedRunId.data }) : null;
  if (!bytes) throw new AppError("not_found:run", "No such saved run in this shared study.");
  return new Response(bytes.buffer instanceof ArrayBuffer ? (bytes as Uint8Array<ArrayBuffer>) : new Uint8Array(bytes), {
    status: 200,
    headers: { "content-type": "application/octet-stream", "content-length": String(bytes.byteLength), "x-content-type-options": "nosniff" },
  });
});
