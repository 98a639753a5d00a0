// Reads the import fixtures in tests/fixtures/import.
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

const folder = fileURLToPath(new URL("../fixtures/import/", import.meta.url));

export function fixtureText(name: string): string {
  return readFileSync(folder + name, "utf8");
}

export function fixtureBytes(name: string): Uint8Array {
  return new Uint8Array(readFileSync(folder + name));
}
