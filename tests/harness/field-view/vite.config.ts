// Vite config of the field-view visual harness (tests/harness/field-view): a small page that renders
// FieldView with an analytic field. Run from the repository root: `npx vite --config tests/harness/field-view/vite.config.ts`.
// JSX uses the automatic runtime set through the `esbuild` option (Vite 8 carries it over to its Oxc
// transformer), so no React plugin is needed; "@" is the repository root as in the app.
import { fileURLToPath } from "node:url";
import { defineConfig } from "vite";

const harnessRoot = fileURLToPath(new URL("./", import.meta.url));
const repositoryRoot = fileURLToPath(new URL("../../../", import.meta.url));

export default defineConfig({
  root: harnessRoot,
  // Keep Vite's dependency cache out of the shared node_modules another engineer installs into.
  cacheDir: "/tmp/rarefact-field-view-harness-vite",
  resolve: { alias: { "@": repositoryRoot } },
  esbuild: { jsx: "automatic", jsxImportSource: "react" },
  // Bundled up front so the first page load does not trigger a reload when Vite discovers them.
  optimizeDeps: { include: ["react", "react/jsx-runtime", "react/jsx-dev-runtime", "react-dom/client", "regl", "zod"] },
  server: { fs: { allow: [repositoryRoot] }, strictPort: true, host: "127.0.0.1" },
  logLevel: "warn",
});
