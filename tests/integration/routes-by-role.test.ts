import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as studyRoute from "@/app/api/studies/[studyId]/route";
import * as membersRoute from "@/app/api/teams/[teamId]/members/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import * as runEvidenceRoute from "@/app/api/runs/[runId]/verifications/route";
import * as runEvidenceItemRoute from "@/app/api/runs/[runId]/verifications/[verificationId]/route";
import * as teamVerificationsRoute from "@/app/api/teams/[teamId]/verifications/route";
import * as verificationRoute from "@/app/api/verifications/[verificationId]/route";
import * as jobRoute from "@/app/api/jobs/[jobId]/route";
import * as jobCancelRoute from "@/app/api/jobs/[jobId]/cancel/route";
import * as sceneJobsRoute from "@/app/api/scenes/[sceneId]/jobs/route";
import * as sceneSweepsRoute from "@/app/api/scenes/[sceneId]/sweeps/route";
import * as studyJobsRoute from "@/app/api/studies/[studyId]/jobs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as sweepRoute from "@/app/api/sweeps/[sweepId]/route";
import * as sweepCancelRoute from "@/app/api/sweeps/[sweepId]/cancel/route";
import { stopBoss } from "@/lib/server/run-queue/boss";
import { tinySceneInput } from "../run-record/fixtures";
import { closeDb } from "@/db/client";
import { demoMembers, demoPassword } from "@/db/seed/demo";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import { callRoute, signInAs, signUp, cookieFrom } from "../helpers/api";
import { saveTinyRun, verificationRecordBody } from "../helpers/verification-fixtures";

// Every route of this issue, called by every demo role, by an outsider and by nobody.
let teamId = "";
let studyId = "";
const cookies = new Map<TeamRole | "outsider", string>();

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Person", email: "outsider@example.org", password: "outsider-password" })));
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get("owner")! });
  teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner")! });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
});
afterAll(async () => {
  await closeDb();
});

const expectations: { caller: TeamRole | "outsider" | "nobody"; listStudies: number; createStudy: number; readStudy: number; listMembers: number }[] = [
  { caller: "owner", listStudies: 200, createStudy: 201, readStudy: 200, listMembers: 200 },
  { caller: "editor", listStudies: 200, createStudy: 201, readStudy: 200, listMembers: 200 },
  { caller: "reviewer", listStudies: 200, createStudy: 403, readStudy: 200, listMembers: 200 },
  { caller: "viewer", listStudies: 200, createStudy: 403, readStudy: 200, listMembers: 200 },
  { caller: "outsider", listStudies: 404, createStudy: 404, readStudy: 404, listMembers: 404 },
  { caller: "nobody", listStudies: 401, createStudy: 401, readStudy: 401, listMembers: 401 },
];

describe("route handlers enforce the role matrix", () => {
  for (const row of expectations) {
    it(`answers ${row.caller}: list ${row.listStudies}, create ${row.createStudy}, read ${row.readStudy}, members ${row.listMembers}`, async () => {
      const cookie = row.caller === "nobody" ? undefined : cookies.get(row.caller);
      const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie });
      const create = await callRoute(teamStudiesRoute.POST, {
        path: `/api/teams/${teamId}/studies`,
        params: { teamId },
        cookie,
        body: { title: `Study by ${row.caller}`, siteReference: "X-1" },
      });
      const read = await callRoute(studyRoute.GET, { path: `/api/studies/${studyId}`, params: { studyId }, cookie });
      const members = await callRoute(membersRoute.GET, { path: `/api/teams/${teamId}/members`, params: { teamId }, cookie });
      expect([list.status, create.status, read.status, members.status]).toEqual([row.listStudies, row.createStudy, row.readStudy, row.listMembers]);
      for (const response of [list, create, read, members]) expect(response.headers.get("content-type")).toContain("application/json");
    });
  }

  it("answers 400 for an id that is not an id, before looking anything up", async () => {
    const response = await callRoute(studyRoute.GET, { path: "/api/studies/not-an-id", params: { studyId: "not-an-id" }, cookie: cookies.get("owner") });
    expect(response.status).toBe(400);
  });

  it("answers 400 naming each bad field of a study", async () => {
    const response = await callRoute(teamStudiesRoute.POST, {
      path: `/api/teams/${teamId}/studies`,
      params: { teamId },
      cookie: cookies.get("owner"),
      body: { title: "x".repeat(200), siteReference: "<script>" },
    });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((issue) => issue.path).sort()).toEqual(["siteReference", "title"]);
  });

  it("refuses a body over the size limit with 413", async () => {
    const response = await callRoute(teamStudiesRoute.POST, {
      path: `/api/teams/${teamId}/studies`,
      params: { teamId },
      cookie: cookies.get("owner"),
      body: { title: "Big", description: "x".repeat(300 * 1024) },
    });
    expect(response.status).toBe(413);
  });
});

