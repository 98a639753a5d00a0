// The OpenAPI 3.1 document of Rarefact's API, built from the operation list with zod-openapi. Public:
// it describes routes and schemas, never data or secrets.
import "server-only";
import { createDocument, type ZodOpenApiOperationObject, type ZodOpenApiPathsObject, type ZodOpenApiResponseObject, type ZodOpenApiResponsesObject } from "zod-openapi";
import { z } from "zod";
import { apiOperations, apiTags, type ApiOperation, type ErrorStatus } from "./operations";
import { errorBodySchema } from "./response-schemas";

const errorMeaning: Record<ErrorStatus, string> = {
  400: "A parameter or a field of the body is not valid; `message` and `issues` name it.",
  401: "No session and no token, or the bearer token is malformed, unknown, revoked or expired (the message says which).",
  403: "The caller's role lacks the action. A token acts with the lower of its own role and its owner's current role in the team.",
  404: "No such thing, or it belongs to a team the caller (or the token) does not reach: other teams' ids reveal nothing.",
  409: "A conflict with the current state.",
  410: "Gone.",
  413: "The body is larger than the route accepts.",
};

function accessText(operation: ApiOperation): string {
  const where = operation.accessNote ? ` (${operation.accessNote})` : "";
  switch (operation.access) {
    case "public":
      return "Open to anyone.";
    case "signed-in":
      return `Any signed-in caller, by session or token${where}.`;
    case "session-only":
      return `A signed-in person only: an API token is refused with 403${where}.`;
    default:
      return `Needs \`${operation.access}\` in the team that owns it${where}.`;
  }
}

function impliedErrors(operation: ApiOperation): ErrorStatus[] {
  const statuses = new Set<ErrorStatus>();
  if (operation.params || operation.query || operation.body) statuses.add(400);
  if (operation.access !== "public") statuses.add(401);
  if (operation.access !== "public" && operation.access !== "signed-in") statuses.add(403);
  if (operation.params && operation.path.includes("{")) statuses.add(404);
  if (operation.body) statuses.add(413);
  return [...statuses];
}

function responsesOf(operation: ApiOperation): ZodOpenApiResponsesObject {
  const { success } = operation;
  const contentType = success.contentType ?? "application/json";
  const responses: Record<string, ZodOpenApiResponseObject> = {
    [String(success.status)]: {
      description: success.description,
      ...(success.status === 204 || success.status === 304 ? {} : { content: { [contentType]: contentType === "application/json" ? { schema: success.schema ?? z.unknown() } : { schema: z.string() } } }),
    },
  };
  const explicit = new Map((operation.errors ?? []).map((error) => [error.status, error.description]));
  const statuses = new Set<ErrorStatus>([...impliedErrors(operation), ...explicit.keys()]);
  for (const status of [...statuses].sort()) {
    responses[String(status)] = { description: explicit.get(status) ?? errorMeaning[status], content: { "application/json": { schema: errorBodySchema } } };
  }
  return responses as ZodOpenApiResponsesObject;
}

function operationObject(operation: ApiOperation): ZodOpenApiOperationObject {
  const security: Record<string, string[]>[] = operation.access === "public" ? [] : operation.access === "session-only" ? [{ sessionCookie: [] }] : [{ bearerToken: [] }, { sessionCookie: [] }];
  const body = operation.body;
  return {
    operationId: operation.operationId,
    summary: operation.summary,
    description: [operation.description, `**Access:** ${accessText(operation)}`].filter(Boolean).join("\n\n"),
    tags: [operation.tag],
    security,
    ...(operation.params || operation.query ? { requestParams: { ...(operation.params ? { path: operation.params } : {}), ...(operation.query ? { query: operation.query } : {}) } } : {}),
    ...(body
      ? {
          requestBody:
            body.contentType === "application/octet-stream"
              ? { required: true, description: body.description, content: { "application/octet-stream": { schema: z.string().meta({ format: "binary" }) } } }
              : { required: true, description: body.description, content: { "application/json": { schema: body.schema } } },
        }
      : {}),
    responses: responsesOf(operation),
    "x-rarefact-access": operation.access,
  };
}

export function buildOpenApiDocument(): ReturnType<typeof createDocument> {
  const paths: ZodOpenApiPathsObject = {};
  for (const operation of apiOperations) {
    const item = (paths[operation.path] ??= {});
    item[operation.method] = operationObject(operation);
  }
  return createDocument({
    openapi: "3.1.0",
    info: {
      title: "Rarefact API",
      version: "1",
      description: [
        "The HTTP API of Rarefact, the browser workbench for 2D FDTD acoustics. Every answer is JSON unless stated; errors are `{ error: { code, message, issues? } }`.",
        "Scripts authenticate with a personal API token (Settings → API tokens in the app) sent as `Authorization: Bearer rft_…`. A token reaches one team only and acts with the lower of its role and its owner's current role there; a call with an Authorization header never uses the session cookie.",
        "Results are 2D predictions (a coherent line source, infinitely long barriers): they support design decisions and are not a statutory noise assessment.",
      ].join("\n\n"),
    },
    tags: apiTags.map((tag) => ({ ...tag })),
    paths,
    components: {
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", bearerFormat: "rft_ and 43 base64url characters", description: "A personal API token, made under Settings → API tokens." },
        sessionCookie: { type: "apiKey", in: "cookie", name: "better-auth.session_token", description: "The browser's session after signing in (POST /api/auth/sign-in/email)." },
      },
    },
  });
}
