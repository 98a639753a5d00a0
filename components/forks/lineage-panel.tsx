"use client";
// A scene's lineage as a small tree: the scenes it was forked from (oldest at the top), this scene,
// and the forks made of it below, each with who forked which version when, and its latest saved
// run. Scenes of teams the reader is not on appear only as "in another team".
import Link from "next/link";
import type { ReactNode } from "react";
import { LoadFailure } from "@/components/ui/load-failure";
import { EmptyState, LoadingRows } from "@/components/ui/states";
import { useLineage } from "@/lib/client/fork-queries";
import { formatWhen } from "@/lib/client/format";
import type { LineageFork, LineageOrigin, LineageRun, LineageScene } from "@/lib/http/fork-types";

function SceneName({ scene }: { scene: LineageScene }) {
  if (scene.access === "other-team") return <span className="italic text-muted">A scene in another team</span>;
  if (scene.access === "deleted") return <span className="italic text-muted">A deleted scene</span>;
  return (
    <Link href={`/studies/${scene.studyId}/scenes/${scene.sceneId}`} className="font-medium text-tide-700 hover:underline">
      {scene.name}
    </Link>
  );
}

function RunLink({ scene, run }: { scene: Extract<LineageScene, { access: "open" }>; run: LineageRun | null }) {
  if (!run) return <span className="text-muted">no saved run yet</span>;
  return (
    <Link href={`/studies/${scene.studyId}/runs/${run.id}`} className="text-tide-700 hover:underline">
      latest run (of version {run.sceneVersion}, {formatWhen(run.createdAt)})
    </Link>
  );
}

/** One line of the tree: the scene, where it lives, and the facts about how it came about. */
function Node({ scene, facts, action }: { scene: LineageScene; facts: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 py-1.5">
      <div className="flex flex-wrap items-baseline gap-x-2">
        <SceneName scene={scene} />
        {scene.access === "open" ? (
          <span className="text-[12.5px] text-muted">
            {scene.studyTitle} · {scene.teamName} · now at version {scene.version}
          </span>
        ) : null}
        {action}
      </div>
      <div className="text-[12.5px] text-ink-soft">{facts}</div>
      {scene.access === "open" ? (
        <div className="text-[12.5px]">
          <RunLink scene={scene} run={scene.latestRun} />
        </div>
      ) : null}
    </div>
  );
}

function originFacts(origin: LineageOrigin): string {
  const version = origin.forkedVersion === null ? "an unknown version" : `version ${origin.forkedVersion}`;
  return `The scene below was forked from its ${version}${origin.versionAuthorName ? `, written by ${origin.versionAuthorName}` : ""}.`;
}

function ForkList({ forks, compareFrom }: { forks: readonly LineageFork[]; compareFrom: { studyId: string; sceneId: string } | null }) {
  return (
    <ul className="ml-3 border-l border-rule pl-4">
      {forks.map((fork, index) => (
        <li key={fork.scene.access === "open" ? fork.scene.sceneId : `hidden-${index}`}>
          <Node
            scene={fork.scene}
            facts={`Forked from version ${fork.forkedVersion ?? "?"}${fork.forkedByName ? ` by ${fork.forkedByName}` : ""}, ${formatWhen(fork.forkedAt)}.`}
            action={
              compareFrom && fork.scene.access === "open" ? (
                <Link href={`/studies/${compareFrom.studyId}/scenes/${compareFrom.sceneId}/compare?with=${fork.scene.sceneId}`} className="text-[12.5px] font-medium text-tide-700 hover:underline">
                  Compare with this scene
                </Link>
              ) : null
            }
          />
          {fork.forks.length > 0 ? <ForkList forks={fork.forks} compareFrom={null} /> : null}
          {fork.moreBelow ? <p className="ml-7 pb-1 text-[12.5px] italic text-muted">Further forks below; open this fork to see them.</p> : null}
        </li>
      ))}
    </ul>
  );
}

export function LineagePanel({ sceneId, studyId }: { sceneId: string; studyId: string }) {
  const lineage = useLineage(sceneId);
  if (lineage.isPending) return <LoadingRows rows={2} label="Loading the lineage" />;
  if (lineage.isError) return <LoadFailure subject="lineage" error={lineage.error} onRetry={() => void lineage.refetch()} />;
  const { scene, origins, forks } = lineage.data;
  if (origins.length === 0 && forks.length === 0) {
    return (
      <EmptyState title="No forks yet">
        This scene was not forked from another, and nobody has forked it. Fork it to try a variant without changing it.
      </EmptyState>
    );
  }
  // Oldest origin first, each indented one step more than the one it came from.
  const chain = [...origins].reverse();
  const nearest = origins[0];

  return (
    <section aria-label="Lineage" className="rounded-lg border border-rule bg-panel p-4" data-testid="lineage">
      {chain.map((origin, depth) => (
        <div key={`origin-${depth}`} style={{ marginLeft: `${depth * 1.25}rem` }} className="border-l border-rule pl-4">
          <Node scene={origin.scene} facts={originFacts(origin)} />
        </div>
      ))}
      <div style={{ marginLeft: `${chain.length * 1.25}rem` }}>
        <div className="flex flex-col gap-0.5 rounded-md border border-tide-500/40 bg-tide-50/60 px-3 py-2">
          <div className="flex flex-wrap items-baseline gap-x-2">
            <span className="font-semibold text-ink">{scene.name}</span>
            <span className="text-[12.5px] text-muted">this scene, version {scene.version}</span>
            {nearest?.scene.access === "open" ? (
              <Link href={`/studies/${studyId}/scenes/${sceneId}/compare`} className="text-[12.5px] font-medium text-tide-700 hover:underline">
                Compare with origin
              </Link>
            ) : null}
          </div>
          <div className="text-[12.5px]">
            {scene.latestRun ? (
              <Link href={`/studies/${studyId}/runs/${scene.latestRun.id}`} className="text-tide-700 hover:underline">
                latest run (of version {scene.latestRun.sceneVersion}, {formatWhen(scene.latestRun.createdAt)})
              </Link>
            ) : (
              <span className="text-muted">no saved run yet</span>
            )}
          </div>
        </div>
        {forks.length > 0 ? (
          <div className="mt-1">
            <ForkList forks={forks} compareFrom={{ studyId, sceneId }} />
          </div>
        ) : (
          <p className="mt-2 text-[12.5px] text-muted">Nobody has forked this scene yet.</p>
        )}
      </div>
    </section>
  );
}
