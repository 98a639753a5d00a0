import "server-only";
import type { StudyListItem, StudyRecord } from "@/lib/http/api-types";
import { and, desc, eq, sql } from "drizzle-orm";
import type { StudyInput } from "@/lib/validation/study";
import { getDb } from "../client";
import { run, scene, study, user } from "../schema";
import { recordActivity } from "./activity";
import { newId, withDatabaseErrors } from "./wrap";

export async function listStudiesByTeamId({ teamId }: { teamId: string }): Promise<StudyListItem[]> {
  return withDatabaseErrors("list the studies", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        id: study.id,
        title: study.title,
        description: study.description,
        siteReference: study.siteReference,
        createdByName: user.name,
        createdAt: study.createdAt,
        updatedAt: study.updatedAt,
        sceneCount: sql<number>`(select count(*) from ${scene} where ${scene.studyId} = ${study.id})`.mapWith(Number),
        runCount: sql<number>`(select count(*) from ${run} where ${run.studyId} = ${study.id})`.mapWith(Number),
      })
      .from(study)
      .leftJoin(user, eq(user.id, study.createdBy))
      .where(eq(study.teamId, teamId))
      .orderBy(desc(study.updatedAt));
    return rows.map((row) => ({ ...row, createdAt: row.createdAt.toISOString(), updatedAt: row.updatedAt.toISOString() }));
  });
}

function toStudyRecord(row: typeof study.$inferSelect): StudyRecord {
  return {
    id: row.id,
    teamId: row.teamId,
    title: row.title,
    description: row.description,
    siteReference: row.siteReference,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export async function getStudyById({ id }: { id: string }): Promise<StudyRecord | null> {
  return withDatabaseErrors("read the study", async () => {
    const db = await getDb();
    const rows = await db.select().from(study).where(eq(study.id, id)).limit(1);
    const row = rows[0];
    return row ? toStudyRecord(row) : null;
  });
}

export async function createStudy({
  teamId,
  createdBy,
  input,
}: {
  teamId: string;
  createdBy: string;
  input: StudyInput;
}): Promise<StudyRecord> {
  return withDatabaseErrors("create the study", async () => {
    const db = await getDb();
    const id = newId();
    const [row] = await db
      .insert(study)
      .values({ id, teamId, title: input.title, description: input.description, siteReference: input.siteReference, createdBy })
      .returning();
    if (!row) throw new Error("insert returned no row");
    await recordActivity({ teamId, studyId: id, actorId: createdBy, action: "study.created", subjectType: "study", subjectId: id, detail: { title: input.title } });
    return toStudyRecord(row);
  });
}

export async function countStudiesByTeamIdAndTitle({ teamId, title }: { teamId: string; title: string }): Promise<number> {
  return withDatabaseErrors("read the studies", async () => {
    const db = await getDb();
    const rows = await db
      .select({ count: sql<number>`count(*)`.mapWith(Number) })
      .from(study)
      .where(and(eq(study.teamId, teamId), eq(study.title, title)));
    return rows[0]?.count ?? 0;
  });
}
