import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as commentRoute from "@/app/api/comments/[commentId]/route";
import * as resolutionRoute from "@/app/api/comments/[commentId]/resolution/route";
import * as runCommentsRoute from "@/app/api/runs/[runId]/comments/route";
import * as sceneRunsRoute from "@/app/api/scenes/[sceneId]/runs/route";
import * as studyScenesRoute from "@/app/api/studies/[studyId]/scenes/route";
import * as teamMembersRoute from "@/app/api/teams/[teamId]/members/route";
import { closeDb } from "@/db/client";
import { listActivityByStudyId } from "@/db/queries/activity";
import { listMailMessagesByTeamId } from "@/db/queries/mail";
import type { TeamRole } from "@/lib/access/roles";
import { mentionToken } from "@/lib/collaboration/mentions";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { runScene } from "@/lib/fdtd/simulation";
import type { RunRecord, SceneRecord, TeamMember } from "@/lib/http/api-types";
import type { CommentItem, CommentsResponse, CommentThread } from "@/lib/http/comment-types";
import { encodeRunPayload } from "@/lib/run-record/payload";
import { callRoute, cookieFrom, signUp, testOrigin } from "../helpers/api";
import { openDemoStudy } from "../helpers/demo-study";
import { tinySceneInput } from "../run-record/fixtures";

type Who = TeamRole | "outsider" | "nobody";
const roles: TeamRole[] = ["owner", "editor", "reviewer", "viewer"];
const cookies = new Map<Who, string | undefined>();
let studyId = "";
let savedRun: RunRecord;
let members: TeamMember[] = [];

function member(role: TeamRole): TeamMember {
  return members.find((candidate) => candidate.role === role)!;
}

beforeAll(async () => {
  const demo = await openDemoStudy();
  studyId = demo.studyId;
  for (const [role, cookie] of demo.cookies) cookies.set(role, cookie);
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Person", email: "comments-outsider@example.org", password: "outsider-password" })));
  cookies.set("nobody", undefined);
  // The tiny scene (1.2 m x 0.6 m, 4 ms; receivers "rx" and "line[0..3]"), run and saved by the editor.
  const created = await callRoute(studyScenesRoute.POST, { path: `/api/studies/${studyId}/scenes`, params: { studyId }, cookie: cookies.get("editor"), body: { name: "Comment check", data: tinySceneInput() } });
  const sceneRecord = ((await created.json()) as { scene: SceneRecord }).scene;
  const scene = parseSceneOrThrow(sceneRecord.data);
  const encoded = encodeRunPayload({ result: runScene(scene), scene, sceneVersion: sceneRecord.version });
  if (!encoded.ok) throw new Error(encoded.message);
  const uploaded = await sceneRunsRoute.POST(
    new Request(`${testOrigin}/api/scenes/${sceneRecord.id}/runs`, { method: "POST", headers: { origin: testOrigin, cookie: cookies.get("editor")!, "content-type": "application/octet-stream" }, body: encoded.bytes }),
    { params: Promise.resolve({ sceneId: sceneRecord.id }) },
  );
  expect(uploaded.status).toBe(201);
  savedRun = ((await uploaded.json()) as { run: RunRecord }).run;
  const listed = await callRoute(teamMembersRoute.GET, { path: `/api/teams/${savedRun.teamId}/members`, params: { teamId: savedRun.teamId }, cookie: cookies.get("owner") });
  members = ((await listed.json()) as { members: TeamMember[] }).members;
});
afterAll(async () => {
  await closeDb();
});

function listComments(who: Who, runId = savedRun.id) {
  return callRoute(runCommentsRoute.GET, { path: `/api/runs/${runId}/comments`, params: { runId }, cookie: cookies.get(who) });
}

function postComment(who: Who, body: unknown, runId = savedRun.id) {
  return callRoute(runCommentsRoute.POST, { path: `/api/runs/${runId}/comments`, params: { runId }, cookie: cookies.get(who), body });
}

function editComment(who: Who, commentId: string, body: unknown) {
  return callRoute(commentRoute.PATCH, { method: "PATCH", path: `/api/comments/${commentId}`, params: { commentId }, cookie: cookies.get(who), body });
}

function deleteComment(who: Who, commentId: string) {
  return callRoute(commentRoute.DELETE, { method: "DELETE", path: `/api/comments/${commentId}`, params: { commentId }, cookie: cookies.get(who) });
}

