// Personal API tokens: a user makes, lists and revokes their own; a script presents the secret as a
// bearer token. Only the secret's SHA-256 is stored and a token is found by looking that hash up, so
// the secret is never compared in application code and exists only in the answer that made it.
import "server-only";
import { and, desc, eq, isNull, lt, or, type SQL } from "drizzle-orm";
import { isTeamRole, type TeamRole } from "@/lib/access/roles";
import type { ApiTokenItem } from "@/lib/http/api-token-types";
import { getDb } from "../client";
import { apiToken, team, user } from "../schema";
import { hashSecret, newSecret } from "./secrets";
import { newId, withDatabaseErrors } from "./wrap";

/** 32 random bytes: 256 bits, so guessing a token is hopeless and needs no rate limit. */
const secretPrefix = "rft_";
/** "rft_" and four characters of the secret: enough to tell one's tokens apart, far too few to guess with. */
const displayPrefixLength = secretPrefix.length + 4;
/** lastUsedAt is a hint for people, not an audit log: one write a minute per token is plenty. */
const lastUsedResolutionMs = 60_000;

function newApiTokenSecret(): string {
  return `${secretPrefix}${newSecret()}`;
}

const itemColumns = {
  id: apiToken.id,
  name: apiToken.name,
  teamId: apiToken.teamId,
  teamName: team.name,
  role: apiToken.role,
  prefix: apiToken.tokenPrefix,
  createdAt: apiToken.createdAt,
  lastUsedAt: apiToken.lastUsedAt,
  expiresAt: apiToken.expiresAt,
  revokedAt: apiToken.revokedAt,
};

type ItemRow = { id: string; name: string; teamId: string; teamName: string; role: string; prefix: string; createdAt: Date; lastUsedAt: Date | null; expiresAt: Date | null; revokedAt: Date | null };

function toItem(row: ItemRow): ApiTokenItem {
  return {
    id: row.id,
    name: row.name,
    teamId: row.teamId,
    teamName: row.teamName,
    // The column only ever receives a role (the route parses it); anything else acts as a viewer.
    role: isTeamRole(row.role) ? row.role : "viewer",
    prefix: row.prefix,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    expiresAt: row.expiresAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}

async function selectItems(where: SQL | undefined): Promise<ApiTokenItem[]> {
  const db = await getDb();
  const rows = await db.select(itemColumns).from(apiToken).innerJoin(team, eq(team.id, apiToken.teamId)).where(where).orderBy(desc(apiToken.createdAt), desc(apiToken.id));
  return rows.map(toItem);
}

/** The user's tokens, newest first, revoked and expired ones included (so people see what once existed). */
export async function listApiTokensByUserId({ userId }: { userId: string }): Promise<ApiTokenItem[]> {
  return withDatabaseErrors("list the API tokens", () => selectItems(eq(apiToken.userId, userId)));
}

/** Makes a token and answers its secret; this is the only time the secret exists outside the script. */
export async function createApiToken({
  userId,
  teamId,
  role,
  name,
  expiresAt,
}: {
  userId: string;
  teamId: string;
  role: TeamRole;
  name: string;
  expiresAt: Date | null;
}): Promise<{ token: ApiTokenItem; secret: string }> {
  return withDatabaseErrors("make the API token", async () => {
    const db = await getDb();
    const id = newId();
    const secret = newApiTokenSecret();
    await db.insert(apiToken).values({ id, userId, teamId, role, name, tokenHash: hashSecret(secret), tokenPrefix: secret.slice(0, displayPrefixLength), expiresAt });
    const [token] = await selectItems(eq(apiToken.id, id));
    if (!token) throw new Error("the new API token could not be read back");
    return { token, secret };
  });
}

/**
 * Revokes one of the user's tokens. Null when the user has no such token (another user's token is
 * not found either); `changed` is false when it was revoked already.
 */
export async function revokeApiToken({ id, userId, now = new Date() }: { id: string; userId: string; now?: Date }): Promise<{ token: ApiTokenItem; changed: boolean } | null> {
  return withDatabaseErrors("revoke the API token", async () => {
    const db = await getDb();
    const updated = await db
      .update(apiToken)
      .set({ revokedAt: now })
      .where(and(eq(apiToken.id, id), eq(apiToken.userId, userId), isNull(apiToken.revokedAt)))
      .returning({ id: apiToken.id });
    const [token] = await selectItems(and(eq(apiToken.id, id), eq(apiToken.userId, userId)));
    return token ? { token, changed: updated.length > 0 } : null;
  });
}

export interface PresentedApiToken {
  id: string;
  userId: string;
  userName: string;
  email: string;
  teamId: string;
  role: TeamRole;
  expiresAt: Date | null;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

/** The token a secret belongs to, with its owner, whatever its state (the caller words the refusal). */
export async function findApiTokenBySecret({ secret }: { secret: string }): Promise<PresentedApiToken | null> {
  return withDatabaseErrors("check the API token", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        id: apiToken.id,
        userId: apiToken.userId,
        userName: user.name,
        email: user.email,
        teamId: apiToken.teamId,
        role: apiToken.role,
        expiresAt: apiToken.expiresAt,
        lastUsedAt: apiToken.lastUsedAt,
        revokedAt: apiToken.revokedAt,
      })
      .from(apiToken)
      .innerJoin(user, eq(user.id, apiToken.userId))
      .where(eq(apiToken.tokenHash, hashSecret(secret)))
      .limit(1);
    const row = rows[0];
    if (!row) return null;
    return { ...row, role: isTeamRole(row.role) ? row.role : "viewer" };
  });
}

/** Notes that the token was used, unless that was noted less than a minute ago. */
export async function touchApiTokenLastUsed({ id, lastUsedAt, now = new Date() }: { id: string; lastUsedAt: Date | null; now?: Date }): Promise<void> {
  if (lastUsedAt && now.getTime() - lastUsedAt.getTime() < lastUsedResolutionMs) return;
  await withDatabaseErrors("note the API token's use", async () => {
    const db = await getDb();
    const threshold = new Date(now.getTime() - lastUsedResolutionMs);
    // Guarded in SQL as well, so that parallel calls of one script write once.
    await db
      .update(apiToken)
      .set({ lastUsedAt: now })
      .where(and(eq(apiToken.id, id), or(isNull(apiToken.lastUsedAt), lt(apiToken.lastUsedAt, threshold))));
  });
}
