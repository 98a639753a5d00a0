// `npm run worker`: a run-queue worker process for a PostgreSQL server (DATABASE_URL). Start as many as
// the machines allow; each takes one job at a time and steps it on RAREFACT_WORKER_THREADS threads.
// SIGTERM or SIGINT: stops taking jobs, lets the job in hand finish for a while, then hands it back.
import { closeDb, getDatabaseKind } from "@/db/client";
import { stopBoss } from "@/lib/server/run-queue/boss";
import { queueTimings, workerThreads } from "@/lib/server/run-queue/settings";
import { startRunWorker } from "@/lib/server/run-queue/worker";

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(1);
}

async function main(): Promise<void> {
  if (!process.env.DATABASE_URL?.trim()) {
    fail(
      "npm run worker needs DATABASE_URL (a PostgreSQL server shared with the app).\n" +
        "On the embedded database the app runs its own worker in-process; a second process cannot open that database.",
    );
  }
  if ((await getDatabaseKind()) !== "postgres") fail("npm run worker refuses the embedded database: set DATABASE_URL to a PostgreSQL server.");
  const timings = queueTimings();
  const stamp = () => new Date().toISOString().slice(11, 19);
  const worker = await startRunWorker({ log: (line) => process.stdout.write(`${stamp()} ${line}\n`) });
  process.stdout.write(
    `${stamp()} ${workerThreads()} threads per job, ${timings.maxAttempts} attempts per job, heartbeat every ${timings.progressSeconds} s, ` +
      `jobs of silent workers handed back after ${timings.staleSeconds} s\n`,
  );
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    process.stdout.write(`${stamp()} ${signal}: stopping\n`);
    const graceMs = Number(process.env.RAREFACT_WORKER_STOP_GRACE_SECONDS ?? 25) * 1000;
    worker
      .stop({ graceMs: Number.isFinite(graceMs) ? graceMs : 25_000 })
      .then(() => stopBoss())
      .then(() => closeDb())
      .then(() => process.exit(0))
      .catch((error: unknown) => {
        process.stderr.write(`could not stop cleanly: ${error instanceof Error ? error.message : String(error)}\n`);
        process.exit(1);
      });
  };
  process.on("SIGTERM", () => stop("SIGTERM"));
  process.on("SIGINT", () => stop("SIGINT"));
}

main().catch((error: unknown) => fail(`the worker could not start: ${error instanceof Error ? error.message : String(error)}`));
