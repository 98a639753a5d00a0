// Review and sign-off of saved runs over the API: every role against both routes, four eyes, the
// note a revision needs, two decisions at once, a sign-off outlived by a newer scene version, and
// the e-mail and activity each step leaves behind.
import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as reviewRoute from "@/app/api/runs/[runId]/review/route";
import * as reviewsRoute from "@/app/api/runs/[runId]/reviews/route";
import * as runRoute from "@/app/api/runs/[runId]/route";
import * as sceneRoute from "@/app/api/scenes/[sceneId]/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as studyRunsRoute from "@/app/api/studies/[studyId]/runs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import { closeDb } from "@/db/client";
import { listActivityByStudyId } from "@/db/queries/activity";
import { listMailMessagesByTeamId } from "@/db/queries/mail";
import { applyReviewDecision } from "@/db/queries/reviews";
import { createRun } from "@/db/queries/runs";
import { demoMembers } from "@/db/seed/demo-accounts";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import type { RunListItem, RunRecord, SceneRecord } from "@/lib/http/api-types";
import type { RunReviewDecisionResponse, RunReviewItem } from "@/lib/http/review-types";
import type { ReviewStateName } from "@/lib/review/review-states";
import { decodeRunPayload, encodeRunPayload } from "@/lib/run-record/payload";
import { summariseRun } from "@/lib/run-record/summary";
import { callRoute, cookieFrom, signUp, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinyRun, tinySceneInput } from "../run-record/fixtures";

type Who = TeamRole | "outsider" | "nobody";

let cookies = new Map<TeamRole | "outsider", string>();
let studyId = "";
let teamId = "";
const userIds = new Map<TeamRole, string>();
const emails = new Map<TeamRole, string>(demoMembers.map((member) => [member.role, member.email]));

beforeAll(async () => {
  const demo = await openDemoStudy();
  cookies = new Map(demo.cookies);
  studyId = demo.studyId;
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Reviewer", email: "reviews-outsider@example.org", password: "outsider-password" })));
  for (const role of ["owner", "editor", "reviewer", "viewer"] as const) {
    const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get(role) });
    const body = (await me.json()) as { user: { id: string }; activeTeamId: string };
    userIds.set(role, body.user.id);
    if (role === "owner") teamId = body.activeTeamId;
  }
});
afterAll(async () => {
  await closeDb();
});

const cookieOf = (who: Who) => (who === "nobody" ? undefined : cookies.get(who));

