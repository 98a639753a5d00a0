import "../helpers/test-database";
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as sharedStudyRoute from "@/app/api/shared/[token]/route";
import * as sharedResultRoute from "@/app/api/shared/[token]/runs/[runId]/result/route";
import * as shareLinkRoute from "@/app/api/studies/[studyId]/share-links/[linkId]/route";
import * as shareLinksRoute from "@/app/api/studies/[studyId]/share-links/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb, getDb } from "@/db/client";
import { listActivityByStudyId } from "@/db/queries/activity";
import { studyShareLink } from "@/db/schema";
import { demoMembers, demoTeam } from "@/db/seed/demo-accounts";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { runScene } from "@/lib/fdtd/simulation";
import type { RunRecord, SceneRecord } from "@/lib/http/api-types";
import type { ShareLinkCreatedResponse, ShareLinkItem, ShareLinksResponse, SharedStudyResponse } from "@/lib/http/share-link-types";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { callRoute, cookieFrom, signUp, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinySceneInput } from "../run-record/fixtures";

type Caller = TeamRole | "outsider" | "nobody";

const cookies = new Map<Caller, string | undefined>();
let studyA = "";
let studyB = "";
let runA: RunRecord;
let runB: RunRecord;

/** A tiny scene added to the study and run as a browser would, then uploaded. */
async function saveTinyRun(studyId: string, cookie: string): Promise<RunRecord> {
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie, body: { name: "Tiny shared check", data: tinySceneInput() } });
  expect(created.status).toBe(201);
  const sceneRecord = ((await created.json()) as { scene: SceneRecord }).scene;
  const scene = parseSceneOrThrow(sceneRecord.data);
  const encoded = encodeRunPayload({ result: runScene(scene), scene, sceneVersion: sceneRecord.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const headers = new Headers({ origin: testOrigin, "content-type": "application/octet-stream", cookie });
  const request = new Request(`${testOrigin}/api/scenes/${sceneRecord.id}/runs`, { method: "POST", headers, body: encoded.bytes as Uint8Array<ArrayBuffer> });
  const response = await sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: sceneRecord.id }) });
  expect(response.status).toBe(201);
  return ((await response.json()) as { run: RunRecord }).run;
}

