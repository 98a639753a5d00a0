import "../helpers/test-database";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb, getDatabaseKind, getDb } from "@/db/client";
import { acquirePgliteLock } from "@/db/pglite-lock";
import { demoMembers, demoPassword, demoStudy } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import { resetAuth } from "@/lib/server/auth";
import { callRoute, signInAs } from "../helpers/api";

const expectedTables = ["activity", "account", "comment", "invitation", "membership", "run", "scene", "scene_version", "session", "study", "team", "user", "verification"];

async function tableNames(): Promise<string[]> {
  const db = await getDb();
  const result = (await db.execute(sql`select table_name from information_schema.tables where table_schema = 'public' order by table_name`)) as unknown as {
    rows: { table_name: string }[];
  };
  return result.rows.map((row) => row.table_name);
}

async function demoStudyTitlesSeenByEngineer(): Promise<string[]> {
  const cookie = await signInAs(demoMembers[0]!.email, demoPassword);
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie });
  return ((await list.json()) as { studies: { title: string }[] }).studies.map((s) => s.title);
}

async function reopen(env: Record<string, string | undefined>): Promise<void> {
  await closeDb();
  resetAuth();
  for (const [key, value] of Object.entries(env)) {
    if (value === undefined) delete process.env[key];
    else process.env[key] = value;
  }
}

afterAll(async () => {
  await closeDb();
});

describe("the embedded database (PGlite on disk)", () => {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), "rarefact-pglite-"));

  it("applies the committed migrations to a new folder and seeds the demo", async () => {
    await reopen({ RAREFACT_DATA_DIR: folder, DATABASE_URL: undefined });
    await prepareDatabase({ seed: true });
    expect(await getDatabaseKind()).toBe("pglite");
    expect(await tableNames()).toEqual(expect.arrayContaining(expectedTables));
    expect(await demoStudyTitlesSeenByEngineer()).toContain(demoStudy.title);
  });

  it("keeps its data across a restart and does not seed twice", async () => {
    await reopen({ RAREFACT_DATA_DIR: folder });
    await prepareDatabase({ seed: true });
    const titles = await demoStudyTitlesSeenByEngineer();
    expect(titles.filter((t) => t === demoStudy.title)).toHaveLength(1);
  });

  it("refuses a folder that another live process holds", () => {
    const lockedFolder = fs.mkdtempSync(path.join(os.tmpdir(), "rarefact-locked-"));
    fs.writeFileSync(path.join(lockedFolder, "pglite.lock"), String(process.ppid));
    expect(() => acquirePgliteLock(path.join(lockedFolder, "pglite"))).toThrow(/in use by process/);
  });
});

// The same schema and migrations on a PostgreSQL server. .ci/run starts a throwaway cluster on
// loopback and sets RAREFACT_TEST_POSTGRES_URL; in CI a missing server is a failure, not a skip.
const postgresUrl = process.env.RAREFACT_TEST_POSTGRES_URL;
describe("a PostgreSQL server (DATABASE_URL)", () => {
  if (!postgresUrl) {
    it.skipIf(process.env.CI !== "true")("needs RAREFACT_TEST_POSTGRES_URL (set by .ci/run)", () => {
      throw new Error("CI must provide RAREFACT_TEST_POSTGRES_URL: .ci/run starts a PostgreSQL cluster for this test");
    });
    return;
  }

  it("applies the same migrations, seeds the demo and serves the same routes", async () => {
    await reopen({ DATABASE_URL: postgresUrl });
    await prepareDatabase({ seed: true });
    expect(await getDatabaseKind()).toBe("postgres");
    expect(await tableNames()).toEqual(expect.arrayContaining(expectedTables));
    expect(await demoStudyTitlesSeenByEngineer()).toContain(demoStudy.title);
  });
});
