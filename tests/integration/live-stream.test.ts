import "../helpers/test-database";
import { eq, and } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/me/route";
import * as studyActivityRoute from "@/app/api/studies/[studyId]/activity/route";
import * as studyEventsRoute from "@/app/api/studies/[studyId]/events/route";
import * as presenceRoute from "@/app/api/studies/[studyId]/presence/route";
import * as teamActivityRoute from "@/app/api/teams/[teamId]/activity/route";
import * as teamEventsRoute from "@/app/api/teams/[teamId]/events/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb, getDb } from "@/db/client";
import { recordActivity } from "@/db/queries/activity";
import { createRun, deleteRunById } from "@/db/queries/runs";
import { listScenesByStudyId } from "@/db/queries/scenes";
import { addMembership } from "@/db/queries/teams";
import { membership, user } from "@/db/schema";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import type { ActivityStreamMessage, FeedPage, PresenceResponse } from "@/lib/http/activity-types";
import type { RunSummary } from "@/lib/run-record/summary";
import { resetLiveHub } from "@/lib/server/live-hub";
import { callRoute, cookieFrom, signInAs, signUp, testOrigin } from "../helpers/api";

// Live updates end to end in one process: activities recorded in the database arrive on the
// server-sent-events streams of the right study and team, and nowhere else.

type Who = TeamRole | "outsider" | "nobody";

const cookies = new Map<TeamRole | "outsider", string>();
const userIds = new Map<TeamRole | "outsider", string>();
let teamId = "";
let studyId = "";
let otherStudyId = "";
let otherTeamId = "";
let sceneId = "";

async function meOf(cookie: string): Promise<{ userId: string; teamId: string }> {
  const me = (await (await callRoute(meRoute.GET, { path: "/api/me", cookie })).json()) as { user: { id: string }; activeTeamId: string };
  return { userId: me.user.id, teamId: me.activeTeamId };
}

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  cookies.set("outsider", cookieFrom(await signUp({ name: "Outside Listener", email: "live-outsider@example.org", password: "outsider-password" })));
  for (const [role, cookie] of cookies) userIds.set(role, (await meOf(cookie)).userId);
  teamId = (await meOf(cookies.get("owner")!)).teamId;
  otherTeamId = (await meOf(cookies.get("outsider")!)).teamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner") });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
  const created = await callRoute(teamStudiesRoute.POST, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner"), body: { title: "Second study", siteReference: "LS-2" } });
  otherStudyId = ((await created.json()) as { study: { id: string } }).study.id;
  sceneId = (await listScenesByStudyId({ studyId }))[0]!.id;
}, 180_000);

afterAll(async () => {
  await resetLiveHub();
  await closeDb();
});

interface StreamMessage {
  event: string;
  id: string | null;
  data: unknown;
}

/** Reads a server-sent-events body as it arrives, message by message. */
class StreamReader {
  readonly messages: StreamMessage[] = [];
  ended = false;
  private buffer = "";
  private waiters: (() => void)[] = [];
  private readonly reader: ReadableStreamDefaultReader<Uint8Array>;

  constructor(readonly response: Response) {
    this.reader = response.body!.getReader();
    void this.pump();
  }

  private async pump(): Promise<void> {
    const decoder = new TextDecoder();
    try {
      for (;;) {
        const { done, value } = await this.reader.read();
        if (done) break;
        this.buffer += decoder.decode(value, { stream: true });
        let end: number;
        while ((end = this.buffer.indexOf("\n\n")) >= 0) {
          const block = this.buffer.slice(0, end);
          this.buffer = this.buffer.slice(end + 2);
          const message: StreamMessage = { event: "message", id: null, data: null };
          let hasData = false;
          for (const line of block.split("\n")) {
            if (line.startsWith("event: ")) message.event = line.slice(7);
            else if (line.startsWith("id: ")) message.id = line.slice(4);
            else if (line.startsWith("data: ")) {
              message.data = JSON.parse(line.slice(6));
              hasData = true;
            }
          }
          if (hasData) this.messages.push(message);
        }
        this.wake();
      }
    } catch {
      // Cancelled by the test.
    }
    this.ended = true;
    this.wake();
  }

  private wake(): void {
    for (const waiter of this.waiters.splice(0)) waiter();
  }

