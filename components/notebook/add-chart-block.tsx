"use client";
// "Add to notebook" in a saved run's analysis panels: keeps the panel's current choices (receivers, runs
// drawn over it, bands, weighting, reference) as a chart block of the study, under the run's block when it
// has one. Shown to those who may edit the study; the server checks again.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";

import { Button } from "@/components/ui/button";
import { roleAllows } from "@/lib/access/roles";
import { fetchJson } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/queries";
import { useRun, useStudyRuns } from "@/lib/client/run-queries";
import type { BlockItem, BlocksResponse } from "@/lib/http/api-types";
import { chartContentSchema, type ChartContent } from "@/lib/validation/blocks";

import { chartBlockAnchor, chartRunLabel, type RunChartQuantity } from "./chart-block-model";

/** What a panel shows now. runIds[0] is the run analysed; then overlaid runs, or the reference for insertion loss. */
export interface ChartChoices {
  quantity: RunChartQuantity;
  runIds: readonly string[];
  receiverIds: readonly string[];
  bandsPerOctave?: 1 | 3;
  weighting?: "Z" | "A";
}

/** Posts the chart after the run's block (and the charts already under it), or at the end of the notebook. */
export async function addChartBlock({ studyId, content }: { studyId: string; content: ChartContent }): Promise<BlockItem> {
  const { blocks } = await fetchJson<BlocksResponse>(`/api/studies/${studyId}/blocks`);
  const afterBlockId = chartBlockAnchor(blocks, content.runIds[0]!);
  const { block } = await fetchJson<{ block: BlockItem }>(`/api/studies/${studyId}/blocks`, { method: "POST", json: { kind: "chart", content, afterBlockId } });
  return block;
}

export interface AddChartButtonProps {
  studyId: string;
  /** The saved run whose page this is: its record (cached by the page) says the caller's role. */
  runId: string;
  choices: ChartChoices;
  /** Why the panel has nothing to keep yet (no receiver, no reference); the button is disabled with it. */
  unavailableReason?: string;
}

export function AddChartButton({ studyId, runId, choices, unavailableReason }: AddChartButtonProps) {
  const client = useQueryClient();
  const record = useRun(runId);
  const runs = useStudyRuns(studyId);
  const add = useMutation({
    mutationFn: (content: ChartContent) => addChartBlock({ studyId, content }),
    onSuccess: () => Promise.all([client.invalidateQueries({ queryKey: queryKeys.blocks(studyId) }), client.invalidateQueries({ queryKey: queryKeys.study(studyId), exact: true })]),
  });

  const role = record.data?.role;
  if (!role || !roleAllows(role, "study:edit")) return null;

  // Kept with the chart so that it can still say which run it was after one is deleted.
  const listed = new Map((runs.data?.runs ?? []).map((item) => [item.id, item]));
  const labels = choices.runIds.map((id) => listed.get(id));
  const content = {
    runIds: [...choices.runIds],
    quantity: choices.quantity,
    receiverIds: [...choices.receiverIds],
    ...(choices.bandsPerOctave ? { bandsPerOctave: choices.bandsPerOctave } : {}),
    ...(choices.weighting ? { weighting: choices.weighting } : {}),
    ...(labels.every((item) => item !== undefined) ? { runLabels: labels.map(chartRunLabel) } : {}),
  };
  const checked = unavailableReason ? null : chartContentSchema.safeParse(content);
  const reason = unavailableReason ?? (checked && !checked.success ? (checked.error.issues[0]?.message ?? "These choices cannot be kept as a chart.") : undefined);
  // "Added" belongs to the choices that were added: changing them offers the button again.
  const key = JSON.stringify([content.runIds, content.receiverIds, content.bandsPerOctave, content.weighting]);
  const variables = add.variables;
  const addedNow = add.isSuccess && variables !== undefined && JSON.stringify([variables.runIds, variables.receiverIds, variables.bandsPerOctave, variables.weighting]) === key;

  return (
    <span className="inline-flex items-center gap-2" data-testid="add-chart-block">
      {addedNow ? (
        <span role="status" className="text-[13px] text-signal-ok">
          Added to the notebook ·{" "}
          <Link href={`/studies/${studyId}#block-${add.data.id}`} className="font-medium text-tide-700 hover:underline">
            Open the study
          </Link>
        </span>
      ) : (
        <Button
          variant="secondary"
          size="sm"
          disabled={reason !== undefined || add.isPending}
          title={reason ?? "Keep this chart, with the choices made here, in the study's notebook"}
          onClick={() => {
            if (checked?.success) add.mutate(checked.data);
          }}
        >
          {add.isPending ? "Adding…" : "Add to notebook"}
        </Button>
      )}
      {add.isError ? (
        <span role="alert" className="text-xs text-signal-error">
          Not added: {add.error.message}
        </span>
      ) : null}
    </span>
  );
}
