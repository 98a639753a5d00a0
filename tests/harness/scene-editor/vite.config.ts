// A small Vite app that mounts the scene editor on a demo scene, for looking at it and for driving it
// in a headless browser (shoot.mjs). Not part of the Next.js build.
import { fileURLToPath } from "node:url";

import tailwindcss from "@tailwindcss/postcss";
import { defineConfig } from "vite";

const here = fileURLToPath(new URL(".", import.meta.url));
const repository = fileURLToPath(new URL("../../../", import.meta.url));

export default defineConfig({
  root: here,
  // The app's own fonts (public/fonts), served as the Next.js app serves them.
  publicDir: `${repository}public`,
  resolve: {
    alias: [{ find: /^@\//, replacement: repository }],
  },
  // The React 17+ JSX transform, so components need no `import React`; no React plugin is installed.
  oxc: { jsx: { runtime: "automatic" } },
  // Tailwind scans only this folder and the editor's sources (harness.css says which), so edits elsewhere
  // in the repository never restyle the page in the middle of a session.
  css: { postcss: { plugins: [tailwindcss({ base: here })] } },
  server: {
    host: "127.0.0.1",
    fs: { allow: [repository] },
    // The app is cross-origin isolated; the harness matches it so workers behave the same.
    headers: { "Cross-Origin-Opener-Policy": "same-origin", "Cross-Origin-Embedder-Policy": "require-corp" },
  },
  worker: { format: "es" },
  // Pre-bundle everything up front: a dependency discovered late (Monaco, loaded when the code view
  // first opens) would otherwise make Vite reload the page in the middle of a session.
  optimizeDeps: {
    entries: ["./main.tsx", "../../../components/scene-editor/**/*.ts", "../../../components/scene-editor/**/*.tsx"],
    include: ["react", "react-dom", "react-dom/client", "react/jsx-runtime", "react/jsx-dev-runtime", "zod", "@monaco-editor/react", "monaco-editor"],
  },
  logLevel: "warn",
});
