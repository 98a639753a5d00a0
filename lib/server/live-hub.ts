// One LISTEN per app process, fanned out to every open server-sent-events stream of the process.
import "server-only";
import { listenToChannel, type Unlisten } from "@/db/client";
import { liveEventChannel, parseLiveEvent, type LiveEvent } from "@/lib/live/live-event";

type Subscriber = (event: LiveEvent) => void;

interface Hub {
  subscribers: Set<Subscriber>;
  unlisten: Promise<Unlisten> | null;
}

const cacheKey = Symbol.for("rarefact.live-hub");
type GlobalWithHub = typeof globalThis & { [cacheKey]?: Hub };

function hub(): Hub {
  const store = globalThis as GlobalWithHub;
  store[cacheKey] ??= { subscribers: new Set(), unlisten: null };
  return store[cacheKey];
}

function deliver(payload: string): void {
  const event = parseLiveEvent(payload);
  if (!event) return;
  for (const subscriber of hub().subscribers) {
    try {
      subscriber(event);
    } catch (error) {
      console.error("[live] a subscriber failed:", error);
    }
  }
}

/** Calls `onEvent` for every live event until the returned function is called. */
export async function subscribeToLiveEvents(onEvent: Subscriber): Promise<() => void> {
  const state = hub();
  state.subscribers.add(onEvent);
  if (!state.unlisten) {
    state.unlisten = listenToChannel(liveEventChannel, deliver).catch((error: unknown) => {
      state.unlisten = null;
      throw error;
    });
  }
  await state.unlisten;
  return () => {
    state.subscribers.delete(onEvent);
  };
}

/** Drops the process's LISTEN (tests that close and reopen the database). */
export async function resetLiveHub(): Promise<void> {
  const state = hub();
  const pending = state.unlisten;
  state.unlisten = null;
  state.subscribers.clear();
  if (pending) await (await pending.catch(() => async () => undefined))();
}
