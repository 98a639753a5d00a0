import "server-only";
import { and, asc, desc, eq } from "drizzle-orm";
import { AppError } from "@/lib/http/app-error";
import type { SceneListItem, SceneRecord, SceneVersionItem } from "@/lib/http/api-types";
import type { Scene as SceneData } from "@/lib/fdtd/scene";
import { getDb } from "../client";
import { scene, sceneVersion, study, user } from "../schema";
import { recordActivity } from "./activity";
import { newId, withDatabaseErrors } from "./wrap";

export async function listScenesByStudyId({ studyId }: { studyId: string }): Promise<SceneListItem[]> {
  return withDatabaseErrors("list the scenes", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        id: scene.id,
        name: scene.name,
        description: scene.description,
        isReference: scene.isReference,
        version: scene.version,
        data: scene.data,
        updatedByName: user.name,
        updatedAt: scene.updatedAt,
      })
      .from(scene)
      .leftJoin(user, eq(user.id, scene.updatedBy))
      .where(eq(scene.studyId, studyId))
      .orderBy(asc(scene.position), asc(scene.createdAt));
    return rows.map((row) => ({ ...row, updatedAt: row.updatedAt.toISOString() }));
  });
}

/** Where a fork came from: the origin scene, its version that was copied, and who wrote that version. */
export interface ForkOrigin {
  sceneId: string;
  version: number;
  authorId: string | null;
}

/**
 * Stores a scene that has already been through parseScene, with its first version in the history.
 * A fork (`forkedFrom`) records its origin; its caller records "scene.forked" instead of "scene.created".
 */
export async function createScene({
  teamId,
  studyId,
  authorId,
  name,
  description,
  isReference,
  data,
  position,
  forkedFrom,
  note = "Created",
}: {
  teamId: string;
  studyId: string;
  authorId: string;
  name: string;
  description: string;
  isReference: boolean;
  data: SceneData;
  position: number;
  forkedFrom?: ForkOrigin;
  note?: string;
}): Promise<string> {
  return withDatabaseErrors("create the scene", async () => {
    const db = await getDb();
    const id = newId();
    const origin = forkedFrom ? { forkedFromSceneId: forkedFrom.sceneId, forkedFromVersion: forkedFrom.version, forkedFromAuthorId: forkedFrom.authorId } : {};
    await db.transaction(async (tx) => {
      await tx.insert(scene).values({ id, studyId, name, description, isReference, data, version: 1, position, createdBy: authorId, updatedBy: authorId, ...origin });
      await tx.insert(sceneVersion).values({ id: newId(), sceneId: id, version: 1, data, authorId, note });
    });
    if (!forkedFrom) await recordActivity({ teamId, studyId, actorId: authorId, action: "scene.created", subjectType: "scene", subjectId: id, detail: { name } });
    return id;
  });
}

export async function getSceneById({ id }: { id: string }): Promise<SceneRecord | null> {
  return withDatabaseErrors("read the scene", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        id: scene.id,
        studyId: scene.studyId,
        teamId: study.teamId,
        name: scene.name,
        description: scene.description,
        isReference: scene.isReference,
        version: scene.version,
        data: scene.data,
        forkedFromSceneId: scene.forkedFromSceneId,
        forkedFromVersion: scene.forkedFromVersion,
        updatedByName: user.name,
        createdAt: scene.createdAt,
        updatedAt: scene.updatedAt,
      })
      .from(scene)
      .innerJoin(study, eq(study.id, scene.studyId))
      .leftJoin(user, eq(user.id, scene.updatedBy))
      .where(eq(scene.id, id))
      .limit(1);
    const row = rows[0];
    return row ? { ...row, createdAt: row.createdAt.toISOString(), updatedAt: row.updatedAt.toISOString() } : null;
  });
}

/**
 * Saves a new version of a scene if, and only if, the caller edited the current one. A save based
 * on an older version answers 409 and changes nothing, so concurrent edits are never lost silently.
 */
