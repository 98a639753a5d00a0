"use client";
// The study as a notebook: notes, scenes, saved runs, charts of runs and sweep results in the order the
// engineer works the question through. Editors add, move, collapse and
// delete blocks; everyone reads.
import Link from "next/link";
import { useState } from "react";
import { isSweepBlock, SweepResultBlock } from "@/components/sweeps/sweep-result-block";
import { SceneCard } from "@/components/studies/scene-card";
import { Button } from "@/components/ui/button";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { useBlocks, useNotebookMutations } from "@/lib/client/queries";
import { useStudyRuns } from "@/lib/client/run-queries";
import type { BlockItem, SceneListItem } from "@/lib/http/api-types";
import { AddSceneForm } from "./add-scene-form";
import { ChartBlock } from "./chart-block";
import { chartBlockTitle, runChartQuantity } from "./chart-block-model";
import { NotesBlock } from "./notes-block";
import { RunBlock, runBlockTitle, runIdOfBlock } from "./run-block";

const kindLabels: Record<BlockItem["kind"], string> = { notes: "Notes", scene: "Scene", run: "Run", chart: "Chart" };

function IconButton({ label, onClick, disabled, children }: { label: string; onClick: () => void; disabled?: boolean; children: React.ReactNode }) {
  return (
    <button
      type="button"
      aria-label={label}
      title={label}
      onClick={onClick}
      disabled={disabled}
      className="inline-flex size-7 items-center justify-center rounded-md text-muted transition hover:bg-ink/5 hover:text-ink disabled:opacity-30"
    >
      {children}
    </button>
  );
}

const deleteQuestions: Partial<Record<BlockItem["kind"], string>> = {
  notes: "Delete these notes? This cannot be undone.",
  run: "Remove this run's block from the notebook? The saved run itself stays in the run table.",
};
/** Only charts of saved runs: a sweep's block holds numbers that were never saved anywhere else. */
const deleteRunChartQuestion = "Remove this chart from the notebook? The saved runs it draws stay in the run table.";

