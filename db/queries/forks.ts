// Forks: a copy of one version of a scene, in the same study or another the caller may edit, that
// remembers where it came from; and the lineage of a scene (its origins up, its forks down), shown
// only as far as the caller's teams reach.
import "server-only";
import { and, asc, desc, eq, gt, inArray, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { isTeamRole, roleAllows } from "@/lib/access/roles";
import type { Scene as SceneData } from "@/lib/fdtd/scene";
import type { SceneRecord, StudyRecord } from "@/lib/http/api-types";
import { AppError } from "@/lib/http/app-error";
import type { ForkTarget, LineageFork, LineageOrigin, LineageResponse, LineageRun, LineageScene } from "@/lib/http/fork-types";
import { getDb } from "../client";
import { membership, run, scene, sceneVersion, study, team, user } from "../schema";
import { recordActivity } from "./activity";
import { createBlock, listBlocksByStudyId } from "./blocks";
import { countScenesByStudyId, createScene } from "./scenes";
import { withDatabaseErrors } from "./wrap";

/** How many levels of forks below a scene the lineage lists. */
export const lineageForkDepth = 3;
/** A guard against a broken chain (a chain cannot loop, but a bad row must not hang the page). */
const maxOriginSteps = 50;

async function getSceneVersionWithAuthor({ sceneId, version }: { sceneId: string; version: number }): Promise<{ data: unknown; authorId: string | null } | null> {
  return withDatabaseErrors("read the scene version", async () => {
    const db = await getDb();
    const rows = await db
      .select({ data: sceneVersion.data, authorId: sceneVersion.authorId })
      .from(sceneVersion)
      .where(and(eq(sceneVersion.sceneId, sceneId), eq(sceneVersion.version, version)))
      .limit(1);
    return rows[0] ?? null;
  });
}

/**
 * Copies one version of `origin` into `target` as a new scene at version 1, adds it to the target
 * study's notebook and records "scene.forked" in the target study and, when it differs, in the
 * origin's. `prepareData` turns the stored JSON into a current, valid scene (a stored version may
 * predate a schema change); it may throw to refuse the fork. Answers the new scene's id.
 */
export async function forkScene({
  origin,
  target,
  authorId,
  name,
  fromVersion,
  prepareData,
}: {
  origin: SceneRecord;
  target: StudyRecord;
  authorId: string;
  name: string;
  fromVersion: number;
  prepareData: (stored: unknown) => SceneData;
}): Promise<string> {
  const stored = await getSceneVersionWithAuthor({ sceneId: origin.id, version: fromVersion });
  if (!stored) throw new AppError("not_found:version", `fromVersion: this scene has no version ${fromVersion}.`, [{ path: "fromVersion", message: `No version ${fromVersion}.` }]);
  const data: SceneData = { ...prepareData(stored.data), name };
  // A variant in the same study goes right after its origin in the notebook; elsewhere, at the end.
  const originBlock = target.id === origin.studyId ? (await listBlocksByStudyId({ studyId: target.id })).find((block) => block.kind === "scene" && (block.content as { sceneId?: string }).sceneId === origin.id) : undefined;
  const forkId = await createScene({
    teamId: target.teamId,
    studyId: target.id,
    authorId,
    name,
    description: origin.description,
    isReference: false,
    data,
    position: await countScenesByStudyId({ studyId: target.id }),
    forkedFrom: { sceneId: origin.id, version: fromVersion, authorId: stored.authorId },
    note: `Forked from "${origin.name}" version ${fromVersion}`,
  });
  await createBlock({ studyId: target.id, authorId, kind: "scene", content: { sceneId: forkId }, afterBlockId: originBlock?.id ?? null });

  const detail = { originSceneId: origin.id, originVersion: fromVersion, originName: origin.name, forkName: name, forkSceneId: forkId, targetStudyId: target.id };
  await recordActivity({ teamId: target.teamId, studyId: target.id, actorId: authorId, action: "scene.forked", subjectType: "scene", subjectId: forkId, detail });
  if (target.id !== origin.studyId) {
    // The origin's team learns of a fork into another team, but not its name or where it went:
    // what lies in a team is seen only by its members.
    const sameTeam = target.teamId === origin.teamId;
    await recordActivity({
      teamId: origin.teamId,
      studyId: origin.studyId,
      actorId: authorId,
      action: "scene.forked",
      subjectType: "scene",
      subjectId: origin.id,
      detail: sameTeam ? detail : { ...detail, forkName: null, forkSceneId: null, targetStudyId: null, intoOtherTeam: true },
    });
  }
  return forkId;
}

/** Studies, over all the user's teams, where their role allows editing scenes: where a fork may go. */
export async function listForkTargetsByUserId({ userId }: { userId: string }): Promise<ForkTarget[]> {
  return withDatabaseErrors("list where a fork may go", async () => {
    const db = await getDb();
    const rows = await db
      .select({ studyId: study.id, studyTitle: study.title, teamId: team.id, teamName: team.name, role: membership.role })
      .from(membership)
      .innerJoin(team, eq(team.id, membership.teamId))
      .innerJoin(study, eq(study.teamId, membership.teamId))
      .where(eq(membership.userId, userId))
      .orderBy(asc(team.name), asc(study.title));
    return rows.filter((row) => isTeamRole(row.role) && roleAllows(row.role, "scene:edit")).map(({ role: _role, ...target }) => target);
  });
}

/** What the lineage needs of one scene, before the visibility rule is applied. */
interface LineageRow {
  id: string;
  name: string;
  version: number;
  studyId: string;
  studyTitle: string;
  teamId: string;
  teamName: string;
  forkedFromSceneId: string | null;
  forkedFromVersion: number | null;
  forkedFromAuthorName: string | null;
  createdByName: string | null;
  createdAt: Date;
}

async function selectLineageRows(where: SQL): Promise<LineageRow[]> {
  const db = await getDb();
  const creator = alias(user, "creator");
  const originAuthor = alias(user, "origin_author");
  return db
    .select({
      id: scene.id,
      name: scene.name,
      version: scene.version,
      studyId: scene.studyId,
      studyTitle: study.title,
      teamId: study.teamId,
      teamName: team.name,
      forkedFromSceneId: scene.forkedFromSceneId,
      forkedFromVersion: scene.forkedFromVersion,
      forkedFromAuthorName: originAuthor.name,
      createdByName: creator.name,
      createdAt: scene.createdAt,
    })
    .from(scene)
    .innerJoin(study, eq(study.id, scene.studyId))
    .innerJoin(team, eq(team.id, study.teamId))
    .leftJoin(creator, eq(creator.id, scene.createdBy))
    .leftJoin(originAuthor, eq(originAuthor.id, scene.forkedFromAuthorId))
    .where(where)
    .orderBy(asc(scene.createdAt));
}

/** The latest completed run (with a stored result) of each scene that has one. */
async function latestRunsBySceneIds(sceneIds: string[]): Promise<Map<string, LineageRun>> {
  const latest = new Map<string, LineageRun>();
  if (sceneIds.length === 0) return latest;
  const db = await getDb();
  const rows = await db
    .select({ id: run.id, sceneId: run.sceneId, sceneVersion: run.sceneVersion, createdAt: run.createdAt })
    .from(run)
    .where(and(inArray(run.sceneId, sceneIds), eq(run.status, "completed"), gt(run.resultBytes, 0)))
    .orderBy(desc(run.createdAt));
  for (const row of rows) {
    if (row.sceneId && !latest.has(row.sceneId)) latest.set(row.sceneId, { id: row.id, sceneVersion: row.sceneVersion, createdAt: row.createdAt.toISOString() });
  }
  return latest;
}

/**
 * A scene's lineage as `teamIds` (the caller's teams) may see it: origins up to the first scene
 * that was not a fork, and forks down `lineageForkDepth` levels. Scenes of other teams appear only
 * as "in another team", without ids, names or people; the chain still continues through them.
 */
export async function getSceneLineage({ sceneId, teamIds }: { sceneId: string; teamIds: ReadonlySet<string> }): Promise<LineageResponse> {
  return withDatabaseErrors("read the scene's lineage", async () => {
    const self = (await selectLineageRows(eq(scene.id, sceneId)))[0];
    if (!self) throw new AppError("not_found:scene", "No such scene.");
    const opens = (row: LineageRow) => teamIds.has(row.teamId);

    const originRows: { row: LineageRow | null; child: LineageRow }[] = [];
    let child = self;
    while (child.forkedFromSceneId && originRows.length < maxOriginSteps) {
      const origin = (await selectLineageRows(eq(scene.id, child.forkedFromSceneId)))[0] ?? null;
      originRows.push({ row: origin, child });
      if (!origin) break;
      child = origin;
    }

    const levels: LineageRow[][] = [];
    let parents = [self.id];
    for (let level = 0; level < lineageForkDepth && parents.length > 0; level++) {
      const children = await selectLineageRows(inArray(scene.forkedFromSceneId, parents));
      levels.push(children);
      parents = children.map((row) => row.id);
    }
    const deeper = parents.length > 0 ? await selectLineageRows(inArray(scene.forkedFromSceneId, parents)) : [];
    const hasDeeper = new Set(deeper.map((row) => row.forkedFromSceneId));

    const openIds = [self, ...originRows.flatMap((o) => (o.row ? [o.row] : [])), ...levels.flat()].filter(opens).map((row) => row.id);
    const runs = await latestRunsBySceneIds(openIds);
    const describe = (row: LineageRow): LineageScene =>
      opens(row)
        ? { access: "open", sceneId: row.id, name: row.name, version: row.version, studyId: row.studyId, studyTitle: row.studyTitle, teamName: row.teamName, latestRun: runs.get(row.id) ?? null }
        : { access: "other-team" };

    const origins: LineageOrigin[] = originRows.map(({ row, child: below }) => ({
      scene: row ? describe(row) : { access: "deleted" },
      forkedVersion: below.forkedFromVersion,
      // The version's author belongs to the origin's team: named only where the origin may be opened
      // (or, for a deleted origin, where the fork that recorded the name may be).
      versionAuthorName: (row ? opens(row) : opens(below)) ? below.forkedFromAuthorName : null,
    }));

    const forksOf = (parentId: string, level: number): LineageFork[] =>
      (levels[level] ?? [])
        .filter((row) => row.forkedFromSceneId === parentId)
        .map((row) => ({
          scene: describe(row),
          forkedVersion: row.forkedFromVersion,
          forkedByName: opens(row) ? row.createdByName : null,
          forkedAt: row.createdAt.toISOString(),
          forks: forksOf(row.id, level + 1),
          moreBelow: level + 1 >= lineageForkDepth && hasDeeper.has(row.id),
        }));

    return {
      scene: { id: self.id, name: self.name, version: self.version, latestRun: runs.get(self.id) ?? null },
      origins,
      forks: forksOf(self.id, 0),
    };
  });
}
