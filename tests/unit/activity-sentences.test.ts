import { describe, expect, it } from "vitest";
import { dayLabel, describeActivity, groupByDay, sentenceText, type SentenceInput } from "@/lib/collaboration/activity-sentences";

// Activity entries read as sentences, with links only where the thing still exists.

const studyId = "11111111-1111-4111-8111-111111111111";
const runId = "22222222-2222-4222-8222-222222222222";
const sceneId = "33333333-3333-4333-8333-333333333333";

function entry(overrides: Partial<SentenceInput>): SentenceInput {
  return {
    action: "study.created",
    subjectType: "study",
    subjectId: studyId,
    actorId: "priya",
    actorName: "Priya Raman",
    detail: {},
    studyId,
    studyTitle: "Station Road barrier",
    runId: null,
    runLabel: null,
    sceneName: null,
    ...overrides,
  };
}

const onRun = { subjectType: "comment", subjectId: "c1", runId, runLabel: { studyId, sceneName: "Barrier 3 m", sceneVersion: 4 } } as const;

function says(overrides: Partial<SentenceInput>, options = {}): string {
  return sentenceText(describeActivity(entry(overrides), options));
}

describe("activity sentences", () => {
  it("names every action of the product in plain words", () => {
    const cases: [Partial<SentenceInput>, string][] = [
      [{ action: "study.created" }, "Priya Raman started the study Station Road barrier"],
      [{ action: "scene.created", subjectType: "scene", subjectId: sceneId, sceneName: "Barrier 3 m" }, "Priya Raman added the scene Barrier 3 m"],
      [{ action: "scene.saved", subjectType: "scene", subjectId: sceneId, sceneName: "Barrier 3 m", detail: { version: 5, note: "Raised the top" } }, "Priya Raman saved version 5 of Barrier 3 m: “Raised the top”"],
      [{ action: "scene.saved", subjectType: "scene", subjectId: sceneId, sceneName: "Barrier 3 m", detail: { version: 6, restoredVersion: 2 } }, "Priya Raman restored version 2 of Barrier 3 m as version 6"],
      [{ action: "block.added", detail: { kind: "notes" } }, "Priya Raman added a notes block to the notebook"],
      [{ action: "block.deleted", detail: { kind: "chart" } }, "Priya Raman removed a chart block from the notebook"],
      [{ action: "run.saved", subjectType: "run", subjectId: runId, runId, runLabel: onRun.runLabel, detail: { status: "completed" } }, "Priya Raman saved a run of Barrier 3 m, version 4"],
      [{ action: "run.saved", subjectType: "run", subjectId: runId, runId, runLabel: onRun.runLabel, detail: { status: "cancelled" } }, "Priya Raman saved a run of Barrier 3 m, version 4 (cancelled)"],
      [{ action: "run.deleted", subjectType: "run", subjectId: runId, detail: { sceneName: "Barrier 3 m" } }, "Priya Raman deleted a run of Barrier 3 m"],
      [{ action: "comment.added", ...onRun, detail: { excerpt: "Check the top edge" } }, "Priya Raman commented on the run of Barrier 3 m, version 4: “Check the top edge”"],
      [{ action: "comment.added", ...onRun, detail: { pinned: "field" } }, "Priya Raman pinned a comment on the run of Barrier 3 m, version 4"],
      [{ action: "comment.added", ...onRun, detail: { reply: true, pinned: "field" } }, "Priya Raman replied to a comment on the run of Barrier 3 m, version 4"],
      [{ action: "comment.edited", ...onRun }, "Priya Raman edited a comment on the run of Barrier 3 m, version 4"],
      [{ action: "comment.deleted", ...onRun, detail: { byModerator: true } }, "Priya Raman removed a comment on the run of Barrier 3 m, version 4"],
      [{ action: "comment.resolved", ...onRun }, "Priya Raman resolved a thread on the run of Barrier 3 m, version 4"],
      [{ action: "comment.reopened", ...onRun }, "Priya Raman reopened a thread on the run of Barrier 3 m, version 4"],
      [{ action: "run.reviewed", ...onRun, subjectType: "run", detail: { fromState: "unreviewed", toState: "awaiting_review" } }, "Priya Raman asked for a review of the run of Barrier 3 m, version 4"],
      [{ action: "run.reviewed", ...onRun, subjectType: "run", detail: { fromState: "awaiting_review", toState: "revision_asked", note: "Finer grid, please" } }, "Priya Raman asked for a revision of the run of Barrier 3 m, version 4: “Finer grid, please”"],
      [{ action: "run.reviewed", ...onRun, subjectType: "run", detail: { toState: "signed_off", note: "" } }, "Priya Raman signed off the run of Barrier 3 m, version 4"],
      [{ action: "scene.forked", subjectType: "scene", subjectId: sceneId, sceneName: "Barrier 4 m", detail: { originName: "Barrier 3 m", originVersion: 4, forkName: "Barrier 4 m", forkSceneId: sceneId, targetStudyId: studyId } }, "Priya Raman forked Barrier 3 m, version 4, as Barrier 4 m"],
      [{ action: "scene.forked", subjectType: "scene", subjectId: "origin", detail: { originName: "Barrier 3 m", originVersion: 4, forkName: null, intoOtherTeam: true } }, "Priya Raman forked Barrier 3 m, version 4, into another team"],
      [{ action: "member.invited", studyId: null, detail: { email: "alex@example.org", role: "editor" } }, "Priya Raman invited alex@example.org to the team as an editor"],
      [{ action: "member.joined", studyId: null, detail: { memberName: "Alex", role: "reviewer" } }, "Priya Raman joined the team as a reviewer"],
      [{ action: "member.role_changed", studyId: null, detail: { memberName: "Tomas Lindgren", fromRole: "editor", toRole: "reviewer" } }, "Priya Raman changed Tomas Lindgren’s role from editor to reviewer"],
      [{ action: "member.removed", studyId: null, subjectId: "owen", detail: { memberName: "Owen Marsh" } }, "Priya Raman removed Owen Marsh from the team"],
      [{ action: "member.removed", studyId: null, subjectId: "priya", detail: { memberName: "Priya Raman", left: true } }, "Priya Raman left the team"],
      [{ action: "invitation.revoked", studyId: null, detail: { email: "alex@example.org" } }, "Priya Raman withdrew the invitation to alex@example.org"],
      [{ action: "share_link.created", detail: { label: "For the client" } }, "Priya Raman made a read-only link to Station Road barrier (For the client)"],
      [{ action: "verification.recorded", subjectType: "verification", subjectId: "v1", studyId: null, studyTitle: null, detail: { passedCount: 6, failedCount: 1 } }, "Priya Raman saved verification results (6 of 7 cases passed)"],
      [{ ...onRun, action: "run.evidence_attached", subjectType: "run", subjectId: runId, detail: { verificationId: "v1" } }, "Priya Raman attached verification results to the run of Barrier 3 m, version 4 as quality evidence"],
      [{ ...onRun, action: "run.evidence_detached", subjectType: "run", subjectId: runId, detail: { verificationId: "v1" } }, "Priya Raman detached verification results from the run of Barrier 3 m, version 4"],
      [{ action: "share_link.revoked", detail: {} }, "Priya Raman revoked a read-only link to Station Road barrier"],
      [{ action: "api_token.created", studyId: null, detail: { name: "Nightly sweep", role: "editor" } }, "Priya Raman made an API token “Nightly sweep” for scripts in the team, acting at most as an editor"],
      [{ action: "api_token.revoked", studyId: null, detail: { name: "Nightly sweep" } }, "Priya Raman revoked the API token “Nightly sweep”"],
    ];
    for (const [overrides, expected] of cases) expect(says(overrides)).toBe(expected);
  });

  it("links a run, a scene and a fork while they exist, and only names them once deleted", () => {
    const linked = describeActivity(entry({ action: "comment.added", ...onRun }));
    expect(linked.parts.find((part) => part.href)?.href).toBe(`/studies/${studyId}/runs/${runId}`);
    const gone = describeActivity(entry({ action: "comment.added", subjectType: "comment", runId, runLabel: null, detail: { sceneName: "Barrier 3 m", sceneVersion: 4 } }));
    expect(gone.parts.some((part) => part.href)).toBe(false);
    expect(sentenceText(gone)).toBe("Priya Raman commented on a run of Barrier 3 m, version 4");
    const scene = describeActivity(entry({ action: "scene.created", subjectType: "scene", subjectId: sceneId, sceneName: "Barrier 3 m" }));
    expect(scene.parts.find((part) => part.href)?.href).toBe(`/studies/${studyId}/scenes/${sceneId}`);
    const deletedScene = describeActivity(entry({ action: "scene.created", subjectType: "scene", subjectId: sceneId, sceneName: null, detail: { name: "Old barrier" } }));
    expect(deletedScene.parts.some((part) => part.href)).toBe(false);
    expect(sentenceText(deletedScene)).toBe("Priya Raman added the scene Old barrier");
  });

  it("says You for the reader's own entries and names a member who has left as a former member", () => {
    expect(says({ action: "block.added", detail: { kind: "run" } }, { viewerId: "priya" })).toBe("You added a run block to the notebook");
    expect(says({ action: "block.added", actorId: null, actorName: null, detail: { kind: "run" } })).toBe("A former member added a run block to the notebook");
  });

  it("names the study in the team feed, once", () => {
    expect(says({ action: "comment.added", ...onRun }, { withStudy: true })).toBe("Priya Raman commented on the run of Barrier 3 m, version 4 in Station Road barrier");
    expect(says({ action: "study.created" }, { withStudy: true })).toBe("Priya Raman started the study Station Road barrier");
    expect(says({ action: "member.joined", studyId: null, studyTitle: null, detail: { role: "viewer" } }, { withStudy: true })).toBe("Priya Raman joined the team as a viewer");
  });

  it("clips a long excerpt and falls back to the action's words for one it does not know", () => {
    const long = says({ action: "comment.added", ...onRun, detail: { excerpt: "word ".repeat(40) } });
    expect(long.length).toBeLessThan(160);
    expect(long.endsWith("…”")).toBe(true);
    expect(says({ action: "study.archived" })).toBe("Priya Raman did study archived");
    expect(says({ action: "comment.edited", ...onRun, detail: { excerpt: "The **reflection** at `x = 2 m`\n- check" } })).toBe(
      "Priya Raman edited a comment on the run of Barrier 3 m, version 4: “The reflection at x = 2 m - check”",
    );
  });

  it("groups entries by the reader's calendar day, newest first, as Today, Yesterday or the date", () => {
    const now = new Date(2026, 2, 10, 15, 0);
    const at = (day: number, hour: number) => new Date(2026, 2, day, hour, 0).toISOString();
    const groups = groupByDay([{ createdAt: at(10, 14) }, { createdAt: at(10, 9) }, { createdAt: at(9, 23) }, { createdAt: at(3, 12) }], now);
    expect(groups.map((group) => [group.label, group.items.length])).toEqual([
      ["Today", 2],
      ["Yesterday", 1],
      ["Tuesday, 3 March 2026", 1],
    ]);
    expect(dayLabel(at(10, 0), now)).toBe("Today");
  });
});
