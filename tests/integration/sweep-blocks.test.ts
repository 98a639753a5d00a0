// Sweep results kept in the notebook: a chart block holding the sweep's definition and numbers.
import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as blocksRoute from "@/app/api/studies/[studyId]/blocks/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import { closeDb } from "@/db/client";
import type { TeamRole } from "@/lib/access/roles";
import type { BlockItem, StudyResponse } from "@/lib/http/api-types";
import { chartContentSchema } from "@/lib/validation/blocks";
import { callRoute } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { definition, results } from "../sweeps/fixtures";

let cookies = new Map<TeamRole, string>();
let studyId = "";
let sceneId = "";
let sceneVersion = 1;

function post(role: TeamRole, content: unknown): Promise<Response> {
  return callRoute(blocksRoute.POST, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookies.get(role), body: { kind: "chart", content } });
}

async function blocks(role: TeamRole): Promise<BlockItem[]> {
  const response = await callRoute(blocksRoute.GET, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie: cookies.get(role) });
  return ((await response.json()) as { blocks: BlockItem[] }).blocks;
}

const sweepContent = () => ({ runIds: [], quantity: "sweep", sweep: { definition: { ...definition, sceneId, sceneVersion }, results } });

beforeAll(async () => {
  ({ cookies, studyId } = await openDemoStudy());
  const study = (await (await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie: cookies.get("owner") })).json()) as StudyResponse;
  sceneId = study.scenes[0]!.id;
  sceneVersion = study.scenes[0]!.version;
});
afterAll(async () => {
  await closeDb();
});

describe("sweep blocks in the notebook", () => {
  it("lets an editor keep a sweep, and every member read it back whole", async () => {
    const response = await post("editor", sweepContent());
    expect(response.status).toBe(201);
    const { block } = (await response.json()) as { block: BlockItem };
    const read = (await blocks("viewer")).find((b) => b.id === block.id);
    expect(read?.kind).toBe("chart");
    const parsed = chartContentSchema.parse(read!.content);
    expect(parsed.sweep?.definition).toEqual({ ...definition, sceneId, sceneVersion });
    expect(parsed.sweep?.results.insertionLoss).toEqual(results.insertionLoss);
  });

  it("refuses a sweep from viewers and reviewers", async () => {
    expect((await post("viewer", sweepContent())).status).toBe(403);
    expect((await post("reviewer", sweepContent())).status).toBe(403);
  });

  it("refuses a sweep of a scene that is not in the study, naming the field", async () => {
    const content = sweepContent();
    content.sweep.definition.sceneId = "7d1e2f3a-4b5c-4d6e-8f70-8192a3b4c5d6";
    const response = await post("owner", content);
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues?: { path: string }[] } };
    expect(body.error.issues?.[0]?.path).toBe("content.sweep.definition.sceneId");
  });

  it("refuses results whose shape does not match their values, and a sweep chart without results", async () => {
    const content = sweepContent();
    const broken = { ...content, sweep: { ...content.sweep, results: { ...results, overall: results.overall.slice(0, 1) } } };
    expect((await post("owner", broken)).status).toBe(400);
    expect((await post("owner", { runIds: [], quantity: "sweep" })).status).toBe(400);
  });

  it("still takes a chart of saved runs as before", async () => {
    expect((await post("owner", { runIds: [], quantity: "insertion-loss" })).status).toBe(201);
  });
});
