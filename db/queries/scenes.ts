import "server-only";
import type { SceneListItem } from "@/lib/http/api-types";
import { asc, eq } from "drizzle-orm";
import type { Scene as SceneData } from "@/lib/fdtd/scene";
import { getDb } from "../client";
import { scene, sceneVersion, user } from "../schema";
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

/** Stores a scene that has already been through parseScene, with its first version in the history. */
export async function createScene({
  teamId,
  studyId,
  authorId,
  name,
  description,
  isReference,
  data,
  position,
}: {
  teamId: string;
  studyId: string;
  authorId: string;
  name: string;
  description: string;
  isReference: boolean;
  data: SceneData;
  position: number;
}): Promise<string> {
  return withDatabaseErrors("create the scene", async () => {
    const db = await getDb();
    const id = newId();
    await db.transaction(async (tx) => {
      await tx.insert(scene).values({ id, studyId, name, description, isReference, data, version: 1, position, createdBy: authorId, updatedBy: authorId });
      await tx.insert(sceneVersion).values({ id: newId(), sceneId: id, version: 1, data, authorId, note: "Created" });
    });
    await recordActivity({ teamId, studyId, actorId: authorId, action: "scene.created", subjectType: "scene", subjectId: id, detail: { name } });
    return id;
  });
}
