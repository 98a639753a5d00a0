// Verification records over the API: saving the page's results (verdicts judged again, size limits,
// field-named 400s), the team's list and one record, attaching a record to a run as quality evidence and
// detaching it, with the activity each leaves; another team's records and runs do not exist.
import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as runEvidenceRoute from "@/app/api/runs/[runId]/verifications/route";
import * as runEvidenceItemRoute from "@/app/api/runs/[runId]/verifications/[verificationId]/route";
import * as teamVerificationsRoute from "@/app/api/teams/[teamId]/verifications/route";
import * as verificationRoute from "@/app/api/verifications/[verificationId]/route";
import { closeDb } from "@/db/client";
import { listActivityByStudyId } from "@/db/queries/activity";
import type { TeamRole } from "@/lib/access/roles";
import type { RunRecord } from "@/lib/http/api-types";
import type { RunEvidenceResponse, VerificationRecordResponse, VerificationRecordsResponse } from "@/lib/http/verification-types";
import { MAX_SAVED_SERIES_POINTS } from "@/lib/validation/verification";
import { callRoute, cookieFrom, signUp } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { saveTinyRun, verificationRecordBody } from "../helpers/verification-fixtures";

type Who = TeamRole | "outsider" | "nobody";

let cookies = new Map<TeamRole | "outsider", string>();
let studyId = "";
let teamId = "";
let outsiderTeamId = "";
let run: RunRecord;

beforeAll(async () => {
  const demo = await openDemoStudy();
  cookies = new Map(demo.cookies);
  studyId = demo.studyId;
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Verifier", email: "verification-outsider@example.org", password: "outsider-password" })));
  const me = async (who: TeamRole | "outsider") => ((await (await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get(who) })).json()) as { activeTeamId: string }).activeTeamId;
  teamId = await me("owner");
  outsiderTeamId = await me("outsider");
  run = await saveTinyRun(studyId, cookies.get("editor")!);
});
afterAll(async () => {
  await closeDb();
});

const cookieOf = (who: Who) => (who === "nobody" ? undefined : cookies.get(who));
const save = (who: Who, body: unknown, team = teamId) => callRoute(teamVerificationsRoute.POST, { path: `/api/teams/${team}/verifications`, params: { teamId: team }, cookie: cookieOf(who), body });
const list = (who: Who, team = teamId) => callRoute(teamVerificationsRoute.GET, { path: `/api/teams/${team}/verifications`, params: { teamId: team }, cookie: cookieOf(who) });
const read = (who: Who, verificationId: string) => callRoute(verificationRoute.GET, { path: `/api/verifications/${verificationId}`, params: { verificationId }, cookie: cookieOf(who) });
const attach = (who: Who, verificationId: unknown, runId = run.id) => callRoute(runEvidenceRoute.POST, { path: `/api/runs/${runId}/verifications`, params: { runId }, cookie: cookieOf(who), body: { verificationId } });
const evidence = (who: Who, runId = run.id) => callRoute(runEvidenceRoute.GET, { path: `/api/runs/${runId}/verifications`, params: { runId }, cookie: cookieOf(who) });
const detach = (who: Who, verificationId: string, runId = run.id) => callRoute(runEvidenceItemRoute.DELETE, { method: "DELETE", path: `/api/runs/${runId}/verifications/${verificationId}`, params: { runId, verificationId }, cookie: cookieOf(who) });

async function saved(who: Who = "reviewer", team = teamId): Promise<VerificationRecordResponse["record"]> {
  const response = await save(who, verificationRecordBody(), team);
  if (response.status !== 201) throw new Error(`${who} save: ${response.status} ${await response.text()}`);
  return ((await response.json()) as VerificationRecordResponse).record;
}

