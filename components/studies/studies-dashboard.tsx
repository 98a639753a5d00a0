"use client";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows } from "@/lib/access/roles";
import { formatWhen } from "@/lib/client/format";
import { useMe, useStudies } from "@/lib/client/queries";
import type { StudyListItem } from "@/lib/http/api-types";
import { CreateStudyForm } from "./create-study-form";
import { RoleBadge } from "./role-badge";
import { TeamPanel } from "./team-panel";

function StudyCard({ study }: { study: StudyListItem }) {
  return (
    <li>
      <Link
        href={`/studies/${study.id}`}
        className="group flex flex-col gap-3 rounded-lg border border-rule bg-panel p-5 shadow-[0_1px_0_rgba(22,33,43,0.04)] transition hover:border-tide-300 hover:shadow-md"
      >
        <div className="flex items-start justify-between gap-4">
          <h3 className="text-[17px] font-semibold text-ink group-hover:text-tide-700">{study.title}</h3>
          {study.siteReference ? (
            <span className="shrink-0 rounded bg-paper px-2 py-0.5 font-mono text-xs text-ink-soft ring-1 ring-rule">{study.siteReference}</span>
          ) : null}
        </div>
        {study.description ? <p className="line-clamp-2 text-sm leading-relaxed text-ink-soft">{study.description}</p> : null}
        <dl className="mt-auto flex flex-wrap gap-x-6 gap-y-1 border-t border-rule pt-3 text-xs text-muted">
          <div className="flex gap-1.5">
            <dt>Scenes</dt>
            <dd className="tabular font-medium text-ink">{study.sceneCount}</dd>
          </div>
          <div className="flex gap-1.5">
            <dt>Runs</dt>
            <dd className="tabular font-medium text-ink">{study.runCount}</dd>
          </div>
          <div className="flex gap-1.5">
            <dt>Updated</dt>
            <dd className="text-ink-soft">{formatWhen(study.updatedAt)}</dd>
          </div>
          {study.createdByName ? (
            <div className="flex gap-1.5">
              <dt>Started by</dt>
              <dd className="text-ink-soft">{study.createdByName}</dd>
            </div>
          ) : null}
        </dl>
      </Link>
    </li>
  );
}

export function StudiesDashboard() {
  const me = useMe();
  const activeTeamId = me.data?.activeTeamId ?? null;
  const studies = useStudies(activeTeamId);
  const [creating, setCreating] = useState(false);

  if (me.isPending) return <LoadingRows label="Loading your teams" />;
  if (me.isError) return <ErrorState title="Your teams could not be loaded" message={me.error.message} onRetry={() => me.refetch()} />;

  const membership = me.data.memberships.find((m) => m.teamId === activeTeamId);
  if (!membership) {
    return <EmptyState title="You are not on a team yet">Ask a team owner to invite you, or create an account of your own.</EmptyState>;
  }
  const canCreate = roleAllows(membership.role, "study:create");

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-sm font-medium text-tide-600">{membership.teamName}</p>
          <div className="mt-1 flex items-center gap-3">
            <h1 className="text-[28px] font-semibold leading-tight text-ink">Studies</h1>
            <RoleBadge role={membership.role} />
          </div>
        </div>
        {canCreate && !creating ? (
          <Button onClick={() => setCreating(true)}>
            <span aria-hidden className="text-lg leading-none">
              +
            </span>
            New study
          </Button>
        ) : null}
      </div>

      {creating ? <CreateStudyForm teamId={membership.teamId} onDone={() => setCreating(false)} /> : null}

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <section aria-label="Study list" className="flex flex-col gap-4">
          {studies.isPending ? (
            <LoadingRows label="Loading studies" />
          ) : studies.isError ? (
            <ErrorState title="The studies could not be loaded" message={studies.error.message} onRetry={() => studies.refetch()} />
          ) : studies.data.studies.length === 0 ? (
            <EmptyState
              title="No studies yet"
              action={canCreate && !creating ? <Button onClick={() => setCreating(true)}>Start the first study</Button> : undefined}
            >
              {canCreate
                ? "A study holds one acoustic question, such as a barrier for a road or an opening in a plant-room wall."
                : "Your role in this team is read-only; studies appear here when an editor creates them."}
            </EmptyState>
          ) : (
            <ul aria-label="Studies" className="grid gap-4 xl:grid-cols-2">
              {studies.data.studies.map((study) => (
                <StudyCard key={study.id} study={study} />
              ))}
            </ul>
          )}
        </section>
        <TeamPanel teamId={membership.teamId} currentUserEmail={me.data.user.email} />
      </div>
    </div>
  );
}
