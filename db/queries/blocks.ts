import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { AppError } from "@/lib/http/app-error";
import type { BlockItem, BlockKind } from "@/lib/http/api-types";
import { getDb } from "../client";
import { run, scene, studyBlock, user } from "../schema";
import { newId, withDatabaseErrors } from "./wrap";

/** Positions leave gaps so that a block can be inserted between two without renumbering. */
const positionGap = 1024;

function toItem(row: {
  id: string;
  kind: BlockKind;
  position: number;
  content: unknown;
  collapsed: boolean;
  version: number;
  updatedByName: string | null;
  updatedAt: Date;
}): BlockItem {
  return { ...row, updatedAt: row.updatedAt.toISOString() };
}

/** The study's blocks in order, exactly as stored (none added): for read-only views such as shared links. */
export async function listStoredBlocksByStudyId({ studyId }: { studyId: string }): Promise<BlockItem[]> {
  return withDatabaseErrors("read the notebook", () => selectBlocks(studyId));
}

async function selectBlocks(studyId: string): Promise<BlockItem[]> {
  const db = await getDb();
  const rows = await db
    .select({
      id: studyBlock.id,
      kind: studyBlock.kind,
      position: studyBlock.position,
      content: studyBlock.content,
      collapsed: studyBlock.collapsed,
      version: studyBlock.version,
      updatedByName: user.name,
      updatedAt: studyBlock.updatedAt,
    })
    .from(studyBlock)
    .leftJoin(user, eq(user.id, studyBlock.updatedBy))
    .where(eq(studyBlock.studyId, studyId))
    .orderBy(asc(studyBlock.position), asc(studyBlock.createdAt));
  return rows.map(toItem);
}

/** The study's blocks in order; a scene that has no block yet (made elsewhere) gets one at the end. */
export async function listBlocksByStudyId({ studyId }: { studyId: string }): Promise<BlockItem[]> {
  return withDatabaseErrors("read the notebook", async () => {
    const blocks = await selectBlocks(studyId);
    const db = await getDb();
    const scenes = await db.select({ id: scene.id }).from(scene).where(eq(scene.studyId, studyId)).orderBy(asc(scene.position), asc(scene.createdAt));
    const shown = new Set(blocks.filter((b) => b.kind === "scene").map((b) => (b.content as { sceneId: string }).sceneId));
    const missing = scenes.filter((s) => !shown.has(s.id));
    if (missing.length === 0) return blocks;
    let position = (blocks.at(-1)?.position ?? 0) + positionGap;
    for (const item of missing) {
      await db.insert(studyBlock).values({ id: newId(), studyId, kind: "scene", position, content: { sceneId: item.id } });
      position += positionGap;
    }
    return selectBlocks(studyId);
  });
}

export async function getBlockById({ id }: { id: string }): Promise<(BlockItem & { studyId: string }) | null> {
  return withDatabaseErrors("read the block", async () => {
    const db = await getDb();
    const rows = await db.select().from(studyBlock).where(eq(studyBlock.id, id)).limit(1);
    const row = rows[0];
    if (!row) return null;
    return { ...toItem({ ...row, updatedByName: null }), studyId: row.studyId };
  });
}

/** The study's block that shows a given saved run, if there is one (a run is shown once). */
export async function findRunBlock({ studyId, runId }: { studyId: string; runId: string }): Promise<BlockItem | null> {
  return withDatabaseErrors("read the notebook", async () => {
    const blocks = await selectBlocks(studyId);
    return blocks.find((b) => b.kind === "run" && (b.content as { runId?: string }).runId === runId) ?? null;
  });
}

/** A sweep chart names the scene it varied: it must be one of this study's, or the block would point elsewhere. */
async function checkSweepScene(studyId: string, kind: BlockKind, content: unknown): Promise<void> {
  if (kind !== "chart") return;
  const sweep = (content as { quantity?: unknown; sweep?: { definition?: { sceneId?: unknown } } }).sweep;
  const sceneId = sweep?.definition?.sceneId;
  if (typeof sceneId !== "string") return;
  const rows = await withDatabaseErrors("check the sweep's scene", async () => {
    const db = await getDb();
    return db.select({ studyId: scene.studyId }).from(scene).where(eq(scene.id, sceneId)).limit(1);
  });
  if (rows[0]?.studyId !== studyId) {
    const path = "content.sweep.definition.sceneId";
    throw new AppError("bad_request:block", `${path}: no such scene in this study.`, [{ path, message: "No such scene in this study." }]);
  }
}

/**
 * A chart of saved runs must name runs of this study only: another study's run would show its results to
 * members who may not read that study, and a made-up id would never draw. The first stranger is named.
 */
