// Charts of saved runs in the notebook: only runs of the study itself, only for those who may edit it,
// and an insertion loss always names its run and reference.
import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as blocksRoute from "@/app/api/studies/[studyId]/blocks/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as meRoute from "@/app/api/me/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import type { BlockItem, RunRecord, SceneRecord } from "@/lib/http/api-types";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { callRoute, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinyRun, tinySceneInput } from "../run-record/fixtures";

let cookies = new Map<TeamRole, string>();
let studyId = "";
let runIds: string[] = [];
let otherStudyRunId = "";

/** Saves a scene in the study and uploads the tiny run of it as a saved run of that scene. */
async function saveRun(inStudy: string, name: string): Promise<string> {
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${inStudy}/scenes`, params: { studyId: inStudy }, cookie: cookies.get("editor"), body: { name, data: tinySceneInput() } });
  expect(created.status).toBe(201);
  const record = ((await created.json()) as { scene: SceneRecord }).scene;
  const scene = parseSceneOrThrow(record.data);
  const encoded = encodeRunPayload({ result: tinyRun().result, scene, sceneVersion: record.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const request = new Request(`${testOrigin}/api/scenes/${record.id}/runs`, {
    method: "POST",
    headers: { origin: testOrigin, cookie: cookies.get("editor")!, "content-type": "application/octet-stream" },
    body: encoded.bytes,
  });
  const uploaded = await sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: record.id }) });
  expect(uploaded.status).toBe(201);
  return ((await uploaded.json()) as { run: RunRecord }).run.id;
}

function addChart(role: TeamRole, content: unknown, afterBlockId: string | null = null): Promise<Response> {
  return callRoute(blocksRoute.POST, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookies.get(role), body: { kind: "chart", content, afterBlockId } });
}

async function issuePaths(response: Response): Promise<string[]> {
  const body = (await response.json()) as { error: { issues?: { path: string }[] } };
  return (body.error.issues ?? []).map((issue) => issue.path);
}

beforeAll(async () => {
  ({ cookies, studyId } = await openDemoStudy());
  runIds = [await saveRun(studyId, "Chart check: design"), await saveRun(studyId, "Chart check: reference")];
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get("owner") });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const other = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner"), body: { title: "Another study for chart checks" } });
  expect(other.status).toBe(201);
  otherStudyRunId = await saveRun(((await other.json()) as { study: { id: string } }).study.id, "Elsewhere");
});
afterAll(async () => {
  await closeDb();
});

describe("charts of saved runs in the notebook", () => {
  it("lets an editor keep a band-level chart of this study's run, with its choices", async () => {
    const content = { runIds: [runIds[0]], quantity: "band-levels", receiverIds: ["rx"], bandsPerOctave: 3, weighting: "A" };
    const response = await addChart("editor", content);
    expect(response.status).toBe(201);
    const { block } = (await response.json()) as { block: BlockItem };
    expect(block.kind).toBe("chart");
    expect(block.content).toEqual(content);
  });

  it("keeps an insertion-loss chart of a run and its reference", async () => {
    const response = await addChart("owner", { runIds, quantity: "insertion-loss", receiverIds: ["rx"], bandsPerOctave: 1, weighting: "Z" });
    expect(response.status).toBe(201);
  });

  it("refuses a run of another study, naming content.runIds", async () => {
    const response = await addChart("editor", { runIds: [runIds[0], otherStudyRunId], quantity: "trace" });
    expect(response.status).toBe(400);
    expect(await issuePaths(response)).toEqual(["content.runIds"]);
  });

  it("refuses a run id that names no saved run", async () => {
    const response = await addChart("editor", { runIds: ["00000000-0000-4000-8000-00000000abcd"], quantity: "spectrum" });
    expect(response.status).toBe(400);
    expect(await issuePaths(response)).toEqual(["content.runIds"]);
  });

  it("refuses an insertion-loss chart with only one run", async () => {
    const response = await addChart("editor", { runIds: [runIds[0]], quantity: "insertion-loss" });
    expect(response.status).toBe(400);
    expect(await issuePaths(response)).toContain("content.runIds");
  });

  it("does not let a viewer or a reviewer add a chart", async () => {
    expect((await addChart("viewer", { runIds: [runIds[0]], quantity: "trace" })).status).toBe(403);
    expect((await addChart("reviewer", { runIds: [runIds[0]], quantity: "trace" })).status).toBe(403);
  });
});
