// Comments on saved runs: threads (a first comment and its replies), edits, soft deletion and
// resolution. Each change is recorded as an activity with the run's id, which also tells open pages.
import "server-only";
import { asc, eq, inArray, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { commentExcerpt } from "@/lib/collaboration/mentions";
import type { CommentItem, CommentThread } from "@/lib/http/comment-types";
import { commentPinSchema, type CommentPin } from "@/lib/validation/comment";
import { getDb } from "../client";
import { comment, run, user, type Comment } from "../schema";
import { recordActivity } from "./activity";
import { newId, withDatabaseErrors } from "./wrap";

/** A comment as stored (the routes check author, thread and run on it). */
export type StoredComment = Comment;

/** The run a comment belongs to, as the access check and the activity need it. */
export interface CommentRunRef {
  id: string;
  teamId: string;
  studyId: string;
}

const resolver = alias(user, "resolver");

const itemColumns = {
  id: comment.id,
  runId: comment.runId,
  parentId: comment.parentId,
  authorId: comment.authorId,
  authorName: user.name,
  body: comment.body,
  pin: comment.pin,
  mentions: comment.mentions,
  createdAt: comment.createdAt,
  editedAt: comment.editedAt,
  deletedAt: comment.deletedAt,
  resolvedAt: comment.resolvedAt,
  resolvedById: comment.resolvedBy,
  resolvedByName: resolver.name,
};

/** A stored pin read back; anything that no longer parses is dropped rather than sent on. */
function storedPin(value: unknown): CommentPin | null {
  if (value === null || value === undefined) return null;
  const parsed = commentPinSchema.safeParse(value);
  return parsed.success ? parsed.data : null;
}

function toItem(row: ItemRow, names: ReadonlyMap<string, string>): CommentItem {
  const deleted = row.deletedAt !== null;
  return {
    id: row.id,
    runId: row.runId,
    parentId: row.parentId,
    authorId: row.authorId,
    authorName: row.authorName,
    body: deleted ? "" : row.body,
    pin: deleted ? null : storedPin(row.pin),
    mentions: deleted ? [] : row.mentions.filter((id) => names.has(id)).map((userId) => ({ userId, name: names.get(userId)! })),
    createdAt: row.createdAt.toISOString(),
    editedAt: row.editedAt?.toISOString() ?? null,
    deleted,
    deletedAt: row.deletedAt?.toISOString() ?? null,
    resolvedAt: row.resolvedAt?.toISOString() ?? null,
    resolvedById: row.resolvedAt ? row.resolvedById : null,
    resolvedByName: row.resolvedAt ? row.resolvedByName : null,
  };
}

async function namesOf(userIds: readonly string[]): Promise<Map<string, string>> {
  if (userIds.length === 0) return new Map();
  const db = await getDb();
  const rows = await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, [...new Set(userIds)]));
  return new Map(rows.map((row) => [row.id, row.name]));
}

function latest(...isoTimes: (string | null)[]): string {
  return isoTimes.reduce<string>((best, time) => (time && time > best ? time : best), "");
}

/**
 * Threads, newest activity first. A deleted first comment stays while a reply under it is still
 * readable; a thread with nothing readable left is not listed.
 */
function assembleThreads(items: readonly CommentItem[]): CommentThread[] {
  const repliesByParent = new Map<string, CommentItem[]>();
  for (const item of items) {
    if (item.parentId === null) continue;
    const list = repliesByParent.get(item.parentId) ?? [];
    list.push(item);
    repliesByParent.set(item.parentId, list);
  }
  const threads: CommentThread[] = [];
  for (const head of items) {
    if (head.parentId !== null) continue;
    const replies = repliesByParent.get(head.id) ?? [];
    if (head.deleted && replies.every((reply) => reply.deleted)) continue;
    const lastActivityAt = latest(head.createdAt, head.editedAt, head.resolvedAt, ...replies.flatMap((reply) => [reply.createdAt, reply.editedAt, reply.deletedAt]));
    threads.push({ ...head, replies, lastActivityAt });
  }
  return threads.sort((a, b) => (a.lastActivityAt < b.lastActivityAt ? 1 : a.lastActivityAt > b.lastActivityAt ? -1 : 0));
}

async function selectItems(where: SQL) {
  const db = await getDb();
  return db
    .select(itemColumns)
    .from(comment)
    .leftJoin(user, eq(user.id, comment.authorId))
    .leftJoin(resolver, eq(resolver.id, comment.resolvedBy))
    .where(where)
    .orderBy(asc(comment.createdAt), asc(comment.id));
}

type ItemRow = Awaited<ReturnType<typeof selectItems>>[number];

