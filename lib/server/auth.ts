// The running app's better-auth instance: e-mail and password sign-in, sessions in the database,
// teams through the organization plugin. Built lazily because it needs the open database.
import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { getDb, type Database } from "@/db/client";
import { createPersonalTeam, findFirstTeamIdByUserId } from "@/db/queries/teams";
import * as schema from "@/db/schema";
import { baseAuthOptions } from "./auth-options";
import { authSecret } from "./auth-secret";

/** Users created while seeding join the demo team instead of getting a team of their own. */
const usersWithoutPersonalTeam = new Set<string>();
export function skipPersonalTeamFor(email: string): void {
  usersWithoutPersonalTeam.add(email.toLowerCase());
}

function listFromEnv(name: string): string[] {
  return (process.env[name] ?? "")
    .split(",")
    .map((item) => item.trim())
    .filter(Boolean);
}

/** A fixed BETTER_AUTH_URL in production; otherwise the request's own host, if it is allowed. */
function baseURL() {
  if (process.env.BETTER_AUTH_URL) return process.env.BETTER_AUTH_URL;
  return {
    allowedHosts: ["localhost:*", "127.0.0.1:*", "localhost", "127.0.0.1", ...listFromEnv("RAREFACT_ALLOWED_HOSTS")],
    fallback: `http://localhost:${process.env.PORT ?? "3000"}`,
    protocol: "auto" as const,
  };
}

function trustedOrigins(): string[] {
  const configured = listFromEnv("RAREFACT_TRUSTED_ORIGINS");
  // Local installs are served on loopback on whatever port is free.
  return [...configured, "http://localhost:*", "http://127.0.0.1:*"];
}

function createAuth(db: Database) {
  return betterAuth({
    ...baseAuthOptions(),
    secret: authSecret(),
    baseURL: baseURL(),
    trustedOrigins: trustedOrigins(),
    database: drizzleAdapter(db, { provider: "pg", schema }),
    advanced: { database: { generateId: () => crypto.randomUUID() } },
    logger: { level: process.env.NODE_ENV === "test" ? "error" : "warn" },
    databaseHooks: {
      user: {
        create: {
          after: async (user) => {
            if (usersWithoutPersonalTeam.has(user.email.toLowerCase())) return;
            await createPersonalTeam({ userId: user.id, userName: user.name });
          },
        },
      },
      session: {
        create: {
          // A new session opens on the user's first team so that pages have one to show.
          before: async (session) => ({
            data: { ...session, activeOrganizationId: await findFirstTeamIdByUserId({ userId: session.userId }) },
          }),
        },
      },
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;

const cacheKey = Symbol.for("rarefact.auth");
type GlobalWithAuth = typeof globalThis & { [cacheKey]?: Promise<Auth> };

export function getAuth(): Promise<Auth> {
  const store = globalThis as GlobalWithAuth;
  store[cacheKey] ??= getDb().then(createAuth);
  return store[cacheKey];
}

/** Forget the cached instance (tests that reopen the database). */
export function resetAuth(): void {
  delete (globalThis as GlobalWithAuth)[cacheKey];
}
