// The caller's personal API tokens: list them, and make one scoped to a team and a role no higher
// than the caller's own there. The secret is in the answer that made the token and nowhere else.
// Only a signed-in person manages tokens: a token cannot list or mint tokens.
import { recordActivity } from "@/db/queries/activity";
import { createApiToken, listApiTokensByUserId } from "@/db/queries/api-tokens";
import { getMembershipRole } from "@/db/queries/teams";
import { roleWithin } from "@/lib/access/token-scope";
import type { ApiTokenCreatedResponse, ApiTokensResponse } from "@/lib/http/api-token-types";
import { AppError } from "@/lib/http/app-error";
import { requireSessionCaller } from "@/lib/server/access";
import { apiRoute, parseJsonBody } from "@/lib/server/route";
import { apiTokenCreateSchema } from "@/lib/validation/api-token";

const tokenRefusal = "An API token cannot manage API tokens; do this under Settings, API tokens, signed in.";
const dayMs = 24 * 60 * 60 * 1000;

export const GET = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request.headers, tokenRefusal);
  const body: ApiTokensResponse = { tokens: await listApiTokensByUserId({ userId: caller.userId }) };
  return Response.json(body, { headers: { "cache-control": "no-store" } });
});

export const POST = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request.headers, tokenRefusal);
  const input = await parseJsonBody(request, apiTokenCreateSchema, "api_token", 8 * 1024);
  const memberRole = await getMembershipRole({ teamId: input.teamId, userId: caller.userId });
  if (memberRole === null) throw new AppError("not_found:team", "No such team.");
  if (!roleWithin(input.role, memberRole)) {
    throw new AppError("forbidden:api_token", `role: your role in this team is ${memberRole}; a token cannot be given more than that, and ${input.role} is not within it.`, [
      { path: "role", message: `Choose a role within yours (${memberRole}).` },
    ]);
  }
  const expiresAt = input.expiresInDays === undefined ? null : new Date(Date.now() + input.expiresInDays * dayMs);
  const { token, secret } = await createApiToken({ userId: caller.userId, teamId: input.teamId, role: input.role, name: input.name, expiresAt });
  await recordActivity({
    teamId: input.teamId,
    actorId: caller.userId,
    action: "api_token.created",
    subjectType: "api_token",
    subjectId: token.id,
    detail: { name: token.name, role: token.role, prefix: token.prefix, expiresAt: token.expiresAt },
  });
  const body: ApiTokenCreatedResponse = { token, secret };
  // The answer holds the secret: no cache may keep it.
  return Response.json(body, { status: 201, headers: { "cache-control": "no-store" } });
});
