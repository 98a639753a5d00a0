// Read-only links to a study: the owner makes, lists and revokes them; anyone holding a working link
// reads that one study. The link's secret is never stored: only its SHA-256 is, and a link is found by
// looking that hash up, so the secret is never compared in application code.
import "server-only";
import { and, desc, eq, isNull, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { RunListFigures, RunListItem } from "@/lib/http/api-types";
import type { SharedRun, SharedScene, SharedStudyHeading, SharedStudyResponse, ShareLinkItem } from "@/lib/http/share-link-types";
import type { RunSummary } from "@/lib/run-record/summary";
import { getDb } from "../client";
import { run, study, studyShareLink, team, user } from "../schema";
import { listStoredBlocksByStudyId } from "./blocks";
import { getRunById, listRunsByStudyId } from "./runs";
import { listScenesByStudyId } from "./scenes";
import { hashSecret, newSecret } from "./secrets";
import { newId, withDatabaseErrors } from "./wrap";


const revoker = alias(user, "revoker");

const linkColumns = {
  id: studyShareLink.id,
  label: studyShareLink.label,
  createdByName: user.name,
  createdAt: studyShareLink.createdAt,
  revokedAt: studyShareLink.revokedAt,
  revokedByName: revoker.name,
};

function toLinkItem(row: { id: string; label: string; createdByName: string | null; createdAt: Date; revokedAt: Date | null; revokedByName: string | null }): ShareLinkItem {
  return { ...row, createdAt: row.createdAt.toISOString(), revokedAt: row.revokedAt ? row.revokedAt.toISOString() : null };
}

async function selectLinks(where: SQL): Promise<ShareLinkItem[]> {
  const db = await getDb();
  const rows = await db
    .select(linkColumns)
    .from(studyShareLink)
    .leftJoin(user, eq(user.id, studyShareLink.createdBy))
    .leftJoin(revoker, eq(revoker.id, studyShareLink.revokedBy))
    .where(where)
    .orderBy(desc(studyShareLink.createdAt));
  return rows.map(toLinkItem);
}

/** The study's links, newest first, revoked ones included (the owner sees what was once shared). */
export async function listShareLinksByStudyId({ studyId }: { studyId: string }): Promise<ShareLinkItem[]> {
  return withDatabaseErrors("list the read-only links", () => selectLinks(eq(studyShareLink.studyId, studyId)));
}

/** One link with the study it opens, for the owner's revoke. */
export async function getShareLinkById({ id }: { id: string }): Promise<(ShareLinkItem & { studyId: string }) | null> {
  return withDatabaseErrors("read the read-only link", async () => {
    const db = await getDb();
    const rows = await db.select({ studyId: studyShareLink.studyId }).from(studyShareLink).where(eq(studyShareLink.id, id)).limit(1);
    const studyId = rows[0]?.studyId;
    if (!studyId) return null;
    const [item] = await selectLinks(eq(studyShareLink.id, id));
    return item ? { ...item, studyId } : null;
  });
}

/** Makes a link and answers its secret; this is the only time the secret exists outside the browser. */
export async function createShareLink({ studyId, label, createdBy }: { studyId: string; label: string; createdBy: string }): Promise<{ link: ShareLinkItem; token: string }> {
  return withDatabaseErrors("make the read-only link", async () => {
    const db = await getDb();
    const id = newId();
    const token = newSecret();
    await db.insert(studyShareLink).values({ id, studyId, tokenHash: hashSecret(token), label, createdBy });
    const [link] = await selectLinks(eq(studyShareLink.id, id));
    if (!link) throw new Error("insert returned no row");
    return { link, token };
  });
}

/**
 * Revokes a link from now on. A link already revoked keeps its first revocation (who and when) and
 * `changed` is false, so the activity is recorded once.
 */
export async function revokeShareLinkById({ id, revokedBy }: { id: string; revokedBy: string }): Promise<{ link: ShareLinkItem; changed: boolean } | null> {
  return withDatabaseErrors("revoke the read-only link", async () => {
    const db = await getDb();
    const updated = await db
      .update(studyShareLink)
      .set({ revokedAt: new Date(), revokedBy })
      .where(and(eq(studyShareLink.id, id), isNull(studyShareLink.revokedAt)))
      .returning({ id: studyShareLink.id });
    const [link] = await selectLinks(eq(studyShareLink.id, id));
    return link ? { link, changed: updated.length > 0 } : null;
  });
}

export interface SharedStudyAccess {
  linkId: string;
  studyId: string;
  teamId: string;
  heading: SharedStudyHeading;
}

/** The study a working link opens, or null for a secret that names no link or a revoked one. */
export async function findSharedStudyByToken({ token }: { token: string }): Promise<SharedStudyAccess | null> {
  return withDatabaseErrors("open the read-only link", async () => {
    const db = await getDb();
    const rows = await db
      .select({
        linkId: studyShareLink.id,
        studyId: study.id,
        teamId: study.teamId,
        title: study.title,
        description: study.description,
        siteReference: study.siteReference,
        teamName: team.name,
      })
      .from(studyShareLink)
      .innerJoin(study, eq(study.id, studyShareLink.studyId))
      .innerJoin(team, eq(team.id, study.teamId))
      .where(and(eq(studyShareLink.tokenHash, hashSecret(token)), isNull(studyShareLink.revokedAt)))
      .limit(1);
    const row = rows[0];
    if (!row) return null;
    const { linkId, studyId, teamId, ...heading } = row;
    return { linkId, studyId, teamId, heading };
  });
}

/** The scenes as the link shows them: without who last changed them (names of people stay on runs only). */
async function selectSharedScenes(studyId: string): Promise<SharedScene[]> {
  return (await listScenesByStudyId({ studyId })).map(({ updatedByName: _updatedByName, ...shared }) => shared);
}

/** The list's figures: the summary without its long parts, as the members' run table has them. */
function figuresOf(summary: RunSummary | null): RunListFigures | null {
  if (!summary) return null;
  const { receivers: _receivers, warnings, ...rest } = summary;
  return { ...rest, warningCount: warnings.length };
}

/** The run as the link shows it: who saved it by name only, never their user id. */
function toSharedRun(item: Omit<RunListItem, "figures">, summary: RunSummary | null): SharedRun {
  return { ...item, createdById: null, summary, figures: figuresOf(summary) };
}

/** The summaries of a study's runs, by run id (the members' list leaves out their long parts). */
async function selectRunSummaries(studyId: string): Promise<Map<string, RunSummary | null>> {
  const db = await getDb();
  const rows = await db.select({ id: run.id, summary: run.summary }).from(run).where(eq(run.studyId, studyId));
  return new Map(rows.map((row) => [row.id, row.summary as RunSummary | null]));
}

/** Everything the shared view shows of the one study the link opens. */
export async function getSharedStudyContent({ access }: { access: SharedStudyAccess }): Promise<SharedStudyResponse> {
  const [blocks, scenes, items, summaries] = await withDatabaseErrors("read the shared study", () =>
    Promise.all([listStoredBlocksByStudyId({ studyId: access.studyId }), selectSharedScenes(access.studyId), listRunsByStudyId({ studyId: access.studyId }), selectRunSummaries(access.studyId)]),
  );
  const runs = items.map(({ figures: _figures, ...item }) => toSharedRun(item, summaries.get(item.id) ?? null));
  return { study: access.heading, blocks, scenes, runs };
}

/** One saved run of the shared study; null when the run does not exist or belongs to another study. */
export async function getSharedRunById({ studyId, runId }: { studyId: string; runId: string }): Promise<SharedRun | null> {
  const record = await getRunById({ id: runId });
  if (!record || record.studyId !== studyId) return null;
  const { teamId: _teamId, settings: _settings, summary, ...item } = record;
  return toSharedRun(item, summary);
}

/** The stored payload of a run of the shared study; null for a run of any other study or without one. */
export async function getSharedRunResult({ studyId, runId }: { studyId: string; runId: string }): Promise<Uint8Array | null> {
  return withDatabaseErrors("read the shared run's result", async () => {
    const db = await getDb();
    const rows = await db
      .select({ resultData: run.resultData })
      .from(run)
      .where(and(eq(run.id, runId), eq(run.studyId, studyId)))
      .limit(1);
    return rows[0]?.resultData ?? null;
  });
}
