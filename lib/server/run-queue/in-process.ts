// The worker inside the app's own process: on the embedded database (PGlite admits one process, so no
// `npm run worker` can join it) server runs work with no set-up. RAREFACT_INPROCESS_WORKER=false turns it
// off; =true starts it on a PostgreSQL server too (a single-machine install without a separate worker).
import "server-only";
import { getDatabaseKind } from "@/db/client";
import { startRunWorker, type RunWorker } from "./worker";

const cacheKey = Symbol.for("rarefact.run-queue.in-process-worker");
type GlobalWithWorker = typeof globalThis & { [cacheKey]?: Promise<RunWorker | null> };

export function inProcessWorkerWanted(kind: "pglite" | "postgres", setting = process.env.RAREFACT_INPROCESS_WORKER?.trim().toLowerCase()): boolean {
  if (setting === "false") return false;
  if (setting === "true") return true;
  return kind === "pglite";
}

/** Starts the process's one in-process worker when wanted; a second call returns the first. */
export function startInProcessWorker(): Promise<RunWorker | null> {
  const store = globalThis as GlobalWithWorker;
  store[cacheKey] ??= (async () => {
    const kind = await getDatabaseKind();
    if (!inProcessWorkerWanted(kind)) return null;
    // No signal handlers here: the server owns its shutdown. A job cut off by it is found by its stale
    // heartbeat after the next start and retried.
    return startRunWorker({ log: (line) => console.log(`[queue] ${line}`) });
  })().catch((error: unknown) => {
    console.error("[queue] the in-process worker could not start:", error);
    delete store[cacheKey];
    return null;
  });
  return store[cacheKey];
}

/** Stops the in-process worker (tests). */
export async function stopInProcessWorker(): Promise<void> {
  const store = globalThis as GlobalWithWorker;
  const pending = store[cacheKey];
  delete store[cacheKey];
  const worker = await pending;
  await worker?.stop({ graceMs: 1_000 });
}
