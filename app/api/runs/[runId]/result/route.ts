// A saved run's payload, as stored (any member). A saved run never changes, so the browser may keep
// it: cached privately (it is behind sign-in) for a year, revalidated by its ETag after that.
import { getRunResultById } from "@/db/queries/runs";
import { AppError } from "@/lib/http/app-error";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ runId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const caller = await requireCaller(request.headers);
  const { run } = await requireRunAccess({ caller, runId, action: "study:read" });
  // The run id names one payload that never changes. Vary on the cookie and the bearer token: on a
  // shared browser or client the next caller must pass the access check, not be served from the cache.
  const etag = `"${run.id}"`;
  const cacheHeaders = { "cache-control": "private, max-age=31536000, immutable", etag, vary: "cookie, authorization" };
  if (request.headers.get("if-none-match") === etag) return new Response(null, { status: 304, headers: cacheHeaders });
  const bytes = await getRunResultById({ id: runId });
  if (!bytes) throw new AppError("not_found:run", "This run has no stored result.");
  return new Response(bytes.buffer instanceof ArrayBuffer ? (bytes as Uint8Array<ArrayBuffer>) : new Uint8Array(bytes), {
    status: 200,
    headers: { ...cacheHeaders, "content-type": "application/octet-stream", "content-length": String(bytes.byteLength), "x-content-type-options": "nosniff" },
  });
});