  /** The first message (already received or still to come) that matches, or a failure after the timeout. */
  async next(matching: (message: StreamMessage) => boolean, timeoutMs = 5_000): Promise<StreamMessage> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const found = this.messages.find(matching);
      if (found) return found;
      if (this.ended) throw new Error(`the stream ended without a matching message; got ${JSON.stringify(this.messages.map((m) => m.event))}`);
      const left = deadline - Date.now();
      if (left <= 0) throw new Error(`no matching message within ${timeoutMs} ms; got ${JSON.stringify(this.messages)}`);
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, left);
        this.waiters.push(() => {
          clearTimeout(timer);
          resolve();
        });
      });
    }
  }

  async untilEnded(timeoutMs = 5_000): Promise<void> {
    const deadline = Date.now() + timeoutMs;
    while (!this.ended) {
      if (Date.now() > deadline) throw new Error("the stream did not end");
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  }

  async cancel(): Promise<void> {
    await this.reader.cancel();
  }

  activities(): ActivityStreamMessage[] {
    return this.messages.filter((message) => message.event === "activity").map((message) => message.data as ActivityStreamMessage);
  }
}

function cookieOf(who: Who): string | undefined {
  return who === "nobody" ? undefined : cookies.get(who);
}

/** Opens a stream as a browser would: GET with cookies, and a signal that fires when the page goes. */
async function openStudyStream(who: Who, id = studyId): Promise<{ response: Response; abort: AbortController }> {
  const abort = new AbortController();
  const headers = new Headers({ origin: testOrigin, accept: "text/event-stream" });
  const cookie = cookieOf(who);
  if (cookie) headers.set("cookie", cookie);
  const request = new Request(`${testOrigin}/api/studies/${id}/events`, { headers, signal: abort.signal });
  return { response: await studyEventsRoute.GET(request, { params: Promise.resolve({ studyId: id }) }), abort };
}

async function openTeamStream(who: Who, id = teamId): Promise<{ response: Response; abort: AbortController }> {
  const abort = new AbortController();
  const headers = new Headers({ origin: testOrigin, accept: "text/event-stream" });
  const cookie = cookieOf(who);
  if (cookie) headers.set("cookie", cookie);
  const request = new Request(`${testOrigin}/api/teams/${id}/events`, { headers, signal: abort.signal });
  return { response: await teamEventsRoute.GET(request, { params: Promise.resolve({ teamId: id }) }), abort };
}

async function presentUserIds(): Promise<string[]> {
  const response = await callRoute(presenceRoute.GET, { path: `/api/studies/${studyId}/presence`, params: { studyId }, cookie: cookies.get("viewer") });
  expect(response.status).toBe(200);
  return ((await response.json()) as PresenceResponse).present.map((person) => person.userId);
}

