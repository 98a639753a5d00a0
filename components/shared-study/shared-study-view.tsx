"use client";
// A study opened by its read-only link: its heading, the notebook as the team keeps it, any scene the
// notebook does not show, and the saved runs. Nothing here changes anything.
import type { SharedStudyResponse } from "@/lib/http/share-link-types";
import { SharedNotebook } from "./shared-notebook";
import { SharedRunsTable } from "./shared-runs-table";
import { SharedSceneCard } from "./shared-scene-card";

export function SharedStudyView({ token, content }: { token: string; content: SharedStudyResponse }) {
  const { study, blocks, scenes, runs } = content;
  const inNotebook = new Set(blocks.flatMap((block) => (block.kind === "scene" ? [(block.content as { sceneId?: unknown } | null)?.sceneId] : [])));
  const otherScenes = scenes.filter((scene) => !inNotebook.has(scene.id));
  return (
    <div className="flex flex-col gap-8">
      <div>
        <p className="text-sm text-muted">
          {study.teamName}
          {study.siteReference ? <span> · {study.siteReference}</span> : null}
        </p>
        <h1 className="mt-1 text-[28px] font-semibold leading-tight text-ink">{study.title}</h1>
        {study.description ? <p className="mt-2 max-w-3xl text-[15px] leading-relaxed text-ink-soft">{study.description}</p> : null}
      </div>
      <section aria-labelledby="shared-notebook-heading" className="flex flex-col gap-4">
        <h2 id="shared-notebook-heading" className="text-lg font-semibold text-ink">
          Notebook
        </h2>
        <SharedNotebook token={token} blocks={blocks} scenes={scenes} runs={runs} />
      </section>
      {otherScenes.length > 0 ? (
        <section aria-labelledby="shared-scenes-heading" className="flex flex-col gap-4">
          <h2 id="shared-scenes-heading" className="text-lg font-semibold text-ink">
            Other scenes
          </h2>
          {otherScenes.map((scene) => (
            <SharedSceneCard key={scene.id} scene={scene} />
          ))}
        </section>
      ) : null}
      <section aria-labelledby="shared-runs-heading" className="flex flex-col gap-4">
        <h2 id="shared-runs-heading" className="text-lg font-semibold text-ink">
          Saved runs
        </h2>
        <SharedRunsTable token={token} runs={runs} />
      </section>
    </div>
  );
}
