// Activity entries as sentences a colleague would say: "Priya pinned a comment on Barrier 3 m,
// version 4". Parts carry links where the thing still exists; the same words serve the feeds and
// the live notices. Pure: no React, no database.
import type { FeedItem } from "@/lib/http/activity-types";
import { isReviewStateName, reviewStateLabels } from "@/lib/review/review-states";

export interface SentencePart {
  text: string;
  /** A link to the thing named, when it still exists and the reader may open it. */
  href?: string;
}

export interface ActivitySentence {
  /** "You" for the reader's own entries. */
  actor: string;
  /** What follows the actor's name, in order. */
  parts: SentencePart[];
}

export type SentenceInput = Pick<FeedItem, "action" | "subjectType" | "subjectId" | "actorId" | "actorName" | "detail" | "studyId" | "studyTitle" | "runId" | "runLabel" | "sceneName">;

export interface SentenceOptions {
  /** The reader, whose own entries read "You …". */
  viewerId?: string | null;
  /** Team feeds name the study each entry belongs to. */
  withStudy?: boolean;
}

function text(value: unknown): string | null {
  return typeof value === "string" && value.trim() ? value.trim() : null;
}

function count(value: unknown): number | null {
  return typeof value === "number" && Number.isFinite(value) ? value : null;
}

