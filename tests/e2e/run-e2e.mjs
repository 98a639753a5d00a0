// `npm run test:e2e`: builds the app for production, starts it on a free loopback port with a
// throwaway embedded database (seeded with the demo), runs the browser tests against it, stops it.
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { freePort } from "../support/postgres-cluster.mjs";

const chromiumCandidates = [process.env.CHROMIUM_PATH, "/usr/bin/chromium", "/usr/bin/chromium-browser"].filter(Boolean);
if (!chromiumCandidates.some((candidate) => fs.existsSync(candidate))) {
  console.error(
    "[e2e] No chromium found for the browser tests.\n" +
      "      Install Debian's browser:  apt-get install -y chromium\n" +
      "      or point CHROMIUM_PATH at a Chromium binary.",
  );
  process.exit(1);
}

const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };
delete env.DATABASE_URL;

if (process.env.RAREFACT_E2E_SKIP_BUILD !== "1") {
  console.log("[e2e] building the production app (next build)…");
  const build = spawnSync("npx", ["next", "build"], { stdio: "inherit", env });
  if (build.status !== 0) process.exit(build.status ?? 1);
}

const port = await freePort();
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "rarefact-e2e-data-"));
const baseUrl = `http://127.0.0.1:${port}`;
const server = spawn("npx", ["next", "start", "--hostname", "127.0.0.1", "--port", String(port)], {
  env: { ...env, PORT: String(port), RAREFACT_DATA_DIR: dataDir, RAREFACT_SEED_DEMO: "true" },
  stdio: ["ignore", "pipe", "pipe"],
  detached: true,
});
let serverLog = "";
server.stdout.on("data", (chunk) => (serverLog += chunk));
server.stderr.on("data", (chunk) => (serverLog += chunk));

function stopServer() {
  try {
    process.kill(-server.pid, "SIGTERM");
  } catch {
    // already stopped
  }
}
process.on("exit", () => {
  stopServer();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

async function waitForServer() {
  const deadline = Date.now() + 120_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the server exited early:\n${serverLog}`);
    try {
      const response = await fetch(`${baseUrl}/sign-in`);
      if (response.ok && serverLog.includes("[rarefact] demo")) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  throw new Error(`the server did not answer within 120 s:\n${serverLog}`);
}

let status = 1;
try {
  await waitForServer();
  console.log(`[e2e] app ready at ${baseUrl}`);
  const result = spawnSync("npx", ["vitest", "run", "--config", "vitest.e2e.config.ts", ...process.argv.slice(2)], {
    stdio: "inherit",
    env: { ...env, RAREFACT_E2E_BASE_URL: baseUrl },
  });
  status = result.status ?? 1;
  if (status !== 0) console.error(`[e2e] server log:\n${serverLog.slice(-4000)}`);
} catch (error) {
  console.error(`[e2e] ${error instanceof Error ? error.message : error}`);
}
stopServer();
process.exit(status);
