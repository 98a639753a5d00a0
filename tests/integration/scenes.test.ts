import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as sceneRoute from "@/app/api/scenes/[sceneId]/route";
import * as versionRoute from "@/app/api/scenes/[sceneId]/versions/[version]/route";
import * as versionsRoute from "@/app/api/scenes/[sceneId]/versions/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { SceneRecord } from "@/lib/http/api-types";
import { callRoute, signInAs } from "../helpers/api";

let owner = "";
let editor = "";
let reviewer = "";
let studyId = "";
let scene: SceneRecord;

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  owner = await signInAs(demoMembers.find((m) => m.role === "owner")!.email, demoPassword);
  editor = await signInAs(demoMembers.find((m) => m.role === "editor")!.email, demoPassword);
  reviewer = await signInAs(demoMembers.find((m) => m.role === "reviewer")!.email, demoPassword);
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: owner });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: owner });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
  const detail = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie: owner });
  const sceneId = ((await detail.json()) as { scenes: { id: string }[] }).scenes[1]!.id;
  scene = ((await (await callRoute(sceneRoute.GET, { path: `/api/scenes/${sceneId}`, params: { sceneId }, cookie: owner })).json()) as { scene: SceneRecord }).scene;
});
afterAll(async () => {
  await closeDb();
});

function save(cookie: string, body: Record<string, unknown>) {
  return callRoute(sceneRoute.PUT, { method: "PUT", path: `/api/scenes/${scene.id}`, params: { sceneId: scene.id }, cookie, body });
}

describe("saving scenes", () => {
  it("saves a new version when the caller edited the latest one", async () => {
    const data = { ...(scene.data as object), duration: { kind: "time", seconds: 0.25 } };
    const response = await save(editor, { baseVersion: scene.version, name: scene.name, description: scene.description, data, note: "Longer run" });
    expect(response.status).toBe(200);
    expect(((await response.json()) as { scene: SceneRecord }).scene.version).toBe(scene.version + 1);
  });

  it("answers 409 to a save based on an older version and keeps the newer one", async () => {
    const stale = await save(owner, { baseVersion: scene.version, name: "Overwritten?", description: "", data: scene.data });
    expect(stale.status).toBe(409);
    expect(await stale.json()).toMatchObject({ error: { code: "conflict:scene" } });
    const current = await callRoute(sceneRoute.GET, { path: `/api/scenes/${scene.id}`, params: { sceneId: scene.id }, cookie: owner });
    expect(((await current.json()) as { scene: SceneRecord }).scene.name).toBe(scene.name);
  });

  it("answers 400 naming the scene path of an invalid scene", async () => {
    const data = { ...(scene.data as object), resolution: { kind: "frequency", maxFrequency: 400, courantNumber: 0.9 } };
    const response = await save(owner, { baseVersion: scene.version + 1, name: scene.name, data });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string; message: string }[] } };
    expect(body.error.issues[0]!.path).toBe("data.resolution.courantNumber");
    expect(body.error.issues[0]!.message).toMatch(/stability limit/);
  });

  it("does not let a reviewer edit a scene", async () => {
    const response = await save(reviewer, { baseVersion: scene.version + 1, name: "Reviewer's edit", data: scene.data });
    expect(response.status).toBe(403);
  });

  it("lists the history and serves an older version's JSON", async () => {
    const history = await callRoute(versionsRoute.GET, { path: `/api/scenes/${scene.id}/versions`, params: { sceneId: scene.id }, cookie: reviewer });
    const { versions } = (await history.json()) as { versions: { version: number; authorName: string; note: string }[] };
    expect(versions.map((v) => v.version)).toEqual([scene.version + 1, scene.version]);
    expect(versions[0]).toMatchObject({ authorName: "Tomas Lindgren", note: "Longer run" });
    const old = await callRoute(versionRoute.GET, {
      path: `/api/scenes/${scene.id}/versions/${scene.version}`,
      params: { sceneId: scene.id, version: String(scene.version) },
      cookie: reviewer,
    });
    expect(((await old.json()) as { data: { duration: unknown } }).data.duration).toEqual((scene.data as { duration: unknown }).duration);
  });

  it("creates a scene from a template and refuses an unknown one", async () => {
    const created = await callRoute(studyScenesRoute.POST, {
      path: `/api/studies/${studyId}/scenes`,
      params: { studyId },
      cookie: editor,
      body: { name: "Canyon check", templateId: "street-canyon" },
    });
    expect(created.status).toBe(201);
    const unknown = await callRoute(studyScenesRoute.POST, {
      path: `/api/studies/${studyId}/scenes`,
      params: { studyId },
      cookie: editor,
      body: { name: "Nothing", templateId: "no-such-template" },
    });
    expect(unknown.status).toBe(400);
  });
});
