"use client";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { LoadFailure } from "@/components/ui/load-failure";
import { LoadingRows } from "@/components/ui/states";
import { formatWhen } from "@/lib/client/format";
import { useStudy } from "@/lib/client/queries";
import type { ActivityItem } from "@/lib/http/api-types";
import { RoleBadge } from "./role-badge";
import { StudyNotebook } from "@/components/notebook/study-notebook";
import { StudyRuns } from "@/components/runs/study-runs";

const activityVerbs: Record<string, string> = {
  "study.created": "started the study",
  "scene.created": "added a scene",
  "scene.saved": "saved a scene",
  "block.added": "added a block",
  "block.deleted": "removed a block",
  "run.saved": "saved a run",
  "run.deleted": "deleted a run",
};

function ActivityList({ items }: { items: ActivityItem[] }) {
  if (items.length === 0) return <p className="text-sm text-muted">Nothing has happened here yet.</p>;
  return (
    <ol className="flex flex-col gap-3">
      {items.map((item) => {
        const detail = item.detail as { name?: string; title?: string } | null;
        return (
          <li key={item.id} className="flex gap-3 text-sm">
            <span aria-hidden className="mt-1.5 size-2 shrink-0 rounded-full bg-tide-300" />
            <div>
              <p className="text-ink-soft">
                <span className="font-medium text-ink">{item.actorName ?? "Someone"}</span> {activityVerbs[item.action] ?? item.action}
                {detail?.name ? <span className="text-ink">: {detail.name}</span> : null}
              </p>
              <p className="text-xs text-muted">{formatWhen(item.createdAt)}</p>
            </div>
          </li>
        );
      })}
    </ol>
  );
}

export function StudyView({ studyId }: { studyId: string }) {
  const query = useStudy(studyId);

  if (query.isPending) return <LoadingRows label="Loading the study" />;
  if (query.isError) return <LoadFailure subject="study" error={query.error} onRetry={() => void query.refetch()} back={{ href: "/dashboard", label: "Back to studies" }} />;

  const { study, role, scenes, activity } = query.data;
  return (
    <div className="flex flex-col gap-8">
      <div>
        <Breadcrumb links={[{ href: "/dashboard", label: "Studies" }]} current={study.siteReference || "Study"} />
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <h1 className="text-[28px] font-semibold leading-tight text-ink">{study.title}</h1>
          <RoleBadge role={role} />
        </div>
        {study.description ? <p className="mt-2 max-w-3xl text-[15px] leading-relaxed text-ink-soft">{study.description}</p> : null}
      </div>

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <StudyNotebook studyId={study.id} role={role} scenes={scenes} />
        <aside aria-labelledby="activity-heading" className="flex flex-col gap-4">
          <h2 id="activity-heading" className="text-lg font-semibold text-ink">
            Activity
          </h2>
          <div className="rounded-lg border border-rule bg-panel p-4">
            <ActivityList items={activity} />
          </div>
        </aside>
      </div>
      <StudyRuns studyId={study.id} />
    </div>
  );
}
