"use client";
// A fork beside its origin: both geometries at one scale, every setting side by side with the
// differences marked, and the insertion loss of the fork relative to its origin when both have a
// completed saved run. From the origin's side, `withSceneId` names the fork to compare.
import Link from "next/link";
import { useMemo } from "react";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { LoadFailure } from "@/components/ui/load-failure";
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { compareSceneSettings } from "@/lib/collaboration/scene-comparison";
import { useLineage, useSceneWhenKnown } from "@/lib/client/fork-queries";
import { useScene } from "@/lib/client/queries";
import { parseScene } from "@/lib/fdtd/scene";
import type { SceneRecord } from "@/lib/http/api-types";
import { idSchema } from "@/lib/validation/ids";
import { ForkInsertionLossPanel } from "./fork-insertion-loss";
import { GeometrySideBySide } from "./geometry-side-by-side";
import { SettingsComparisonTable } from "./settings-comparison-table";

/** Which of the two is the origin: the one the other was forked from (else this page's scene goes left). */
function orient(current: SceneRecord, other: SceneRecord): { origin: SceneRecord; fork: SceneRecord; related: boolean } {
  if (current.forkedFromSceneId === other.id) return { origin: other, fork: current, related: true };
  if (other.forkedFromSceneId === current.id) return { origin: current, fork: other, related: true };
  return { origin: current, fork: other, related: false };
}

function ComparedPair({ current, other }: { current: SceneRecord; other: SceneRecord }) {
  const { origin, fork, related } = orient(current, other);
  const originRole = related ? "origin" : "first scene";
  const forkRole = related ? "fork" : "second scene";
  const parsedOrigin = useMemo(() => parseScene(origin.data), [origin.data]);
  const parsedFork = useMemo(() => parseScene(fork.data), [fork.data]);
  const groups = useMemo(() => (parsedOrigin.ok && parsedFork.ok ? compareSceneSettings(parsedOrigin.scene, parsedFork.scene) : null), [parsedOrigin, parsedFork]);
  const originLineage = useLineage(origin.id);
  const forkLineage = useLineage(fork.id);

  if (!parsedOrigin.ok || !parsedFork.ok) {
    const problem = !parsedOrigin.ok ? parsedOrigin.problems[0] : !parsedFork.ok ? parsedFork.problems[0] : undefined;
    return <ErrorState title="A scene does not validate" message={problem ? `${problem.path}: ${problem.message}` : "Unknown problem."} />;
  }
  const title = (role: string, record: SceneRecord) => `${role[0]!.toUpperCase()}${role.slice(1)}: ${record.name}`;

  return (
    <div className="flex flex-col gap-6">
      <section className="flex flex-col gap-3" aria-label="Geometry">
        <h2 className="text-base font-semibold text-ink">Geometry</h2>
        <GeometrySideBySide
          sides={[
            { title: title(originRole, origin), caption: `version ${origin.version}`, scene: parsedOrigin.scene },
            { title: title(forkRole, fork), caption: `version ${fork.version}${related && fork.forkedFromVersion !== null ? `, forked from version ${fork.forkedFromVersion}` : ""}`, scene: parsedFork.scene },
          ]}
        />
        <p className="text-[12px] text-muted">Both drawn at the same scale in metres.</p>
      </section>
      <section className="flex flex-col gap-3" aria-label="Settings">
        <h2 className="text-base font-semibold text-ink">Settings</h2>
        {groups ? <SettingsComparisonTable groups={groups} originTitle={title(originRole, origin)} forkTitle={title(forkRole, fork)} /> : null}
      </section>
      {originLineage.isError || forkLineage.isError ? (
        <ErrorState title="The scenes' runs could not be looked up" message={(originLineage.error ?? forkLineage.error)!.message} onRetry={() => void Promise.all([originLineage.refetch(), forkLineage.refetch()])} />
      ) : originLineage.data && forkLineage.data ? (
        <ForkInsertionLossPanel
          origin={{ sceneName: origin.name, studyId: origin.studyId, run: originLineage.data.scene.latestRun }}
          fork={{ sceneName: fork.name, studyId: fork.studyId, run: forkLineage.data.scene.latestRun }}
          originRole={originRole}
          forkRole={forkRole}
        />
      ) : (
        <LoadingRows rows={1} label="Looking up the scenes' runs" />
      )}
    </div>
  );
}

export function SceneComparisonView({ studyId, sceneId, withSceneId }: { studyId: string; sceneId: string; withSceneId: string | null }) {
  const current = useScene(sceneId);
  const withValid = withSceneId !== null && idSchema.safeParse(withSceneId).success;
  const otherId = withValid ? withSceneId : (current.data?.scene.forkedFromSceneId ?? null);
  const other = useSceneWhenKnown(otherId);

  const header = (
    <div>
      <Breadcrumb
        links={[
          { href: "/dashboard", label: "Studies" },
          { href: `/studies/${studyId}`, label: "Study" },
          { href: `/studies/${studyId}/scenes/${sceneId}`, label: current.data?.scene.name ?? "Scene" },
        ]}
        current="Comparison"
      />
      <h1 className="mt-2 text-[26px] font-semibold leading-tight text-ink">{withValid ? "Scene and fork side by side" : "Fork and origin side by side"}</h1>
    </div>
  );

  let body;
  if (withSceneId !== null && !withValid) body = <ErrorState title="Nothing to compare with" message="The scene to compare with is not a valid id." />;
  else if (current.isPending) body = <LoadingRows label="Loading the scene" />;
  else if (current.isError) body = <LoadFailure subject="scene" error={current.error} />;
  else if (otherId === null)
    body = (
      <EmptyState title="This scene is not a fork" action={<Link href={`/studies/${studyId}/scenes/${sceneId}`} className="text-sm font-medium text-tide-600 hover:underline">Back to the scene</Link>}>
        Open the Lineage tab of the scene and choose one of its forks to compare with.
      </EmptyState>
    );
  else if (other.isPending) body = <LoadingRows label="Loading the other scene" />;
  else if (other.isError) body = <LoadFailure subject={withValid ? "scene to compare with" : "origin"} error={other.error} back={{ href: `/studies/${studyId}/scenes/${sceneId}`, label: "Back to the scene" }} />;
  else body = <ComparedPair current={current.data.scene} other={other.data.scene} />;

  return (
    <div className="flex flex-col gap-6">
      {header}
      {body}
    </div>
  );
}
