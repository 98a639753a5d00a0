"use client";
import Link from "next/link";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { LoadFailure } from "@/components/ui/load-failure";
import { LoadingRows } from "@/components/ui/states";
import { useStudy } from "@/lib/client/queries";
import { useStudyLiveUpdates } from "@/lib/client/use-live-updates";
import { StudyActivityPanel } from "@/components/activity/study-activity-panel";
import { StudyLiveStrip } from "@/components/live/study-live-strip";
import { RoleBadge } from "./role-badge";
import { StudyNotebook } from "@/components/notebook/study-notebook";
import { StudyRuns } from "@/components/runs/study-runs";
import { StudyQueuePanel } from "@/components/queue/study-queue-panel";
import { ShareLinksPanel } from "@/components/share-links/share-links-panel";

export function StudyView({ studyId }: { studyId: string }) {
  const query = useStudy(studyId);
  // Live: the notebook, runs, feed and presence refresh when a colleague changes something.
  const live = useStudyLiveUpdates(studyId, { enabled: !query.isError });

  if (query.isPending) return <LoadingRows label="Loading the study" />;
  if (query.isError) return <LoadFailure subject="study" error={query.error} onRetry={() => void query.refetch()} back={{ href: "/dashboard", label: "Back to studies" }} />;

  const { study, role, scenes } = query.data;
  return (
    <div className="flex flex-col gap-8">
      <div>
        <Breadcrumb links={[{ href: "/dashboard", label: "Studies" }]} current={study.siteReference || "Study"} />
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <h1 className="text-[28px] font-semibold leading-tight text-ink">{study.title}</h1>
          <RoleBadge role={role} />
        </div>
        {study.description ? <p className="mt-2 max-w-3xl text-[15px] leading-relaxed text-ink-soft">{study.description}</p> : null}
        <div className="mt-3">
          <StudyLiveStrip studyId={study.id} live={live} />
        </div>
      </div>

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <StudyNotebook studyId={study.id} role={role} scenes={scenes} />
        <aside aria-labelledby="activity-heading" className="flex flex-col gap-4">
          <div className="flex items-baseline justify-between gap-3">
            <h2 id="activity-heading" className="text-lg font-semibold text-ink">
              Activity
            </h2>
            <Link href={`/teams/${study.teamId}/activity`} className="text-sm font-medium text-tide-700 hover:underline">
              Whole team
            </Link>
          </div>
          <div className="rounded-lg border border-rule bg-panel p-4">
            <StudyActivityPanel studyId={study.id} viewerId={live.viewerId} />
          </div>
          <ShareLinksPanel studyId={study.id} role={role} />
        </aside>
      </div>
      <StudyQueuePanel studyId={study.id} role={role} />
      <StudyRuns studyId={study.id} />
    </div>
  );
}
