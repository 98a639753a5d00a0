import { describe, expect, it } from "vitest";
import { matchesRunFilter, toRunTableRow } from "@/components/runs/run-table-model";
import { reviewStates } from "@/db/schema";
import type { TeamRole } from "@/lib/access/roles";
import type { RunListItem } from "@/lib/http/api-types";
import { reviewMailRecipients, type TeamMemberAddress } from "@/lib/review/review-recipients";
import { checkReviewCommand, decideReviewTransition, reviewCommandFor, reviewCommandOptions, type ReviewedRun } from "@/lib/review/review-rules";
import { reviewStateLabels, reviewStateNames, type ReviewStateName } from "@/lib/review/review-states";
import { signOffStanding, signOffStandingNotice } from "@/lib/review/sign-off-standing";

const author = "author-id";
const colleague = "colleague-id";

function run(reviewState: ReviewStateName, overrides: Partial<ReviewedRun> = {}): ReviewedRun {
  return { status: "completed", reviewState, createdById: author, ...overrides };
}

function decide(role: TeamRole, from: ReviewStateName, to: ReviewStateName, note = "", userId = colleague) {
  return decideReviewTransition({ actor: { userId, role }, run: run(from), toState: to, note });
}

describe("review states", () => {
  it("are the states the database stores, each with a label", () => {
    expect([...reviewStateNames]).toEqual([...reviewStates]);
    for (const state of reviewStateNames) expect(reviewStateLabels[state]).toBeTruthy();
  });
});

describe("which command a transition is", () => {
  it("names the command for each way between states", () => {
    expect(reviewCommandFor("unreviewed", "awaiting_review")).toBe("request_review");
    expect(reviewCommandFor("awaiting_review", "revision_asked")).toBe("ask_revision");
    expect(reviewCommandFor("signed_off", "revision_asked")).toBe("withdraw_sign_off");
    expect(reviewCommandFor("awaiting_review", "signed_off")).toBe("sign_off");
    expect(reviewCommandFor("signed_off", "unreviewed")).toBeNull();
  });
});

describe("asking for review", () => {
  it("is for owners and editors, from not reviewed or after a revision was asked", () => {
    for (const role of ["owner", "editor"] as const) {
      expect(decide(role, "unreviewed", "awaiting_review")).toEqual({ ok: true, command: "request_review" });
      expect(decide(role, "revision_asked", "awaiting_review")).toEqual({ ok: true, command: "request_review" });
    }
  });

  it("lets the run's own author ask", () => {
    expect(decide("editor", "unreviewed", "awaiting_review", "", author).ok).toBe(true);
  });

  it("is refused to reviewers and viewers with a reason that says who may", () => {
    for (const role of ["reviewer", "viewer"] as const) {
      const verdict = decide(role, "unreviewed", "awaiting_review");
      expect(verdict).toMatchObject({ ok: false, kind: "forbidden" });
      if (!verdict.ok) expect(verdict.reason).toContain("Owners and editors");
    }
  });

  it("is refused when a review is already asked for, or the run is signed off", () => {
    expect(decide("editor", "awaiting_review", "awaiting_review")).toMatchObject({ ok: false, kind: "conflict", reason: "The run is already “Awaiting review”." });
    const signed = decide("editor", "signed_off", "awaiting_review");
    expect(signed).toMatchObject({ ok: false, kind: "conflict" });
    if (!signed.ok) expect(signed.reason).toContain("withdraw the sign-off");
  });
});

