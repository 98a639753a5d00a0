// Chart blocks of saved runs, without React: what each quantity is called, which block a new chart goes
// after, and what part each run plays in a chart.
import type { BlockItem } from "@/lib/http/api-types";
import type { ChartQuantity } from "@/lib/validation/blocks";

/** Charts made from saved runs; "sweep" charts hold their own numbers and are drawn elsewhere. */
export type RunChartQuantity = Exclude<ChartQuantity, "sweep">;

export const chartQuantityLabels: Record<RunChartQuantity, string> = {
  trace: "pressure traces",
  spectrum: "spectra",
  "band-levels": "band levels",
  "insertion-loss": "insertion loss",
};

/** The quantity a chart block draws, or null when the block is not a chart of saved runs. */
export function runChartQuantity(block: Pick<BlockItem, "kind" | "content">): RunChartQuantity | null {
  if (block.kind !== "chart") return null;
  const quantity = (block.content as { quantity?: unknown } | null)?.quantity;
  return typeof quantity === "string" && quantity in chartQuantityLabels ? (quantity as RunChartQuantity) : null;
}

/** The title of a folded chart block: "Chart: band levels", with the chart's own title after it when it has one. */
export function chartBlockTitle(block: Pick<BlockItem, "kind" | "content">): string {
  const quantity = runChartQuantity(block);
  const title = (block.content as { title?: unknown } | null)?.title;
  const base = `Chart: ${quantity ? chartQuantityLabels[quantity] : "unknown quantity"}`;
  return typeof title === "string" && title.trim() !== "" ? `${base} – ${title}` : base;
}

/** What run `index` of a chart is: the run analysed, a run drawn over it, or the insertion-loss reference. */
export function chartRunRole(quantity: RunChartQuantity, index: number): string {
  if (quantity === "insertion-loss") return index === 0 ? "Run" : "Reference";
  if (quantity === "band-levels") return "Run";
  return index === 0 ? "Run" : "Drawn over it";
}

function firstRunOf(block: BlockItem): string | null {
  if (block.kind !== "chart") return null;
  const runIds = (block.content as { runIds?: unknown } | null)?.runIds;
  return Array.isArray(runIds) && typeof runIds[0] === "string" ? runIds[0] : null;
}

/**
 * Where a new chart of `runId` goes: after the run's block and the charts of that run already under it (so
 * charts keep the order they were added in), or at the end (null) when the run has no block.
 */
export function chartBlockAnchor(blocks: readonly BlockItem[], runId: string): string | null {
  const runIndex = blocks.findIndex((block) => block.kind === "run" && (block.content as { runId?: unknown } | null)?.runId === runId);
  if (runIndex < 0) return null;
  let last = runIndex;
  while (last + 1 < blocks.length && firstRunOf(blocks[last + 1]!) === runId) last++;
  return blocks[last]!.id;
}

/** How a chart names a run when it is kept: scene, version, who ran it and when (UTC, to the minute). */
export function chartRunLabel(item: { sceneName: string | null; sceneVersion: number; createdByName: string | null; createdAt: string }): string {
  const when = new Date(item.createdAt);
  const date = Number.isNaN(when.getTime()) ? item.createdAt : `${when.toISOString().slice(0, 16).replace("T", " ")} UTC`;
  return `${item.sceneName ?? "Deleted scene"} v${item.sceneVersion}, run by ${item.createdByName ?? "a former member"}, ${date}`;
}
