import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as forkTargetsRoute from "@/app/api/me/fork-targets/route";
import * as meRoute from "@/app/api/me/route";
import * as forkRoute from "@/app/api/scenes/[sceneId]/fork/route";
import * as lineageRoute from "@/app/api/scenes/[sceneId]/lineage/route";
import * as sceneRoute from "@/app/api/scenes/[sceneId]/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as blocksRoute from "@/app/api/studies/[studyId]/blocks/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { listActivityByStudyId } from "@/db/queries/activity";
import { createRun } from "@/db/queries/runs";
import { createStudy } from "@/db/queries/studies";
import { addMembership, createTeam } from "@/db/queries/teams";
import { getUserIdByEmail } from "@/db/queries/users";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import type { BlocksResponse, SceneRecord, StudyResponse } from "@/lib/http/api-types";
import type { ForkTargetsResponse, LineageResponse } from "@/lib/http/fork-types";
import type { RunSummary } from "@/lib/run-record/summary";
import { callRoute, cookieFrom, signInAs, signUp } from "../helpers/api";

type Caller = TeamRole | "outsider" | "bea" | "nobody";
const cookies = new Map<Caller, string>();
let demoTeamId = "";
let studyId = "";
let originId = "";
/** A study of Bea's team, where the demo editor (Tomas) is also an editor. */
let harbourStudyId = "";
/** A study of a team where Tomas is only a viewer. */
let lookoutStudyId = "";
let originVersion1Duration: unknown;

const cookieOf = (caller: Caller) => (caller === "nobody" ? undefined : cookies.get(caller));

function fork(caller: Caller, body: unknown, sceneId = originId) {
  return callRoute(forkRoute.POST, { method: "POST", path: `/api/scenes/${sceneId}/fork`, params: { sceneId }, cookie: cookieOf(caller), body });
}

async function forkOk(caller: Caller, body: unknown, sceneId = originId): Promise<SceneRecord> {
  const response = await fork(caller, body, sceneId);
  expect(response.status, await response.clone().text()).toBe(201);
  return ((await response.json()) as { scene: SceneRecord }).scene;
}

async function lineage(caller: Caller, sceneId: string): Promise<{ status: number; body: LineageResponse; text: string }> {
  const response = await callRoute(lineageRoute.GET, { path: `/api/scenes/${sceneId}/lineage`, params: { sceneId }, cookie: cookieOf(caller) });
  const text = await response.text();
  return { status: response.status, body: JSON.parse(text) as LineageResponse, text };
}

