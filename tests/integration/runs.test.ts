import "../helpers/test-database";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as runRoute from "@/app/api/runs/[runId]/route";
import * as runResultRoute from "@/app/api/runs/[runId]/result/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as studyRunsRoute from "@/app/api/studies/[studyId]/runs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { createRun } from "@/db/queries/runs";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow, type Scene } from "@/lib/fdtd/scene";
import { runScene, type SimulationResult } from "@/lib/fdtd/simulation";
import type { RunListItem, RunRecord, RunResponse, SceneRecord } from "@/lib/http/api-types";
import { computeRunInputHash } from "@/lib/run-record/input-hash";
import { decodeRunPayload, encodeRunPayload } from "@/lib/run-record/payload";
import { defaultRunSettings } from "@/lib/run-record/settings";
import { summariseRun } from "@/lib/run-record/summary";
import { callRoute, cookieFrom, signInAs, signUp, testOrigin } from "../helpers/api";
import { tinySceneInput } from "../run-record/fixtures";
import { flipBit, rewriteHeader } from "../run-record/payload-surgery";

const cookies = new Map<TeamRole | "outsider", string>();
let studyId = "";
let sceneRecord: SceneRecord;
let scene: Scene;
let result: SimulationResult;
let payload: Uint8Array;

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Person", email: "runs-outsider@example.org", password: "outsider-password" })));
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get("owner") });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner") });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
  // A scene small enough to run here, saved as version 1, then run exactly as the browser would.
  const created = await callRoute(studyScenesRoute.POST, {
    path: `/api/studies/${studyId}/scenes`,
    params: { studyId },
    cookie: cookies.get("editor"),
    body: { name: "Tiny run check", data: tinySceneInput() },
  });
  sceneRecord = ((await created.json()) as { scene: SceneRecord }).scene;
  scene = parseSceneOrThrow(sceneRecord.data);
  result = runScene(scene);
  payload = encodeOrThrow(scene);
});
afterAll(async () => {
  await closeDb();
});
afterEach(() => {
  delete process.env.RAREFACT_MAX_RUN_UPLOAD_BYTES;
});

function encodeOrThrow(runScene: Scene, sceneVersion = sceneRecord.version): Uint8Array {
  const encoded = encodeRunPayload({ result, scene: runScene, sceneVersion });
  if (!encoded.ok) throw new Error(encoded.message);
  return encoded.bytes;
}

/**
 * Posts a payload as a browser would. `stream` sends it in two chunks without a Content-Length;
 * `declaredLength` sets a Content-Length, true or not.
 */
function upload(cookie: string | undefined, bytes: Uint8Array, options: { contentType?: string; declaredLength?: number; stream?: boolean } = {}): Promise<Response> {
  const headers = new Headers({ origin: testOrigin, "content-type": options.contentType ?? "application/octet-stream" });
  if (cookie) headers.set("cookie", cookie);
  if (options.declaredLength !== undefined) headers.set("content-length", String(options.declaredLength));
  const half = Math.floor(bytes.length / 2);
  const body = options.stream
    ? new ReadableStream<Uint8Array>({
        start(controller) {
          controller.enqueue(bytes.slice(0, half));
          controller.enqueue(bytes.slice(half));
          controller.close();
        },
      })
    : (bytes as Uint8Array<ArrayBuffer>);
  const request = new Request(`${testOrigin}/api/scenes/${sceneRecord.id}/runs`, { method: "POST", headers, body, duplex: "half" } as RequestInit);
  return sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: sceneRecord.id }) });
}

async function listRuns(cookie = cookies.get("owner")): Promise<RunListItem[]> {
  const response = await callRoute(studyRunsRoute.GET, { path: `/api/studies/${studyId}/runs`, params: { studyId }, cookie });
  expect(response.status).toBe(200);
  return ((await response.json()) as { runs: RunListItem[] }).runs;
}

function getRun(runId: string, cookie: string | undefined) {
  return callRoute(runRoute.GET, { path: `/api/runs/${runId}`, params: { runId }, cookie });
}

function getResult(runId: string, cookie: string | undefined, headers: Record<string, string> = {}) {
  const request = new Request(`${testOrigin}/api/runs/${runId}/result`, { headers: { origin: testOrigin, ...(cookie ? { cookie } : {}), ...headers } });
  return runResultRoute.GET(request, { params: Promise.resolve({ runId }) });
}

function deleteRun(runId: string, cookie: string | undefined) {
  return callRoute(runRoute.DELETE, { method: "DELETE", path: `/api/runs/${runId}`, params: { runId }, cookie });
}