describe("deciding", () => {
  it("lets owners and reviewers sign off or ask for a revision, when asked and unasked", () => {
    for (const role of ["owner", "reviewer"] as const) {
      for (const from of ["awaiting_review", "unreviewed"] as const) {
        expect(decide(role, from, "signed_off")).toEqual({ ok: true, command: "sign_off" });
        expect(decide(role, from, "revision_asked", "Refine the grid near the barrier top.")).toEqual({ ok: true, command: "ask_revision" });
      }
    }
  });

  it("refuses editors and viewers", () => {
    for (const role of ["editor", "viewer"] as const) {
      expect(decide(role, "awaiting_review", "signed_off")).toMatchObject({ ok: false, kind: "forbidden" });
      expect(decide(role, "awaiting_review", "revision_asked", "note")).toMatchObject({ ok: false, kind: "forbidden" });
    }
  });

  it("needs a note to ask for a revision", () => {
    expect(decide("reviewer", "awaiting_review", "revision_asked", "   ")).toMatchObject({ ok: false, kind: "invalid", field: "note", reason: "Say what should be revised." });
  });

  it("keeps four eyes: an owner who ran it cannot sign it off, but can ask for a revision", () => {
    const own = decide("owner", "awaiting_review", "signed_off", "", author);
    expect(own).toMatchObject({ ok: false, kind: "forbidden", reason: "You ran this yourself, so someone else must sign it off." });
    expect(decide("owner", "awaiting_review", "revision_asked", "Check the source height.", author).ok).toBe(true);
  });

  it("does not sign off after a revision was asked until review is asked again", () => {
    const verdict = decide("reviewer", "revision_asked", "signed_off");
    expect(verdict).toMatchObject({ ok: false, kind: "conflict" });
    if (!verdict.ok) expect(verdict.reason).toContain("ask for a review again");
  });

  it("refuses the same state twice", () => {
    expect(decide("reviewer", "signed_off", "signed_off")).toMatchObject({ ok: false, kind: "conflict", reason: "The run is already “Signed off”." });
    expect(decide("reviewer", "revision_asked", "revision_asked", "again")).toMatchObject({ ok: false, kind: "conflict" });
  });

  it("never leads back to not reviewed", () => {
    expect(decide("owner", "signed_off", "unreviewed")).toMatchObject({ ok: false, kind: "invalid", field: "toState" });
  });
});

describe("withdrawing a sign-off", () => {
  it("goes to revision asked, for owners and reviewers, with a note", () => {
    expect(decide("reviewer", "signed_off", "revision_asked", "The source spectrum was wrong.")).toEqual({ ok: true, command: "withdraw_sign_off" });
    expect(decide("owner", "signed_off", "revision_asked", "Superseded.", author)).toEqual({ ok: true, command: "withdraw_sign_off" });
    expect(decide("reviewer", "signed_off", "revision_asked", "")).toMatchObject({ ok: false, kind: "invalid", field: "note", reason: "Say why the sign-off is withdrawn." });
    expect(decide("editor", "signed_off", "revision_asked", "no")).toMatchObject({ ok: false, kind: "forbidden" });
  });
});

describe("runs that did not finish", () => {
  it("cannot be reviewed at all", () => {
    for (const status of ["failed", "cancelled", "running", "queued"] as const) {
      const verdict = checkReviewCommand({ actor: { userId: colleague, role: "owner" }, run: run("unreviewed", { status }), command: "request_review" });
      expect(verdict).toMatchObject({ ok: false, kind: "conflict", reason: `Only a completed run can be reviewed; this one is ${status}.` });
    }
  });
});

describe("the panel's commands", () => {
  it("shows each role only the ways on from the current state that its role may take", () => {
    expect(reviewCommandOptions({ actor: { userId: colleague, role: "viewer" }, run: run("unreviewed") })).toEqual([]);
    const reviewer = reviewCommandOptions({ actor: { userId: colleague, role: "reviewer" }, run: run("awaiting_review") });
    expect(reviewer.map((option) => [option.command, option.available])).toEqual([
      ["ask_revision", true],
      ["sign_off", true],
    ]);
    const editor = reviewCommandOptions({ actor: { userId: colleague, role: "editor" }, run: run("unreviewed") });
    expect(editor.map((option) => [option.command, option.available])).toEqual([["request_review", true]]);
    expect(reviewCommandOptions({ actor: { userId: colleague, role: "editor" }, run: run("awaiting_review") })).toEqual([]);
    const owner = reviewCommandOptions({ actor: { userId: colleague, role: "owner" }, run: run("unreviewed") });
    expect(owner.map((option) => option.command)).toEqual(["request_review", "ask_revision", "sign_off"]);
  });

  it("disables every command on a run that did not finish, with the reason", () => {
    const options = reviewCommandOptions({ actor: { userId: colleague, role: "owner" }, run: run("unreviewed", { status: "failed" }) });
    expect(options.every((option) => !option.available && option.reason === "Only a completed run can be reviewed; this one is failed.")).toBe(true);
  });

  it("disables sign-off for the author with the four-eyes reason", () => {
    const owner = reviewCommandOptions({ actor: { userId: author, role: "owner" }, run: run("awaiting_review") });
    expect(owner.find((option) => option.command === "sign_off")).toMatchObject({ available: false, reason: "You ran this yourself, so someone else must sign it off." });
  });

  it("offers owners and reviewers only the withdrawal on a signed-off run, and says a note is needed", () => {
    for (const role of ["owner", "reviewer"] as const) {
      const options = reviewCommandOptions({ actor: { userId: colleague, role }, run: run("signed_off") });
      expect(options.map((option) => option.command)).toEqual(["withdraw_sign_off"]);
      expect(options[0]?.noteRequired).toBe(true);
    }
  });
});

