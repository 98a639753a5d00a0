// The API's OpenAPI 3.1 document (public: it describes routes and schemas, holds no data or secrets).
// Built once per process from lib/server/openapi, the same zod schemas the routes parse with.
import { buildOpenApiDocument } from "@/lib/server/openapi/document";
import { apiRoute } from "@/lib/server/route";

let cached: string | null = null;

export const GET = apiRoute(async () => {
  cached ??= JSON.stringify(buildOpenApiDocument());
  return new Response(cached, { status: 200, headers: { "content-type": "application/json; charset=utf-8", "cache-control": "public, max-age=300" } });
});
