// The identity of a run's input: SHA-256 of the canonical JSON of the parsed scene and the run
// settings. Equal hashes mean the same simulation was asked for, whatever the key order or the
// defaults left out, so runs can be matched and repeated ones recognised.
import { sha256 } from "@noble/hashes/sha2.js";
import { bytesToHex, utf8ToBytes } from "@noble/hashes/utils.js";
import type { Scene } from "@/lib/fdtd/scene";
import { canonicalJson } from "./canonical-json";
import type { RunSettings } from "./settings";

/** Names what is hashed, so a future change of the hashed shape cannot collide with this one. */
const HASH_DOMAIN = "rarefact.run-input.v1";

/**
 * `scene` must have been through parseScene: defaults filled in, so that a scene that leaves a
 * default out and one that writes it hash alike. Returns 64 lower-case hex digits.
 */
export function computeRunInputHash({ scene, settings }: { scene: Scene; settings: RunSettings }): string {
  const text = canonicalJson({ domain: HASH_DOMAIN, scene, settings });
  return bytesToHex(sha256(utf8ToBytes(text)));
}

export const inputHashPattern = /^[0-9a-f]{64}$/;
