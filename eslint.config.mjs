import nextCoreWebVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

// Folder boundaries: data flows one way (scene -> lib/fdtd -> workers -> components/app).
// Putting the bans here means nobody has to remember them.
const outsideLib = ["node:*", "@/app/*", "@/components/*", "@/db/*", "@/workers/*", "react", "react-dom", "next", "next/*", "drizzle-orm", "drizzle-orm/*", "pg", "@electric-sql/pglite"];

const config = [
  ...nextCoreWebVitals,
  ...nextTypescript,
  {
    ignores: [".next/**", "node_modules/**", ".data/**", ".test-data/**", "next-env.d.ts", "db/migrations/**", "lib/fdtd/wasm/build/**", "lib/fdtd/wasm/assembly/**"],
  },
  {
    // lib/server (auth, access gate) and lib/client (browser hooks) are the app's own layers;
    // everything else under lib/ is pure TypeScript that runs anywhere.
    files: ["lib/fdtd/**/*.ts", "lib/verification/**/*.ts", "lib/analysis/**/*.ts", "lib/scene-templates/**/*.ts", "lib/access/**/*.ts", "lib/validation/**/*.ts", "lib/http/**/*.ts", "lib/scene-import/**/*.ts", "lib/run-record/**/*.ts", "lib/scene-variants/**/*.ts", "lib/live/**/*.ts", "lib/review/**/*.ts", "lib/mail-templates/**/*.ts", "lib/collaboration/**/*.ts", "lib/sweeps/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: outsideLib, message: "lib/ is pure TypeScript: no DOM, React, Next.js or database imports." }] }],
    },
  },
  {
    files: ["workers/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["@/app/*", "@/components/*", "@/db/*", "react", "next", "next/*"], message: "workers/ are thin adapters over lib/ only." }] }],
    },
  },
  {
    files: ["app/**/*.ts", "app/**/*.tsx", "components/**/*.ts", "components/**/*.tsx"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["drizzle-orm", "drizzle-orm/*", "pg", "@electric-sql/pglite"], message: "No SQL under app/ or components/: call a named query in db/queries." }] }],
    },
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
];

export default config;
