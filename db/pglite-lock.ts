// PGlite takes no lock of its own: two processes on one folder would both open it and one
// side's writes would be lost. A lock file with the owner's pid refuses the second process.
import fs from "node:fs";
import path from "node:path";

function processIsAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
}

export function acquirePgliteLock(dir: string): void {
  fs.mkdirSync(dir, { recursive: true });
  const lockPath = path.join(dir, "..", "pglite.lock");
  try {
    const holder = Number.parseInt(fs.readFileSync(lockPath, "utf8"), 10);
    if (Number.isFinite(holder) && holder !== process.pid && processIsAlive(holder)) {
      throw new Error(
        `The embedded database at ${dir} is in use by process ${holder}. Stop that process, or point this one at another folder with RAREFACT_DATA_DIR.`,
      );
    }
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== "ENOENT") throw error;
  }
  fs.writeFileSync(lockPath, String(process.pid));
  const release = () => {
    try {
      if (fs.readFileSync(lockPath, "utf8") === String(process.pid)) fs.unlinkSync(lockPath);
    } catch {
      // Already gone: nothing to release.
    }
  };
  process.once("exit", release);
}
