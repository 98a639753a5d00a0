// pg-boss on the process's own database: a PostgreSQL server through a small pool of its own, or the
// embedded PGlite through the app's one client. pg-boss creates (or migrates) its schema "pgboss" on
// first start; one instance per process, cached on globalThis like the database client.
import "server-only";
import PgBoss from "pg-boss";
import { getQueueConnection } from "@/db/client";
import { queueTimings, runQueueName } from "./settings";

const cacheKey = Symbol.for("rarefact.run-queue.boss");
type GlobalWithBoss = typeof globalThis & { [cacheKey]?: Promise<PgBoss> };

async function startBoss(): Promise<PgBoss> {
  const connection = await getQueueConnection();
  const timings = queueTimings();
  const common = {
    // No cron schedules; maintenance (expiry of jobs whose worker vanished, archiving) stays on.
    schedule: false,
    supervise: true,
    maintenanceIntervalSeconds: Math.max(1, Math.min(60, Math.round(timings.staleSeconds / 2))),
  };
  const boss =
    connection.kind === "postgres"
      ? new PgBoss({ ...common, connectionString: connection.url, max: 4, application_name: "rarefact-queue" })
      : new PgBoss({ ...common, db: { executeSql: (text, values) => connection.executeSql(text, values) } });
  boss.on("error", (error) => console.error("[queue] pg-boss:", error instanceof Error ? error.message : error));
  await boss.start();
  const queue = {
    name: runQueueName,
    retryLimit: timings.maxAttempts - 1,
    retryDelay: timings.retryDelaySeconds,
    retryBackoff: true,
    expireInSeconds: timings.expireSeconds,
  };
  // Creating is idempotent (two workers may start at once); settings may change between starts (env).
  await boss.createQueue(runQueueName, queue);
  await boss.updateQueue(runQueueName, queue);
  return boss;
}

/** The process's started pg-boss, with the run queue created. */
export function getBoss(): Promise<PgBoss> {
  const store = globalThis as GlobalWithBoss;
  store[cacheKey] ??= startBoss().catch((error: unknown) => {
    delete store[cacheKey];
    throw error;
  });
  return store[cacheKey];
}

/** Stops pg-boss (tests, worker shutdown); the database stays open. */
export async function stopBoss(options: { graceful?: boolean; timeoutMs?: number } = {}): Promise<void> {
  const store = globalThis as GlobalWithBoss;
  const pending = store[cacheKey];
  if (!pending) return;
  delete store[cacheKey];
  const boss = await pending.catch(() => null);
  await boss?.stop({ graceful: options.graceful ?? true, timeout: options.timeoutMs ?? 30_000, wait: true, close: true });
}