beforeAll(async () => {
  const demo = await openDemoStudy();
  for (const [role, cookie] of demo.cookies) cookies.set(role, cookie);
  cookies.set("nobody", undefined);
  studyA = demo.studyId;
  // The outsider has a team of their own (made at sign-up) with a study and a run: study B.
  const outsider = cookieFrom(await signUp({ name: "Share Outsider", email: "share-outsider@example.org", password: "outsider-password" }));
  cookies.set("outsider", outsider);
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: outsider });
  const outsiderTeamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const made = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${outsiderTeamId}/studies`, params: { teamId: outsiderTeamId }, cookie: outsider, body: { title: "Outsider's private study" } });
  studyB = ((await made.json()) as { study: { id: string } }).study.id;
  runA = await saveTinyRun(studyA, cookies.get("owner")!);
  runB = await saveTinyRun(studyB, outsider);
}, 120_000);

afterAll(async () => {
  await closeDb();
});

function listLinks(studyId: string, cookie: string | undefined) {
  return callRoute(shareLinksRoute.GET, { path: `/api/studies/${studyId}/share-links`, params: { studyId }, cookie });
}

function createLink(studyId: string, cookie: string | undefined, body: unknown = { label: "For the council" }) {
  return callRoute(shareLinksRoute.POST, { method: "POST", path: `/api/studies/${studyId}/share-links`, params: { studyId }, cookie, body });
}

function revokeLink(studyId: string, linkId: string, cookie: string | undefined) {
  return callRoute(shareLinkRoute.DELETE, { method: "DELETE", path: `/api/studies/${studyId}/share-links/${linkId}`, params: { studyId, linkId }, cookie });
}

function openShared(token: string) {
  return callRoute(sharedStudyRoute.GET, { path: `/api/shared/${token}`, params: { token } });
}

function openSharedResult(token: string, runId: string) {
  return callRoute(sharedResultRoute.GET, { path: `/api/shared/${token}/runs/${runId}/result`, params: { token, runId } });
}

async function made(studyId: string, cookie: string | undefined, label = "For the council"): Promise<{ link: ShareLinkItem; token: string; url: string }> {
  const response = await createLink(studyId, cookie, { label });
  expect(response.status).toBe(201);
  const body = (await response.json()) as ShareLinkCreatedResponse;
  const token = new URL(body.url).pathname.replace(/^\/shared\//, "");
  return { link: body.link, token, url: body.url };
}

function expectSharedHeaders(response: Response): void {
  expect(response.headers.get("cache-control")).toBe("no-store");
  expect(response.headers.get("x-robots-tag")).toBe("noindex");
}

describe("who may manage a study's read-only links", () => {
  const refused: [Caller, number][] = [
    ["editor", 403],
    ["reviewer", 403],
    ["viewer", 403],
    ["outsider", 404],
    ["nobody", 401],
  ];

  it("an owner lists, makes and revokes links", async () => {
    const owner = cookies.get("owner");
    const { link } = await made(studyA, owner, "Owner's own check");
    const list = await listLinks(studyA, owner);
    expect(list.status).toBe(200);
    expect(((await list.json()) as ShareLinksResponse).links.map((item) => item.id)).toContain(link.id);
    const revoked = await revokeLink(studyA, link.id, owner);
    expect(revoked.status).toBe(200);
    expect(((await revoked.json()) as { link: ShareLinkItem }).link.revokedAt).not.toBeNull();
  });

  for (const [caller, status] of refused) {
    it(`${caller === "nobody" ? "someone signed out" : caller === "outsider" ? "someone outside the team" : `the ${caller}`} can neither list, make nor revoke links (${status})`, async () => {
      const { link, token } = await made(studyA, cookies.get("owner"), `Refusal check for ${caller}`);
      const cookie = cookies.get(caller);
      expect((await listLinks(studyA, cookie)).status).toBe(status);
      expect((await createLink(studyA, cookie)).status).toBe(status);
      expect((await revokeLink(studyA, link.id, cookie)).status).toBe(status);
      // The refused revoke changed nothing: the link still opens the study.
      expect((await openShared(token)).status).toBe(200);
    });
  }

  it("a label is required and limited, and the 400 names the field", async () => {
    for (const body of [{ label: "   " }, { label: "x".repeat(81) }, {}]) {
      const response = await createLink(studyA, cookies.get("owner"), body);
      expect(response.status).toBe(400);
      const error = ((await response.json()) as { error: { issues: { path: string }[] } }).error;
      expect(error.issues[0]?.path).toBe("label");
    }
  });

  it("a link of another study cannot be revoked through this study's address", async () => {
    const { link, token } = await made(studyB, cookies.get("outsider"), "Outsider's link");
    expect((await revokeLink(studyA, link.id, cookies.get("owner"))).status).toBe(404);
    expect((await openShared(token)).status).toBe(200);
  });
});

describe("the secret", () => {
  it("is answered once, in the URL, and only its SHA-256 is stored", async () => {
    const { link, token, url } = await made(studyA, cookies.get("owner"), "Hash check");
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(token, "base64url")).toHaveLength(32);
    expect(url).toBe(`http://localhost:3000/shared/${token}`);

    const db = await getDb();
    const [row] = await db.select().from(studyShareLink).where(eq(studyShareLink.id, link.id));
    expect(row?.tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(token);

    const list = await (await listLinks(studyA, cookies.get("owner"))).text();
    expect(list).toContain(link.id);
    expect(list).not.toContain(token);
    expect(list).not.toContain(row!.tokenHash);
  });
});

