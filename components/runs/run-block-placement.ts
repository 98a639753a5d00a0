// Where a saved run's notebook block goes: right under its scene's block, after the runs of that
// scene already shown there, so a scene's runs read in the order they were made.
import type { BlockItem } from "@/lib/http/api-types";

function contentField(block: BlockItem, field: "sceneId" | "runId"): string | undefined {
  const content = block.content as Record<string, unknown> | null;
  const value = content?.[field];
  return typeof value === "string" ? value : undefined;
}

export function hasRunBlock(blocks: readonly BlockItem[], runId: string): boolean {
  return blocks.some((block) => block.kind === "run" && contentField(block, "runId") === runId);
}

/**
 * The block to insert after: the scene's block, or the last of the run blocks directly below it whose
 * runs are of that scene. Null (append at the end) when the scene has no block.
 */
export function runBlockAnchor(blocks: readonly BlockItem[], sceneId: string, runSceneIds: ReadonlyMap<string, string>): string | null {
  const sceneIndex = blocks.findIndex((block) => block.kind === "scene" && contentField(block, "sceneId") === sceneId);
  if (sceneIndex < 0) return null;
  let anchor = sceneIndex;
  for (let index = sceneIndex + 1; index < blocks.length; index++) {
    const block = blocks[index]!;
    const runId = block.kind === "run" ? contentField(block, "runId") : undefined;
    if (runId === undefined || runSceneIds.get(runId) !== sceneId) break;
    anchor = index;
  }
  return blocks[anchor]!.id;
}