// Verification records and a run's quality evidence (issue 9): save and attach for owners, editors and
// reviewers; reading for every member; nothing for another team or nobody.
describe("verification routes enforce the role matrix", () => {
  const rows: { caller: TeamRole | "outsider" | "nobody"; list: number; save: number; read: number; attach: number; evidence: number; detach: number }[] = [
    { caller: "owner", list: 200, save: 201, read: 200, attach: 201, evidence: 200, detach: 200 },
    { caller: "editor", list: 200, save: 201, read: 200, attach: 201, evidence: 200, detach: 200 },
    { caller: "reviewer", list: 200, save: 201, read: 200, attach: 201, evidence: 200, detach: 200 },
    { caller: "viewer", list: 200, save: 403, read: 200, attach: 403, evidence: 200, detach: 403 },
    { caller: "outsider", list: 404, save: 404, read: 404, attach: 404, evidence: 404, detach: 404 },
    { caller: "nobody", list: 401, save: 401, read: 401, attach: 401, evidence: 401, detach: 401 },
  ];
  let runId = "";
  let recordId = "";
  beforeAll(async () => {
    runId = (await saveTinyRun(studyId, cookies.get("editor")!, "Routes by role")).id;
    const saved = await callRoute(teamVerificationsRoute.POST, { path: `/api/teams/${teamId}/verifications`, params: { teamId }, cookie: cookies.get("owner")!, body: verificationRecordBody() });
    recordId = ((await saved.json()) as { record: { id: string } }).record.id;
  });

  for (const row of rows) {
    it(`answers ${row.caller}: list ${row.list}, save ${row.save}, read ${row.read}, attach ${row.attach}, evidence ${row.evidence}, detach ${row.detach}`, async () => {
      const cookie = row.caller === "nobody" ? undefined : cookies.get(row.caller);
      const verificationId = recordId;
      const list = await callRoute(teamVerificationsRoute.GET, { path: `/api/teams/${teamId}/verifications`, params: { teamId }, cookie });
      const save = await callRoute(teamVerificationsRoute.POST, { path: `/api/teams/${teamId}/verifications`, params: { teamId }, cookie, body: verificationRecordBody() });
      const read = await callRoute(verificationRoute.GET, { path: `/api/verifications/${verificationId}`, params: { verificationId }, cookie });
      const attach = await callRoute(runEvidenceRoute.POST, { path: `/api/runs/${runId}/verifications`, params: { runId }, cookie, body: { verificationId } });
      const evidence = await callRoute(runEvidenceRoute.GET, { path: `/api/runs/${runId}/verifications`, params: { runId }, cookie });
      // Detach what this caller attached; where they could not attach, the owner's attachment stands in.
      if (attach.status !== 201) await callRoute(runEvidenceRoute.POST, { path: `/api/runs/${runId}/verifications`, params: { runId }, cookie: cookies.get("owner")!, body: { verificationId } });
      const detach = await callRoute(runEvidenceItemRoute.DELETE, { method: "DELETE", path: `/api/runs/${runId}/verifications/${verificationId}`, params: { runId, verificationId }, cookie });
      await callRoute(runEvidenceItemRoute.DELETE, { method: "DELETE", path: `/api/runs/${runId}/verifications/${verificationId}`, params: { runId, verificationId }, cookie: cookies.get("owner")! });
      expect([list.status, save.status, read.status, attach.status, evidence.status, detach.status]).toEqual([row.list, row.save, row.read, row.attach, row.evidence, row.detach]);
      for (const response of [list, save, read, attach, evidence, detach]) expect(response.headers.get("content-type")).toContain("application/json");
    });
  }
});

