// A throwaway PostgreSQL cluster on loopback for the DATABASE_URL tests: created in a temp
// folder, started on a free port, removed afterwards. Needs Debian's postgresql package;
// as root it runs the server as the "postgres" system user (initdb refuses root).
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

export function findPostgresBin() {
  const root = "/usr/lib/postgresql";
  if (!fs.existsSync(root)) return null;
  const versions = fs
    .readdirSync(root)
    .filter((v) => fs.existsSync(path.join(root, v, "bin", "initdb")))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(root, versions[0], "bin") : null;
}

export function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

function asServerUser(command, args) {
  const isRoot = process.getuid?.() === 0;
  const [file, fullArgs] = isRoot ? ["runuser", ["-u", "postgres", "--", command, ...args]] : [command, args];
  const result = spawnSync(file, fullArgs, { encoding: "utf8" });
  if (result.status !== 0) throw new Error(`${command} failed: ${result.stderr || result.stdout}`);
  return result.stdout;
}

/** Starts a cluster; returns its URL and a stop function. */
export async function startPostgresCluster() {
  const bin = findPostgresBin();
  if (!bin) throw new Error("PostgreSQL is not installed (apt-get install -y postgresql)");
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "rarefact-pg-"));
  fs.chmodSync(dir, 0o777);
  if (process.getuid?.() === 0) execFileSync("chown", ["postgres:postgres", dir]);
  const dataDir = path.join(dir, "data");
  const port = await freePort();
  asServerUser(path.join(bin, "initdb"), ["-D", dataDir, "-U", "rarefact", "--auth=trust", "-E", "UTF8", "--no-sync"]);
  asServerUser(path.join(bin, "pg_ctl"), [
    "-D",
    dataDir,
    "-l",
    path.join(dir, "server.log"),
    "-w",
    "-o",
    `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off`,
    "start",
  ]);
  asServerUser(path.join(bin, "createdb"), ["-h", "127.0.0.1", "-p", String(port), "-U", "rarefact", "rarefact_test"]);
  const stop = () => {
    try {
      asServerUser(path.join(bin, "pg_ctl"), ["-D", dataDir, "-m", "immediate", "-w", "stop"]);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  };
  return { url: `postgres://rarefact@127.0.0.1:${port}/rarefact_test`, stop };
}
