// Driver errors never reach the client raw: they are logged here and become AppErrors.
import "server-only";
import { AppError } from "@/lib/http/app-error";

export async function withDatabaseErrors<T>(what: string, work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof AppError) throw error;
    console.error(`[db] ${what} failed:`, error);
    throw new AppError("internal:database", `The database could not ${what}. Try again; if it persists, tell your administrator.`);
  }
}

export function newId(): string {
  return crypto.randomUUID();
}
