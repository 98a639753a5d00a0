"use client";
// One scene: what it is, what grid it implies, and running it in this browser with the field
// shown live and, afterwards, replayable over the snapshots.
import { useEffect, useMemo, useState } from "react";
import { ForkActions } from "@/components/forks/fork-actions";
import { LineagePanel } from "@/components/forks/lineage-panel";
import { StudyLiveStrip } from "@/components/live/study-live-strip";
import { ServerRunAction } from "@/components/queue/server-run-action";
import { RunPanel } from "@/components/run/run-panel";
import { rememberSessionRun } from "@/components/run/session-runs";
import { useBrowserRun } from "@/components/run/use-browser-run";
import { RoleBadge } from "@/components/studies/role-badge";
import { SceneSketch } from "@/components/studies/scene-sketch";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { LoadFailure } from "@/components/ui/load-failure";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows } from "@/lib/access/roles";
import { formatWhen } from "@/lib/client/format";
import { useScene } from "@/lib/client/queries";
import { useStudyLiveUpdates } from "@/lib/client/use-live-updates";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
import { GridFigures } from "./grid-figures";
import { SceneHistory } from "./history/scene-history";
import { RunViewer } from "./run-viewer";
import { SceneEditPanel } from "./scene-edit-panel";

export function SceneWorkspace({ studyId, sceneId }: { studyId: string; sceneId: string }) {
  const query = useScene(sceneId);
  const run = useBrowserRun();
  const [view, setView] = useState<"run" | "edit" | "history" | "lineage">("run");
  // The editor stays mounted once opened (hidden on the other tabs), so a draft survives a look at the history.
  const [editorOpened, setEditorOpened] = useState(false);
  const [unsavedEdits, setUnsavedEdits] = useState(false);
  // Live: a colleague's save refreshes this scene, except while the editor holds a draft (see the hook).
  const live = useStudyLiveUpdates(studyId, { sceneWithUnsavedEdits: unsavedEdits ? sceneId : null, enabled: !query.isError });
  const parsed = useMemo(() => (query.data ? parseScene(query.data.scene.data) : null), [query.data]);
  const grid = useMemo(() => (parsed?.ok ? deriveGrid(parsed.scene) : null), [parsed]);
  const finished = run.state.phase === "finished" ? run.state.result : null;
  const record = query.data?.scene;
  useEffect(() => {
    if (finished && record) rememberSessionRun({ sceneId: record.id, sceneName: record.name, isReference: record.isReference, result: finished, finishedAt: Date.now() });
  }, [finished, record]);

  if (query.isPending) return <LoadingRows label="Loading the scene" />;
  if (query.isError) return <LoadFailure subject="scene" error={query.error} />;
  const { role } = query.data;
  const current = query.data.scene;

  return (
    <div className="flex flex-col gap-6">
      <div>
        <Breadcrumb
          links={[
            { href: "/dashboard", label: "Studies" },
            { href: `/studies/${studyId}`, label: "Study" },
          ]}
          current="Scene"
        />
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <h1 className="text-[26px] font-semibold leading-tight text-ink">{current.name}</h1>
          <RoleBadge role={role} />
          <span className="text-sm text-muted">
            Version {current.version} · {current.updatedByName ?? "someone"}, {formatWhen(current.updatedAt)}
          </span>
          <div className="ml-auto">
            <ForkActions scene={current} />
          </div>
        </div>
        {current.description ? <p className="mt-2 max-w-3xl text-[15px] text-ink-soft">{current.description}</p> : null}
        <div className="mt-3">
          <StudyLiveStrip studyId={studyId} live={live} />
        </div>
      </div>

      {parsed && !parsed.ok ? (
        <ErrorState title="This scene does not validate" message={parsed.problems.map((p) => `${p.path}: ${p.message}`).join("; ")} />
      ) : null}

      <div role="tablist" aria-label="Scene views" className="flex gap-1 border-b border-rule">
        {(["run", "edit", "history", "lineage"] as const).map((tab) => (
          <button
            key={tab}
            type="button"
            role="tab"
            aria-selected={view === tab}
            onClick={() => {
              setView(tab);
              if (tab === "edit") setEditorOpened(true);
            }}
            className={`-mb-px border-b-2 px-4 py-2 text-sm font-medium transition ${view === tab ? "border-tide-600 text-ink" : "border-transparent text-muted hover:text-ink"}`}
          >
            {tab === "run" ? "Run and results" : tab === "history" ? "History" : tab === "lineage" ? "Lineage" : roleAllows(role, "scene:edit") ? "Edit scene" : "Scene details"}
          </button>
        ))}
      </div>

      {editorOpened ? (
        <div hidden={view !== "edit"}>
          <SceneEditPanel record={current} role={role} onUnsavedChange={setUnsavedEdits} />
        </div>
      ) : null}
      {view === "history" ? <SceneHistory record={current} role={role} hasUnsavedEdits={unsavedEdits} /> : null}
      {view === "lineage" ? <LineagePanel sceneId={current.id} studyId={current.studyId} /> : null}

      {view === "run" && parsed?.ok && grid ? (
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
          <div className="flex flex-col gap-4">
            <div className="rounded-lg border border-rule bg-panel p-4">
              <RunPanel
                state={run.state}
                canRun={roleAllows(role, "run:create")}
                onStart={() => void run.start(parsed.scene)}
                onPause={run.pause}
                onResume={run.resume}
                onCancel={run.cancel}
                serverRun={<ServerRunAction studyId={studyId} sceneId={current.id} sceneVersion={current.version} unsavedEdits={unsavedEdits} canRun={roleAllows(role, "run:create")} />}
              />
            </div>
            <div className="rounded-lg border border-rule bg-panel p-3">
              {run.state.frame || run.state.result ? (
                <RunViewer scene={parsed.scene} sceneId={current.id} grid={grid} state={run.state} />
              ) : (
                <SceneSketch scene={parsed.scene} className="h-auto w-full" />
              )}
            </div>
          </div>
          <aside className="flex flex-col gap-3">
            <h2 className="text-base font-semibold text-ink">Grid</h2>
            <div className="rounded-lg border border-rule bg-panel p-4">
              <GridFigures grid={grid} />
            </div>
          </aside>
        </div>
      ) : null}
    </div>
  );
}
