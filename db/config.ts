// Where the database lives. One place reads the environment so that tests and scripts can
// point the app at a temporary store without touching the live one.
import path from "node:path";

export interface DatabaseLocation {
  kind: "pglite" | "postgres";
  /** PGlite: a folder, or "memory://" for a throwaway in-memory database. */
  pgliteDir: string;
  /** PostgreSQL server: the connection string from DATABASE_URL. */
  postgresUrl: string | undefined;
}

export function databaseLocation(env: NodeJS.ProcessEnv = process.env): DatabaseLocation {
  const postgresUrl = env.DATABASE_URL?.trim() || undefined;
  const dataDir = env.RAREFACT_DATA_DIR?.trim() || path.join(/*turbopackIgnore: true*/ process.cwd(), ".data");
  const pgliteDir = dataDir.startsWith("memory://") ? "memory://" : path.join(path.resolve(/*turbopackIgnore: true*/ dataDir), "pglite");
  return { kind: postgresUrl ? "postgres" : "pglite", pgliteDir, postgresUrl };
}

/** The folder for the app's own files beside the database (auth secret, lock). */
export function dataDirectory(env: NodeJS.ProcessEnv = process.env): string {
  const dataDir = env.RAREFACT_DATA_DIR?.trim() || path.join(/*turbopackIgnore: true*/ process.cwd(), ".data");
  return dataDir.startsWith("memory://") ? "memory://" : path.resolve(/*turbopackIgnore: true*/ dataDir);
}

export const migrationsFolder = path.join(/*turbopackIgnore: true*/ process.cwd(), "db", "migrations");