async function expectRefused(response: Response, status: number, path?: string): Promise<void> {
  expect(response.status).toBe(status);
  const body = (await response.json()) as { error: { code: string; issues?: { path: string }[] } };
  if (path !== undefined) expect(body.error.issues?.[0]?.path).toBe(path);
}

async function saved(cookie: string): Promise<RunRecord> {
  const response = await upload(cookie, payload);
  expect(response.status).toBe(201);
  return ((await response.json()) as { run: RunRecord }).run;
}

describe("saving a run", () => {
  it("saves an uploaded run, lists it with its figures, and serves it back byte for byte", async () => {
    const run = await saved(cookies.get("editor")!);
    expect(run).toMatchObject({ sceneId: sceneRecord.id, sceneVersion: 1, status: "completed", createdByName: "Tomas Lindgren", resultBytes: payload.length });
    expect(run.inputHash).toBe(computeRunInputHash({ scene, settings: defaultRunSettings }));
    expect(run.summary!.steps).toEqual({ planned: result.grid.steps, run: result.stepsRun });

    const listed = (await listRuns()).find((item) => item.id === run.id)!;
    expect(listed).toMatchObject({ sceneName: "Tiny run check", status: "completed", createdByName: "Tomas Lindgren" });
    expect(listed.figures).toMatchObject({ grid: run.summary!.grid, receiverCount: 5, warningCount: run.summary!.warnings.length });
    expect(listed.figures).not.toHaveProperty("receivers");
    expect(listed).not.toHaveProperty("resultData");

    const metadata = await getRun(run.id, cookies.get("viewer"));
    expect(metadata.status).toBe(200);
    expect(((await metadata.json()) as RunResponse).run).toEqual(run);

    const fetched = await getResult(run.id, cookies.get("viewer"));
    expect(fetched.status).toBe(200);
    expect(fetched.headers.get("content-type")).toBe("application/octet-stream");
    expect(fetched.headers.get("cache-control")).toContain("immutable");
    const bytes = new Uint8Array(await fetched.arrayBuffer());
    expect(Buffer.from(bytes).equals(Buffer.from(payload))).toBe(true);
    const decoded = decodeRunPayload(bytes);
    if (!decoded.ok) throw new Error(decoded.message);
    decoded.run.receivers.forEach((trace, r) => expect(trace.pressure).toEqual(result.receivers[r]!.pressure));

    const again = await getResult(run.id, cookies.get("viewer"), { "if-none-match": fetched.headers.get("etag")! });
    expect(again.status).toBe(304);
  });

  it("accepts a payload streamed without a Content-Length", async () => {
    const response = await upload(cookies.get("owner"), payload, { stream: true });
    expect(response.status).toBe(201);
  });

  it("answers 413 to an upload over the limit, declared or streamed, and saves nothing", async () => {
    const before = (await listRuns()).length;
    process.env.RAREFACT_MAX_RUN_UPLOAD_BYTES = String(payload.length - 1);
    // Refused on the declared length alone: the few bytes actually sent are never counted up to the limit.
    await expectRefused(await upload(cookies.get("editor"), payload.subarray(0, 100), { declaredLength: payload.length }), 413);
    await expectRefused(await upload(cookies.get("editor"), payload, { stream: true }), 413);
    expect((await listRuns()).length).toBe(before);
  });

  it("answers 400 naming the damage to a corrupt or truncated payload, and saves nothing", async () => {
    const before = (await listRuns()).length;
    await expectRefused(await upload(cookies.get("editor"), flipBit(payload, 8 * 200 + 3)), 400, "payload.crc");
    await expectRefused(await upload(cookies.get("editor"), payload.subarray(0, payload.length - 10)), 400, "payload.length");
    await expectRefused(await upload(cookies.get("editor"), new Uint8Array(0)), 400, "payload");
    await expectRefused(await upload(cookies.get("editor"), payload, { contentType: "application/json" }), 400, "content-type");
    expect((await listRuns()).length).toBe(before);
  });

  it("answers 400 when the input hash is not the one the server recomputes", async () => {
    const forged = rewriteHeader(payload, (header) => {
      header.inputHash = "0".repeat(64);
    });
    await expectRefused(await upload(cookies.get("editor"), forged), 400, "header.inputHash");
  });

  it("answers 400 when the frozen scene is not the saved version it names, or that version does not exist", async () => {
    const moved = structuredClone(scene);
    moved.receivers[0]!.position = { x: 1.0, y: 0.1 };
    const otherScene = rewriteHeader(payload, (header) => {
      header.scene = moved;
      header.inputHash = computeRunInputHash({ scene: moved, settings: defaultRunSettings });
    });
    await expectRefused(await upload(cookies.get("editor"), otherScene), 400, "header.scene");
    await expectRefused(await upload(cookies.get("editor"), encodeOrThrow(scene, 99)), 400, "header.sceneVersion");
    const invalid = rewriteHeader(payload, (header) => {
      (header.scene as { resolution: { courantNumber: number } }).resolution.courantNumber = 0.9;
    });
    await expectRefused(await upload(cookies.get("editor"), invalid), 400, "header.scene.resolution.courantNumber");
  });

  it("answers 400 to a run made by another solver version", async () => {
    const stale = rewriteHeader(payload, (header) => {
      header.solverVersion = "rarefact-fdtd-2d/0";
    });
    await expectRefused(await upload(cookies.get("editor"), stale), 400, "header.solverVersion");
  });

  it("keeps nothing of a run whose activity entry cannot be written (one transaction)", async () => {
    const editorId = (await saved(cookies.get("editor")!)).createdById!;
    const before = (await listRuns()).length;
    const decoded = decodeRunPayload(payload);
    if (!decoded.ok) throw new Error(decoded.message);
    const { header } = decoded.run;
    const attempt = createRun({
      // No such team: the activity row's foreign key fails after the run row was inserted.
      teamId: "no-such-team",
      studyId,
      sceneId: sceneRecord.id,
      sceneVersion: header.sceneVersion,
      sceneSnapshot: scene,
      settings: header.settings,
      inputHash: header.inputHash,
      solverVersion: header.solverVersion,
      status: "completed",
      statusMessage: "",
      summary: summariseRun(decoded.run),
      resultData: payload,
      createdBy: editorId,
      sceneName: sceneRecord.name,
    });
    await expect(attempt).rejects.toMatchObject({ code: "internal:database" });
    expect((await listRuns()).length).toBe(before);
  });

  it("lets only owners and editors upload: 403 for reviewers and viewers, 404 for outsiders, 401 for nobody", async () => {
    const before = (await listRuns()).length;
    await expectRefused(await upload(cookies.get("reviewer"), payload), 403);
    await expectRefused(await upload(cookies.get("viewer"), payload), 403);
    await expectRefused(await upload(cookies.get("outsider"), payload), 404);
    await expectRefused(await upload(undefined, payload), 401);
    expect((await listRuns()).length).toBe(before);
  });
});

