// `npm run test:unit`: vitest with a throwaway PostgreSQL cluster beside it, so that the
// DATABASE_URL path is tested along with the embedded one. Without PostgreSQL installed the
// server tests are skipped locally and fail in CI (CI=true).
import { spawnSync } from "node:child_process";
import { findPostgresBin, startPostgresCluster } from "./support/postgres-cluster.mjs";

let cluster = null;
if (findPostgresBin()) {
  cluster = await startPostgresCluster();
  console.log(`[test] throwaway PostgreSQL cluster at ${cluster.url}`);
} else {
  console.log("[test] PostgreSQL not installed: the DATABASE_URL tests are skipped (apt-get install -y postgresql to run them)");
}

let status = 1;
try {
  const result = spawnSync("npx", ["vitest", "run", ...process.argv.slice(2)], {
    stdio: "inherit",
    env: { ...process.env, ...(cluster ? { RAREFACT_TEST_POSTGRES_URL: cluster.url } : {}) },
  });
  status = result.status ?? 1;
} finally {
  cluster?.stop();
}
process.exit(status);
