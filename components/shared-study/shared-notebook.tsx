"use client";
// The study's notebook, read-only: notes rendered as Markdown, scenes drawn, runs summarised, charts and
// sweep results drawn. Blocks fold for the reader only.
import { useState } from "react";
import ReactMarkdown from "react-markdown";
import remarkGfm from "remark-gfm";
import { runChartQuantity } from "@/components/notebook/chart-block-model";
import { isSweepBlock } from "@/components/sweeps/sweep-result-block";
import { SweepResultView } from "@/components/sweeps/sweep-result-view";
import type { BlockItem } from "@/lib/http/api-types";
import type { SharedRun, SharedScene } from "@/lib/http/share-link-types";
import { chartContentSchema } from "@/lib/validation/blocks";
import { SharedChartBlock } from "./shared-chart-block";
import { SharedRunBlock } from "./shared-run-block";
import { SharedSceneCard } from "./shared-scene-card";

const kindLabels: Record<BlockItem["kind"], string> = { notes: "Notes", scene: "Scene", run: "Run", chart: "Chart" };

function idIn(block: BlockItem, key: "sceneId" | "runId"): string {
  const value = (block.content as Record<string, unknown> | null)?.[key];
  return typeof value === "string" ? value : "";
}

function SharedBlockBody({ token, block, sceneById, runById }: { token: string; block: BlockItem; sceneById: ReadonlyMap<string, SharedScene>; runById: ReadonlyMap<string, SharedRun> }) {
  if (block.kind === "notes") {
    const markdown = (block.content as { markdown?: unknown } | null)?.markdown;
    const text = typeof markdown === "string" ? markdown : "";
    return <div className="notes-prose">{text.trim() ? <ReactMarkdown remarkPlugins={[remarkGfm]}>{text}</ReactMarkdown> : <p className="text-muted">Empty notes.</p>}</div>;
  }
  if (block.kind === "scene") {
    const scene = sceneById.get(idIn(block, "sceneId"));
    return scene ? <SharedSceneCard scene={scene} /> : <p className="text-sm text-muted">This scene has been deleted.</p>;
  }
  if (block.kind === "run") return <SharedRunBlock token={token} run={runById.get(idIn(block, "runId"))} />;
  if (isSweepBlock(block)) {
    const parsed = chartContentSchema.safeParse(block.content);
    return parsed.success && parsed.data.sweep ? <SweepResultView definition={parsed.data.sweep.definition} results={parsed.data.sweep.results} /> : <p className="text-sm text-muted">This sweep cannot be shown.</p>;
  }
  if (runChartQuantity(block)) return <SharedChartBlock token={token} block={block} runById={runById} />;
  return <p className="text-sm text-muted">This block cannot be shown here.</p>;
}

export function SharedNotebook({ token, blocks, scenes, runs }: { token: string; blocks: BlockItem[]; scenes: SharedScene[]; runs: SharedRun[] }) {
  const [folded, setFolded] = useState<Record<string, boolean>>({});
  const sceneById = new Map(scenes.map((scene) => [scene.id, scene]));
  const runById = new Map(runs.map((run) => [run.id, run]));
  if (blocks.length === 0) return <p className="text-sm text-muted">The notebook is empty.</p>;
  return (
    <ol aria-label="Notebook blocks" className="flex flex-col gap-4">
      {blocks.map((block) => {
        const isFolded = folded[block.id] ?? block.collapsed;
        return (
          <li key={block.id} data-block-kind={block.kind} className="rounded-lg border border-rule bg-panel shadow-[0_1px_0_rgba(22,33,43,0.04)]">
            <div className="flex items-center gap-2 border-b border-rule px-3 py-1.5">
              <button
                type="button"
                aria-label={isFolded ? "Expand block" : "Collapse block"}
                aria-expanded={!isFolded}
                onClick={() => setFolded((previous) => ({ ...previous, [block.id]: !isFolded }))}
                className="inline-flex size-7 items-center justify-center rounded-md text-muted transition hover:bg-ink/5 hover:text-ink"
              >
                <svg viewBox="0 0 16 16" className={`size-4 transition ${isFolded ? "-rotate-90" : ""}`} aria-hidden>
                  <path d="M4 6l4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
                </svg>
              </button>
              <span className="rounded bg-paper px-1.5 py-0.5 text-[11px] font-medium uppercase tracking-wide text-muted ring-1 ring-rule">{isSweepBlock(block) ? "Sweep" : kindLabels[block.kind]}</span>
            </div>
            {isFolded ? null : (
              <div className="p-4">
                <SharedBlockBody token={token} block={block} sceneById={sceneById} runById={runById} />
              </div>
            )}
          </li>
        );
      })}
    </ol>
  );
}
