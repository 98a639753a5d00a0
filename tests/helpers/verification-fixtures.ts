// Builders for the verification-record tests: a record body as the page posts it (made from real case
// outcome shapes) and a small completed run saved through the API to attach records to.
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import type { RunRecord, SceneRecord } from "@/lib/http/api-types";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { SOLVER_VERSION } from "@/lib/run-record/solver-version";
import type { VerificationRecordInput } from "@/lib/validation/verification";
import { makeCheck, makeOutcome, makeRelativeCheck } from "@/lib/verification/cases/outcome";
import { savedCaseOutcome } from "@/lib/verification/saved-record";
import { tinyRun, tinySceneInput } from "../run-record/fixtures";
import { callRoute, testOrigin } from "./api";

/** Two cases, the second failing one of its checks; a curve of `points` points per series. */
export function verificationRecordBody(points = 50): VerificationRecordInput {
  const x = Array.from({ length: points }, (_, k) => k);
  const curve = { title: "Trace", xLabel: "time (ms)", yLabel: "pressure (Pa)", series: [{ name: "FDTD", kind: "simulated" as const, x, y: x.map(Math.sin) }, { name: "exact", kind: "exact" as const, x, y: x.map(Math.sin) }] };
  const passing = makeOutcome([makeCheck("arrival", 0.1, 0, 0.4, "steps")], [curve], 0);
  const failing = makeOutcome([makeCheck("level", 0.01, 0, 0.03, "dB"), makeRelativeCheck("mode", 101, 100, 0.005, "Hz")], [curve], 0);
  return {
    solverVersion: SOLVER_VERSION,
    browser: "Linux x86_64 | Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) HeadlessChrome/139.0.0.0 Safari/537.36",
    kernel: "wasm-simd",
    // The page sends what it measured; the server judges the verdicts again (the failing case claims a pass here).
    outcomes: [savedCaseOutcome({ id: "free-field", title: "Free field" }, passing), { ...savedCaseOutcome({ id: "room-modes", title: "Room modes" }, failing), pass: true }],
  };
}

/** A new scene (version 1) in the study and a completed run of it saved by the caller. */
export async function saveTinyRun(studyId: string, cookie: string, name = "Evidence check"): Promise<RunRecord> {
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie, body: { name, data: tinySceneInput() } });
  if (created.status !== 201) throw new Error(`scene: ${created.status} ${await created.text()}`);
  const scene = ((await created.json()) as { scene: SceneRecord }).scene;
  const encoded = encodeRunPayload({ result: tinyRun().result, scene: parseSceneOrThrow(scene.data), sceneVersion: scene.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const request = new Request(`${testOrigin}/api/scenes/${scene.id}/runs`, {
    method: "POST",
    headers: { origin: testOrigin, cookie, "content-type": "application/octet-stream" },
    body: encoded.bytes as Uint8Array<ArrayBuffer>,
  });
  const uploaded = await sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: scene.id }) });
  if (uploaded.status !== 201) throw new Error(`run: ${uploaded.status} ${await uploaded.text()}`);
  return ((await uploaded.json()) as { run: RunRecord }).run;
}