export function StudyNotebook({ studyId, role, scenes }: { studyId: string; role: TeamRole; scenes: SceneListItem[] }) {
  const query = useBlocks(studyId);
  const runs = useStudyRuns(studyId);
  const mutations = useNotebookMutations(studyId);
  const [addingScene, setAddingScene] = useState(false);
  const [localCollapsed, setLocalCollapsed] = useState<Record<string, boolean>>({});
  const canEdit = roleAllows(role, "study:edit");
  const canEditScenes = roleAllows(role, "scene:edit");

  if (query.isPending) return <LoadingRows label="Loading the notebook" />;
  if (query.isError) return <ErrorState title="The notebook could not be loaded" message={query.error.message} onRetry={() => query.refetch()} />;
  const blocks = query.data.blocks;
  const sceneById = new Map(scenes.map((scene) => [scene.id, scene]));
  const runById = new Map((runs.data?.runs ?? []).map((run) => [run.id, run]));

  const move = (index: number, by: -1 | 1) => {
    const ids = blocks.map((b) => b.id);
    const [moved] = ids.splice(index, 1);
    ids.splice(index + by, 0, moved!);
    mutations.reorder.mutate(ids);
  };
  const collapsedOf = (block: BlockItem) => localCollapsed[block.id] ?? block.collapsed;
  const toggleCollapsed = (block: BlockItem) => {
    // Editors keep the choice for the team; everyone else folds blocks for themselves only.
    if (canEdit) mutations.updateBlock.mutate({ blockId: block.id, baseVersion: block.version, collapsed: !block.collapsed });
    else setLocalCollapsed((previous) => ({ ...previous, [block.id]: !collapsedOf(block) }));
  };

  return (
    <section aria-labelledby="notebook-heading" className="flex flex-col gap-4">
      <div className="flex items-baseline justify-between">
        <h2 id="notebook-heading" className="text-lg font-semibold text-ink">
          Notebook
        </h2>
        <p className="text-sm text-muted">{blocks.length === 1 ? "1 block" : `${blocks.length} blocks`}</p>
      </div>
      <ol aria-label="Notebook blocks" className="flex flex-col gap-4">
        {blocks.map((block, index) => {
          const collapsed = collapsedOf(block);
          const scene = block.kind === "scene" ? sceneById.get((block.content as { sceneId: string }).sceneId) : undefined;
          const title =
            block.kind === "scene"
              ? (scene?.name ?? "Scene")
              : block.kind === "notes"
                ? (block.content as { markdown: string }).markdown.split("\n")[0]?.replace(/^#+\s*/, "") || "Notes"
                : block.kind === "run"
                  ? runBlockTitle(runById.get(runIdOfBlock(block) ?? ""))
                  : isSweepBlock(block)
                    ? "Sweep result"
                    : runChartQuantity(block)
                      ? chartBlockTitle(block)
                      : kindLabels[block.kind];
          const kindLabel = isSweepBlock(block) ? "Sweep" : kindLabels[block.kind];
          const deleteQuestion = runChartQuantity(block) ? deleteRunChartQuestion : deleteQuestions[block.kind];
          return (
            <li key={block.id} id={`block-${block.id}`} data-block-kind={block.kind} className="group rounded-lg border border-rule bg-panel shadow-[0_1px_0_rgba(22,33,43,0.04)]">
              <div className="flex items-center gap-2 border-b border-rule px-3 py-1.5">
                <IconButton label={collapsed ? "Expand block" : "Collapse block"} onClick={() => toggleCollapsed(block)}>
                  <svg viewBox="0 0 16 16" className={`size-4 transition ${collapsed ? "-rotate-90" : ""}`} aria-hidden>
                    <path d="M4 6l4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
                  </svg>
                </IconButton>
                <span className="rounded bg-paper px-1.5 py-0.5 text-[11px] font-medium uppercase tracking-wide text-muted ring-1 ring-rule">{kindLabel}</span>
                <span className="truncate text-sm text-ink-soft">{collapsed ? title : ""}</span>
                {canEdit ? (
                  <div className="ml-auto flex items-center gap-0.5 opacity-60 transition group-hover:opacity-100">
                    <IconButton label="Move up" onClick={() => move(index, -1)} disabled={index === 0}>
                      <svg viewBox="0 0 16 16" className="size-4" aria-hidden><path d="M8 12V4M4.5 7.5L8 4l3.5 3.5" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" /></svg>
                    </IconButton>
                    <IconButton label="Move down" onClick={() => move(index, 1)} disabled={index === blocks.length - 1}>
                      <svg viewBox="0 0 16 16" className="size-4" aria-hidden><path d="M8 4v8M4.5 8.5L8 12l3.5-3.5" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" /></svg>
                    </IconButton>
                    <IconButton label="Add notes below" onClick={() => mutations.addNotes.mutate({ markdown: "", afterBlockId: block.id })}>
                      <svg viewBox="0 0 16 16" className="size-4" aria-hidden><path d="M8 3.5v9M3.5 8h9" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" /></svg>
                    </IconButton>
                    {deleteQuestion ? (
                      <IconButton label="Delete block" onClick={() => window.confirm(deleteQuestion) && mutations.deleteBlock.mutate(block.id)}>
                        <svg viewBox="0 0 16 16" className="size-4" aria-hidden><path d="M3.5 4.5h9M6.5 4.5V3h3v1.5M5 4.5l.5 8h5l.5-8" fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" strokeLinejoin="round" /></svg>
                      </IconButton>
                    ) : null}
                  </div>
                ) : null}
              </div>
              {collapsed ? null : (
                <div className="p-4">
                  {block.kind === "notes" ? (
                    <NotesBlock
                      block={block}
                      canEdit={canEdit}
                      onSave={async (markdown, baseVersion) => (await mutations.updateBlock.mutateAsync({ blockId: block.id, baseVersion, markdown })).block}
                      onKeepAsNew={async (markdown) => {
                        await mutations.addNotes.mutateAsync({ markdown, afterBlockId: block.id });
                      }}
                      onReload={async () => {
                        await query.refetch();
                      }}
                    />
                  ) : block.kind === "run" ? (
                    <RunBlock block={block} studyId={studyId} />
                  ) : isSweepBlock(block) ? (
                    <SweepResultBlock block={block} studyId={studyId} />
                  ) : runChartQuantity(block) ? (
                    <ChartBlock block={block} studyId={studyId} />
                  ) : block.kind === "scene" && scene ? (
                    <ul className="max-w-xl">
                      <SceneCard item={scene} studyId={studyId} />
                    </ul>
                  ) : (
                    <p className="text-sm text-muted">This block refers to something that no longer exists.</p>
                  )}
                </div>
              )}
            </li>
          );
        })}
      </ol>
      {canEdit ? (
        addingScene && canEditScenes ? (
          <AddSceneForm onAdd={(input) => mutations.addScene.mutateAsync(input)} onClose={() => setAddingScene(false)} />
        ) : (
          <div className="flex flex-wrap gap-3">
            <Button variant="secondary" size="sm" onClick={() => mutations.addNotes.mutate({ markdown: "", afterBlockId: null })}>
              Add notes
            </Button>
            {canEditScenes ? (
              <Button variant="secondary" size="sm" onClick={() => setAddingScene(true)}>
                Add a scene
              </Button>
            ) : null}
            {canEditScenes && scenes.length > 0 ? (
              <Link href={`/studies/${studyId}/sweeps`} className="inline-flex h-8 items-center rounded-md border border-rule-strong bg-panel px-3 text-sm font-medium text-ink hover:border-ink-soft">
                Sweep a parameter
              </Link>
            ) : null}
          </div>
        )
      ) : null}
    </section>
  );
}