function resolve(who: Who, commentId: string, resolved: boolean) {
  return callRoute(resolutionRoute.POST, { path: `/api/comments/${commentId}/resolution`, params: { commentId }, cookie: cookies.get(who), body: { resolved } });
}

async function posted(who: Who, body: unknown): Promise<CommentItem> {
  const response = await postComment(who, body);
  expect(response.status).toBe(201);
  return ((await response.json()) as { comment: CommentItem }).comment;
}

async function threads(): Promise<CommentThread[]> {
  const response = await listComments("viewer");
  expect(response.status).toBe(200);
  return ((await response.json()) as CommentsResponse).threads;
}

async function expectRefused(response: Response, status: number, path?: string): Promise<{ code: string; message: string }> {
  expect(response.status).toBe(status);
  const body = (await response.json()) as { error: { code: string; message: string; issues?: { path: string }[] } };
  if (path !== undefined) expect(body.error.issues?.map((issue) => issue.path)).toContain(path);
  return body.error;
}

async function mentionMails() {
  return (await listMailMessagesByTeamId({ teamId: savedRun.teamId })).filter((mail) => mail.kind === "mention");
}

describe("who may read and write a run's discussion", () => {
  it("lets owners, editors and reviewers start a thread, and refuses viewers, outsiders and the signed-out", async () => {
    for (const role of ["owner", "editor", "reviewer"] as const) {
      const comment = await posted(role, { body: `From the ${role}: the **500 Hz** band looks low.` });
      expect(comment.authorName).toBe(member(role).name);
      expect(comment.parentId).toBeNull();
    }
    await expectRefused(await postComment("viewer", { body: "I may only read." }), 403);
    await expectRefused(await postComment("outsider", { body: "Not my team." }), 404);
    await expectRefused(await postComment("nobody", { body: "Who am I?" }), 401);
  });

  it("lets every member read the threads, and nobody else", async () => {
    for (const role of roles) expect((await listComments(role)).status).toBe(200);
    await expectRefused(await listComments("outsider"), 404);
    await expectRefused(await listComments("nobody"), 401);
    await expectRefused(await listComments("owner", "00000000-0000-4000-8000-00000000beef"), 404);
    const bodies = (await threads()).map((thread) => thread.body);
    expect(bodies).toContain("From the reviewer: the **500 Hz** band looks low.");
  });

  it("checks the body: empty and over 10,000 characters are refused, naming the field", async () => {
    await expectRefused(await postComment("editor", { body: "   " }), 400, "body");
    await expectRefused(await postComment("editor", { body: "x".repeat(10_001) }), 400, "body");
    expect((await postComment("editor", { body: "x".repeat(10_000) })).status).toBe(201);
  });
});

describe("replies", () => {
  it("adds a reply under a thread's first comment, listed with its thread", async () => {
    const head = await posted("reviewer", { body: "Is the PML thick enough on the right?" });
    const reply = await posted("editor", { body: "Twelve cells; I will check.", parentId: head.id });
    expect(reply.parentId).toBe(head.id);
    const thread = (await threads()).find((candidate) => candidate.id === head.id)!;
    expect(thread.replies.map((item) => item.id)).toEqual([reply.id]);
    // The thread with the newest activity comes first.
    expect((await threads())[0]!.id).toBe(head.id);
  });

  it("refuses a reply to a reply, and a parent on another run or none at all", async () => {
    const head = await posted("reviewer", { body: "Thread for nesting" });
    const reply = await posted("owner", { body: "First reply", parentId: head.id });
    await expectRefused(await postComment("editor", { body: "Nested", parentId: reply.id }), 400, "parentId");
    await expectRefused(await postComment("editor", { body: "Lost", parentId: "00000000-0000-4000-8000-00000000cafe" }), 400, "parentId");
    await expectRefused(await postComment("editor", { body: "Bad id", parentId: "not-an-id" }), 400, "parentId");
  });
});