describe("the standing of a sign-off", () => {
  it("belongs to an older version once the scene has moved on", () => {
    expect(signOffStanding({ signedVersion: 3, sceneCurrentVersion: 3 })).toEqual({ kind: "current", signedVersion: 3 });
    const older = signOffStanding({ signedVersion: 3, sceneCurrentVersion: 5 });
    expect(signOffStandingNotice(older)).toBe("Signed off for version 3 of the scene; the scene is now at version 5. This sign-off belongs to the older version.");
    expect(signOffStandingNotice(signOffStanding({ signedVersion: 3, sceneCurrentVersion: null }))).toContain("since been deleted");
    expect(signOffStandingNotice(signOffStanding({ signedVersion: 3, sceneCurrentVersion: 3 }))).toBeNull();
  });
});

describe("who is written to", () => {
  const members: TeamMemberAddress[] = [
    { userId: "o", name: "Owner", email: "o@x.test", role: "owner" },
    { userId: "e", name: "Editor", email: "e@x.test", role: "editor" },
    { userId: "r", name: "Reviewer", email: "r@x.test", role: "reviewer" },
    { userId: "v", name: "Viewer", email: "v@x.test", role: "viewer" },
  ];
  const ids = (list: TeamMemberAddress[]) => list.map((member) => member.userId).sort();

  it("sends a request to reviewers and owners but not to the requester", () => {
    expect(ids(reviewMailRecipients({ command: "request_review", actorId: "e", runCreatorId: "e", requesterId: null, members }))).toEqual(["o", "r"]);
    expect(ids(reviewMailRecipients({ command: "request_review", actorId: "o", runCreatorId: "e", requesterId: null, members }))).toEqual(["r"]);
  });

  it("sends a decision to the author and the requester, once each, never to the decider or a former member", () => {
    expect(ids(reviewMailRecipients({ command: "sign_off", actorId: "r", runCreatorId: "e", requesterId: "o", members }))).toEqual(["e", "o"]);
    expect(ids(reviewMailRecipients({ command: "ask_revision", actorId: "r", runCreatorId: "e", requesterId: "e", members }))).toEqual(["e"]);
    expect(ids(reviewMailRecipients({ command: "ask_revision", actorId: "o", runCreatorId: "o", requesterId: null, members }))).toEqual([]);
    expect(ids(reviewMailRecipients({ command: "withdraw_sign_off", actorId: "r", runCreatorId: "gone", requesterId: "e", members }))).toEqual(["e"]);
  });
});

describe("the run table's review column", () => {
  const item = (reviewState: ReviewStateName, signedVersion: number | null, currentVersion: number | null) =>
    ({
      id: `run-${reviewState}-${signedVersion}-${currentVersion}`,
      sceneName: "Design B",
      sceneVersion: 1,
      status: "completed",
      createdByName: "Tomas",
      createdAt: "2026-03-02T10:00:00.000Z",
      figures: null,
      reviewState,
      sceneCurrentVersion: currentVersion,
      signOff: signedVersion === null ? null : { signedOffById: "r", signedOffByName: "Priya", signedOffAt: "2026-03-03T10:00:00.000Z", runInputHash: "a".repeat(64), sceneVersion: signedVersion, note: "" },
    }) as unknown as RunListItem;

  it("ranks a sign-off for an older scene version below one that still holds, and filters by state", () => {
    const current = toRunTableRow(item("signed_off", 1, 1));
    const older = toRunTableRow(item("signed_off", 1, 2));
    const waiting = toRunTableRow(item("awaiting_review", null, 1));
    expect(older.signOffIsOlder).toBe(true);
    expect(current.signOffIsOlder).toBe(false);
    expect(current.reviewRank).toBeGreaterThan(older.reviewRank);
    expect(older.reviewRank).toBeGreaterThan(waiting.reviewRank);
    expect(current.signedOffBy).toBe("Priya");
    expect(matchesRunFilter(waiting, { text: "", status: "all", review: "signed_off" })).toBe(false);
    expect(matchesRunFilter(older, { text: "", status: "all", review: "signed_off" })).toBe(true);
    expect(matchesRunFilter(waiting, { text: "", status: "all" })).toBe(true);
  });
});
