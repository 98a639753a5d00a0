import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// Browser end-to-end tests: playwright-core drives Debian's chromium against a production build
// started by tests/e2e/run-e2e.mjs (which sets RAREFACT_E2E_BASE_URL).
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    include: ["tests/e2e/**/*.e2e.ts"],
    environment: "node",
    testTimeout: 120_000,
    // Above signedInBrowser's own waits, so that its message (not a bare timeout) reports a failed sign-in.
    hookTimeout: 360_000,
    fileParallelism: false,
  },
});
