"use client";
import Link from "next/link";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { ApiError } from "@/lib/client/api";
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
  if (query.isError) {
    const notFound = query.error instanceof ApiError && query.error.status === 404;
    return (
      <div className="flex flex-col gap-4">
        <ErrorState
          title={notFound ? "No such study" : "The study could not be loaded"}
          message={notFound ? "It may have been deleted, or it belongs to a team you are not on." : query.error.message}
          onRetry={notFound ? undefined : () => query.refetch()}
        />
        <Link href="/dashboard" className="text-sm font-medium text-tide-600 hover:underline">
          Back to studies
        </Link>
      </div>
    );
  }

  const { study, role, scenes, activity } = query.data;
  return (
    <div className="flex flex-col gap-8">
      <div>
        <nav aria-label="Breadcrumb" className="text-sm text-muted">
          <Link href="/dashboard" className="hover:text-tide-600">
            Studies
          </Link>
          <span aria-hidden> / </span>
          <span className="text-ink-soft">{study.siteReference || "Study"}</span>
        </nav>
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
