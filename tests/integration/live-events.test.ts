import "../helpers/test-database";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { recordActivity } from "@/db/queries/activity";
import { publishLiveEvent } from "@/db/queries/live-events";
import { demoMembers } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import type { LiveEvent } from "@/lib/live/live-event";
import { resetAuth } from "@/lib/server/auth";
import { resetLiveHub, subscribeToLiveEvents } from "@/lib/server/live-hub";
import { getDb } from "@/db/client";
import { team, user } from "@/db/schema";
import { eq } from "drizzle-orm";

// Live updates travel through PostgreSQL LISTEN/NOTIFY: the same code on PGlite (in-process) and
// on a server (a connection of its own per process).

async function nextEvent(matching: (event: LiveEvent) => boolean): Promise<{ event: Promise<LiveEvent>; stop: () => void }> {
  let resolve: (event: LiveEvent) => void = () => undefined;
  const event = new Promise<LiveEvent>((done) => (resolve = done));
  const stop = await subscribeToLiveEvents((received) => {
    if (matching(received)) resolve(received);
  });
  return { event, stop };
}

async function demoTeamAndActor(): Promise<{ teamId: string; actorId: string }> {
  const db = await getDb();
  const [owner] = await db.select().from(user).where(eq(user.email, demoMembers[0]!.email));
  const [firstTeam] = await db.select().from(team);
  return { teamId: firstTeam!.id, actorId: owner!.id };
}

async function checkDelivery(): Promise<void> {
  await prepareDatabase({ seed: true });
  const { teamId, actorId } = await demoTeamAndActor();

  const presence = await nextEvent((event) => event.kind === "presence" && event.studyId === "study-x");
  await publishLiveEvent({ kind: "presence", teamId, studyId: "study-x", at: new Date().toISOString() });
  expect(await presence.event).toMatchObject({ kind: "presence", teamId, studyId: "study-x" });
  presence.stop();

  const activity = await nextEvent((event) => event.kind === "activity" && event.action === "comment.added");
  await recordActivity({ teamId, studyId: null, actorId, action: "comment.added", subjectType: "comment", subjectId: "c-1", runId: "run-1" });
  expect(await activity.event).toMatchObject({ kind: "activity", teamId, action: "comment.added", subjectId: "c-1", runId: "run-1", actorId });
  activity.stop();
}

async function reopen(env: Record<string, string | undefined>): Promise<void> {
  await resetLiveHub();
  await closeDb();
  resetAuth();
  for (const [key, value] of Object.entries(env)) {
    if (value === undefined) delete process.env[key];
    else process.env[key] = value;
  }
}

afterAll(async () => {
  await resetLiveHub();
  await closeDb();
});

describe("live events", () => {
  it("reach subscribers on the embedded database (PGlite), activities included", { timeout: 60_000 }, async () => {
    await reopen({ DATABASE_URL: undefined });
    await checkDelivery();
  });

  const postgresUrl = process.env.RAREFACT_TEST_POSTGRES_URL;
  it.skipIf(!postgresUrl)("reach subscribers on a PostgreSQL server, over a LISTEN connection of their own", { timeout: 60_000 }, async () => {
    // A database of its own on the throwaway cluster, so that no other test file's migrations race this one's.
    const { Client } = await import("pg");
    const admin = new Client({ connectionString: postgresUrl });
    await admin.connect();
    const name = `rarefact_live_${process.pid}`;
    await admin.query(`drop database if exists ${name}`);
    await admin.query(`create database ${name}`);
    await admin.end();
    const url = new URL(postgresUrl!);
    url.pathname = `/${name}`;
    await reopen({ DATABASE_URL: url.toString() });
    await checkDelivery();
    await reopen({ DATABASE_URL: undefined });
  });
});
