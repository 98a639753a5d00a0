// Publishing live events: NOTIFY on one channel, so that every app process (one on PGlite, any
// number on a PostgreSQL server) hears every change and tells its open pages.
import "server-only";
import { sql } from "drizzle-orm";
import { liveEventChannel, type LiveEvent } from "@/lib/live/live-event";
import { getDb } from "../client";

/**
 * Best effort: a page that misses an event still shows the change on its next fetch, so a failed
 * NOTIFY is logged and never fails the action that caused it.
 */
export async function publishLiveEvent(event: LiveEvent): Promise<void> {
  try {
    const db = await getDb();
    await db.execute(sql`select pg_notify(${liveEventChannel}, ${JSON.stringify(event)})`);
  } catch (error) {
    console.error("[live] could not publish an event:", error);
  }
}
