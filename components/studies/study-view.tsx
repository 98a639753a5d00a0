"use client";
import Link from "next/link";
import { useMemo } from "react";
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
import { ApiError } from "@/lib/client/api";
import { formatWhen } from "@/lib/client/format";
import { useStudy } from "@/lib/client/queries";
import type { ActivityItem, SceneListItem } from "@/lib/http/api-types";
import { RoleBadge } from "./role-badge";
import { SceneSketch } from "./scene-sketch";

const number = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });

function formatBytes(bytes: number): string {
  if (bytes >= 1e9) return `${number.format(bytes / 1e9)} GB`;
  if (bytes >= 1e6) return `${number.format(bytes / 1e6)} MB`;
  return `${number.format(bytes / 1e3)} kB`;
}

function SceneCard({ item }: { item: SceneListItem }) {
  const parsed = useMemo(() => parseScene(item.data), [item.data]);
  const grid = useMemo(() => (parsed.ok ? deriveGrid(parsed.scene) : null), [parsed]);

  return (
    <li className="flex flex-col overflow-hidden rounded-lg border border-rule bg-panel shadow-[0_1px_0_rgba(22,33,43,0.04)]">
      <div className="border-b border-rule bg-paper/60 p-3">
        {parsed.ok ? (
          <SceneSketch scene={parsed.scene} className="h-auto w-full" />
        ) : (
          <p className="flex h-32 items-center justify-center text-sm text-signal-error">This scene no longer validates: {parsed.problems[0]?.message}</p>
        )}
      </div>
      <div className="flex flex-1 flex-col gap-3 p-4">
        <div className="flex items-start justify-between gap-3">
          <h3 className="font-semibold leading-snug text-ink">{item.name}</h3>
          {item.isReference ? (
            <span className="shrink-0 rounded-full bg-night px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide text-white">Reference</span>
          ) : (
            <span className="shrink-0 rounded-full bg-tide-50 px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide text-tide-700 ring-1 ring-tide-100">
              Variant
            </span>
          )}
        </div>
        {item.description ? <p className="text-sm leading-relaxed text-ink-soft">{item.description}</p> : null}
        {grid ? (
          <dl className="mt-auto grid grid-cols-3 gap-x-3 gap-y-2 border-t border-rule pt-3 text-xs">
            <Figure label="Cell size" value={`${number.format(grid.cellSize * 100)} cm`} />
            <Figure label="Resolved to" value={`${number.format(grid.maxResolvedFrequency)} Hz`} />
            <Figure label="Grid" value={`${grid.nx} × ${grid.ny}`} />
            <Figure label="Steps" value={grid.steps.toLocaleString("en-GB")} />
            <Figure label="Courant" value={grid.courantNumber.toFixed(2)} />
            <Figure label="Memory" value={formatBytes(grid.memoryBytes)} />
          </dl>
        ) : null}
        <p className="text-xs text-muted">
          Version {item.version} · {item.updatedByName ? `${item.updatedByName}, ` : ""}
          {formatWhen(item.updatedAt)}
        </p>
      </div>
    </li>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-muted">{label}</dt>
      <dd className="tabular whitespace-nowrap font-mono text-[13px] text-ink">{value}</dd>
    </div>
  );
}

const activityVerbs: Record<string, string> = {
  "study.created": "started the study",
  "scene.created": "added a scene",
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
        <section aria-labelledby="scenes-heading" className="flex flex-col gap-4">
          <div className="flex items-baseline justify-between">
            <h2 id="scenes-heading" className="text-lg font-semibold text-ink">
              Scenes
            </h2>
            <p className="text-sm text-muted">{scenes.length === 1 ? "1 scene" : `${scenes.length} scenes`}</p>
          </div>
          {scenes.length === 0 ? (
            <EmptyState title="No scenes yet">A scene is the 2D section to simulate: its domain, surfaces, barriers, sources and receivers.</EmptyState>
          ) : (
            <ul aria-label="Scenes" className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
              {scenes.map((item) => (
                <SceneCard key={item.id} item={item} />
              ))}
            </ul>
          )}
        </section>
        <aside aria-labelledby="activity-heading" className="flex flex-col gap-4">
          <h2 id="activity-heading" className="text-lg font-semibold text-ink">
            Activity
          </h2>
          <div className="rounded-lg border border-rule bg-panel p-4">
            <ActivityList items={activity} />
          </div>
        </aside>
      </div>
    </div>
  );
}
