"use client";
// The team's activity across all its studies, kept live: what colleagues saved, forked, commented
// and decided, newest first.
import { LiveNotice } from "@/components/live/live-notice";
import { LiveStatusNote } from "@/components/live/live-status-note";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { useTeamActivity } from "@/lib/client/activity-queries";
import { useTeamLiveUpdates } from "@/lib/client/use-live-updates";
import { ActivityFeed } from "./activity-feed";

export function TeamActivityView({ teamId, teamName }: { teamId: string; teamName: string }) {
  const query = useTeamActivity(teamId);
  const live = useTeamLiveUpdates(teamId);
  return (
    <div className="flex flex-col gap-6">
      <div>
        <Breadcrumb links={[{ href: "/dashboard", label: "Studies" }]} current="Team activity" />
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <h1 className="text-[28px] font-semibold leading-tight text-ink">Activity in {teamName}</h1>
          <LiveStatusNote status={live.status} />
        </div>
        <p className="mt-2 max-w-3xl text-[15px] text-ink-soft">Runs saved, scenes forked, comments and review decisions in every study of the team, and who joined or left.</p>
      </div>
      <div className="max-w-3xl rounded-lg border border-rule bg-panel p-5">
        <ActivityFeed query={query} viewerId={live.viewerId} withStudy emptyText="Nothing has happened in this team yet." />
      </div>
      <LiveNotice notice={live.notice} viewerId={live.viewerId} onDismiss={live.dismissNotice} />
    </div>
  );
}
