// The one database client of a process: PGlite on disk by default, node-postgres when
// DATABASE_URL is set. Opened lazily (next build imports route modules and must not open it),
// migrated on first open, and cached on globalThis so that every bundle in the process shares it.
import "server-only";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import { databaseLocation, migrationsFolder } from "./config";
import { acquirePgliteLock } from "./pglite-lock";
import * as schema from "./schema";

export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

/** Stops listening to a channel. */
export type Unlisten = () => Promise<void>;

/**
 * How the run queue (pg-boss) reaches this process's database: a PostgreSQL server by its URL (pg-boss
 * keeps a pool of its own), or the embedded PGlite through the one client (a single connection, so
 * every statement queues behind an open transaction).
 */
export type QueueConnection =
  | { kind: "postgres"; url: string }
  | { kind: "pglite"; executeSql: (text: string, values?: unknown[]) => Promise<{ rows: unknown[] }> };

interface OpenDatabase {
  db: Database;
  kind: "pglite" | "postgres";
  /** LISTEN on a channel; PGlite delivers in-process, PostgreSQL over a connection of its own. */
  listen: (channel: string, onPayload: (payload: string) => void) => Promise<Unlisten>;
  close: () => Promise<void>;
  queue: QueueConnection;
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
  return {
    db: db as unknown as Database,
    kind: "pglite",
    listen: async (channel, onPayload) => client.listen(channel, onPayload),
    close: () => client.close(),
    queue: { kind: "pglite", executeSql: (text, values) => executeOnPglite(client, text, values) },
  };
}

type PgliteClient = InstanceType<(typeof import("@electric-sql/pglite"))["PGlite"]>;

/**
 * pg-boss's statements on PGlite: with values, one prepared statement; without, possibly several in one
 * text (its schema creation and maintenance run as BEGIN; ...; COMMIT), which only exec() accepts. The
 * rows answered are those of the last statement that returns any. A failed multi-statement text could
 * leave its transaction open on the one connection, so it is rolled back.
 */
async function executeOnPglite(client: PgliteClient, text: string, values?: unknown[]): Promise<{ rows: unknown[] }> {
  if (values && values.length > 0) return { rows: (await client.query(text, values)).rows };
  try {
    const results = await client.exec(text);
    const last = [...results].reverse().find((result) => result.fields.length > 0);
    return { rows: last?.rows ?? [] };
  } catch (error) {
    if (/\bBEGIN\b/i.test(text)) await client.exec("ROLLBACK").catch(() => undefined);
    throw error;
  }
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
  const listeners = new Set<{ close: () => Promise<void> }>();
  return {
    db: db as unknown as Database,
    kind: "postgres",
    listen: async (channel, onPayload) => {
      const listener = await listenOnPostgres(url, channel, onPayload);
      listeners.add(listener);
      return async () => {
        listeners.delete(listener);
        await listener.close();
      };
    },
    close: async () => {
      await Promise.all([...listeners].map((listener) => listener.close()));
      await pool.end();
    },
    queue: { kind: "postgres", url },
  };
}

/**
 * A pooled connection cannot hold a LISTEN (it goes back to the pool), so each listener keeps a
 * connection of its own and reconnects after a second if the server drops it.
 */
async function listenOnPostgres(url: string, channel: string, onPayload: (payload: string) => void): Promise<{ close: () => Promise<void> }> {
  const { Client } = await import("pg");
  let closed = false;
  let current: InstanceType<typeof Client> | null = null;
  const connect = async (): Promise<void> => {
    const client = new Client({ connectionString: url });
    client.on("notification", (message) => {
      if (message.channel === channel && message.payload !== undefined) onPayload(message.payload);
    });
    client.on("error", (error) => {
      console.error(`[db] the LISTEN connection for ${channel} failed; reconnecting:`, error.message);
      void client.end().catch(() => undefined);
      if (!closed) setTimeout(() => void connect().catch(() => undefined), 1000);
    });
    await client.connect();
    await client.query(`LISTEN "${channel.replace(/"/g, "")}"`);
    current = client;
  };
  await connect();
  return {
    close: async () => {
      closed = true;
      await current?.end().catch(() => undefined);
    },
  };
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

/** Listens to a NOTIFY channel of the process's database. */
export async function listenToChannel(channel: string, onPayload: (payload: string) => void): Promise<Unlisten> {
  return (await getOpenDatabase()).listen(channel, onPayload);
}

/** Where the run queue finds this process's database (lib/server/run-queue/boss.ts). */
export async function getQueueConnection(): Promise<QueueConnection> {
  const { queue } = await getOpenDatabase();
  // A development server keeps the database its first code opened across reloads; that code had no queue.
  if (!queue) throw new Error("the database was opened before the run queue existed in this process; restart the server");
  return queue;
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
