// A saved run's band-level table as CSV (any member): one row per receiver, the overall level and one
// column per band the grid resolves, octave or one-third-octave, Z or A weighting. The same figures
// as the run page's band-level panel, for scripts that do not decode the run payload themselves.
import { getRunResultById } from "@/db/queries/runs";
import { runBandLevels, runBandLevelsCsv } from "@/lib/analysis/run-band-levels";
import { searchParamsObject } from "@/lib/validation/activity";
import { AppError } from "@/lib/http/app-error";
import { decodeRunPayload } from "@/lib/run-record/payload";
import { requireCaller, requireRunAccess } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { bandLevelsQuerySchema } from "@/lib/validation/band-levels";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ runId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const runId = parseWith(idSchema, (await params).runId, "run");
  const query = parseWith(bandLevelsQuerySchema, searchParamsObject(request.url), "band_levels");
  const caller = await requireCaller(request.headers);
  await requireRunAccess({ caller, runId, action: "study:read" });
  const bytes = await getRunResultById({ id: runId });
  if (!bytes) throw new AppError("not_found:run", "This run has no stored result.");
  const decoded = decodeRunPayload(bytes);
  if (!decoded.ok) throw new AppError("internal:run", `The stored result of this run cannot be read (${decoded.path}: ${decoded.message}).`);
  const outcome = runBandLevels(decoded.run, query);
  if (!outcome.ok) throw new AppError("conflict:run", outcome.message);
  const fileName = `run-${runId.slice(0, 8)}-band-levels-${query.bandsPerOctave === 3 ? "third-octave" : "octave"}-${query.weighting}.csv`;
  return new Response(runBandLevelsCsv(outcome.table), {
    status: 200,
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${fileName}"`,
      // A saved run never changes, but the answer is behind the access check: private, per caller.
      "cache-control": "private, max-age=3600",
      vary: "cookie, authorization",
      "x-content-type-options": "nosniff",
    },
  });
});
