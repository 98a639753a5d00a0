"use client";
// Says so when live updates stop arriving: the page still works, it only stops refreshing itself.
import type { LiveStatus } from "@/lib/client/use-live-updates";

export function LiveStatusNote({ status }: { status: LiveStatus }) {
  if (status !== "paused" && status !== "ended") return null;
  return (
    <p role="status" className="inline-flex items-center gap-1.5 rounded-full bg-ember-50 px-2.5 py-0.5 text-xs text-ember-700" data-testid="live-status">
      <span aria-hidden className="size-1.5 rounded-full bg-ember-500" />
      {status === "paused" ? "Live updates paused — reconnecting…" : "Live updates stopped. Reload the page to see changes."}
    </p>
  );
}
