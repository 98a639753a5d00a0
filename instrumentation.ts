// Runs once when the server starts (not during next build): database and demo first, so the
// first request finds them ready; then, on the embedded database, the in-process run-queue worker.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { prepareDatabase } = await import("./db/startup");
  await prepareDatabase();
  const { startInProcessWorker } = await import("./lib/server/run-queue/in-process");
  await startInProcessWorker();
}
