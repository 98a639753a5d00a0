// Secrets handed out once: invitation links, read-only study links and API tokens. Each is 32
// random bytes (256 bits, so guessing one is hopeless and needs no rate limit) in base64url; the
// database keeps only its SHA-256 (hex), found by lookup and never compared in application code,
// so a copy of the database opens nothing.
import "server-only";
import { createHash, randomBytes } from "node:crypto";

/** 43 base64url characters. */
export function newSecret(): string {
  return randomBytes(32).toString("base64url");
}

/** The stored form of a secret. */
export function hashSecret(secret: string): string {
  return createHash("sha256").update(secret, "utf8").digest("hex");
}
