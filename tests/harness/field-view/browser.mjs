// What the field-view harness scripts share: the Vite server for the harness page and Debian's chromium
// with a software WebGL context (SwiftShader), the only kind this GPU-less machine has.
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

import { chromium } from "playwright-core";
import { createServer } from "vite";

const here = path.dirname(fileURLToPath(import.meta.url));

export const softwareWebGlFlags = [
  "--use-angle=swiftshader",
  "--enable-unsafe-swiftshader",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

/** Starts the harness page on a free loopback port. */
export async function startHarnessServer() {
  const port = await freePort();
  // No file watching or hot reload: other people edit lib/ while this runs, and a reload mid-check loses the page.
  const server = await createServer({ configFile: path.join(here, "vite.config.ts"), server: { port, hmr: false, watch: null } });
  await server.listen();
  return { server, base: `http://127.0.0.1:${port}` };
}

/** Opens chromium in a throwaway profile (playwright refuses a --user-data-dir among the arguments). */
export async function launch(args, deviceScaleFactor = 1) {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), "rarefact-field-view-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: "/usr/bin/chromium",
    args,
    viewport: { width: 1360, height: 900 },
    deviceScaleFactor,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.on("pageerror", (error) => console.log(`[page error] ${error.message}`));
  page.on("console", (message) => {
    if (message.type() === "error" || message.type() === "warning") console.log(`[console ${message.type()}] ${message.text()}`);
  });
  return {
    page,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}
