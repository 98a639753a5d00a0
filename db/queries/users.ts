import "server-only";
import { eq } from "drizzle-orm";
import { getDb } from "../client";
import { user } from "../schema";
import { withDatabaseErrors } from "./wrap";

export async function getUserIdByEmail({ email }: { email: string }): Promise<string | null> {
  return withDatabaseErrors("read the user", async () => {
    const db = await getDb();
    const rows = await db.select({ id: user.id }).from(user).where(eq(user.email, email.toLowerCase())).limit(1);
    return rows[0]?.id ?? null;
  });
}
