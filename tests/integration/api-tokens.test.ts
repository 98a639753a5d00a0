import "../helpers/test-database";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as tokenRoute from "@/app/api/me/tokens/[tokenId]/route";
import * as tokensRoute from "@/app/api/me/tokens/route";
import * as sceneJobsRoute from "@/app/api/scenes/[sceneId]/jobs/route";
import * as sceneRoute from "@/app/api/scenes/[sceneId]/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as memberRoute from "@/app/api/teams/[teamId]/members/[memberId]/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb, getDb } from "@/db/client";
import { apiToken, membership } from "@/db/schema";
import type { TeamRole } from "@/lib/access/roles";
import type { ApiTokenCreatedResponse, ApiTokensResponse } from "@/lib/http/api-token-types";
import type { SceneRecord } from "@/lib/http/api-types";
import { callRoute, cookieFrom, signUp } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinySceneInput } from "../run-record/fixtures";

let cookies = new Map<TeamRole, string>();
let demoTeamId = "";
let demoStudyId = "";
let scene: SceneRecord;
const userIds = new Map<TeamRole, string>();
let otherTeamId = "";
let otherStudyId = "";

async function makeToken(cookie: string, input: { name?: string; teamId?: string; role: TeamRole; expiresInDays?: number }) {
  return callRoute(tokensRoute.POST, { path: "/api/me/tokens", cookie, body: { name: input.name ?? `Script (${input.role})`, teamId: input.teamId ?? demoTeamId, role: input.role, expiresInDays: input.expiresInDays } });
}

async function secretFor(cookie: string, role: TeamRole, teamId?: string): Promise<ApiTokenCreatedResponse> {
  const response = await makeToken(cookie, { role, teamId });
  expect(response.status).toBe(201);
  return (await response.json()) as ApiTokenCreatedResponse;
}

const bearer = (secret: string) => `Bearer ${secret}`;

function readStudy(studyId: string, auth: { cookie?: string; authorization?: string }) {
  return callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, ...auth });
}

/** Queueing a run the way a browser saves one: run:create on the scene, checked before the body is read. */
function queueRun(sceneId: string, authorization: string) {
  return callRoute(sceneRunsRoute.POST, { path: `/api/scenes/${sceneId}/runs`, params: { sceneId }, authorization, rawBody: "not a payload" });
}

beforeAll(async () => {
  const demo = await openDemoStudy();
  cookies = demo.cookies;
  demoStudyId = demo.studyId;
  for (const [role, cookie] of cookies) {
    const me = (await (await callRoute(meRoute.GET, { path: "/api/me", cookie })).json()) as { user: { id: string }; activeTeamId: string };
    userIds.set(role, me.user.id);
    demoTeamId = me.activeTeamId;
  }
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${demoStudyId}/scenes`, params: { studyId: demoStudyId }, cookie: cookies.get("owner"), body: { name: "Token check", data: tinySceneInput() } });
  scene = ((await created.json()) as { scene: SceneRecord }).scene;
  // A second team with a study of its own; the demo owner is made an editor there too, so that a
  // token's team, not the person's memberships, decides what it reaches.
  const other = cookieFrom(await signUp({ name: "Other Firm", email: "other-firm@example.org", password: "other-firm-password" }));
  otherTeamId = ((await (await callRoute(meRoute.GET, { path: "/api/me", cookie: other })).json()) as { activeTeamId: string }).activeTeamId;
  const study = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${otherTeamId}/studies`, params: { teamId: otherTeamId }, cookie: other, body: { title: "Other firm's study" } });
  otherStudyId = ((await study.json()) as { study: { id: string } }).study.id;
  const db = await getDb();
  await db.insert(membership).values({ id: crypto.randomUUID(), teamId: otherTeamId, userId: userIds.get("owner")!, role: "editor", createdAt: new Date() });
}, 120_000);

afterAll(async () => {
  await closeDb();
});