/** A new scene (version 1) in the demo study and a completed run of it saved by `by`. */
async function savedRun(by: "owner" | "editor" = "editor"): Promise<{ run: RunRecord; scene: SceneRecord }> {
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie: cookies.get(by), body: { name: `Review check by ${by}`, data: tinySceneInput() } });
  expect(created.status).toBe(201);
  const scene = ((await created.json()) as { scene: SceneRecord }).scene;
  const encoded = encodeRunPayload({ result: tinyRun().result, scene: parseSceneOrThrow(scene.data), sceneVersion: scene.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const request = new Request(`${testOrigin}/api/scenes/${scene.id}/runs`, {
    method: "POST",
    headers: { origin: testOrigin, cookie: cookies.get(by)!, "content-type": "application/octet-stream" },
    body: encoded.bytes as Uint8Array<ArrayBuffer>,
  });
  const uploaded = await sceneRunsRoute.POST(request, { params: Promise.resolve({ sceneId: scene.id }) });
  expect(uploaded.status).toBe(201);
  return { run: ((await uploaded.json()) as { run: RunRecord }).run, scene };
}

function decide(who: Who, runId: string, body: unknown): Promise<Response> {
  return callRoute(reviewRoute.POST, { path: `/api/runs/${runId}/review`, params: { runId }, cookie: cookieOf(who), body });
}

/** A decision that must succeed; answers the run and the recorded decision. */
async function decided(who: Who, runId: string, toState: ReviewStateName, note = ""): Promise<RunReviewDecisionResponse> {
  const response = await decide(who, runId, { toState, note });
  if (response.status !== 201) throw new Error(`${who} → ${toState}: ${response.status} ${await response.text()}`);
  return (await response.json()) as RunReviewDecisionResponse;
}

function history(who: Who, runId: string): Promise<Response> {
  return callRoute(reviewsRoute.GET, { path: `/api/runs/${runId}/reviews`, params: { runId }, cookie: cookieOf(who) });
}

async function readRun(runId: string, who: Who = "owner"): Promise<RunRecord> {
  const response = await callRoute(runRoute.GET, { path: `/api/runs/${runId}`, params: { runId }, cookie: cookieOf(who) });
  expect(response.status).toBe(200);
  return ((await response.json()) as { run: RunRecord }).run;
}

async function listed(runId: string): Promise<RunListItem> {
  const response = await callRoute(studyRunsRoute.GET, { path: `/api/studies/${studyId}/runs`, params: { studyId }, cookie: cookies.get("viewer") });
  const item = ((await response.json()) as { runs: RunListItem[] }).runs.find((r) => r.id === runId);
  if (!item) throw new Error(`run ${runId} is not listed`);
  return item;
}

async function errorOf(response: Response): Promise<{ status: number; code: string; message: string; issuePath?: string }> {
  const body = (await response.json()) as { error: { code: string; message: string; issues?: { path: string }[] } };
  return { status: response.status, code: body.error.code, message: body.error.message, issuePath: body.error.issues?.[0]?.path };
}

/** The kept e-mails that concern one run (their link names it), newest first. */
async function mailsAbout(runId: string) {
  return (await listMailMessagesByTeamId({ teamId })).filter((mail) => mail.textBody.includes(`/runs/${runId}`));
}

describe("asking for review", () => {
  const expected: Record<Who, number> = { owner: 201, editor: 201, reviewer: 403, viewer: 403, outsider: 404, nobody: 401 };
  for (const [who, status] of Object.entries(expected) as [Who, number][]) {
    it(`answers ${status} to ${who}`, async () => {
      const { run } = await savedRun();
      const response = await decide(who, run.id, { toState: "awaiting_review", note: "" });
      expect(response.status).toBe(status);
      expect((await readRun(run.id)).reviewState).toBe(status === 201 ? "awaiting_review" : "unreviewed");
    });
  }

  it("tells a reviewer who may ask, in words", async () => {
    const { run } = await savedRun();
    expect(await errorOf(await decide("reviewer", run.id, { toState: "awaiting_review" }))).toMatchObject({ status: 403, code: "forbidden:review", message: "Your role (reviewer) cannot do this. Owners and editors ask for a review." });
  });
});

describe("deciding", () => {
  const deciders: Record<Who, number> = { owner: 201, reviewer: 201, editor: 403, viewer: 403, outsider: 404, nobody: 401 };
  for (const [who, status] of Object.entries(deciders) as [Who, number][]) {
    it(`signing off answers ${status} to ${who}`, async () => {
      const { run } = await savedRun("editor");
      await decided("editor", run.id, "awaiting_review");
      expect((await decide(who, run.id, { toState: "signed_off" })).status).toBe(status);
      expect((await readRun(run.id)).reviewState).toBe(status === 201 ? "signed_off" : "awaiting_review");
    });

    it(`asking for a revision answers ${status} to ${who}`, async () => {
      const { run } = await savedRun("editor");
      await decided("editor", run.id, "awaiting_review");
      expect((await decide(who, run.id, { toState: "revision_asked", note: "Extend the domain behind the façade." })).status).toBe(status);
    });

    it(`withdrawing a sign-off answers ${status} to ${who}`, async () => {
      const { run } = await savedRun("editor");
      await decided("reviewer", run.id, "signed_off");
      expect((await decide(who, run.id, { toState: "revision_asked", note: "The source level was a placeholder." })).status).toBe(status);
      expect((await readRun(run.id)).reviewState).toBe(status === 201 ? "revision_asked" : "signed_off");
    });
  }

  it("records who signed off, when, and for which run hash and scene version", async () => {
    const { run } = await savedRun("editor");
    await decided("editor", run.id, "awaiting_review");
    const before = Date.now();
    const { run: after, review } = await decided("reviewer", run.id, "signed_off", "Grid fine enough up to 400 Hz.");
    expect(review).toMatchObject({ fromState: "awaiting_review", toState: "signed_off", actorId: userIds.get("reviewer"), actorName: "Priya Raman", runInputHash: run.inputHash, sceneVersion: 1, note: "Grid fine enough up to 400 Hz." });
    expect(Date.parse(review.createdAt)).toBeGreaterThanOrEqual(before - 1000);
    expect(after.signOff).toEqual({ signedOffById: userIds.get("reviewer"), signedOffByName: "Priya Raman", signedOffAt: review.createdAt, runInputHash: run.inputHash, sceneVersion: 1, note: "Grid fine enough up to 400 Hz." });
    expect((await listed(run.id)).signOff?.signedOffByName).toBe("Priya Raman");
  });

  it("keeps four eyes: the owner who ran it cannot sign it off, a reviewer can", async () => {
    const { run } = await savedRun("owner");
    await decided("owner", run.id, "awaiting_review");
    expect(await errorOf(await decide("owner", run.id, { toState: "signed_off" }))).toMatchObject({ status: 403, message: "You ran this yourself, so someone else must sign it off." });
    expect((await readRun(run.id)).reviewState).toBe("awaiting_review");
    await decided("reviewer", run.id, "signed_off");
  });

  it("needs a note to ask for a revision or withdraw a sign-off (400 naming the note)", async () => {
    const { run } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    expect(await errorOf(await decide("reviewer", run.id, { toState: "revision_asked", note: "   " }))).toMatchObject({ status: 400, issuePath: "note", message: "Say what should be revised." });
    await decided("reviewer", run.id, "signed_off");
    expect(await errorOf(await decide("owner", run.id, { toState: "revision_asked" }))).toMatchObject({ status: 400, issuePath: "note" });
    expect((await readRun(run.id)).reviewState).toBe("signed_off");
  });

  it("refuses the same state twice, and signing off after a revision before review is asked again (409)", async () => {
    const { run } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    expect(await errorOf(await decide("owner", run.id, { toState: "awaiting_review" }))).toMatchObject({ status: 409, code: "conflict:review" });
    await decided("reviewer", run.id, "revision_asked", "Add a receiver at the first-floor window.");
    expect((await decide("reviewer", run.id, { toState: "signed_off" })).status).toBe(409);
    await decided("editor", run.id, "awaiting_review");
    await decided("reviewer", run.id, "signed_off");
  });

  it("answers 400 naming the field to a state that is not a target, or a note that is too long", async () => {
    const { run } = await savedRun();
    expect(await errorOf(await decide("owner", run.id, { toState: "unreviewed" }))).toMatchObject({ status: 400, issuePath: "toState" });
    expect(await errorOf(await decide("owner", run.id, { toState: "approved" }))).toMatchObject({ status: 400, issuePath: "toState" });
    expect(await errorOf(await decide("owner", run.id, { toState: "awaiting_review", note: "x".repeat(2001) }))).toMatchObject({ status: 400, issuePath: "note" });
  });

  it("reviews only completed runs", async () => {
    const { run, scene } = await savedRun();
    const decoded = decodeRunPayload(encodeOrThrow(scene));
    if (!decoded.ok) throw new Error(decoded.message);
    const cancelled = await createRun({
      teamId,
      studyId,
      sceneId: scene.id,
      sceneVersion: 1,
      sceneSnapshot: parseSceneOrThrow(scene.data),
      settings: decoded.run.header.settings,
      inputHash: run.inputHash,
      solverVersion: run.solverVersion,
      status: "cancelled",
      statusMessage: "Cancelled after 10 steps.",
      summary: summariseRun(decoded.run),
      resultData: new Uint8Array(4),
      createdBy: userIds.get("editor")!,
      sceneName: scene.name,
    });
    expect(await errorOf(await decide("editor", cancelled.id, { toState: "awaiting_review" }))).toMatchObject({ status: 409, message: "Only a completed run can be reviewed; this one is cancelled." });
  });
});

function encodeOrThrow(scene: SceneRecord): Uint8Array {
  const encoded = encodeRunPayload({ result: tinyRun().result, scene: parseSceneOrThrow(scene.data), sceneVersion: scene.version });
  if (!encoded.ok) throw new Error(encoded.message);
  return encoded.bytes;
}

describe("two decisions at once", () => {
  it("lets one through and answers 409 to the other, keeping one decision", async () => {
    const { run } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    const [signOff, revision] = await Promise.all([
      decide("reviewer", run.id, { toState: "signed_off", fromState: "awaiting_review" }),
      decide("owner", run.id, { toState: "revision_asked", note: "Check the ground impedance.", fromState: "awaiting_review" }),
    ]);
    expect([signOff.status, revision.status].sort()).toEqual([201, 409]);
    const loser = signOff.status === 409 ? signOff : revision;
    expect((await errorOf(loser)).code).toBe("conflict:review");
    const reviews = ((await (await history("viewer", run.id)).json()) as { reviews: RunReviewItem[] }).reviews;
    expect(reviews.map((r) => r.fromState)).toEqual(["awaiting_review", "unreviewed"]);
    expect((await readRun(run.id)).reviewState).toBe(reviews[0]!.toState);
  });

  it("refuses a decision made on a state that has changed since it was read", async () => {
    const { run } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    await decided("reviewer", run.id, "signed_off");
    // The owner's page still showed "awaiting review": without the guard this would withdraw the sign-off.
    expect(await errorOf(await decide("owner", run.id, { toState: "revision_asked", note: "Needs work.", fromState: "awaiting_review" }))).toMatchObject({
      status: 409,
      message: "The review state changed meanwhile; reload the run to see the latest decision.",
    });
    expect((await readRun(run.id)).reviewState).toBe("signed_off");
  });

  it("guards the update itself: a decision from a state the run has left changes nothing", async () => {
    const { run } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    const stale = { runId: run.id, fromState: "unreviewed" as const, toState: "awaiting_review" as const, actorId: userIds.get("owner")!, note: "", runInputHash: run.inputHash, sceneVersion: 1 };
    await expect(applyReviewDecision(stale)).rejects.toMatchObject({ code: "conflict:review" });
    expect(((await (await history("owner", run.id)).json()) as { reviews: RunReviewItem[] }).reviews).toHaveLength(1);
  });
});

describe("a sign-off and later versions of the scene", () => {
  it("stays on the run but is reported as belonging to the older scene version", async () => {
    const { run, scene } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    await decided("reviewer", run.id, "signed_off");
    const current = await readRun(run.id);
    expect(current).toMatchObject({ reviewState: "signed_off", sceneVersion: 1, sceneCurrentVersion: 1 });

    const saved = await callRoute(sceneRoute.PUT, {
      method: "PUT",
      path: `/api/scenes/${scene.id}`,
      params: { sceneId: scene.id },
      cookie: cookies.get("editor"),
      body: { baseVersion: 1, name: scene.name, description: "Barrier moved 0.5 m towards the road.", data: scene.data, note: "moved the barrier" },
    });
    expect(saved.status).toBe(200);

    const after = await readRun(run.id, "viewer");
    expect(after).toMatchObject({ reviewState: "signed_off", sceneVersion: 1, sceneCurrentVersion: 2 });
    expect(after.signOff).toMatchObject({ sceneVersion: 1, runInputHash: run.inputHash, signedOffByName: "Priya Raman" });
    expect(await listed(run.id)).toMatchObject({ reviewState: "signed_off", sceneCurrentVersion: 2, signOff: { sceneVersion: 1 } });
  });
});

describe("the review history", () => {
  const expected: Record<Who, number> = { owner: 200, editor: 200, reviewer: 200, viewer: 200, outsider: 404, nobody: 401 };
  for (const [who, status] of Object.entries(expected) as [Who, number][]) {
    it(`answers ${status} to ${who}`, async () => {
      const { run } = await savedRun();
      await decided("editor", run.id, "awaiting_review", "Ready for a look.");
      const response = await history(who, run.id);
      expect(response.status).toBe(status);
      if (status === 200) {
        const { reviews } = (await response.json()) as { reviews: RunReviewItem[] };
        expect(reviews).toHaveLength(1);
        expect(reviews[0]).toMatchObject({ fromState: "unreviewed", toState: "awaiting_review", actorName: "Tomas Lindgren", note: "Ready for a look.", runInputHash: run.inputHash, sceneVersion: 1 });
      }
    });
  }

  it("lists decisions newest first, and answers 404 for an unknown run and 400 for a bad id", async () => {
    const { run } = await savedRun();
    await decided("editor", run.id, "awaiting_review");
    await decided("reviewer", run.id, "revision_asked", "Refine the grid.");
    await decided("editor", run.id, "awaiting_review", "Refined to 2 cm.");
    await decided("reviewer", run.id, "signed_off");
    const { reviews } = (await (await history("viewer", run.id)).json()) as { reviews: RunReviewItem[] };
    expect(reviews.map((r) => r.toState)).toEqual(["signed_off", "awaiting_review", "revision_asked", "awaiting_review"]);
    expect((await history("owner", "00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await history("owner", "not-an-id")).status).toBe(400);
    expect((await decide("owner", "00000000-0000-4000-8000-000000000000", { toState: "awaiting_review" })).status).toBe(404);
  });
});

describe("e-mail and activity", () => {
  it("writes a review request to the reviewers and owners but not to the requester or viewers", async () => {
    const { run } = await savedRun("editor");
    await decided("editor", run.id, "awaiting_review", "Both designs are in; please look at design B first.");
    const mails = await mailsAbout(run.id);
    expect(mails.every((mail) => mail.kind === "review_request")).toBe(true);
    expect(mails.map((mail) => mail.toAddress).sort()).toEqual([emails.get("owner"), emails.get("reviewer")].sort());
    expect(mails[0]!.textBody).toContain("please look at design B first");
    expect(mails[0]!.textBody).toContain(`${testOrigin}/studies/${studyId}/runs/${run.id}`);
    expect(mails[0]!.subject).toContain("Review asked");
  });

  it("writes a decision to the run's author and to whoever asked for review, with the note", async () => {
    const { run } = await savedRun("editor");
    await decided("owner", run.id, "awaiting_review");
    const requestMails = (await mailsAbout(run.id)).length;
    await decided("reviewer", run.id, "revision_asked", "The PML looks too thin at the top.");
    const decisions = (await mailsAbout(run.id)).filter((mail) => mail.kind === "review_decision");
    expect(decisions.map((mail) => mail.toAddress).sort()).toEqual([emails.get("owner"), emails.get("editor")].sort());
    expect(decisions[0]!.textBody).toContain("The PML looks too thin at the top.");
    expect(decisions[0]!.subject).toContain("Revision asked");
    expect((await mailsAbout(run.id)).length).toBe(requestMails + 2);
  });

  it("says in the sign-off e-mail which run hash and scene version were signed off", async () => {
    const { run } = await savedRun("editor");
    await decided("editor", run.id, "awaiting_review");
    await decided("reviewer", run.id, "signed_off");
    const [signOff] = (await mailsAbout(run.id)).filter((mail) => mail.kind === "review_decision");
    expect(signOff?.toAddress).toBe(emails.get("editor"));
    expect(signOff?.textBody).toContain(`run hash ${run.inputHash.slice(0, 12)}, made from version 1 of the scene`);
  });

  it("records each decision in the study's activity with its states and note", async () => {
    const { run } = await savedRun("editor");
    await decided("editor", run.id, "awaiting_review");
    await decided("reviewer", run.id, "revision_asked", "Check the source height.");
    const entries = (await listActivityByStudyId({ studyId, limit: 200 })).filter((entry) => entry.action === "run.reviewed" && entry.subjectId === run.id);
    expect(entries.map((entry) => entry.detail)).toEqual([
      expect.objectContaining({ fromState: "awaiting_review", toState: "revision_asked", note: "Check the source height.", runId: run.id }),
      expect.objectContaining({ fromState: "unreviewed", toState: "awaiting_review", note: "", runId: run.id }),
    ]);
    expect(entries.map((entry) => entry.actorName)).toEqual(["Priya Raman", "Tomas Lindgren"]);
  });

  it("records nothing for a refused decision", async () => {
    const { run } = await savedRun("editor");
    await decide("viewer", run.id, { toState: "awaiting_review" });
    expect(await mailsAbout(run.id)).toEqual([]);
    const entries = (await listActivityByStudyId({ studyId, limit: 200 })).filter((entry) => entry.action === "run.reviewed" && entry.subjectId === run.id);
    expect(entries).toEqual([]);
  });
});
