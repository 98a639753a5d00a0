// Revoking one of the caller's API tokens: from this answer on, scripts using it get 401. Revoking a
// token already revoked changes nothing and answers it as it is; another user's token is not found.
import { recordActivity } from "@/db/queries/activity";
import { revokeApiToken } from "@/db/queries/api-tokens";
import type { ApiTokenResponse } from "@/lib/http/api-token-types";
import { AppError } from "@/lib/http/app-error";
import { requireSessionCaller } from "@/lib/server/access";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ tokenId: string }>;
}

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const tokenId = parseWith(idSchema, (await params).tokenId, "api_token");
  const caller = await requireSessionCaller(request.headers, "An API token cannot manage API tokens; do this under Settings, API tokens, signed in.");
  const revoked = await revokeApiToken({ id: tokenId, userId: caller.userId });
  if (!revoked) throw new AppError("not_found:api_token", "No such API token of yours.");
  if (revoked.changed) {
    await recordActivity({
      teamId: revoked.token.teamId,
      actorId: caller.userId,
      action: "api_token.revoked",
      subjectType: "api_token",
      subjectId: tokenId,
      detail: { name: revoked.token.name, role: revoked.token.role, prefix: revoked.token.prefix },
    });
  }
  const body: ApiTokenResponse = { token: revoked.token };
  return Response.json(body);
});