describe("pins", () => {
  it("keeps a pin on the field and one on a receiver's trace", async () => {
    const field = await posted("reviewer", { body: "Look here", pin: { kind: "field", x: 0.9, y: 0.1, t: 0.002 } });
    expect(field.pin).toEqual({ kind: "field", x: 0.9, y: 0.1, t: 0.002 });
    const trace = await posted("reviewer", { body: "This peak", pin: { kind: "trace", receiverId: "line[2]", t: 0.0015, value: 0.12 } });
    expect(trace.pin).toEqual({ kind: "trace", receiverId: "line[2]", t: 0.0015, value: 0.12 });
  });

  it("refuses a pin outside the run's domain or duration, naming the field", async () => {
    const outside = await expectRefused(await postComment("reviewer", { body: "Off the map", pin: { kind: "field", x: 1.5, y: 0.1, t: 0.001 } }), 400, "pin.x");
    expect(outside.message).toMatch(/pin\.x/);
    await expectRefused(await postComment("reviewer", { body: "Underground", pin: { kind: "field", x: 0.5, y: -0.1, t: 0.001 } }), 400, "pin.y");
    await expectRefused(await postComment("reviewer", { body: "Too late", pin: { kind: "field", x: 0.5, y: 0.1, t: 0.5 } }), 400, "pin.t");
    await expectRefused(await postComment("reviewer", { body: "Before it began", pin: { kind: "field", x: 0.5, y: 0.1, t: -0.001 } }), 400, "pin.t");
    await expectRefused(await postComment("reviewer", { body: "No such receiver", pin: { kind: "trace", receiverId: "R9", t: 0.001 } }), 400, "pin.receiverId");
    await expectRefused(await postComment("reviewer", { body: "Shapeless", pin: { kind: "map", x: 0.5 } }), 400, "pin.kind");
  });
});

describe("editing and deleting", () => {
  it("lets only the author edit, and marks the comment as edited", async () => {
    const comment = await posted("reviewer", { body: "Frist draft" });
    expect(comment.editedAt).toBeNull();
    for (const role of ["owner", "editor", "viewer"] as const) await expectRefused(await editComment(role, comment.id, { body: "Not mine" }), 403);
    await expectRefused(await editComment("outsider", comment.id, { body: "Not mine" }), 404);
    await expectRefused(await editComment("nobody", comment.id, { body: "Not mine" }), 401);
    await expectRefused(await editComment("reviewer", comment.id, { body: "" }), 400, "body");
    const response = await editComment("reviewer", comment.id, { body: "First draft" });
    expect(response.status).toBe(200);
    const edited = ((await response.json()) as { comment: CommentItem }).comment;
    expect(edited.body).toBe("First draft");
    expect(edited.editedAt).not.toBeNull();
  });

  it("lets the author delete their own, an owner delete anyone's, and nobody else", async () => {
    const byReviewer = await posted("reviewer", { body: "Reviewer's note" });
    const byEditor = await posted("editor", { body: "Editor's note" });
    await expectRefused(await deleteComment("editor", byReviewer.id), 403);
    await expectRefused(await deleteComment("viewer", byReviewer.id), 403);
    await expectRefused(await deleteComment("reviewer", byEditor.id), 403);
    await expectRefused(await deleteComment("outsider", byReviewer.id), 404);
    await expectRefused(await deleteComment("nobody", byReviewer.id), 401);
    expect((await deleteComment("reviewer", byReviewer.id)).status).toBe(204);
    expect((await deleteComment("owner", byEditor.id)).status).toBe(204);
    await expectRefused(await deleteComment("owner", byEditor.id), 409);
    await expectRefused(await editComment("reviewer", byReviewer.id, { body: "Back from the dead" }), 409);
    const ids = (await threads()).map((thread) => thread.id);
    expect(ids).not.toContain(byReviewer.id);
    expect(ids).not.toContain(byEditor.id);
  });

  it("keeps a deleted first comment's replies, with its text gone", async () => {
    const head = await posted("editor", { body: "Pinned then deleted", pin: { kind: "field", x: 0.3, y: 0.3, t: 0.001 } });
    const reply = await posted("reviewer", { body: "A reply that must stay", parentId: head.id });
    expect((await deleteComment("editor", head.id)).status).toBe(204);
    const thread = (await threads()).find((candidate) => candidate.id === head.id)!;
    expect(thread.deleted).toBe(true);
    expect(thread.body).toBe("");
    expect(thread.pin).toBeNull();
    expect(thread.deletedAt).not.toBeNull();
    expect(thread.replies.map((item) => [item.id, item.body])).toEqual([[reply.id, "A reply that must stay"]]);
  });
});