describe("personal API tokens", () => {
  it("answers the secret once, keeps only its hash and a short prefix, and lists the token without it", async () => {
    const { token, secret } = await secretFor(cookies.get("editor")!, "editor");
    expect(secret).toMatch(/^rft_[A-Za-z0-9_-]{43}$/);
    expect(token.prefix).toBe(secret.slice(0, 8));
    const db = await getDb();
    const [row] = await db.select().from(apiToken).where(eq(apiToken.id, token.id));
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(secret.slice(8));
    const list = await callRoute(tokensRoute.GET, { path: "/api/me/tokens", cookie: cookies.get("editor") });
    const text = await list.text();
    expect(text).not.toContain(secret);
    expect((JSON.parse(text) as ApiTokensResponse).tokens.map((t) => t.id)).toContain(token.id);
  });

  it("accepts a bearer token on the API with its team and role", async () => {
    const { secret } = await secretFor(cookies.get("editor")!, "editor");
    const read = await readStudy(demoStudyId, { authorization: bearer(secret) });
    expect(read.status).toBe(200);
    expect(((await read.json()) as { role: TeamRole }).role).toBe("editor");
    const me = (await (await callRoute(meRoute.GET, { path: "/api/me", authorization: bearer(secret) })).json()) as { memberships: { teamId: string; role: TeamRole }[] };
    expect(me.memberships).toEqual([expect.objectContaining({ teamId: demoTeamId, role: "editor" })]);
  });

  it("refuses a role above the member's own (403) and a team the caller is not on (404)", async () => {
    expect((await makeToken(cookies.get("editor")!, { role: "owner" })).status).toBe(403);
    expect((await makeToken(cookies.get("editor")!, { role: "reviewer" })).status).toBe(403);
    expect((await makeToken(cookies.get("viewer")!, { role: "editor" })).status).toBe(403);
    expect((await makeToken(cookies.get("editor")!, { role: "viewer", teamId: otherTeamId })).status).toBe(404);
    const bad = await makeToken(cookies.get("editor")!, { role: "viewer", name: " ", expiresInDays: 0 });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues.map((issue) => issue.path).sort()).toEqual(["expiresInDays", "name"]);
  });

  it("a revoked token gets 401", async () => {
    const { token, secret } = await secretFor(cookies.get("editor")!, "editor");
    expect((await readStudy(demoStudyId, { authorization: bearer(secret) })).status).toBe(200);
    const revoked = await callRoute(tokenRoute.DELETE, { method: "DELETE", path: `/api/me/tokens/${token.id}`, params: { tokenId: token.id }, cookie: cookies.get("editor") });
    expect(revoked.status).toBe(200);
    const refused = await readStudy(demoStudyId, { authorization: bearer(secret) });
    expect(refused.status).toBe(401);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toContain("revoked");
  });

  it("another user cannot revoke someone's token (404)", async () => {
    const { token } = await secretFor(cookies.get("editor")!, "viewer");
    const response = await callRoute(tokenRoute.DELETE, { method: "DELETE", path: `/api/me/tokens/${token.id}`, params: { tokenId: token.id }, cookie: cookies.get("owner") });
    expect(response.status).toBe(404);
  });

  it("an expired token gets 401", async () => {
    const response = await makeToken(cookies.get("editor")!, { role: "editor", expiresInDays: 1 });
    const { token, secret } = (await response.json()) as ApiTokenCreatedResponse;
    expect((await readStudy(demoStudyId, { authorization: bearer(secret) })).status).toBe(200);
    const db = await getDb();
    await db.update(apiToken).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(apiToken.id, token.id));
    const refused = await readStudy(demoStudyId, { authorization: bearer(secret) });
    expect(refused.status).toBe(401);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toContain("expired");
  });

  it("an unknown or malformed bearer token gets 401 and never falls back to the session cookie", async () => {
    const unknown = `rft_${"A".repeat(43)}`;
    expect((await readStudy(demoStudyId, { authorization: bearer(unknown), cookie: cookies.get("owner") })).status).toBe(401);
    expect((await readStudy(demoStudyId, { authorization: "Bearer not-a-token", cookie: cookies.get("owner") })).status).toBe(401);
    expect((await readStudy(demoStudyId, { authorization: "Basic b3duZXI6cGFzcw==", cookie: cookies.get("owner") })).status).toBe(401);
  });

  it("a viewer-scoped token cannot queue a run (403)", async () => {
    const viewerScoped = await secretFor(cookies.get("owner")!, "viewer");
    const queued = await callRoute(sceneJobsRoute.POST, { path: `/api/scenes/${scene.id}/jobs`, params: { sceneId: scene.id }, authorization: bearer(viewerScoped.secret), body: {} });
    expect(queued.status).toBe(403);
    expect((await queueRun(scene.id, bearer(viewerScoped.secret))).status).toBe(403);
    // The same person's editor-scoped token passes the gate and reaches the body checks (400), so
    // nothing is queued here.
    const editorScoped = await secretFor(cookies.get("owner")!, "editor");
    const badVersion = await callRoute(sceneJobsRoute.POST, { path: `/api/scenes/${scene.id}/jobs`, params: { sceneId: scene.id }, authorization: bearer(editorScoped.secret), body: { sceneVersion: 0 } });
    expect(badVersion.status).toBe(400);
    expect((await queueRun(scene.id, bearer(editorScoped.secret))).status).toBe(400);
  });

  it("an editor's token scoped viewer cannot edit a scene (403), while the editor can", async () => {
    const { secret } = await secretFor(cookies.get("editor")!, "viewer");
    const body = { baseVersion: scene.version, name: scene.name, description: "", data: scene.data, note: "by a script" };
    const byToken = await callRoute(sceneRoute.PUT, { method: "PUT", path: `/api/scenes/${scene.id}`, params: { sceneId: scene.id }, authorization: bearer(secret), body });
    expect(byToken.status).toBe(403);
    const byEditor = await callRoute(sceneRoute.PUT, { method: "PUT", path: `/api/scenes/${scene.id}`, params: { sceneId: scene.id }, cookie: cookies.get("editor"), body });
    expect(byEditor.status).toBe(200);
    scene = ((await byEditor.json()) as { scene: SceneRecord }).scene;
  });

  it("a token of one team cannot read another team's study (404), though its owner is on both", async () => {
    const { secret } = await secretFor(cookies.get("owner")!, "owner");
    expect((await readStudy(otherStudyId, { cookie: cookies.get("owner") })).status).toBe(200);
    expect((await readStudy(otherStudyId, { authorization: bearer(secret) })).status).toBe(404);
    const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${otherTeamId}/studies`, params: { teamId: otherTeamId }, authorization: bearer(secret) });
    expect(list.status).toBe(404);
  });

  it("a token cannot create, list or revoke tokens, nor leave the team (403)", async () => {
    const { token, secret } = await secretFor(cookies.get("owner")!, "owner");
    const create = await callRoute(tokensRoute.POST, { path: "/api/me/tokens", authorization: bearer(secret), body: { name: "Minted by a token", teamId: demoTeamId, role: "viewer" } });
    expect(create.status).toBe(403);
    expect((await callRoute(tokensRoute.GET, { path: "/api/me/tokens", authorization: bearer(secret) })).status).toBe(403);
    expect((await callRoute(tokenRoute.DELETE, { method: "DELETE", path: `/api/me/tokens/${token.id}`, params: { tokenId: token.id }, authorization: bearer(secret) })).status).toBe(403);
    // Nor take its owner off the team.
    const ownerId = userIds.get("owner")!;
    const leave = await callRoute(memberRoute.DELETE, { method: "DELETE", path: `/api/teams/${demoTeamId}/members/${ownerId}`, params: { teamId: demoTeamId, memberId: ownerId }, authorization: bearer(secret) });
    expect(leave.status).toBe(403);
  });

  it("notes when a token was last used, at most once a minute", async () => {
    const { token, secret } = await secretFor(cookies.get("reviewer")!, "reviewer");
    const db = await getDb();
    await readStudy(demoStudyId, { authorization: bearer(secret) });
    const [first] = await db.select({ lastUsedAt: apiToken.lastUsedAt }).from(apiToken).where(eq(apiToken.id, token.id));
    expect(first!.lastUsedAt).toBeInstanceOf(Date);
    await readStudy(demoStudyId, { authorization: bearer(secret) });
    const [second] = await db.select({ lastUsedAt: apiToken.lastUsedAt }).from(apiToken).where(eq(apiToken.id, token.id));
    expect(second!.lastUsedAt!.getTime()).toBe(first!.lastUsedAt!.getTime());
  });

  it("a token outlives nothing: demoting its owner caps it, removing them from the team makes it 404", async () => {
    const { secret } = await secretFor(cookies.get("editor")!, "editor");
    const editorId = userIds.get("editor")!;
    const demote = await callRoute(memberRoute.PATCH, { method: "PATCH", path: `/api/teams/${demoTeamId}/members/${editorId}`, params: { teamId: demoTeamId, memberId: editorId }, cookie: cookies.get("owner"), body: { role: "viewer" } });
    expect(demote.status).toBe(200);
    expect((await queueRun(scene.id, bearer(secret))).status).toBe(403);
    const remove = await callRoute(memberRoute.DELETE, { method: "DELETE", path: `/api/teams/${demoTeamId}/members/${editorId}`, params: { teamId: demoTeamId, memberId: editorId }, cookie: cookies.get("owner") });
    expect(remove.status).toBe(200);
    expect((await readStudy(demoStudyId, { authorization: bearer(secret) })).status).toBe(404);
  });
});
