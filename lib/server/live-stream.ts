// A server-sent-events answer fed by the process's live hub: it subscribes before answering (so
// nothing recorded after the connect is missed), pings every 20 s to keep proxies from closing
// it, re-checks the caller's access with each ping and on membership changes, and lets go of
// everything (subscription, timer, presence) once the page goes away.
import "server-only";
import { getFeedItemById } from "@/db/queries/activity";
import type { ActivityStreamMessage, FeedItem } from "@/lib/http/activity-types";
import type { ActivityLiveEvent, JobLiveEvent, LiveEvent } from "@/lib/live/live-event";
import { subscribeToLiveEvents } from "./live-hub";

export const livePingIntervalMs = 20_000;

export interface StreamMessage {
  event: "activity" | "presence" | "job";
  id: string;
  data: unknown;
}

export interface LiveStreamSpec {
  request: Request;
  /** The message this stream sends for an event, or null when the event is not for it. */
  select: (event: LiveEvent) => Promise<StreamMessage | null>;
  /** Whether the caller may still read what the stream shows; false ends the stream. */
  stillAllowed: () => Promise<boolean>;
  /** Events after which access is checked at once rather than at the next ping (membership changes). */
  recheckAfter?: (event: LiveEvent) => boolean;
  onOpen?: () => Promise<void>;
  onPing?: () => Promise<void>;
  onClose?: () => Promise<void>;
  pingIntervalMs?: number;
}

export const liveStreamHeaders = {
  "content-type": "text/event-stream; charset=utf-8",
  // no-transform: compression would hold events back until a buffer fills.
  "cache-control": "no-cache, no-transform",
  connection: "keep-alive",
  // nginx and similar proxies would otherwise buffer the stream.
  "x-accel-buffering": "no",
};

function formatMessage(message: StreamMessage): string {
  return `id: ${message.id}\nevent: ${message.event}\ndata: ${JSON.stringify(message.data)}\n\n`;
}

function logFailure(what: string) {
  return (error: unknown) => console.error(`[live] ${what}:`, error);
}

export async function openLiveStream(spec: LiveStreamSpec): Promise<Response> {
  const encoder = new TextEncoder();
  let controller: ReadableStreamDefaultController<Uint8Array> | null = null;
  let closed = false;
  let unsubscribe: (() => void) | null = null;
  let timer: ReturnType<typeof setInterval> | null = null;
  // Events and pings run one after another, so that messages keep their order.
  let queue: Promise<void> = Promise.resolve();
  const enqueue = (work: () => Promise<void>) => {
    queue = queue.then(work).catch(logFailure("a stream step failed"));
  };

  const write = (text: string) => {
    if (closed || !controller) return;
    try {
      controller.enqueue(encoder.encode(text));
    } catch {
      void close(false);
    }
  };

  const onAbort = () => void close(true);

  async function close(endStream: boolean): Promise<void> {
    if (closed) return;
    closed = true;
    if (timer) clearInterval(timer);
    unsubscribe?.();
    spec.request.signal.removeEventListener("abort", onAbort);
    if (endStream) {
      try {
        controller?.close();
      } catch {
        // Already closed by the reader.
      }
    }
    await spec.onClose?.().catch(logFailure("closing a stream failed"));
  }

  async function checkAccess(): Promise<boolean> {
    const allowed = await spec.stillAllowed().catch(() => false);
    if (!allowed && !closed) {
      // Tells the page not to reconnect: its access is gone, not the connection.
      write(`event: closed\ndata: ${JSON.stringify({ reason: "access" })}\n\n`);
      await close(true);
    }
    return allowed;
  }

  const body = new ReadableStream<Uint8Array>({
    start(streamController) {
      controller = streamController;
    },
    cancel() {
      void close(false);
    },
  });

  // Ask the browser to come back after 3 s if the connection drops, and open the stream at once.
  write("retry: 3000\n: connected\n\n");

  unsubscribe = await subscribeToLiveEvents((event) => {
    if (closed) return;
    enqueue(async () => {
      if (closed) return;
      if (spec.recheckAfter?.(event) && !(await checkAccess())) return;
      const message = await spec.select(event);
      if (message && !closed) write(formatMessage(message));
    });
  });
  if (spec.request.signal.aborted) {
    await close(true);
    return new Response(body, { headers: liveStreamHeaders });
  }
  spec.request.signal.addEventListener("abort", onAbort);
  await spec.onOpen?.().catch(logFailure("opening a stream failed"));

  timer = setInterval(() => {
    enqueue(async () => {
      if (closed) return;
      write(": ping\n\n");
      if (await checkAccess()) await spec.onPing?.();
    });
  }, spec.pingIntervalMs ?? livePingIntervalMs);

  return new Response(body, { headers: liveStreamHeaders });
}

/**
 * The feed entry behind an activity event, shared by every stream of the process: one read per
 * event, however many pages are open.
 */
const recentItems = new Map<string, Promise<FeedItem | null>>();
async function feedItemOf(event: ActivityLiveEvent): Promise<FeedItem | null> {
  let pending = recentItems.get(event.id);
  if (!pending) {
    pending = getFeedItemById({ id: event.id }).catch(() => null);
    recentItems.set(event.id, pending);
    if (recentItems.size > 200) recentItems.delete(recentItems.keys().next().value!);
  }
  const item = await pending;
  // Never hand out an entry of another team, whatever the event claimed.
  return item && item.teamId === event.teamId ? item : null;
}

export async function activityMessage(event: ActivityLiveEvent): Promise<StreamMessage> {
  const data: ActivityStreamMessage = {
    id: event.id,
    teamId: event.teamId,
    studyId: event.studyId,
    actorId: event.actorId,
    action: event.action,
    subjectType: event.subjectType,
    subjectId: event.subjectId,
    runId: event.runId ?? null,
    at: event.at,
    item: await feedItemOf(event),
  };
  return { event: "activity", id: event.id, data };
}

/** Membership changes in the team: the stream checks the caller's access at once. */
export function isMembershipChange(event: LiveEvent, teamId: string): boolean {
  return event.kind === "activity" && event.teamId === teamId && (event.action.startsWith("member.") || event.action === "invitation.revoked");
}

/** A server-side run's change, as study streams forward it: which job, its sweep, its state now. */
export function jobMessage(event: JobLiveEvent): StreamMessage {
  return { event: "job", id: `job-${event.jobId}-${event.at}`, data: { jobId: event.jobId, sweepId: event.sweepId, state: event.state, at: event.at } };
}
