"use client";
// The live parts of a study's pages in one place: who else is here, whether updates are flowing,
// and the notice of what a colleague just did.
import type { LiveUpdates } from "@/lib/client/use-live-updates";
import { LiveNotice } from "./live-notice";
import { LiveStatusNote } from "./live-status-note";
import { PresenceBar } from "./presence-bar";

export function StudyLiveStrip({ studyId, live }: { studyId: string; live: LiveUpdates }) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <PresenceBar studyId={studyId} viewerId={live.viewerId} />
      <LiveStatusNote status={live.status} />
      <LiveNotice notice={live.notice} viewerId={live.viewerId} onDismiss={live.dismissNotice} />
    </div>
  );
}
