// Vite config of the analysis visual harness (tests/harness/analysis): a page that mounts RunAnalysis on
// runs of the demo scenes computed on the page by lib/fdtd, with the study's API answered in the page.
// Run from the repository root: `npx vite --config tests/harness/analysis/vite.config.ts`.
import { fileURLToPath } from "node:url";
import { defineConfig } from "vite";

const harnessRoot = fileURLToPath(new URL("./", import.meta.url));
const repositoryRoot = fileURLToPath(new URL("../../../", import.meta.url));

export default defineConfig({
  root: harnessRoot,
  // Keep Vite's dependency cache out of the shared node_modules.
  cacheDir: "/tmp/rarefact-analysis-harness-vite",
  resolve: { alias: { "@": repositoryRoot } },
  esbuild: { jsx: "automatic", jsxImportSource: "react" },
  optimizeDeps: { include: ["react", "react/jsx-runtime", "react/jsx-dev-runtime", "react-dom/client", "regl", "zod", "uplot", "@tanstack/react-query", "fft.js", "wavefile", "comlink"] },
  server: { fs: { allow: [repositoryRoot] }, strictPort: true, host: "127.0.0.1" },
  logLevel: "warn",
});
