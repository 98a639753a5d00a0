// Who may move a saved run from one review state to another. Pure, so that the route (which
// answers 403/409/400 with the reason) and the review panel (which disables a button and shows the
// same reason) cannot disagree.
import { roleAllows, type TeamAction, type TeamRole } from "@/lib/access/roles";
import type { RunStatusName } from "@/lib/http/api-types";
import { reviewStateLabels, type ReviewStateName } from "./review-states";

/** What a person does to the review state; each maps to one target state. */
export type ReviewCommand = "request_review" | "ask_revision" | "sign_off" | "withdraw_sign_off";

/** The states a decision can move a run to; nothing leads back to "unreviewed". */
export const reviewTargetStates = ["awaiting_review", "revision_asked", "signed_off"] as const;
export type ReviewTargetState = (typeof reviewTargetStates)[number];

interface CommandRule {
  to: ReviewTargetState;
  /** The states the command starts from. */
  from: readonly ReviewStateName[];
  action: TeamAction;
  noteRequired: boolean;
  /** Plain words for "who may", used when a role lacks the action. */
  whoMay: string;
}

export const reviewCommandRules: Record<ReviewCommand, CommandRule> = {
  request_review: { to: "awaiting_review", from: ["unreviewed", "revision_asked"], action: "run:request-review", noteRequired: false, whoMay: "Owners and editors ask for a review." },
  // A reviewer may decide without waiting to be asked: a run that nobody has put forward yet.
  ask_revision: { to: "revision_asked", from: ["awaiting_review", "unreviewed"], action: "run:review", noteRequired: true, whoMay: "Owners and reviewers ask for a revision." },
  sign_off: { to: "signed_off", from: ["awaiting_review", "unreviewed"], action: "run:review", noteRequired: false, whoMay: "Owners and reviewers sign runs off." },
  withdraw_sign_off: { to: "revision_asked", from: ["signed_off"], action: "run:review", noteRequired: true, whoMay: "Owners and reviewers withdraw a sign-off." },
};

export const reviewCommands = Object.keys(reviewCommandRules) as ReviewCommand[];

/** The command that moves a run from `from` to `to`, or null when no command does. */
export function reviewCommandFor(from: ReviewStateName, to: ReviewStateName): ReviewCommand | null {
  if (to === "revision_asked") return from === "signed_off" ? "withdraw_sign_off" : "ask_revision";
  if (to === "awaiting_review") return "request_review";
  if (to === "signed_off") return "sign_off";
  return null;
}

export interface ReviewActor {
  userId: string;
  role: TeamRole;
}

export interface ReviewedRun {
  status: RunStatusName;
  reviewState: ReviewStateName;
  createdById: string | null;
}

/** forbidden: the person may not (403); conflict: not from this state or run (409); invalid: the input is short of something (400). */
export type ReviewRefusalKind = "forbidden" | "conflict" | "invalid";

export type ReviewVerdict =
  | { ok: true; command: ReviewCommand }
  | { ok: false; kind: ReviewRefusalKind; reason: string; command: ReviewCommand | null; field?: "note" | "toState" };

function refuse(kind: ReviewRefusalKind, reason: string, command: ReviewCommand | null, field?: "note" | "toState"): ReviewVerdict {
  return field ? { ok: false, kind, reason, command, field } : { ok: false, kind, reason, command };
}

const quoted = (state: ReviewStateName) => `“${reviewStateLabels[state]}”`;

/**
 * Whether the actor may give this command to this run now, the note aside. Checks in order: the
 * role, a finished run, the starting state, and four eyes (nobody signs off a run they made).
 */
export function checkReviewCommand({ actor, run, command }: { actor: ReviewActor; run: ReviewedRun; command: ReviewCommand }): ReviewVerdict {
  const rule = reviewCommandRules[command];
  if (!roleAllows(actor.role, rule.action)) return refuse("forbidden", `Your role (${actor.role}) cannot do this. ${rule.whoMay}`, command);
  if (run.status !== "completed") return refuse("conflict", `Only a completed run can be reviewed; this one is ${run.status}.`, command);
  if (run.reviewState === rule.to) return refuse("conflict", `The run is already ${quoted(rule.to)}.`, command);
  if (!rule.from.includes(run.reviewState)) return refuse("conflict", fromStateReason(command, run.reviewState), command);
  if (command === "sign_off" && run.createdById !== null && run.createdById === actor.userId) {
    return refuse("forbidden", "You ran this yourself, so someone else must sign it off.", command);
  }
  return { ok: true, command };
}

function fromStateReason(command: ReviewCommand, state: ReviewStateName): string {
  if (command === "request_review" && state === "awaiting_review") return "A review has already been asked for.";
  if (command === "request_review" && state === "signed_off") return "The run is signed off; a reviewer must withdraw the sign-off before it is reviewed again.";
  if (command === "sign_off" && state === "revision_asked") return "A revision was asked for: ask for a review again before signing it off.";
  return `This cannot be done while the run is ${quoted(state)}.`;
}

/** The full decision on a request to move a run to `toState`, note included. */
export function decideReviewTransition({ actor, run, toState, note }: { actor: ReviewActor; run: ReviewedRun; toState: ReviewStateName; note: string }): ReviewVerdict {
  const command = reviewCommandFor(run.reviewState, toState);
  if (!command) return refuse("invalid", `A run cannot be moved back to ${quoted(toState)}.`, null, "toState");
  const verdict = checkReviewCommand({ actor, run, command });
  if (!verdict.ok) return verdict;
  if (reviewCommandRules[command].noteRequired && note.trim().length === 0) {
    return refuse("invalid", command === "withdraw_sign_off" ? "Say why the sign-off is withdrawn." : "Say what should be revised.", command, "note");
  }
  return verdict;
}

export interface ReviewCommandOption {
  command: ReviewCommand;
  toState: ReviewTargetState;
  /** Whether the button is enabled; when not, `reason` says why in plain words. */
  available: boolean;
  reason: string | null;
  noteRequired: boolean;
}

/**
 * The commands the review panel shows to this person for this run: those that lead on from the
 * current state and that the person's role may give (a viewer sees none, an editor never sees
 * "Sign off"). One the person still may not give here (their own run, an unfinished run) is listed
 * disabled, with the reason.
 */
export function reviewCommandOptions({ actor, run }: { actor: ReviewActor; run: ReviewedRun }): ReviewCommandOption[] {
  return reviewCommands
    .filter((command) => reviewCommandRules[command].from.includes(run.reviewState) && roleAllows(actor.role, reviewCommandRules[command].action))
    .map((command) => {
      const verdict = checkReviewCommand({ actor, run, command });
      return { command, toState: reviewCommandRules[command].to, available: verdict.ok, reason: verdict.ok ? null : verdict.reason, noteRequired: reviewCommandRules[command].noteRequired };
    });
}
