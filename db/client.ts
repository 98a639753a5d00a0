// The one database client of a process: PGlite on disk by default, node-postgres when
// DATABASE_URL is set. Opened lazily (next build imports route modules and must not open it),
// migrated on first open, and cached on globalThis so that every bundle in the process shares it.
import "server-only";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import { databaseLocation, migrationsFolder } from "./config";
import { acquirePgliteLock } from "./pglite-lock";
import * as schema from "./schema";

export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

interface OpenDatabase {
  db: Database;
  kind: "pglite" | "postgres";
  close: () => Promise<void>;
}

const cacheKey = Symbol.for("rarefact.database");
type GlobalWithDatabase = typeof globalThis & { [cacheKey]?: Promise<OpenDatabase> };

async function openPglite(dir: string): Promise<OpenDatabase> {
  const [{ PGlite }, { drizzle }, { migrate }] = await Promise.all([
    import("@electric-sql/pglite"),
    import("drizzle-orm/pglite"),
    import("drizzle-orm/pglite/migrator"),
  ]);
  if (dir !== "memory://") acquirePgliteLock(dir);
  const client = new PGlite(dir);
  const db = drizzle(client, { schema });
  await migrate(db, { migrationsFolder });
  return { db: db as unknown as Database, kind: "pglite", close: () => client.close() };
}

async function openPostgres(url: string): Promise<OpenDatabase> {
  const [{ Pool }, { drizzle }, { migrate }] = await Promise.all([
    import("pg"),
    import("drizzle-orm/node-postgres"),
    import("drizzle-orm/node-postgres/migrator"),
  ]);
  const pool = new Pool({ connectionString: url, max: 10 });
  const db = drizzle(pool, { schema });
  await migrate(db, { migrationsFolder });
  return { db: db as unknown as Database, kind: "postgres", close: () => pool.end() };
}

function openDatabase(): Promise<OpenDatabase> {
  const location = databaseLocation();
  return location.kind === "postgres" && location.postgresUrl ? openPostgres(location.postgresUrl) : openPglite(location.pgliteDir);
}

async function getOpenDatabase(): Promise<OpenDatabase> {
  const store = globalThis as GlobalWithDatabase;
  if (!store[cacheKey]) {
    store[cacheKey] = openDatabase().catch((error: unknown) => {
      delete store[cacheKey];
      throw error;
    });
  }
  return store[cacheKey];
}

/** The migrated database of this process. */
export async function getDb(): Promise<Database> {
  return (await getOpenDatabase()).db;
}

export async function getDatabaseKind(): Promise<"pglite" | "postgres"> {
  return (await getOpenDatabase()).kind;
}

/** Closes the database (tests and scripts); the next getDb() opens it again. */
export async function closeDb(): Promise<void> {
  const store = globalThis as GlobalWithDatabase;
  const open = store[cacheKey];
  if (!open) return;
  delete store[cacheKey];
  await (await open).close();
}
