// The signing secret for sessions. Production sets BETTER_AUTH_SECRET; a local install gets a
// random one, kept beside the embedded database so sessions survive a restart.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { dataDirectory } from "@/db/config";

export function authSecret(env: NodeJS.ProcessEnv = process.env): string {
  const fromEnv = env.BETTER_AUTH_SECRET?.trim();
  if (fromEnv) return fromEnv;
  const dir = dataDirectory(env);
  if (dir === "memory://") return crypto.randomBytes(32).toString("hex");
  const file = path.join(dir, "auth-secret");
  try {
    return fs.readFileSync(file, "utf8").trim();
  } catch {
    fs.mkdirSync(dir, { recursive: true });
    const secret = crypto.randomBytes(32).toString("hex");
    fs.writeFileSync(file, secret, { mode: 0o600 });
    return secret;
  }
}