// The run queue (issue 8): queuing and cancelling for owners and editors; reading for every member.
// No worker runs here, so jobs stay queued; the cancel routes are called on a job and a sweep already
// cancelled, so that owners and editors get 409 (allowed, nothing left to cancel) whatever the order.
describe("run queue routes enforce the role matrix", () => {
  const rows: { caller: TeamRole | "outsider" | "nobody"; queue: number; sweep: number; list: number; read: number; cancel: number; readSweep: number; cancelSweep: number }[] = [
    { caller: "owner", queue: 202, sweep: 202, list: 200, read: 200, cancel: 409, readSweep: 200, cancelSweep: 409 },
    { caller: "editor", queue: 202, sweep: 202, list: 200, read: 200, cancel: 409, readSweep: 200, cancelSweep: 409 },
    { caller: "reviewer", queue: 403, sweep: 403, list: 200, read: 200, cancel: 403, readSweep: 200, cancelSweep: 403 },
    { caller: "viewer", queue: 403, sweep: 403, list: 200, read: 200, cancel: 403, readSweep: 200, cancelSweep: 403 },
    { caller: "outsider", queue: 404, sweep: 404, list: 404, read: 404, cancel: 404, readSweep: 404, cancelSweep: 404 },
    { caller: "nobody", queue: 401, sweep: 401, list: 401, read: 401, cancel: 401, readSweep: 401, cancelSweep: 401 },
  ];
  let sceneId = "";
  let sceneVersion = 1;
  let jobId = "";
  let sweepId = "";
  const definition = () => ({
    sceneId,
    sceneVersion,
    sceneName: "Queue roles",
    parameter: { kind: "receiver-height", receiverId: "rx" },
    parameterLabel: "receiver height",
    unit: "m",
    range: { from: 0.1, to: 0.2, step: 0.1 },
    reference: { kind: "free-field" },
    bandsPerOctave: 1,
    weighting: "Z",
    receiverIds: ["rx"],
  });
  beforeAll(async () => {
    const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie: cookies.get("owner")!, body: { name: "Queue roles", data: tinySceneInput() } });
    ({ id: sceneId, version: sceneVersion } = ((await created.json()) as { scene: { id: string; version: number } }).scene);
    const queued = await callRoute(sceneJobsRoute.POST, { path: `/api/scenes/${sceneId}/jobs`, params: { sceneId }, cookie: cookies.get("owner")!, body: {} });
    jobId = ((await queued.json()) as { job: { id: string } }).job.id;
    await callRoute(jobCancelRoute.POST, { method: "POST", path: `/api/jobs/${jobId}/cancel`, params: { jobId }, cookie: cookies.get("owner")! });
    const sweep = await callRoute(sceneSweepsRoute.POST, { path: `/api/scenes/${sceneId}/sweeps`, params: { sceneId }, cookie: cookies.get("owner")!, body: { definition: definition() } });
    sweepId = ((await sweep.json()) as { sweep: { id: string } }).sweep.id;
    await callRoute(sweepCancelRoute.POST, { method: "POST", path: `/api/sweeps/${sweepId}/cancel`, params: { sweepId }, cookie: cookies.get("owner")! });
  });
  afterAll(async () => {
    await stopBoss({ graceful: false });
  });

  for (const row of rows) {
    it(`answers ${row.caller}: queue ${row.queue}, sweep ${row.sweep}, list ${row.list}, read ${row.read}, cancel ${row.cancel}, sweep read ${row.readSweep}, sweep cancel ${row.cancelSweep}`, async () => {
      const cookie = row.caller === "nobody" ? undefined : cookies.get(row.caller);
      const queue = await callRoute(sceneJobsRoute.POST, { path: `/api/scenes/${sceneId}/jobs`, params: { sceneId }, cookie, body: {} });
      const sweep = await callRoute(sceneSweepsRoute.POST, { path: `/api/scenes/${sceneId}/sweeps`, params: { sceneId }, cookie, body: { definition: definition() } });
      const list = await callRoute(studyJobsRoute.GET, { path: `/api/studies/${studyId}/jobs`, params: { studyId }, cookie });
      const read = await callRoute(jobRoute.GET, { path: `/api/jobs/${jobId}`, params: { jobId }, cookie });
      const cancel = await callRoute(jobCancelRoute.POST, { method: "POST", path: `/api/jobs/${jobId}/cancel`, params: { jobId }, cookie });
      const readSweep = await callRoute(sweepRoute.GET, { path: `/api/sweeps/${sweepId}`, params: { sweepId }, cookie });
      const cancelSweep = await callRoute(sweepCancelRoute.POST, { method: "POST", path: `/api/sweeps/${sweepId}/cancel`, params: { sweepId }, cookie });
      // What this caller queued is withdrawn again, so the team stays under its limit.
      for (const made of [queue, sweep]) {
        if (made.status !== 202) continue;
        const body = (await made.clone().json()) as { job?: { id: string }; sweep?: { id: string } };
        if (body.job) await callRoute(jobCancelRoute.POST, { method: "POST", path: `/api/jobs/${body.job.id}/cancel`, params: { jobId: body.job.id }, cookie: cookies.get("owner")! });
        if (body.sweep) await callRoute(sweepCancelRoute.POST, { method: "POST", path: `/api/sweeps/${body.sweep.id}/cancel`, params: { sweepId: body.sweep.id }, cookie: cookies.get("owner")! });
      }
      const responses = [queue, sweep, list, read, cancel, readSweep, cancelSweep];
      expect(responses.map((r) => r.status)).toEqual([row.queue, row.sweep, row.list, row.read, row.cancel, row.readSweep, row.cancelSweep]);
      for (const response of responses) expect(response.headers.get("content-type")).toContain("application/json");
    });
  }
});