export async function listCommentThreadsByRunId({ runId }: { runId: string }): Promise<CommentThread[]> {
  return withDatabaseErrors("read the comments", async () => {
    const rows = await selectItems(eq(comment.runId, runId));
    const names = await namesOf(rows.flatMap((row) => row.mentions));
    return assembleThreads(rows.map((row) => toItem(row, names)));
  });
}

/** One comment as the routes answer it. */
export async function getCommentItemById({ id }: { id: string }): Promise<CommentItem | null> {
  return withDatabaseErrors("read the comment", async () => {
    const [row] = await selectItems(eq(comment.id, id));
    if (!row) return null;
    return toItem(row, await namesOf(row.mentions));
  });
}

/** The stored row, for the access checks (author, thread, run). */
export async function getCommentById({ id }: { id: string }): Promise<StoredComment | null> {
  return withDatabaseErrors("read the comment", async () => {
    const db = await getDb();
    const [row] = await db.select().from(comment).where(eq(comment.id, id)).limit(1);
    return row ?? null;
  });
}

/** The scene a run was made from, as frozen with it: pins are checked against its domain and receivers. */
export async function getRunSceneSnapshotById({ id }: { id: string }): Promise<unknown> {
  return withDatabaseErrors("read the run's scene", async () => {
    const db = await getDb();
    const [row] = await db.select({ sceneSnapshot: run.sceneSnapshot }).from(run).where(eq(run.id, id)).limit(1);
    return row?.sceneSnapshot ?? null;
  });
}

export async function createComment({
  run: owner,
  parentId,
  authorId,
  body,
  pin,
  mentions,
}: {
  run: CommentRunRef;
  parentId: string | null;
  authorId: string;
  body: string;
  pin: CommentPin | null;
  mentions: string[];
}): Promise<string> {
  const id = newId();
  await withDatabaseErrors("save the comment", async () => {
    const db = await getDb();
    await db.insert(comment).values({ id, runId: owner.id, parentId, authorId, body, pin, mentions });
  });
  await recordActivity({
    teamId: owner.teamId,
    studyId: owner.studyId,
    runId: owner.id,
    actorId: authorId,
    action: "comment.added",
    subjectType: "comment",
    subjectId: id,
    detail: { runId: owner.id, excerpt: commentExcerpt(body), reply: parentId !== null, ...(parentId ? { parentId } : {}), ...(pin ? { pinned: pin.kind } : {}) },
  });
  return id;
}

export async function updateCommentBody({ run: owner, id, actorId, body, mentions }: { run: CommentRunRef; id: string; actorId: string; body: string; mentions: string[] }): Promise<void> {
  await withDatabaseErrors("save the comment", async () => {
    const db = await getDb();
    await db.update(comment).set({ body, mentions, editedAt: new Date() }).where(eq(comment.id, id));
  });
  await recordActivity({
    teamId: owner.teamId,
    studyId: owner.studyId,
    runId: owner.id,
    actorId,
    action: "comment.edited",
    subjectType: "comment",
    subjectId: id,
    detail: { runId: owner.id, excerpt: commentExcerpt(body) },
  });
}

/** Soft deletion: the row keeps its place in the thread (replies stay) but loses its text, pin and mentions. */
export async function softDeleteComment({ run: owner, id, actorId, byModerator }: { run: CommentRunRef; id: string; actorId: string; byModerator: boolean }): Promise<void> {
  await withDatabaseErrors("delete the comment", async () => {
    const db = await getDb();
    await db.update(comment).set({ body: "", pin: null, mentions: [], deletedAt: new Date() }).where(eq(comment.id, id));
  });
  await recordActivity({
    teamId: owner.teamId,
    studyId: owner.studyId,
    runId: owner.id,
    actorId,
    action: "comment.deleted",
    subjectType: "comment",
    subjectId: id,
    detail: { runId: owner.id, byModerator },
  });
}

/** Resolves or reopens a thread (its first comment); records who and when, or clears both. */
export async function setCommentResolution({ run: owner, id, actorId, resolved, excerpt }: { run: CommentRunRef; id: string; actorId: string; resolved: boolean; excerpt: string }): Promise<void> {
  await withDatabaseErrors("save the thread's state", async () => {
    const db = await getDb();
    await db
      .update(comment)
      .set(resolved ? { resolvedAt: new Date(), resolvedBy: actorId } : { resolvedAt: null, resolvedBy: null })
      .where(eq(comment.id, id));
  });
  await recordActivity({
    teamId: owner.teamId,
    studyId: owner.studyId,
    runId: owner.id,
    actorId,
    action: resolved ? "comment.resolved" : "comment.reopened",
    subjectType: "comment",
    subjectId: id,
    detail: { runId: owner.id, excerpt },
  });
}