function quote(raw: string, limit = 80): string {
  // Excerpts are Markdown; in a one-line sentence its emphasis marks are noise.
  const value = raw.replace(/\*\*|__|`/g, "").replace(/\s+/g, " ");
  const clipped = value.length > limit ? `${value.slice(0, limit - 1).trimEnd()}…` : value;
  return `“${clipped}”`;
}

function article(word: string): string {
  return /^[aeiou]/i.test(word) ? `an ${word}` : `a ${word}`;
}

function stateLabel(value: unknown): string | null {
  if (isReviewStateName(value)) return reviewStateLabels[value].toLowerCase();
  return text(value)?.replace(/_/g, " ") ?? null;
}

/** The run an entry concerns, linked while it exists: "Barrier 3 m, version 4". */
function runPart(item: SentenceInput, lead: "the" | "a" = "the"): SentencePart {
  const detail = item.detail;
  if (item.runLabel && item.runId) {
    const name = item.runLabel.sceneName ?? text(detail.sceneName) ?? "a deleted scene";
    return { text: `${lead} run of ${name}, version ${item.runLabel.sceneVersion}`, href: `/studies/${item.runLabel.studyId}/runs/${item.runId}` };
  }
  const name = text(detail.sceneName);
  const version = count(detail.sceneVersion);
  if (name) return { text: `a run of ${name}${version !== null ? `, version ${version}` : ""}` };
  return { text: "a run that has since been deleted" };
}

/** The scene an entry concerns, linked while it exists. */
function scenePart(item: SentenceInput, fallbackName: string | null): SentencePart {
  const name = item.sceneName ?? fallbackName ?? "a scene";
  const href = item.sceneName && item.studyId ? `/studies/${item.studyId}/scenes/${item.subjectId}` : undefined;
  return href ? { text: name, href } : { text: name };
}

/** The scene and version a server run was queued from, by name (a job has no page of its own). */
function serverRunScene(item: SentenceInput): SentencePart {
  const name = text(item.detail.sceneName) ?? "a scene";
  const version = count(item.detail.sceneVersion);
  return { text: `${name}${version !== null ? `, version ${version}` : ""}` };
}

function blockKind(value: unknown): string {
  const kind = text(value);
  if (kind === "notes") return "a notes block";
  if (kind === "scene") return "a scene block";
  if (kind === "run") return "a run block";
  if (kind === "chart") return "a chart block";
  return "a block";
}

function commentVerb(item: SentenceInput): string {
  const detail = item.detail;
  if (detail.reply === true) return "replied to a comment on ";
  if (text(detail.pinned) || detail.pinned === true) return "pinned a comment on ";
  return "commented on ";
}

function withExcerpt(parts: SentencePart[], excerpt: unknown): SentencePart[] {
  const said = text(excerpt);
  return said ? [...parts, { text: `: ${quote(said)}` }] : parts;
}

function describeParts(item: SentenceInput): { parts: SentencePart[]; namesStudy: boolean } {
  const detail = item.detail;
  const studyLink: SentencePart = item.studyId ? { text: item.studyTitle ?? "the study", href: `/studies/${item.studyId}` } : { text: "the study" };
  switch (item.action) {
    case "study.created":
      return { parts: [{ text: "started the study " }, { ...studyLink, text: item.studyTitle ?? text(detail.title) ?? "a study" }], namesStudy: true };
    case "scene.created":
      return { parts: [{ text: "added the scene " }, scenePart(item, text(detail.name))], namesStudy: false };
    case "scene.saved": {
      const version = count(detail.version);
      const restored = count(detail.restoredVersion);
      const scene = scenePart(item, text(detail.name));
      const parts: SentencePart[] =
        restored !== null
          ? [{ text: `restored version ${restored} of ` }, scene, { text: version !== null ? ` as version ${version}` : "" }]
          : [{ text: version !== null ? `saved version ${version} of ` : "saved " }, scene];
      return { parts: restored === null ? withExcerpt(parts, detail.note) : parts, namesStudy: false };
    }
    case "scene.forked": {
      const origin = text(detail.originName) ?? "a scene";
      const originVersion = count(detail.originVersion);
      const from = `forked ${origin}${originVersion !== null ? `, version ${originVersion},` : ""}`;
      if (detail.intoOtherTeam === true) return { parts: [{ text: `${from} into another team` }], namesStudy: false };
      const forkName = text(detail.forkName) ?? "a variant";
      const forkSceneId = text(detail.forkSceneId);
      const targetStudyId = text(detail.targetStudyId);
      // The entry in the fork's own study has the fork as its subject; the origin's study names where it went.
      const forkExists = item.subjectId === forkSceneId ? item.sceneName !== null : true;
      const fork: SentencePart = forkSceneId && targetStudyId && forkExists ? { text: forkName, href: `/studies/${targetStudyId}/scenes/${forkSceneId}` } : { text: forkName };
      const elsewhere = targetStudyId && item.studyId && targetStudyId !== item.studyId ? " in another study" : "";
      return { parts: [{ text: `${from} as ` }, fork, { text: elsewhere }], namesStudy: false };
    }
    case "block.added":
      return { parts: [{ text: `added ${blockKind(detail.kind)} to the notebook` }], namesStudy: false };
    case "block.deleted":
      return { parts: [{ text: `removed ${blockKind(detail.kind)} from the notebook` }], namesStudy: false };
    case "run.saved": {
      const status = text(detail.status);
      const note = status && status !== "completed" ? ` (${status})` : "";
      return { parts: [{ text: "saved " }, runPart(item, "a"), { text: note }], namesStudy: false };
    }
    case "run.deleted":
      return { parts: [{ text: `deleted a run${text(detail.sceneName) ? ` of ${text(detail.sceneName)}` : ""}` }], namesStudy: false };
    case "comment.added":
      return { parts: withExcerpt([{ text: commentVerb(item) }, runPart(item)], detail.excerpt), namesStudy: false };
    case "comment.edited":
      return { parts: withExcerpt([{ text: "edited a comment on " }, runPart(item)], detail.excerpt), namesStudy: false };
    case "comment.deleted":
      return { parts: [{ text: detail.byModerator === true ? "removed a comment on " : "deleted a comment on " }, runPart(item)], namesStudy: false };
    case "comment.resolved":
      return { parts: withExcerpt([{ text: "resolved a thread on " }, runPart(item)], detail.excerpt), namesStudy: false };
    case "comment.reopened":
      return { parts: withExcerpt([{ text: "reopened a thread on " }, runPart(item)], detail.excerpt), namesStudy: false };
    case "run.reviewed": {
      const to = text(detail.toState);
      const run = runPart(item);
      const parts: SentencePart[] =
        to === "awaiting_review"
          ? [{ text: "asked for a review of " }, run]
          : to === "revision_asked"
            ? [{ text: "asked for a revision of " }, run]
            : to === "signed_off"
              ? [{ text: "signed off " }, run]
              : to === "unreviewed"
                ? [{ text: "withdrew the review of " }, run]
                : [{ text: "set " }, run, { text: ` to ${stateLabel(to) ?? "a new review state"}` }];
      return { parts: withExcerpt(parts, detail.note), namesStudy: false };
    }
    case "verification.recorded": {
      const passed = count(detail.passedCount);
      const failed = count(detail.failedCount);
      const tally = passed !== null && failed !== null ? ` (${passed} of ${passed + failed} cases passed)` : "";
      return { parts: [{ text: "saved " }, { text: "verification results", href: "/verification" }, { text: tally }], namesStudy: true };
    }
    case "run.evidence_attached":
      return { parts: [{ text: "attached verification results to " }, runPart(item), { text: " as quality evidence" }], namesStudy: false };
    case "run.evidence_detached":
      return { parts: [{ text: "detached verification results from " }, runPart(item)], namesStudy: false };
    case "member.invited": {
      const role = text(detail.role);
      return { parts: [{ text: `invited ${text(detail.email) ?? "someone"} to the team${role ? ` as ${article(role)}` : ""}` }], namesStudy: true };
    }
    case "member.joined": {
      const role = text(detail.role);
      return { parts: [{ text: `joined the team${role ? ` as ${article(role)}` : ""}` }], namesStudy: true };
    }
    case "member.role_changed": {
      const who = text(detail.memberName) ?? text(detail.name) ?? text(detail.email) ?? "a member";
      const from = text(detail.fromRole);
      const to = text(detail.toRole) ?? text(detail.role);
      return { parts: [{ text: `changed ${who}’s role${from ? ` from ${from}` : ""}${to ? ` to ${to}` : ""}` }], namesStudy: true };
    }
    case "member.removed": {
      if (detail.left === true || (item.actorId !== null && item.actorId === item.subjectId)) return { parts: [{ text: "left the team" }], namesStudy: true };
      const who = text(detail.memberName) ?? text(detail.name) ?? text(detail.email) ?? "a member";
      return { parts: [{ text: `removed ${who} from the team` }], namesStudy: true };
    }
    case "invitation.revoked":
      return { parts: [{ text: `withdrew the invitation to ${text(detail.email) ?? "someone"}` }], namesStudy: true };
    case "share_link.created": {
      const label = text(detail.label);
      return { parts: [{ text: "made a read-only link to " }, studyLink, { text: label ? ` (${label})` : "" }], namesStudy: true };
    }
    case "share_link.revoked": {
      const label = text(detail.label);
      return { parts: [{ text: "revoked a read-only link to " }, studyLink, { text: label ? ` (${label})` : "" }], namesStudy: true };
    }
    case "api_token.created": {
      const name = text(detail.name);
      const role = text(detail.role);
      return { parts: [{ text: `made an API token${name ? ` ${quote(name)}` : ""} for scripts in the team${role ? `, acting at most as ${article(role)}` : ""}` }], namesStudy: true };
    }
    case "api_token.revoked": {
      const name = text(detail.name);
      return { parts: [{ text: `revoked the API token${name ? ` ${quote(name)}` : ""}` }], namesStudy: true };
    }
    case "job.queued":
      return { parts: [{ text: "queued a server run of " }, serverRunScene(item)], namesStudy: false };
    case "job.completed":
      return { parts: [{ text: "ran " }, runPart(item), { text: " on the server" }], namesStudy: false };
    case "job.failed": {
      const attempts = count(detail.attempts);
      const reason = text(detail.message);
      return {
        parts: [{ text: "could not run " }, serverRunScene(item), { text: ` on the server${attempts !== null ? ` after ${attempts} attempt${attempts === 1 ? "" : "s"}` : ""}` }, { text: reason ? `: ${quote(reason, 120)}` : "" }],
        namesStudy: false,
      };
    }
    case "job.cancelled":
      return { parts: [{ text: `cancelled ${detail.whileRunning === true ? "the running" : "a queued"} server run of ` }, serverRunScene(item)], namesStudy: false };
    case "sweep.queued": {
      const label = text(detail.label);
      return { parts: [{ text: `queued a server sweep${label ? ` (${label})` : ""} of ` }, serverRunScene(item)], namesStudy: false };
    }
    case "sweep.completed": {
      const label = text(detail.label) ?? "a sweep";
      const state = text(detail.state);
      const note = text(detail.message);
      if (state === "failed" || state === "cancelled") {
        return { parts: [{ text: `ran the server sweep ${label}, which ${state === "failed" ? "failed" : "was cancelled"}` }, { text: note ? `: ${note}` : "" }], namesStudy: false };
      }
      return { parts: [{ text: `ran the server sweep ${label}; its insertion-loss chart is in the notebook` }, { text: note ? ` (${note})` : "" }], namesStudy: false };
    }
    default:
      return { parts: [{ text: `did ${item.action.replace(/[._]/g, " ")}` }], namesStudy: false };
  }
}

export function describeActivity(item: SentenceInput, options: SentenceOptions = {}): ActivitySentence {
  const isViewer = !!options.viewerId && item.actorId === options.viewerId;
  const actor = isViewer ? "You" : (item.actorName ?? "A former member");
  const { parts, namesStudy } = describeParts(item);
  const kept = parts.filter((part) => part.text !== "");
  if (options.withStudy && !namesStudy && item.studyId) kept.push({ text: " in " }, { text: item.studyTitle ?? "a study", href: `/studies/${item.studyId}` });
  return { actor, parts: kept };
}

/** The sentence as plain text, for notices read aloud and for tests. */
export function sentenceText(sentence: ActivitySentence): string {
  return `${sentence.actor} ${sentence.parts.map((part) => part.text).join("")}`;
}

const dayFormat = new Intl.DateTimeFormat("en-GB", { weekday: "long", day: "numeric", month: "long", year: "numeric" });

function localDayKey(date: Date): string {
  return `${date.getFullYear()}-${String(date.getMonth() + 1).padStart(2, "0")}-${String(date.getDate()).padStart(2, "0")}`;
}

/** "Today", "Yesterday" or the date, for the reader's own calendar day. */
export function dayLabel(iso: string, now: Date = new Date()): string {
  const then = new Date(iso);
  const key = localDayKey(then);
  if (key === localDayKey(now)) return "Today";
  const yesterday = new Date(now);
  yesterday.setDate(now.getDate() - 1);
  if (key === localDayKey(yesterday)) return "Yesterday";
  return dayFormat.format(then);
}

/** Entries (newest first) grouped by calendar day, keeping their order. */
export function groupByDay<Item extends { createdAt: string }>(items: readonly Item[], now: Date = new Date()): { day: string; label: string; items: Item[] }[] {
  const groups: { day: string; label: string; items: Item[] }[] = [];
  for (const item of items) {
    const day = localDayKey(new Date(item.createdAt));
    const last = groups.at(-1);
    if (last && last.day === day) last.items.push(item);
    else groups.push({ day, label: dayLabel(item.createdAt, now), items: [item] });
  }
  return groups;
}
