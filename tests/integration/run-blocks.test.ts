import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as blockRoute from "@/app/api/blocks/[blockId]/route";
import * as runRoute from "@/app/api/runs/[runId]/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as blocksRoute from "@/app/api/studies/[studyId]/blocks/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import { closeDb } from "@/db/client";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { runScene } from "@/lib/fdtd/simulation";
import type { BlockItem, RunRecord, SceneRecord } from "@/lib/http/api-types";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { callRoute, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinySceneInput } from "../run-record/fixtures";

let cookies = new Map<TeamRole, string>();
let studyId = "";
let sceneRecord: SceneRecord;
let savedRun: RunRecord;

async function blocks(): Promise<BlockItem[]> {
  const response = await callRoute(blocksRoute.GET, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookies.get("viewer") });
  return ((await response.json()) as { blocks: BlockItem[] }).blocks;
}

function addRunBlock(role: TeamRole, runId: string, afterBlockId: string | null = null) {
  return callRoute(blocksRoute.POST, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookies.get(role), body: { kind: "run", content: { runId }, afterBlockId } });
}

beforeAll(async () => {
  ({ cookies, studyId } = await openDemoStudy());
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie: cookies.get("editor"), body: { name: "Run block check", data: tinySceneInput() } });
  sceneRecord = ((await created.json()) as { scene: SceneRecord }).scene;
  const scene = parseSceneOrThrow(sceneRecord.data);
  const encoded = encodeRunPayload({ result: runScene(scene), scene, sceneVersion: sceneRecord.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const request = new Request(`${testOrigin}/api/scenes/${sceneRecord.id}/runs`, {
    method: "POST",
    headers: { origin: testOrigin, cookie: cookies.get("editor")!, "content-type": "application/octet-stream" },
    body: encoded.bytes,
  });
  const uploaded = await sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: sceneRecord.id }) });
  expect(uploaded.status).toBe(201);
  savedRun = ((await uploaded.json()) as { run: RunRecord }).run;
});
afterAll(async () => {
  await closeDb();
});

describe("run blocks in the study notebook", () => {
  it("adds a run's block right after its scene's block", async () => {
    const sceneBlock = (await blocks()).find((b) => b.kind === "scene" && (b.content as { sceneId: string }).sceneId === sceneRecord.id)!;
    const response = await addRunBlock("editor", savedRun.id, sceneBlock.id);
    expect(response.status).toBe(201);
    const order = (await blocks()).map((b) => b.id);
    const added = ((await response.json()) as { block: BlockItem }).block;
    expect(order.indexOf(added.id)).toBe(order.indexOf(sceneBlock.id) + 1);
    expect(added.content).toEqual({ runId: savedRun.id });
  });

  it("shows a run once: adding its block again answers the existing block", async () => {
    const before = await blocks();
    const response = await addRunBlock("owner", savedRun.id);
    expect(response.status).toBe(200);
    const again = ((await response.json()) as { block: BlockItem }).block;
    expect(again.id).toBe(before.find((b) => b.kind === "run")!.id);
    expect(await blocks()).toHaveLength(before.length);
  });

  it("refuses a run that is not saved in this study", async () => {
    const response = await addRunBlock("editor", "00000000-0000-4000-8000-00000000abcd");
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues[0]!.path).toBe("content.runId");
  });

  it("does not let a reviewer or a viewer add a run block", async () => {
    expect((await addRunBlock("reviewer", savedRun.id)).status).toBe(403);
    expect((await addRunBlock("viewer", savedRun.id)).status).toBe(403);
  });

  it("removing the block keeps the saved run", async () => {
    const runBlock = (await blocks()).find((b) => b.kind === "run")!;
    const removed = await callRoute(blockRoute.DELETE, { method: "DELETE", path: `/api/blocks/${runBlock.id}`, params: { blockId: runBlock.id }, cookie: cookies.get("editor") });
    expect(removed.status).toBe(204);
    expect((await blocks()).some((b) => b.kind === "run")).toBe(false);
    const run = await callRoute(runRoute.GET, { path: `/api/runs/${savedRun.id}`, params: { runId: savedRun.id }, cookie: cookies.get("viewer") });
    expect(run.status).toBe(200);
  });
});