describe("saving verification results", () => {
  it("keeps the solver version, browser, kernel and outcomes, and judges each case again from its checks", async () => {
    const record = await saved("reviewer");
    expect(record).toMatchObject({ teamId, kernel: "wasm-simd", passedCount: 1, failedCount: 1, createdByName: "Priya Raman" });
    expect(record.solverVersion).toMatch(/^rarefact-fdtd-2d\//);
    expect(record.browser).toContain("HeadlessChrome/139");
    expect(record.outcomes.map((outcome) => [outcome.caseId, outcome.pass])).toEqual([
      ["free-field", true],
      ["room-modes", false],
    ]);
    expect(record.outcomes[0]!.curves[0]!.series[0]!.x).toHaveLength(50);
  });

  it("lets owners, editors and reviewers save, not viewers, and hides the team from everyone else", async () => {
    const statuses = [];
    for (const who of ["owner", "editor", "reviewer", "viewer", "outsider", "nobody"] as const) statuses.push((await save(who, verificationRecordBody())).status);
    expect(statuses).toEqual([201, 201, 201, 403, 404, 401]);
  });

  it("names the field it refuses: too many points in a series, a duplicate case, a missing solver version", async () => {
    // The page thins its curves before posting; a client that does not is refused.
    const long = verificationRecordBody();
    const points = Array.from({ length: MAX_SAVED_SERIES_POINTS + 1 }, (_, k) => k);
    long.outcomes[0]!.curves[0]!.series[0] = { ...long.outcomes[0]!.curves[0]!.series[0]!, x: points, y: points };
    const tooLong = await save("editor", long);
    expect(tooLong.status).toBe(400);
    const paths = ((await tooLong.json()) as { error: { issues: { path: string }[] } }).error.issues.map((issue) => issue.path);
    expect(paths).toContain("outcomes[0].curves[0].series[0].x");

    const body = verificationRecordBody();
    const duplicate = await save("editor", { ...body, outcomes: [body.outcomes[0], body.outcomes[0]] });
    expect(duplicate.status).toBe(400);
    const missing = await save("editor", { ...body, solverVersion: "" });
    expect(((await missing.json()) as { error: { issues: { path: string }[] } }).error.issues.map((issue) => issue.path)).toEqual(["solverVersion"]);
    const none = await save("editor", { ...body, outcomes: [] });
    expect(none.status).toBe(400);
  });

  it("refuses a body over the size limit with 413", async () => {
    const body = verificationRecordBody();
    const padded = { ...body, outcomes: body.outcomes.map((outcome) => ({ ...outcome, checks: Array.from({ length: 200 }, () => ({ ...outcome.checks[0]!, label: "x".repeat(290) })), curves: [] })) };
    const huge = { ...padded, outcomes: Array.from({ length: 20 }, (_, k) => ({ ...padded.outcomes[0]!, caseId: `case-${k}` })) };
    expect(JSON.stringify(huge).length).toBeGreaterThan(1024 * 1024);
    expect((await save("editor", huge)).status).toBe(413);
  });
});

describe("the team's saved results", () => {
  it("lists them newest first for any member, without outcomes, and opens one with its curves", async () => {
    const record = await saved("editor");
    const response = await list("viewer");
    expect(response.status).toBe(200);
    const { records } = (await response.json()) as VerificationRecordsResponse;
    expect(records[0]!.id).toBe(record.id);
    expect(records[0]).not.toHaveProperty("outcomes");
    const opened = await read("viewer", record.id);
    expect(opened.status).toBe(200);
    expect(((await opened.json()) as VerificationRecordResponse).record.outcomes[1]!.curves).toHaveLength(1);
  });

  it("answers 404 to another team's member, 401 to nobody and 400 to a malformed id", async () => {
    const record = await saved("owner");
    expect((await read("outsider", record.id)).status).toBe(404);
    expect((await list("outsider")).status).toBe(404);
    expect((await read("nobody", record.id)).status).toBe(401);
    expect((await read("owner", "not-an-id")).status).toBe(400);
  });
});

describe("quality evidence on a run", () => {
  it("attaches a record once, lists it with each case's checks but no curves, records the activity with the run, and detaches it", async () => {
    const record = await saved("reviewer");
    const first = await attach("reviewer", record.id);
    expect(first.status).toBe(201);
    const again = await attach("editor", record.id);
    expect(again.status).toBe(200);
    const listed = (await (await evidence("viewer")).json()) as RunEvidenceResponse;
    const item = listed.evidence.find((entry) => entry.record.id === record.id)!;
    expect(item.attachedByName).toBe("Priya Raman");
    expect(item.record.outcomes[1]!.checks.map((check) => check.pass)).toEqual([true, false]);
    expect(item.record.outcomes[1]).not.toHaveProperty("curves");

    const activities = (await listActivityByStudyId({ studyId })).filter((entry) => entry.action === "run.evidence_attached");
    expect(activities).toHaveLength(1);

    expect((await detach("editor", record.id)).status).toBe(200);
    expect((await detach("editor", record.id)).status).toBe(404);
    const after = (await (await evidence("viewer")).json()) as RunEvidenceResponse;
    expect(after.evidence.some((entry) => entry.record.id === record.id)).toBe(false);
    expect((await listActivityByStudyId({ studyId })).some((entry) => entry.action === "run.evidence_detached")).toBe(true);
  });

  it("lets owners, editors and reviewers attach and detach, not viewers; another team's caller finds no run", async () => {
    const record = await saved("owner");
    const statuses = [];
    for (const who of ["viewer", "outsider", "nobody"] as const) statuses.push((await attach(who, record.id)).status);
    expect(statuses).toEqual([403, 404, 401]);
    expect((await attach("owner", record.id)).status).toBe(201);
    expect((await detach("viewer", record.id)).status).toBe(403);
    expect((await detach("outsider", record.id)).status).toBe(404);
    expect((await evidence("outsider")).status).toBe(404);
    expect((await detach("owner", record.id)).status).toBe(200);
  });

  it("does not attach another team's record, and names a malformed id", async () => {
    const foreign = await saved("outsider", outsiderTeamId);
    const response = await attach("owner", foreign.id);
    expect(response.status).toBe(404);
    expect(((await response.json()) as { error: { code: string } }).error.code).toBe("not_found:verification");
    const malformed = await attach("owner", "nope");
    expect(malformed.status).toBe(400);
    expect(((await malformed.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("verificationId");
  });
});