async function checkChartRuns(studyId: string, kind: BlockKind, content: unknown): Promise<void> {
  if (kind !== "chart") return;
  const runIds = (content as { runIds?: unknown }).runIds;
  if (!Array.isArray(runIds) || runIds.length === 0) return;
  const ids = runIds.filter((id): id is string => typeof id === "string");
  const rows = await withDatabaseErrors("check the chart's runs", async () => {
    const db = await getDb();
    return db.select({ id: run.id }).from(run).where(and(eq(run.studyId, studyId), inArray(run.id, ids)));
  });
  const known = new Set(rows.map((row) => row.id));
  const stranger = runIds.findIndex((id) => typeof id !== "string" || !known.has(id));
  if (stranger >= 0) {
    const path = "content.runIds";
    throw new AppError("bad_request:block", `${path}: run ${stranger + 1} (${String(runIds[stranger])}) is not a saved run of this study.`, [
      { path, message: `Run ${stranger + 1} is not a saved run of this study.` },
    ]);
  }
}

export async function createBlock({
  studyId,
  authorId,
  kind,
  content,
  afterBlockId,
}: {
  studyId: string;
  authorId: string;
  kind: BlockKind;
  content: unknown;
  afterBlockId: string | null;
}): Promise<BlockItem> {
  await checkSweepScene(studyId, kind, content);
  await checkChartRuns(studyId, kind, content);
  const id = await withDatabaseErrors("add the block", async () => {
    const blocks = await selectBlocks(studyId);
    const afterIndex = afterBlockId === null ? blocks.length - 1 : blocks.findIndex((b) => b.id === afterBlockId);
    if (afterBlockId !== null && afterIndex < 0) throw new AppError("bad_request:block", "afterBlockId: no such block in this study.", [{ path: "afterBlockId", message: "No such block in this study." }]);
    const before = blocks[afterIndex]?.position ?? 0;
    const after = blocks[afterIndex + 1]?.position;
    let position = after === undefined ? before + positionGap : Math.floor((before + after) / 2);
    const db = await getDb();
    if (after !== undefined && (position === before || position === after)) {
      // No room left between the two: renumber the whole notebook with fresh gaps.
      await db.transaction(async (tx) => {
        for (const [index, block] of blocks.entries()) {
          await tx.update(studyBlock).set({ position: (index + 1) * positionGap * 2 }).where(eq(studyBlock.id, block.id));
        }
      });
      position = (afterIndex + 1) * positionGap * 2 + positionGap;
    }
    const blockId = newId();
    await db.insert(studyBlock).values({ id: blockId, studyId, kind, position, content, createdBy: authorId, updatedBy: authorId });
    return blockId;
  });
  const created = (await selectBlocks(studyId)).find((b) => b.id === id);
  if (!created) throw new AppError("internal:block", "The block was not stored.");
  return created;
}

/** Applies an edit made on `baseVersion`; a stale version answers 409 and changes nothing. */
export async function updateBlock({
  id,
  authorId,
  baseVersion,
  markdown,
  collapsed,
}: {
  id: string;
  authorId: string;
  baseVersion: number;
  markdown?: string;
  collapsed?: boolean;
}): Promise<BlockItem> {
  const updated = await withDatabaseErrors("save the block", async () => {
    const db = await getDb();
    const changes: Partial<typeof studyBlock.$inferInsert> = { version: baseVersion + 1, updatedBy: authorId, updatedAt: new Date() };
    if (markdown !== undefined) changes.content = { markdown };
    if (collapsed !== undefined) changes.collapsed = collapsed;
    const rows = await db
      .update(studyBlock)
      .set(changes)
      .where(and(eq(studyBlock.id, id), eq(studyBlock.version, baseVersion)))
      .returning({ studyId: studyBlock.studyId });
    return rows[0] ?? null;
  });
  if (!updated) {
    throw new AppError("conflict:block", "Someone changed this block after you opened it. Reload it, or keep your text as a new notes block.");
  }
  const block = (await selectBlocks(updated.studyId)).find((b) => b.id === id);
  if (!block) throw new AppError("not_found:block", "No such block.");
  return block;
}

export async function deleteBlock({ id }: { id: string }): Promise<void> {
  await withDatabaseErrors("delete the block", async () => {
    const db = await getDb();
    await db.delete(studyBlock).where(eq(studyBlock.id, id));
  });
}

/** Puts the study's blocks in the given order; the list must name every block exactly once. */
export async function reorderBlocks({ studyId, blockIds }: { studyId: string; blockIds: string[] }): Promise<BlockItem[]> {
  return withDatabaseErrors("reorder the notebook", async () => {
    const current = await selectBlocks(studyId);
    const known = new Set(current.map((b) => b.id));
    if (blockIds.length !== current.length || new Set(blockIds).size !== blockIds.length || blockIds.some((id) => !known.has(id))) {
      throw new AppError("bad_request:block", "blockIds: name every block of the study exactly once.", [{ path: "blockIds", message: "Name every block of the study exactly once." }]);
    }
    const db = await getDb();
    await db.transaction(async (tx) => {
      for (const [index, id] of blockIds.entries()) {
        await tx.update(studyBlock).set({ position: (index + 1) * positionGap }).where(and(eq(studyBlock.id, id), eq(studyBlock.studyId, studyId)));
      }
    });
    return selectBlocks(studyId);
  });
}
