import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as bandLevelsCsvRoute from "@/app/api/runs/[runId]/band-levels.csv/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import { closeDb } from "@/db/client";
import { bandLevelTable } from "@/lib/analysis/band-levels";
import { bandLevelsCsv } from "@/lib/analysis/csv";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { runScene, type SimulationResult } from "@/lib/fdtd/simulation";
import type { TeamRole } from "@/lib/access/roles";
import type { RunRecord, SceneRecord } from "@/lib/http/api-types";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { callRoute, cookieFrom, signUp, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinySceneInput } from "../run-record/fixtures";

// The CSV a script fetches must hold the figures the run page shows: the band levels of the run's
// receivers (IEC 61260-1 bands, IEC 61672-1 A weighting, in lib/analysis), computed here straight
// from the solver's traces and compared with the route's answer, which decodes the stored payload.
// Grid: the tiny fixture scene, 1.2 m x 0.6 m at 0.02 m cells (60 x 30).

let cookies = new Map<TeamRole, string>();
let run: RunRecord;
let result: SimulationResult;
let highestResolvedFrequency = 0;
let outsider = "";

beforeAll(async () => {
  const demo = await openDemoStudy();
  cookies = demo.cookies;
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${demo.studyId}/scenes`, params: { studyId: demo.studyId }, cookie: cookies.get("owner"), body: { name: "Band CSV check", data: tinySceneInput() } });
  const sceneRecord = ((await created.json()) as { scene: SceneRecord }).scene;
  const scene = parseSceneOrThrow(sceneRecord.data);
  highestResolvedFrequency = deriveGrid(scene).maxResolvedFrequency;
  result = runScene(scene);
  const encoded = encodeRunPayload({ result, scene, sceneVersion: sceneRecord.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const headers = new Headers({ origin: testOrigin, "content-type": "application/octet-stream", cookie: cookies.get("owner")! });
  const request = new Request(`${testOrigin}/api/scenes/${sceneRecord.id}/runs`, { method: "POST", headers, body: encoded.bytes });
  const response = await sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: sceneRecord.id }) });
  run = ((await response.json()) as { run: RunRecord }).run;
  outsider = cookieFrom(await signUp({ name: "CSV Outsider", email: "csv-outsider@example.org", password: "outsider-password" }));
}, 120_000);

afterAll(async () => {
  await closeDb();
});

function fetchCsv(query: string, cookie: string | undefined) {
  return callRoute(bandLevelsCsvRoute.GET, { path: `/api/runs/${run.id}/band-levels.csv${query}`, params: { runId: run.id }, cookie });
}

function parse(csv: string): { header: string[]; rows: string[][] } {
  const lines = csv.trim().split(/\r?\n/).filter((line) => !line.startsWith("#") && !line.startsWith('"#'));
  const [header, ...rows] = lines.map((line) => line.split(","));
  return { header: header!, rows };
}

describe("GET /api/runs/[runId]/band-levels.csv", () => {
  for (const [bandsPerOctave, weighting] of [[1, "Z"], [3, "A"]] as const) {
    it(`answers the run's ${bandsPerOctave === 1 ? "octave" : "one-third-octave"} ${weighting}-weighted band levels, as computed from the solver's traces`, async () => {
      const response = await fetchCsv(`?bandsPerOctave=${bandsPerOctave}&weighting=${weighting}`, cookies.get("viewer"));
      expect(response.status).toBe(200);
      expect(response.headers.get("content-type")).toContain("text/csv");
      const served = parse(await response.text());
      const expected = parse(bandLevelsCsv(bandLevelTable(result.receivers, { bandsPerOctave, weighting, highestResolvedFrequency })));
      expect(served.header).toEqual(expected.header);
      expect(served.header.length).toBeGreaterThan(2);
      expect(served.rows.length).toBe(result.receivers.length);
      served.rows.forEach((row, r) => {
        expect(row[0]).toBe(expected.rows[r]![0]);
        // The payload keeps traces as float32: levels agree to the CSV's 0.01 dB.
        row.slice(1).forEach((cell, c) => expect(Math.abs(Number(cell) - Number(expected.rows[r]![c + 1]))).toBeLessThanOrEqual(0.011));
      });
    });
  }

  it("answers 400 naming a bad query field, 404 to another team, 401 to nobody", async () => {
    const bad = await fetchCsv("?bandsPerOctave=2", cookies.get("owner"));
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("bandsPerOctave");
    expect((await fetchCsv("", outsider)).status).toBe(404);
    expect((await fetchCsv("", undefined)).status).toBe(401);
  });
});
