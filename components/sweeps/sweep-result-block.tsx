"use client";
// The notebook's view of a saved sweep: a chart block whose quantity is "sweep". Everyone who can read
// the study sees it; the link opens the sweeps page with the same definition, to run it again.
import Link from "next/link";
import type { BlockItem } from "@/lib/http/api-types";
import { chartContentSchema } from "@/lib/validation/blocks";
import { SweepResultView } from "./sweep-result-view";

/** True for a block this component shows, so the notebook can pick it. */
export function isSweepBlock(block: Pick<BlockItem, "kind" | "content">): boolean {
  return block.kind === "chart" && (block.content as { quantity?: unknown } | null)?.quantity === "sweep";
}

export function SweepResultBlock({ block, studyId }: { block: BlockItem; studyId: string }) {
  const parsed = chartContentSchema.safeParse(block.content);
  if (!parsed.success || !parsed.data.sweep) {
    const problem = parsed.success ? "it holds no sweep" : parsed.error.issues[0]?.message;
    return <p className="text-sm text-signal-error">This sweep block cannot be shown: {problem ?? "its content is not valid"}.</p>;
  }
  const { definition, results } = parsed.data.sweep;
  return (
    <div className="flex flex-col gap-3">
      <SweepResultView definition={definition} results={results} />
      <p className="text-[13px] text-muted">
        Computed {new Date(results.completedAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}
        {block.updatedByName ? ` by ${block.updatedByName}` : ""}.{" "}
        <Link href={`/studies/${studyId}/sweeps?block=${block.id}`} className="font-medium text-tide-600 hover:underline">
          Open this sweep&apos;s definition
        </Link>
      </p>
    </div>
  );
}