export async function saveSceneVersion({
  teamId,
  sceneId,
  authorId,
  baseVersion,
  name,
  description,
  data,
  note,
}: {
  teamId: string;
  sceneId: string;
  authorId: string;
  baseVersion: number;
  name: string;
  description: string;
  data: SceneData;
  note: string;
}): Promise<{ version: number }> {
  const saved = await withDatabaseErrors("save the scene", async () => {
    const db = await getDb();
    return db.transaction(async (tx) => {
      const next = baseVersion + 1;
      const updated = await tx
        .update(scene)
        .set({ name, description, data, version: next, updatedBy: authorId, updatedAt: new Date() })
        .where(and(eq(scene.id, sceneId), eq(scene.version, baseVersion)))
        .returning({ studyId: scene.studyId });
      const row = updated[0];
      if (!row) return null;
      await tx.insert(sceneVersion).values({ id: newId(), sceneId, version: next, data, authorId, note });
      return { version: next, studyId: row.studyId };
    });
  });
  if (!saved) throw await staleVersionError({ sceneId, baseVersion });
  await recordActivity({ teamId, studyId: saved.studyId, actorId: authorId, action: "scene.saved", subjectType: "scene", subjectId: sceneId, detail: { name, version: saved.version, note } });
  return { version: saved.version };
}

/** The 409 for a change based on a version that is no longer the latest, naming who saved the newer one. */
async function staleVersionError({ sceneId, baseVersion }: { sceneId: string; baseVersion: number }): Promise<AppError> {
  const current = await getSceneById({ id: sceneId });
  return new AppError(
    "conflict:scene",
    current
      ? `Someone saved version ${current.version} of this scene${current.updatedByName ? ` (${current.updatedByName})` : ""} after you opened version ${baseVersion}. Reload it, or keep your copy as a new variant.`
      : "The scene no longer exists.",
  );
}

/**
 * Makes an older version the latest again by saving its data as a new version (the history only
 * grows, so the restore itself can be undone). The same 409 rule as a save applies: the caller must
 * have seen the current version. `prepareData` turns the stored JSON into a current, valid scene
 * (stored versions may predate a schema change); it may throw to refuse the restore.
 */
export async function restoreSceneVersion({
  teamId,
  sceneId,
  authorId,
  version,
  baseVersion,
  prepareData,
}: {
  teamId: string;
  sceneId: string;
  authorId: string;
  version: number;
  baseVersion: number;
  prepareData: (stored: unknown) => SceneData;
}): Promise<{ version: number }> {
  const stored = await getSceneVersionData({ sceneId, version });
  if (stored === null) throw new AppError("not_found:version", `This scene has no version ${version}.`);
  const data = prepareData(stored);
  const note = `Restored version ${version}`;
  const saved = await withDatabaseErrors("restore the scene version", async () => {
    const db = await getDb();
    return db.transaction(async (tx) => {
      const next = baseVersion + 1;
      const updated = await tx
        .update(scene)
        .set({ data, version: next, updatedBy: authorId, updatedAt: new Date() })
        .where(and(eq(scene.id, sceneId), eq(scene.version, baseVersion)))
        .returning({ studyId: scene.studyId, name: scene.name });
      const row = updated[0];
      if (!row) return null;
      await tx.insert(sceneVersion).values({ id: newId(), sceneId, version: next, data, authorId, note });
      return { version: next, studyId: row.studyId, name: row.name };
    });
  });
  if (!saved) throw await staleVersionError({ sceneId, baseVersion });
  await recordActivity({
    teamId,
    studyId: saved.studyId,
    actorId: authorId,
    action: "scene.saved",
    subjectType: "scene",
    subjectId: sceneId,
    detail: { name: saved.name, version: saved.version, note, restoredVersion: version },
  });
  return { version: saved.version };
}

export async function listSceneVersionsBySceneId({ sceneId }: { sceneId: string }): Promise<SceneVersionItem[]> {
  return withDatabaseErrors("read the scene's history", async () => {
    const db = await getDb();
    const rows = await db
      .select({ version: sceneVersion.version, authorName: user.name, note: sceneVersion.note, createdAt: sceneVersion.createdAt })
      .from(sceneVersion)
      .leftJoin(user, eq(user.id, sceneVersion.authorId))
      .where(eq(sceneVersion.sceneId, sceneId))
      .orderBy(desc(sceneVersion.version));
    return rows.map((row) => ({ ...row, createdAt: row.createdAt.toISOString() }));
  });
}

export async function getSceneVersionData({ sceneId, version }: { sceneId: string; version: number }): Promise<unknown | null> {
  return withDatabaseErrors("read the scene version", async () => {
    const db = await getDb();
    const rows = await db
      .select({ data: sceneVersion.data })
      .from(sceneVersion)
      .where(and(eq(sceneVersion.sceneId, sceneId), eq(sceneVersion.version, version)))
      .limit(1);
    return rows[0]?.data ?? null;
  });
}

export async function countScenesByStudyId({ studyId }: { studyId: string }): Promise<number> {
  return (await listScenesByStudyId({ studyId })).length;
}