async function readScene(caller: Caller, sceneId: string): Promise<SceneRecord> {
  const response = await callRoute(sceneRoute.GET, { path: `/api/scenes/${sceneId}`, params: { sceneId }, cookie: cookieOf(caller) });
  expect(response.status).toBe(200);
  return ((await response.json()) as { scene: SceneRecord }).scene;
}

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Person", email: "forks-outsider@example.org", password: "outsider-password" })));
  cookies.set("bea", cookieFrom(await signUp({ name: "Bea Harbour", email: "bea@harbour.test", password: "bea-harbour-password" })));
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookieOf("owner") });
  demoTeamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${demoTeamId}/studies`, params: { teamId: demoTeamId }, cookie: cookieOf("owner") });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
  const detail = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie: cookieOf("owner") });
  originId = ((await detail.json()) as StudyResponse).scenes[0]!.id;

  // Version 2 of the origin, written by the editor (version 1 is the seed's, written by the owner).
  const origin = await readScene("owner", originId);
  originVersion1Duration = (origin.data as { duration: unknown }).duration;
  const saved = await callRoute(sceneRoute.PUT, {
    method: "PUT",
    path: `/api/scenes/${originId}`,
    params: { sceneId: originId },
    cookie: cookieOf("editor"),
    body: { baseVersion: origin.version, name: origin.name, description: origin.description, data: { ...(origin.data as object), duration: { kind: "time", seconds: 0.37 } }, note: "Longer" },
  });
  expect(saved.status).toBe(200);

  // Two more teams for Tomas (the demo editor): Bea's, where he edits; and one where he only reads.
  const tomasId = (await getUserIdByEmail({ email: demoMembers.find((m) => m.role === "editor")!.email }))!;
  const beaId = (await getUserIdByEmail({ email: "bea@harbour.test" }))!;
  const harbour = await createTeam({ name: "Harbour Acoustics" });
  await addMembership({ teamId: harbour.id, userId: beaId, role: "owner" });
  await addMembership({ teamId: harbour.id, userId: tomasId, role: "editor" });
  harbourStudyId = (await createStudy({ teamId: harbour.id, createdBy: beaId, input: { title: "Quay wall reflections", description: "", siteReference: "" } })).id;
  const lookout = await createTeam({ name: "Lookout Planning" });
  await addMembership({ teamId: lookout.id, userId: beaId, role: "owner" });
  await addMembership({ teamId: lookout.id, userId: tomasId, role: "viewer" });
  lookoutStudyId = (await createStudy({ teamId: lookout.id, createdBy: beaId, input: { title: "Lookout tower", description: "", siteReference: "" } })).id;
});
afterAll(async () => {
  await closeDb();
});

describe("forking a scene", () => {
  it("forks the current version into the same study as a variant, recording origin, version and author", async () => {
    const created = await forkOk("editor", {});
    const origin = await readScene("owner", originId);
    expect(created.studyId).toBe(studyId);
    expect(created.name).toBe(`${origin.name} (fork)`);
    expect(created.version).toBe(1);
    expect(created.isReference).toBe(false);
    expect(created.forkedFromSceneId).toBe(originId);
    expect(created.forkedFromVersion).toBe(origin.version);
    expect((created.data as { duration: unknown }).duration).toEqual({ kind: "time", seconds: 0.37 });
    const up = await lineage("editor", created.id);
    expect(up.body.origins).toHaveLength(1);
    expect(up.body.origins[0]).toMatchObject({ forkedVersion: 2, versionAuthorName: "Tomas Lindgren", scene: { access: "open", sceneId: originId, studyId } });
  });

  it("copies an old version's data when asked for it, and names that version's author", async () => {
    const created = await forkOk("owner", { fromVersion: 1, name: "Seeded geometry again" });
    expect(created.name).toBe("Seeded geometry again");
    expect(created.forkedFromVersion).toBe(1);
    expect((created.data as { duration: unknown; name: string }).duration).toEqual(originVersion1Duration);
    expect((created.data as { name: string }).name).toBe("Seeded geometry again");
    const up = await lineage("owner", created.id);
    expect(up.body.origins[0]).toMatchObject({ forkedVersion: 1, versionAuthorName: "Ines Okafor" });
  });

  it("puts a same-study fork in the notebook right after its origin", async () => {
    const created = await forkOk("editor", { name: "Notebook placement" });
    const response = await callRoute(blocksRoute.GET, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookieOf("owner") });
    const sceneIds = ((await response.json()) as BlocksResponse).blocks.filter((b) => b.kind === "scene").map((b) => (b.content as { sceneId: string }).sceneId);
    expect(sceneIds.filter((id) => id === created.id)).toHaveLength(1);
    expect(sceneIds[sceneIds.indexOf(originId) + 1]).toBe(created.id);
  });

  it("forks into a study of another team the caller edits, and records the fork in both studies", async () => {
    const created = await forkOk("editor", { targetStudyId: harbourStudyId, name: "Harbour copy" });
    expect(created.studyId).toBe(harbourStudyId);
    const response = await callRoute(blocksRoute.GET, { path: `/api/studies/${harbourStudyId}/blocks`, params: { studyId: harbourStudyId }, cookie: cookieOf("bea") });
    expect(((await response.json()) as BlocksResponse).blocks.some((b) => b.kind === "scene" && (b.content as { sceneId: string }).sceneId === created.id)).toBe(true);

    const inTarget = (await listActivityByStudyId({ studyId: harbourStudyId })).find((a) => a.action === "scene.forked" && a.subjectId === created.id);
    expect(inTarget?.detail).toMatchObject({ originSceneId: originId, originVersion: 2, forkName: "Harbour copy", forkSceneId: created.id, targetStudyId: harbourStudyId });
    // The origin's team hears of it without learning the other team's names or ids.
    const inOrigin = (await listActivityByStudyId({ studyId })).filter((a) => a.action === "scene.forked" && a.subjectId === originId);
    const crossTeam = inOrigin.find((a) => (a.detail as { intoOtherTeam?: boolean }).intoOtherTeam);
    expect(crossTeam?.detail).toMatchObject({ originSceneId: originId, forkName: null, forkSceneId: null, targetStudyId: null });
    expect(JSON.stringify(inOrigin)).not.toContain(created.id);
  });

  it("records a same-study fork once, in that study", async () => {
    const created = await forkOk("editor", { name: "Counted once" });
    const entries = (await listActivityByStudyId({ studyId })).filter((a) => a.action === "scene.forked" && (a.detail as { forkSceneId?: string }).forkSceneId === created.id);
    expect(entries).toHaveLength(1);
    expect(entries[0]!.subjectId).toBe(created.id);
  });
});

describe("who may fork", () => {
  const sameStudy: { caller: Caller; status: number }[] = [
    { caller: "owner", status: 201 },
    { caller: "editor", status: 201 },
    { caller: "reviewer", status: 403 },
    { caller: "viewer", status: 403 },
    { caller: "outsider", status: 404 },
    { caller: "nobody", status: 401 },
  ];
  for (const row of sameStudy) {
    it(`answers ${row.status} to ${row.caller} forking into the origin's study`, async () => {
      const response = await fork(row.caller, { name: `By ${row.caller}` });
      expect(response.status).toBe(row.status);
      expect(response.headers.get("content-type")).toContain("application/json");
    });
  }

  it("refuses an editor of the origin's team forking into a team where they only view (403)", async () => {
    expect((await fork("editor", { targetStudyId: lookoutStudyId })).status).toBe(403);
  });

  it("answers 404 for a target study in a team the caller is not on", async () => {
    expect((await fork("owner", { targetStudyId: harbourStudyId })).status).toBe(404);
  });

  it("answers 404 to a member of the target team who cannot see the origin", async () => {
    expect((await fork("bea", { targetStudyId: harbourStudyId })).status).toBe(404);
  });

  it("answers 400 naming the field for bad input, and 404 for a version the origin never had", async () => {
    const badTarget = await fork("editor", { targetStudyId: "not-an-id" });
    expect(badTarget.status).toBe(400);
    expect(((await badTarget.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("targetStudyId");
    const badName = await fork("editor", { name: "   " });
    expect(badName.status).toBe(400);
    const extra = await fork("editor", { targetStudy: studyId });
    expect(extra.status).toBe(400);
    expect((await fork("editor", { fromVersion: 99 })).status).toBe(404);
  });
});

describe("fork targets", () => {
  it("lists every study the caller may edit scenes in, over all their teams", async () => {
    const response = await callRoute(forkTargetsRoute.GET, { path: "/api/me/fork-targets", cookie: cookieOf("editor") });
    expect(response.status).toBe(200);
    const { targets } = (await response.json()) as ForkTargetsResponse;
    const ids = targets.map((t) => t.studyId);
    expect(ids).toContain(studyId);
    expect(ids).toContain(harbourStudyId);
    expect(ids).not.toContain(lookoutStudyId);
    expect(targets.find((t) => t.studyId === harbourStudyId)).toMatchObject({ teamName: "Harbour Acoustics", studyTitle: "Quay wall reflections" });
  });

  for (const [caller, expected] of [
    ["reviewer", 0],
    ["viewer", 0],
  ] as const) {
    it(`lists nothing for a ${caller}, who edits nowhere`, async () => {
      const response = await callRoute(forkTargetsRoute.GET, { path: "/api/me/fork-targets", cookie: cookieOf(caller) });
      expect(((await response.json()) as ForkTargetsResponse).targets).toHaveLength(expected);
    });
  }

  it("answers 401 without a session", async () => {
    expect((await callRoute(forkTargetsRoute.GET, { path: "/api/me/fork-targets" })).status).toBe(401);
  });
});

describe("lineage", () => {
  let child = "";
  let grandchild = "";
  let abroad = "";
  let runId = "";

  beforeAll(async () => {
    child = (await forkOk("editor", { name: "Lineage child" })).id;
    grandchild = (await forkOk("owner", { name: "Lineage grandchild" }, child)).id;
    abroad = (await forkOk("editor", { name: "Lineage abroad", targetStudyId: harbourStudyId }, child)).id;
    const ownerId = (await getUserIdByEmail({ email: demoMembers[0]!.email }))!;
    const childRecord = await readScene("owner", child);
    runId = (
      await createRun({
        teamId: demoTeamId,
        studyId,
        sceneId: child,
        sceneVersion: 1,
        sceneSnapshot: childRecord.data,
        settings: {},
        inputHash: "0".repeat(64),
        solverVersion: "test",
        status: "completed",
        statusMessage: "",
        summary: {} as RunSummary,
        resultData: new Uint8Array([1, 2, 3]),
        createdBy: ownerId,
        sceneName: childRecord.name,
      })
    ).id;
  });

  it("shows forks downward, recursively, with who forked which version and the latest completed run", async () => {
    const { status, body } = await lineage("owner", originId);
    expect(status).toBe(200);
    expect(body.origins).toEqual([]);
    const childEntry = body.forks.find((f) => f.scene.access === "open" && f.scene.sceneId === child);
    expect(childEntry).toMatchObject({ forkedVersion: 2, forkedByName: "Tomas Lindgren", scene: { name: "Lineage child", latestRun: { id: runId, sceneVersion: 1 } } });
    expect(childEntry!.forks.find((f) => f.scene.access === "open" && f.scene.sceneId === grandchild)).toMatchObject({ forkedVersion: 1, forkedByName: "Ines Okafor" });
  });

  it("shows the origin chain upward from a fork of a fork", async () => {
    const { body } = await lineage("owner", grandchild);
    expect(body.scene.id).toBe(grandchild);
    expect(body.origins.map((o) => (o.scene.access === "open" ? o.scene.sceneId : o.scene.access))).toEqual([child, originId]);
    expect(body.origins[0]!.scene).toMatchObject({ latestRun: { id: runId } });
  });

  it("shows a fork in a team the caller is not on only as 'in another team', without ids or names", async () => {
    const { body, text } = await lineage("owner", child);
    const hidden = body.forks.filter((f) => f.scene.access === "other-team");
    expect(hidden).toHaveLength(1);
    expect(hidden[0]).toMatchObject({ forkedByName: null, scene: { access: "other-team" } });
    expect(text).not.toContain(abroad);
    expect(text).not.toContain("Lineage abroad");
    expect(text).not.toContain("Harbour");
  });

  it("shows origins in a team the caller is not on only as 'in another team', and the chain goes on through them", async () => {
    const { status, body, text } = await lineage("bea", abroad);
    expect(status).toBe(200);
    expect(body.origins.map((o) => o.scene.access)).toEqual(["other-team", "other-team"]);
    expect(body.origins.map((o) => o.versionAuthorName)).toEqual([null, null]);
    expect(body.origins[0]!.forkedVersion).toBe(1);
    for (const secret of [child, originId, studyId, "Lineage child", "Tomas", "Ines", "Alder Row", "Fernhill"]) expect(text).not.toContain(secret);
  });

  it("opens both teams' scenes for someone on both", async () => {
    const { body } = await lineage("editor", abroad);
    expect(body.origins.map((o) => o.scene.access)).toEqual(["open", "open"]);
  });

  const readers: { caller: Caller; status: number }[] = [
    { caller: "owner", status: 200 },
    { caller: "editor", status: 200 },
    { caller: "reviewer", status: 200 },
    { caller: "viewer", status: 200 },
    { caller: "outsider", status: 404 },
    { caller: "nobody", status: 401 },
  ];
  for (const row of readers) {
    it(`answers ${row.status} to ${row.caller} reading a lineage`, async () => {
      expect((await lineage(row.caller, originId)).status).toBe(row.status);
    });
  }
});