describe("reading and deleting saved runs", () => {
  it("lets a reviewer read the list, the run and its result; an outsider finds none of them", async () => {
    const run = await saved(cookies.get("editor")!);
    expect((await listRuns(cookies.get("reviewer"))).map((item) => item.id)).toContain(run.id);
    expect((await getRun(run.id, cookies.get("reviewer"))).status).toBe(200);
    expect((await getResult(run.id, cookies.get("reviewer"))).status).toBe(200);
    const outsider = cookies.get("outsider");
    await expectRefused(await callRoute(studyRunsRoute.GET, { path: `/api/studies/${studyId}/runs`, params: { studyId }, cookie: outsider }), 404);
    await expectRefused(await getRun(run.id, outsider), 404);
    await expectRefused(await getResult(run.id, outsider), 404);
    await expectRefused(await getRun("not-a-run-id", cookies.get("owner")), 400);
  });

  it("lets an editor delete their own runs but not the owner's, and the owner delete any", async () => {
    const editorsRun = await saved(cookies.get("editor")!);
    const ownersRun = await saved(cookies.get("owner")!);
    const secondEditorsRun = await saved(cookies.get("editor")!);
    await expectRefused(await deleteRun(editorsRun.id, cookies.get("reviewer")), 403);
    await expectRefused(await deleteRun(editorsRun.id, cookies.get("viewer")), 403);
    await expectRefused(await deleteRun(ownersRun.id, cookies.get("editor")), 403);
    await expectRefused(await deleteRun(editorsRun.id, cookies.get("outsider")), 404);
    expect((await deleteRun(editorsRun.id, cookies.get("editor"))).status).toBe(204);
    expect((await deleteRun(secondEditorsRun.id, cookies.get("owner"))).status).toBe(204);
    const remaining = (await listRuns()).map((item) => item.id);
    expect(remaining).toContain(ownersRun.id);
    expect(remaining).not.toContain(editorsRun.id);
    expect(remaining).not.toContain(secondEditorsRun.id);
    await expectRefused(await getResult(editorsRun.id, cookies.get("owner")), 404);
  });
});
