"use client";
// Live updates: an EventSource on the study's or the team's event stream, turned into cache
// invalidations (the page refetches what it shows; the event only says what changed) and into a
// short notice when a colleague did something. The browser reconnects on its own after a dropped
// connection; when it gives up (the server answered an error) we try again with a growing pause.
import { useQueryClient, type QueryClient } from "@tanstack/react-query";
import { useCallback, useEffect, useEffectEvent, useRef, useState } from "react";
import type { ActivityStreamMessage, FeedItem } from "@/lib/http/activity-types";
import { useMe } from "./queries";

/** open: events arrive; connecting: first connect; paused: cut off for more than 10 s; ended: access withdrawn. */
export type LiveStatus = "connecting" | "open" | "paused" | "ended";

export interface LiveNotice {
  id: string;
  item: FeedItem;
}

export interface LiveUpdates {
  status: LiveStatus;
  /** The latest thing a colleague did (never the viewer's own actions), until dismissed or replaced. */
  notice: LiveNotice | null;
  dismissNotice: () => void;
  viewerId: string | null;
}

const pausedAfterMs = 10_000;
const noticeForMs = 9_000;

function retryDelayMs(attempt: number): number {
  return Math.min(60_000, 2_000 * 2 ** attempt);
}

/** What a job event says: which job, and the state it is now in (progress sends "running" again). */
export interface JobStreamMessage {
  jobId: string;
  sweepId: string | null;
  state: string;
}

function parseJob(data: string): JobStreamMessage | null {
  try {
    const parsed: unknown = JSON.parse(data);
    if (!parsed || typeof parsed !== "object") return null;
    const { jobId, sweepId, state } = parsed as Record<string, unknown>;
    return typeof jobId === "string" && typeof state === "string" ? { jobId, sweepId: typeof sweepId === "string" ? sweepId : null, state } : null;
  } catch {
    return null;
  }
}

function parseActivity(data: string): ActivityStreamMessage | null {
  try {
    const parsed: unknown = JSON.parse(data);
    return parsed && typeof parsed === "object" && "action" in parsed ? (parsed as ActivityStreamMessage) : null;
  } catch {
    return null;
  }
}

interface StreamHandlers {
  onActivity: (message: ActivityStreamMessage) => void;
  onPresence: () => void;
  /** A server-side run changed state or progressed (study streams only). */
  onJob?: (message: JobStreamMessage) => void;
  /** After a reconnect: events may have been missed, so everything shown is refetched. */
  onReconnect: () => void;
}

function useEventStream(url: string | null, handlers: StreamHandlers): LiveStatus {
  const [status, setStatus] = useState<LiveStatus>("connecting");
  const onActivity = useEffectEvent(handlers.onActivity);
  const onPresence = useEffectEvent(handlers.onPresence);
  const onJob = useEffectEvent((message: JobStreamMessage) => handlers.onJob?.(message));
  const onReconnect = useEffectEvent(handlers.onReconnect);

  useEffect(() => {
    if (!url) return;
    let source: EventSource | null = null;
    let stopped = false;
    let attempt = 0;
    let everOpened = false;
    let retryTimer: ReturnType<typeof setTimeout> | undefined;
    let pausedTimer: ReturnType<typeof setTimeout> | undefined;

    const notePaused = () => {
      pausedTimer ??= setTimeout(() => {
        if (!stopped) setStatus("paused");
      }, pausedAfterMs);
    };

    const connect = () => {
      const current = new EventSource(url);
      source = current;
      current.addEventListener("open", () => {
        attempt = 0;
        clearTimeout(pausedTimer);
        pausedTimer = undefined;
        setStatus("open");
        if (everOpened) onReconnect();
        everOpened = true;
      });
      current.addEventListener("activity", (event) => {
        const message = parseActivity((event as MessageEvent<string>).data);
        if (message) onActivity(message);
      });
      current.addEventListener("presence", () => onPresence());
      current.addEventListener("job", (event) => {
        const message = parseJob((event as MessageEvent<string>).data);
        if (message) onJob(message);
      });
      current.addEventListener("closed", () => {
        // The server withdrew access: reconnecting would only be refused.
        stopped = true;
        current.close();
        clearTimeout(pausedTimer);
        setStatus("ended");
      });
      current.addEventListener("error", () => {
        if (stopped) return;
        notePaused();
        if (current.readyState === EventSource.CLOSED) {
          current.close();
          retryTimer = setTimeout(connect, retryDelayMs(attempt++));
        }
      });
    };

    connect();
    notePaused();
    return () => {
      stopped = true;
      source?.close();
      clearTimeout(retryTimer);
      clearTimeout(pausedTimer);
    };
  }, [url]);

  return url ? status : "connecting";
}

