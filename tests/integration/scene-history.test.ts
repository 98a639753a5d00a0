import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as sceneRoute from "@/app/api/scenes/[sceneId]/route";
import * as restoreRoute from "@/app/api/scenes/[sceneId]/versions/[version]/restore/route";
import * as versionRoute from "@/app/api/scenes/[sceneId]/versions/[version]/route";
import * as versionsRoute from "@/app/api/scenes/[sceneId]/versions/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import type { SceneRecord, SceneVersionItem, StudyResponse } from "@/lib/http/api-types";
import { callRoute, cookieFrom, signInAs, signUp } from "../helpers/api";

const cookies = new Map<TeamRole | "outsider", string>();
let studyId = "";
let sceneId = "";
let firstData: Record<string, unknown> = {};

function cookieOf(caller: TeamRole | "outsider"): string {
  return cookies.get(caller)!;
}

async function readScene(): Promise<SceneRecord> {
  const response = await callRoute(sceneRoute.GET, { path: `/api/scenes/${sceneId}`, params: { sceneId }, cookie: cookieOf("owner") });
  return ((await response.json()) as { scene: SceneRecord }).scene;
}

async function readVersions(): Promise<SceneVersionItem[]> {
  const response = await callRoute(versionsRoute.GET, { path: `/api/scenes/${sceneId}/versions`, params: { sceneId }, cookie: cookieOf("owner") });
  return ((await response.json()) as { versions: SceneVersionItem[] }).versions;
}

async function readVersionData(version: number): Promise<unknown> {
  const response = await callRoute(versionRoute.GET, { path: `/api/scenes/${sceneId}/versions/${version}`, params: { sceneId, version: String(version) }, cookie: cookieOf("owner") });
  return ((await response.json()) as { data: unknown }).data;
}

function restore(cookie: string | undefined, version: string | number, body: unknown) {
  return callRoute(restoreRoute.POST, {
    method: "POST",
    path: `/api/scenes/${sceneId}/versions/${version}/restore`,
    params: { sceneId, version: String(version) },
    cookie,
    body,
  });
}

/** Saves `changes` over the current scene as the editor, and answers the new record. */
async function saveChange(changes: Record<string, unknown>, note: string): Promise<SceneRecord> {
  const current = await readScene();
  const response = await callRoute(sceneRoute.PUT, {
    method: "PUT",
    path: `/api/scenes/${sceneId}`,
    params: { sceneId },
    cookie: cookieOf("editor"),
    body: { baseVersion: current.version, name: current.name, description: current.description, data: { ...(current.data as object), ...changes }, note },
  });
  expect(response.status).toBe(200);
  return ((await response.json()) as { scene: SceneRecord }).scene;
}

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", cookieFrom(await signUp({ name: "Someone Else", email: "someone-else@example.org", password: "someone-else-password" })));
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookieOf("owner") });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookieOf("owner") });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
  const detail = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie: cookieOf("owner") });
  sceneId = ((await detail.json()) as StudyResponse).scenes[0]!.id;
  const original = await readScene();
  firstData = (await readVersionData(original.version)) as Record<string, unknown>;
  // Two saved changes on top of the seeded version, so there is something to go back over.
  await saveChange({ duration: { kind: "time", seconds: 0.31 } }, "Longer run");
  await saveChange({ duration: { kind: "time", seconds: 0.42 } }, "Longer still");
});
afterAll(async () => {
  await closeDb();
});

describe("restoring a scene version", () => {
  it("saves the chosen version's data as a new latest version, noted and attributed", async () => {
    const before = await readScene();
    const target = before.version - 2;
    const response = await restore(cookieOf("editor"), target, { baseVersion: before.version });
    expect(response.status).toBe(201);
    const restored = ((await response.json()) as { scene: SceneRecord }).scene;
    expect(restored.version).toBe(before.version + 1);
    expect(restored.data).toEqual(firstData);
    expect(restored.name).toBe(before.name);
    expect(await readVersionData(restored.version)).toEqual(firstData);
    // The history only grows: the versions restored over are still there.
    const versions = await readVersions();
    expect(versions.map((v) => v.version).slice(0, 4)).toEqual([before.version + 1, before.version, before.version - 1, target]);
    expect(versions[0]).toMatchObject({ authorName: "Tomas Lindgren", note: `Restored version ${target}` });
    expect(((await readVersionData(before.version)) as { duration: unknown }).duration).toEqual({ kind: "time", seconds: 0.42 });
  });

  it("records the restore in the study's activity", async () => {
    const current = await readScene();
    const detail = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie: cookieOf("owner") });
    const { activity } = (await detail.json()) as StudyResponse;
    const entry = activity.find((item) => item.subjectId === sceneId && (item.detail as { version?: number }).version === current.version);
    expect(entry).toMatchObject({ action: "scene.saved", actorName: "Tomas Lindgren", detail: { restoredVersion: current.version - 3, note: `Restored version ${current.version - 3}` } });
  });

  it("answers 409 to a restore based on an older version and changes nothing", async () => {
    const before = await readScene();
    const versionsBefore = await readVersions();
    const response = await restore(cookieOf("owner"), 2, { baseVersion: before.version - 1 });
    expect(response.status).toBe(409);
    expect(await response.json()).toMatchObject({ error: { code: "conflict:scene" } });
    const after = await readScene();
    expect(after.version).toBe(before.version);
    expect(after.data).toEqual(before.data);
    expect(await readVersions()).toEqual(versionsBefore);
  });

  it("does not let a reviewer or a viewer restore, and changes nothing", async () => {
    const before = await readScene();
    for (const role of ["reviewer", "viewer"] as const) {
      const response = await restore(cookieOf(role), 2, { baseVersion: before.version });
      expect(response.status).toBe(403);
    }
    expect((await readScene()).version).toBe(before.version);
  });

  it("hides the scene from someone outside the team and asks a stranger to sign in", async () => {
    const { version } = await readScene();
    expect((await restore(cookieOf("outsider"), 1, { baseVersion: version })).status).toBe(404);
    expect((await restore(undefined, 1, { baseVersion: version })).status).toBe(401);
  });

  it("answers 404 for a version the scene never had", async () => {
    const before = await readScene();
    const response = await restore(cookieOf("owner"), before.version + 5, { baseVersion: before.version });
    expect(response.status).toBe(404);
    expect(await response.json()).toMatchObject({ error: { code: "not_found:version" } });
    expect((await readScene()).version).toBe(before.version);
  });

  it("answers 400 for a version that is not a number and for a body without baseVersion", async () => {
    const { version } = await readScene();
    expect((await restore(cookieOf("owner"), "latest", { baseVersion: version })).status).toBe(400);
    const missing = await restore(cookieOf("owner"), 1, {});
    expect(missing.status).toBe(400);
    expect(((await missing.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("baseVersion");
  });
});