async function eventually(check: () => Promise<boolean>, what: string, timeoutMs = 5_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting until ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

function comment(input: { teamId?: string; studyId?: string | null; runId?: string | null; excerpt: string }) {
  return recordActivity({
    teamId: input.teamId ?? teamId,
    studyId: input.studyId === undefined ? studyId : input.studyId,
    actorId: userIds.get("reviewer")!,
    action: "comment.added",
    subjectType: "comment",
    subjectId: crypto.randomUUID(),
    runId: input.runId ?? null,
    detail: { excerpt: input.excerpt, pinned: "field" },
  });
}

async function saveFakeRun(): Promise<string> {
  const saved = await createRun({
    teamId,
    studyId,
    sceneId,
    sceneVersion: 1,
    sceneSnapshot: {},
    settings: {},
    inputHash: "0".repeat(64),
    solverVersion: "test",
    status: "completed",
    statusMessage: "",
    // The stream and the feed only read the row's identity, never the figures.
    summary: {} as RunSummary,
    resultData: new Uint8Array(4),
    createdBy: userIds.get("editor")!,
    sceneName: "Fake scene",
  });
  return saved.id;
}

describe("the study's event stream", () => {
  it("answers every member with an open text/event-stream that proxies leave alone", async () => {
    for (const who of ["owner", "editor", "reviewer", "viewer"] as const) {
      const { response, abort } = await openStudyStream(who);
      expect(response.status, who).toBe(200);
      expect(response.headers.get("content-type")).toContain("text/event-stream");
      expect(response.headers.get("cache-control")).toBe("no-cache, no-transform");
      expect(response.headers.get("x-accel-buffering")).toBe("no");
      abort.abort();
      await response.body?.cancel();
    }
  });

  it("answers an outsider 404, nobody 401 and a bad id 400, as JSON", async () => {
    const outsider = (await openStudyStream("outsider")).response;
    const nobody = (await openStudyStream("nobody")).response;
    const bad = (await openStudyStream("viewer", "not-an-id")).response;
    expect([outsider.status, nobody.status, bad.status]).toEqual([404, 401, 400]);
    for (const response of [outsider, nobody, bad]) expect(response.headers.get("content-type")).toContain("application/json");
  });

  it("delivers a comment recorded in the study, with its feed entry, and nothing of another study or team", { timeout: 20_000 }, async () => {
    const stream = new StreamReader((await openStudyStream("viewer")).response);
    await comment({ studyId: otherStudyId, excerpt: "other study" });
    await comment({ teamId: otherTeamId, studyId: null, excerpt: "other team" });
    await comment({ excerpt: "Check the barrier top" });
    const arrived = await stream.next((message) => message.event === "activity" && (message.data as ActivityStreamMessage).action === "comment.added");
    const data = arrived.data as ActivityStreamMessage;
    expect(arrived.id).toBe(data.id);
    expect(data).toMatchObject({ teamId, studyId, actorId: userIds.get("reviewer"), subjectType: "comment" });
    expect(data.item?.actorName).toBe(demoMembers.find((member) => member.role === "reviewer")!.name);
    expect(data.item?.detail).toMatchObject({ excerpt: "Check the barrier top" });
    // Events keep their order on one channel: had the others been sent, they would have come first.
    const excerpts = stream.activities().map((message) => message.item?.detail.excerpt);
    expect(excerpts).not.toContain("other study");
    expect(excerpts).not.toContain("other team");
    await stream.cancel();
  });

  it("delivers runs saved and deleted (published after their transaction) and comments recorded against one of its runs only", { timeout: 20_000 }, async () => {
    const stream = new StreamReader((await openStudyStream("reviewer")).response);
    const runId = await saveFakeRun();
    const saved = (await stream.next((message) => (message.data as ActivityStreamMessage | null)?.action === "run.saved")).data as ActivityStreamMessage;
    expect(saved).toMatchObject({ subjectId: runId, runId, studyId });
    expect(saved.item?.runLabel).toMatchObject({ studyId, sceneVersion: 1 });

    await comment({ studyId: null, runId, excerpt: "on the run alone" });
    const onRun = (await stream.next((message) => (message.data as ActivityStreamMessage | null)?.item?.detail.excerpt === "on the run alone")).data as ActivityStreamMessage;
    expect(onRun).toMatchObject({ runId, studyId: null });

    await deleteRunById({ id: runId, teamId, studyId, actorId: userIds.get("owner")!, sceneName: "Fake scene" });
    const deleted = (await stream.next((message) => (message.data as ActivityStreamMessage | null)?.action === "run.deleted")).data as ActivityStreamMessage;
    expect(deleted).toMatchObject({ subjectId: runId, runId });
    await stream.cancel();
  });

  it("shows the connected member as present, announces it, and drops them when the page goes away", { timeout: 20_000 }, async () => {
    const watcher = new StreamReader((await openStudyStream("reviewer")).response);
    const owner = await openStudyStream("owner");
    const ownerStream = new StreamReader(owner.response);
    await watcher.next((message) => message.event === "presence");
    expect(await presentUserIds()).toContain(userIds.get("owner"));

    const before = watcher.messages.filter((message) => message.event === "presence").length;
    owner.abort.abort();
    await ownerStream.untilEnded();
    await eventually(async () => !(await presentUserIds()).includes(userIds.get("owner")!), "the owner is no longer present");
    await eventually(async () => watcher.messages.filter((message) => message.event === "presence").length > before, "the departure is announced");
    await watcher.cancel();
    // A reader that stops reading (a closed tab) is let go the same way.
    await eventually(async () => !(await presentUserIds()).includes(userIds.get("reviewer")!), "the reviewer is no longer present");
  });

  it("closes the stream of a member removed from the team, without reconnecting them", { timeout: 20_000 }, async () => {
    const email = "live-temporary@example.org";
    const cookie = cookieFrom(await signUp({ name: "Temporary Member", email, password: "temporary-password" }));
    const db = await getDb();
    const [member] = await db.select().from(user).where(eq(user.email, email));
    await addMembership({ teamId, userId: member!.id, role: "viewer" });
    const headers = new Headers({ origin: testOrigin, cookie });
    const response = await studyEventsRoute.GET(new Request(`${testOrigin}/api/studies/${studyId}/events`, { headers }), { params: Promise.resolve({ studyId }) });
    expect(response.status).toBe(200);
    const stream = new StreamReader(response);

    await db.delete(membership).where(and(eq(membership.teamId, teamId), eq(membership.userId, member!.id)));
    await recordActivity({ teamId, actorId: userIds.get("owner")!, action: "member.removed", subjectType: "user", subjectId: member!.id, detail: { name: "Temporary Member" } });
    const closed = await stream.next((message) => message.event === "closed");
    expect(closed.data).toEqual({ reason: "access" });
    await stream.untilEnded();
    await comment({ excerpt: "after the removal" });
    expect(stream.activities().map((message) => message.item?.detail.excerpt)).not.toContain("after the removal");
  });
});

describe("the team's event stream", () => {
  it("answers members 200, an outsider 404 and nobody 401", async () => {
    const statuses: number[] = [];
    for (const who of ["owner", "editor", "reviewer", "viewer", "outsider", "nobody"] as const) {
      const { response, abort } = await openTeamStream(who);
      statuses.push(response.status);
      abort.abort();
      if (response.status === 200) await response.body?.cancel();
    }
    expect(statuses).toEqual([200, 200, 200, 200, 404, 401]);
  });

  it("delivers activity from every study of the team and none from another team", { timeout: 20_000 }, async () => {
    const stream = new StreamReader((await openTeamStream("viewer")).response);
    await comment({ teamId: otherTeamId, studyId: null, excerpt: "elsewhere" });
    await comment({ studyId: otherStudyId, excerpt: "in the second study" });
    await comment({ excerpt: "in the first study" });
    await stream.next((message) => (message.data as ActivityStreamMessage | null)?.item?.detail.excerpt === "in the first study");
    const excerpts = stream.activities().map((message) => message.item?.detail.excerpt);
    expect(excerpts).toContain("in the second study");
    expect(excerpts).not.toContain("elsewhere");
    expect(stream.activities().every((message) => message.teamId === teamId)).toBe(true);
    await stream.cancel();
  });
});

describe("activity feeds", () => {
  const expected: { who: Who; status: number }[] = [
    { who: "owner", status: 200 },
    { who: "editor", status: 200 },
    { who: "reviewer", status: 200 },
    { who: "viewer", status: 200 },
    { who: "outsider", status: 404 },
    { who: "nobody", status: 401 },
  ];
  for (const row of expected) {
    it(`answers ${row.who} ${row.status} for the study feed, the team feed and the presence list`, async () => {
      const cookie = cookieOf(row.who);
      const study = await callRoute(studyActivityRoute.GET, { path: `/api/studies/${studyId}/activity`, params: { studyId }, cookie });
      const team = await callRoute(teamActivityRoute.GET, { path: `/api/teams/${teamId}/activity`, params: { teamId }, cookie });
      const presence = await callRoute(presenceRoute.GET, { path: `/api/studies/${studyId}/presence`, params: { studyId }, cookie });
      expect([study.status, team.status, presence.status]).toEqual([row.status, row.status, row.status]);
    });
  }

  it("pages the study feed newest first, without repeats, and keeps other studies out", async () => {
    for (let index = 0; index < 5; index += 1) await comment({ excerpt: `paged ${index}` });
    const seen: string[] = [];
    let before: string | null = null;
    let pages = 0;
    do {
      const path: string = `/api/studies/${studyId}/activity?limit=3${before ? `&before=${before}` : ""}`;
      const response = await callRoute(studyActivityRoute.GET, { path, params: { studyId }, cookie: cookies.get("viewer") });
      expect(response.status).toBe(200);
      const page = (await response.json()) as FeedPage;
      expect(page.items.length).toBeLessThanOrEqual(3);
      for (const item of page.items) {
        expect(item.studyId === studyId || item.runId !== null).toBe(true);
        expect(item.detail.excerpt).not.toBe("other study");
      }
      seen.push(...page.items.map((item) => item.id));
      before = page.nextBefore;
      pages += 1;
    } while (before && pages < 50);
    expect(new Set(seen).size).toBe(seen.length);
    expect(pages).toBeGreaterThan(2);
    const first = (await (await callRoute(studyActivityRoute.GET, { path: `/api/studies/${studyId}/activity?limit=5`, params: { studyId }, cookie: cookies.get("viewer") })).json()) as FeedPage;
    expect(first.items.map((item) => item.detail.excerpt)).toEqual(["paged 4", "paged 3", "paged 2", "paged 1", "paged 0"]);
  });

  it("names the study of each entry in the team feed and keeps other teams out", async () => {
    const response = await callRoute(teamActivityRoute.GET, { path: `/api/teams/${teamId}/activity?limit=100`, params: { teamId }, cookie: cookies.get("reviewer") });
    const page = (await response.json()) as FeedPage;
    expect(page.items.every((item) => item.teamId === teamId)).toBe(true);
    expect(page.items.map((item) => item.detail.excerpt)).not.toContain("elsewhere");
    expect(page.items.find((item) => item.detail.excerpt === "in the second study")?.studyTitle).toBe("Second study");
  });

  it("answers 400 naming the field for a bad page size or cursor", async () => {
    const limit = await callRoute(studyActivityRoute.GET, { path: `/api/studies/${studyId}/activity?limit=1000`, params: { studyId }, cookie: cookies.get("owner") });
    const before = await callRoute(teamActivityRoute.GET, { path: `/api/teams/${teamId}/activity?before=nope`, params: { teamId }, cookie: cookies.get("owner") });
    expect([limit.status, before.status]).toEqual([400, 400]);
    expect(((await limit.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("limit");
    expect(((await before.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe("before");
  });
});