function useNotice(viewerId: string | null) {
  const [notice, setNotice] = useState<LiveNotice | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const dismissNotice = useCallback(() => {
    clearTimeout(timer.current);
    setNotice(null);
  }, []);
  const offer = useCallback(
    (message: ActivityStreamMessage) => {
      // One's own actions are seen where they were made; only colleagues' get a notice.
      if (!message.item || !viewerId || message.actorId === viewerId) return;
      clearTimeout(timer.current);
      setNotice({ id: message.id, item: message.item });
      timer.current = setTimeout(() => setNotice(null), noticeForMs);
    },
    [viewerId],
  );
  useEffect(() => () => clearTimeout(timer.current), []);
  return { notice, offer, dismissNotice };
}

function refreshRun(client: QueryClient, runId: string | null): void {
  // ["runs", id] holds the record, comments and reviews; the payload sits apart under
  // ["run-payloads", id] and is never fetched again (a saved run's result does not change).
  if (runId) void client.invalidateQueries({ queryKey: ["runs", runId] });
}

export interface StudyLiveOptions {
  /**
   * The scene whose editor holds unsaved edits, if any. The editor saves against the version of
   * the scene record it was given; refetching that record while a draft exists would move the
   * base to a colleague's newer version and the save would overwrite it without the 409 that
   * protects both. So while a draft exists the scene's own keys are left alone: the save answers
   * 409 and the editor's conflict notice offers to load the latest or keep the draft as a variant.
   */
  sceneWithUnsavedEdits?: string | null;
  /** False while the page cannot show the study (it failed to load): no stream then. */
  enabled?: boolean;
}

export function useStudyLiveUpdates(studyId: string, options: StudyLiveOptions = {}): LiveUpdates {
  const client = useQueryClient();
  const me = useMe();
  const viewerId = me.data?.user.id ?? null;
  const { notice, offer, dismissNotice } = useNotice(viewerId);
  const heldScene = options.sceneWithUnsavedEdits ?? null;

  const refreshScene = (sceneId: string) => {
    if (sceneId === heldScene) return;
    void client.invalidateQueries({ queryKey: ["scenes", sceneId] });
    // Exact: the stored versions under ["scene-versions", id, n] never change.
    void client.invalidateQueries({ queryKey: ["scene-versions", sceneId], exact: true });
  };

  const status = useEventStream(options.enabled === false ? null : `/api/studies/${studyId}/events`, {
    onActivity: (message) => {
      // The study's record, notebook, runs, feed and presence all sit under ["studies", id].
      void client.invalidateQueries({ queryKey: ["studies", studyId] });
      refreshRun(client, message.runId);
      if (message.subjectType === "scene") refreshScene(message.subjectId);
      const origin = message.item?.detail.originSceneId;
      if (message.action === "scene.forked" && typeof origin === "string") refreshScene(origin);
      offer(message);
    },
    onPresence: () => void client.invalidateQueries({ queryKey: ["studies", studyId, "presence"] }),
    onJob: (message) => {
      // Progress arrives every few seconds per job: only the queue refetches. A completed job has
      // saved a run or finished a sweep's chart block, so then the whole study (runs, notebook) does.
      if (message.state === "completed") void client.invalidateQueries({ queryKey: ["studies", studyId] });
      else void client.invalidateQueries({ queryKey: ["studies", studyId, "jobs"] });
    },
    onReconnect: () => {
      void client.invalidateQueries({ queryKey: ["studies", studyId] });
      void client.invalidateQueries({ queryKey: ["runs"] });
    },
  });
  return { status, notice, dismissNotice, viewerId };
}

export function useTeamLiveUpdates(teamId: string): LiveUpdates {
  const client = useQueryClient();
  const me = useMe();
  const viewerId = me.data?.user.id ?? null;
  const { notice, offer, dismissNotice } = useNotice(viewerId);

  const status = useEventStream(`/api/teams/${teamId}/events`, {
    onActivity: (message) => {
      // The team's feed, study list (counts) and members sit under ["teams", id].
      void client.invalidateQueries({ queryKey: ["teams", teamId] });
      if (message.studyId) void client.invalidateQueries({ queryKey: ["studies", message.studyId] });
      refreshRun(client, message.runId);
      offer(message);
    },
    onPresence: () => undefined,
    onReconnect: () => void client.invalidateQueries({ queryKey: ["teams", teamId] }),
  });
  return { status, notice, dismissNotice, viewerId };
}
