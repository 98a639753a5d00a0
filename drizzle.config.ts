import { defineConfig } from "drizzle-kit";

// Migrations are generated from db/schema.ts and committed; the app applies them at start
// on PGlite (default) or on a PostgreSQL server (DATABASE_URL).
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./db/migrations",
});
