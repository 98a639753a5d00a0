// What the server does once when it starts: open and migrate the database, then seed the demo
// on a store that has none (unless RAREFACT_SEED_DEMO=false).
import "server-only";
import { getDatabaseKind, getDb } from "./client";
import { demoCredentialsText, seedDemo } from "./seed/demo";

export async function prepareDatabase({ seed = process.env.RAREFACT_SEED_DEMO !== "false" } = {}): Promise<void> {
  await getDb();
  const kind = await getDatabaseKind();
  console.log(`[rarefact] database ready (${kind === "pglite" ? "embedded PGlite" : "PostgreSQL server"}), migrations applied`);
  if (!seed) return;
  const added = await seedDemo();
  console.log(`[rarefact] demo ${added ? "seeded" : "already present"}. Sign in with:\n${demoCredentialsText()}`);
}