describe("opening a study by its link, signed out", () => {
  it("answers the study's heading, notebook, scenes and runs, with no-store and noindex", async () => {
    const { token } = await made(studyA, cookies.get("owner"), "Content check");
    const response = await openShared(token);
    expect(response.status).toBe(200);
    expectSharedHeaders(response);
    const body = (await response.json()) as SharedStudyResponse;
    expect(body.study.teamName).toBe(demoTeam.name);
    expect(body.study.title.length).toBeGreaterThan(0);
    expect(body.blocks.some((block) => block.kind === "notes")).toBe(true);
    expect(body.scenes.length).toBeGreaterThanOrEqual(3);
    const shared = body.runs.find((item) => item.id === runA.id);
    expect(shared?.reviewState).toBe("unreviewed");
    expect(shared?.summary?.grid.cells).toBeGreaterThan(0);
    expect(shared?.figures?.warningCount).toBe(shared?.summary?.warnings.length);
    expect(shared?.createdById).toBeNull();
    // Only this study's runs; nothing of the team beyond its name.
    expect(body.runs.every((item) => item.studyId === studyA)).toBe(true);
    expect(body.runs.map((item) => item.id)).not.toContain(runB.id);
    expect(JSON.stringify(body)).not.toContain('"teamId"');
  });

  it("serves the stored payload of a run of the study, byte for byte", async () => {
    const { token } = await made(studyA, cookies.get("owner"), "Result check");
    const response = await openSharedResult(token, runA.id);
    expect(response.status).toBe(200);
    expectSharedHeaders(response);
    expect(response.headers.get("content-type")).toBe("application/octet-stream");
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(bytes.byteLength).toBe(runA.resultBytes);
  });

  it("answers 404 for a run of another study, and a token of study A never opens study B", async () => {
    const a = await made(studyA, cookies.get("owner"), "Cross-study check A");
    const b = await made(studyB, cookies.get("outsider"), "Cross-study check B");
    const crossed = await openSharedResult(a.token, runB.id);
    expect(crossed.status).toBe(404);
    expectSharedHeaders(crossed);
    expect((await openSharedResult(b.token, runA.id)).status).toBe(404);
    expect((await openSharedResult(a.token, "not-a-run-id")).status).toBe(404);

    const bodyB = (await (await openShared(b.token)).json()) as SharedStudyResponse;
    expect(bodyB.study.title).toBe("Outsider's private study");
    expect(bodyB.runs.map((item) => item.id)).toEqual([runB.id]);
    const bodyA = (await (await openShared(a.token)).json()) as SharedStudyResponse;
    expect(bodyA.study.title).not.toBe("Outsider's private study");
    expect(bodyA.runs.map((item) => item.id)).not.toContain(runB.id);
  });

  it("answers 404 with a plain message for unknown and malformed tokens", async () => {
    for (const token of ["A".repeat(43), "short", "../../api/me", `${"A".repeat(42)}=`]) {
      const response = await openShared(token);
      expect(response.status).toBe(404);
      expectSharedHeaders(response);
      const body = (await response.json()) as { error: { message: string } };
      expect(body.error.message).toMatch(/does not work/);
    }
  });

  it("stops working at once when revoked, and the revocation is recorded once", async () => {
    const owner = cookies.get("owner");
    const { link, token } = await made(studyA, owner, "Revocation check");
    expect((await openShared(token)).status).toBe(200);
    expect((await openSharedResult(token, runA.id)).status).toBe(200);

    const revoked = await revokeLink(studyA, link.id, owner);
    expect(revoked.status).toBe(200);
    const after = ((await revoked.json()) as { link: ShareLinkItem }).link;
    expect(after.revokedAt).not.toBeNull();
    expect(after.revokedByName).toBe(demoMembers.find((member) => member.role === "owner")?.name);

    const gone = await openShared(token);
    expect(gone.status).toBe(404);
    expectSharedHeaders(gone);
    expect((await openSharedResult(token, runA.id)).status).toBe(404);

    // Revoking again changes nothing: same time, no second activity.
    const again = ((await (await revokeLink(studyA, link.id, owner)).json()) as { link: ShareLinkItem }).link;
    expect(again.revokedAt).toBe(after.revokedAt);
    const activity = await listActivityByStudyId({ studyId: studyA, limit: 200 });
    const about = activity.filter((item) => item.subjectId === link.id);
    expect(about.map((item) => item.action).sort()).toEqual(["share_link.created", "share_link.revoked"]);
    expect(about.every((item) => item.subjectType === "share_link")).toBe(true);

    const listed = ((await (await listLinks(studyA, owner)).json()) as ShareLinksResponse).links.find((item) => item.id === link.id);
    expect(listed?.revokedAt).toBe(after.revokedAt);
    expect(listed?.label).toBe("Revocation check");
  });

  it("offers no way to write", () => {
    expect(Object.keys(sharedStudyRoute).filter((name) => /^[A-Z]+$/.test(name))).toEqual(["GET"]);
    expect(Object.keys(sharedResultRoute).filter((name) => /^[A-Z]+$/.test(name))).toEqual(["GET"]);
  });
});