describe("resolving a thread", () => {
  it("lets anyone who may comment resolve and reopen a thread, recording who and when", async () => {
    const head = await posted("reviewer", { body: "Resolve me" });
    await expectRefused(await resolve("viewer", head.id, true), 403);
    await expectRefused(await resolve("outsider", head.id, true), 404);
    await expectRefused(await resolve("nobody", head.id, true), 401);
    for (const role of ["editor", "owner", "reviewer"] as const) {
      const resolved = await resolve(role, head.id, true);
      expect(resolved.status).toBe(200);
      const item = ((await resolved.json()) as { comment: CommentItem }).comment;
      expect(item.resolvedAt).not.toBeNull();
      const reopened = ((await (await resolve(role, head.id, false)).json()) as { comment: CommentItem }).comment;
      expect(reopened.resolvedAt).toBeNull();
    }
    await resolve("editor", head.id, true);
    const thread = (await threads()).find((candidate) => candidate.id === head.id)!;
    expect(thread.resolvedByName).toBe(member("editor").name);
    const actions = (await listActivityByStudyId({ studyId, limit: 200 })).filter((item) => item.subjectId === head.id).map((item) => item.action);
    expect(actions).toContain("comment.resolved");
    expect(actions).toContain("comment.reopened");
  });

  it("refuses to resolve a reply on its own", async () => {
    const head = await posted("reviewer", { body: "Thread" });
    const reply = await posted("editor", { body: "Reply", parentId: head.id });
    await expectRefused(await resolve("reviewer", reply.id, true), 400);
    await expectRefused(await callRoute(resolutionRoute.POST, { path: `/api/comments/${head.id}/resolution`, params: { commentId: head.id }, cookie: cookies.get("reviewer"), body: { resolved: "yes" } }), 400, "resolved");
  });
});

describe("mentions", () => {
  it("stores members mentioned and e-mails them, but not the author or someone outside the team", async () => {
    const before = (await mentionMails()).length;
    const outsiderToken = "@[Outside Person](user:00000000-0000-4000-8000-000000000042)";
    const body = `${mentionToken(member("editor"))} and ${mentionToken(member("owner"))}, see the 1 kHz dip. (${mentionToken(member("reviewer"))} wrote this.) ${outsiderToken}`;
    const comment = await posted("reviewer", { body });
    expect(comment.mentions.map((item) => item.userId).sort()).toEqual([member("editor").userId, member("owner").userId, member("reviewer").userId].sort());
    const mails = (await mentionMails()).slice(0, (await mentionMails()).length - before);
    expect(mails.map((mail) => mail.toAddress).sort()).toEqual([member("editor").email, member("owner").email].sort());
    const toEditor = mails.find((mail) => mail.toAddress === member("editor").email)!;
    expect(toEditor.toUserId).toBe(member("editor").userId);
    expect(toEditor.subject).toContain(member("reviewer").name);
    expect(toEditor.textBody).toContain(`/studies/${studyId}/runs/${savedRun.id}#comment-${comment.id}`);
    expect(toEditor.textBody).toContain(`@${member("owner").name}`);
    expect(toEditor.textBody).not.toContain("user:");
  });

  it("e-mails on an edit only those newly mentioned", async () => {
    const comment = await posted("editor", { body: `${mentionToken(member("reviewer"))} please check` });
    const afterPost = (await mentionMails()).length;
    expect((await editComment("editor", comment.id, { body: `${mentionToken(member("reviewer"))} and ${mentionToken(member("viewer"))} please check` })).status).toBe(200);
    const mails = await mentionMails();
    expect(mails.length).toBe(afterPost + 1);
    expect(mails[0]!.toAddress).toBe(member("viewer").email);
  });

  it("records the comment as an activity with the run's id and an excerpt", async () => {
    const head = await posted("reviewer", { body: `${mentionToken(member("editor"))} ${"long ".repeat(40)}` });
    const reply = await posted("editor", { body: "ok", parentId: head.id });
    const activity = await listActivityByStudyId({ studyId, limit: 200 });
    const added = activity.find((item) => item.subjectId === head.id && item.action === "comment.added")!;
    expect(added.detail).toMatchObject({ runId: savedRun.id, reply: false });
    const excerpt = (added.detail as { excerpt: string }).excerpt;
    expect(excerpt.startsWith(`@${member("editor").name} long`)).toBe(true);
    expect(excerpt.length).toBeLessThanOrEqual(120);
    expect(activity.find((item) => item.subjectId === reply.id)!.detail).toMatchObject({ runId: savedRun.id, reply: true });
  });
});
