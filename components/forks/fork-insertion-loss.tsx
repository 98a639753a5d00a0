"use client";
// Insertion loss of the fork relative to its origin, from the latest completed saved run of each:
// octave-band levels per receiver (lib/analysis, as the run analysis computes them), receivers
// paired by id, name or place, and the origin's level minus the fork's in the bands both resolve.
import Link from "next/link";
import { useMemo } from "react";
import { AnalysisPanel, Note } from "@/components/analysis/analysis-controls";
import { receiverColour } from "@/components/analysis/analysis-traces";
import { BandTableHead, ReceiverBandRow } from "@/components/analysis/band-table";
import { sceneFacts } from "@/components/analysis/run-analysis";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { bandLevelTable } from "@/lib/analysis/band-levels";
import { forkInsertionLoss, pairReceivers, type ForkInsertionLoss } from "@/lib/collaboration/scene-comparison";
import { useSavedRunPayload } from "@/lib/client/run-queries";
import type { LineageRun } from "@/lib/http/fork-types";
import { UnresolvedBandsNote, unresolvedBandsOf } from "@/components/analysis/unresolved-bands-note";
import type { ExcludedBand } from "@/lib/analysis/band-levels";
import type { DecodedRun } from "@/lib/run-record/payload";

export interface ComparedRun {
  sceneName: string;
  studyId: string;
  run: LineageRun | null;
}

/** The table, or why there is none. */
function compute(origin: DecodedRun, fork: DecodedRun): (ForkInsertionLoss & { unresolved: ExcludedBand[] }) | string {
  try {
    const octaves = (run: DecodedRun) => bandLevelTable(run.receivers, { bandsPerOctave: 1, weighting: "Z", highestResolvedFrequency: sceneFacts(run).highestResolvedFrequency });
    // "The same place" is the same cell of the coarser grid.
    const pairs = pairReceivers(origin.receivers, fork.receivers, Math.max(origin.header.grid.cellSize, fork.header.grid.cellSize));
    if (pairs.length === 0) return "No receiver of the fork's run matches one of the origin's run by id, name or place.";
    const result = forkInsertionLoss(octaves(origin), octaves(fork), pairs);
    if (result.bands.length === 0) return "The two runs resolve no octave band in common.";
    // A band either run leaves out is missing from the comparison: list it once, with that run's reason.
    const unresolved = new Map<number, ExcludedBand>();
    for (const run of [origin, fork]) for (const entry of unresolvedBandsOf(run, 1, sceneFacts(run).highestResolvedFrequency)) if (!unresolved.has(entry.band.index)) unresolved.set(entry.band.index, entry);
    return { ...result, unresolved: [...unresolved.values()].sort((a, b) => a.band.index - b.band.index) };
  } catch (error) {
    return error instanceof Error ? error.message : String(error);
  }
}

function RunLine({ side, role }: { side: ComparedRun; role: string }) {
  if (!side.run) return <li>{role} “{side.sceneName}”: no completed saved run yet.</li>;
  return (
    <li>
      {role} “{side.sceneName}”:{" "}
      <Link href={`/studies/${side.studyId}/runs/${side.run.id}`} className="text-tide-700 hover:underline">
        run of version {side.run.sceneVersion}
      </Link>
    </li>
  );
}

export function ForkInsertionLossPanel({ origin, fork, originRole, forkRole }: { origin: ComparedRun; fork: ComparedRun; originRole: string; forkRole: string }) {
  const originPayload = useSavedRunPayload(origin.run?.id ?? null);
  const forkPayload = useSavedRunPayload(fork.run?.id ?? null);
  const result = useMemo(() => (originPayload.data && forkPayload.data ? compute(originPayload.data, forkPayload.data) : null), [originPayload.data, forkPayload.data]);
  const failed = originPayload.error ?? forkPayload.error;

  return (
    <AnalysisPanel
      title={`Insertion loss of the ${forkRole} relative to the ${originRole}`}
      testId="fork-insertion-loss"
      description={`The ${originRole}'s octave-band level minus the ${forkRole}'s, per receiver, unweighted: positive means the ${forkRole} is quieter there.`}
    >
      <ul className="text-[13px] text-ink-soft">
        <RunLine side={origin} role={`${originRole[0]!.toUpperCase()}${originRole.slice(1)}`} />
        <RunLine side={fork} role={`${forkRole[0]!.toUpperCase()}${forkRole.slice(1)}`} />
      </ul>
      {!origin.run || !fork.run ? (
        <Note>Save a completed run of both scenes to compare their levels.</Note>
      ) : failed ? (
        <ErrorState title="A run could not be loaded" message={failed.message} onRetry={() => void (originPayload.error ? originPayload.refetch() : forkPayload.refetch())} />
      ) : result === null ? (
        <LoadingRows rows={1} label="Loading both runs" />
      ) : typeof result === "string" ? (
        <Note>{result}</Note>
      ) : (
        <>
          <div className="overflow-x-auto">
            <table className="w-full border-collapse font-mono text-[12.5px]" data-testid="fork-insertion-loss-table">
              <BandTableHead bands={result.bands} />
              <tbody>
                {result.receivers.map((row, index) => (
                  <ReceiverBandRow
                    key={`${row.pair.originId}:${row.pair.forkId}`}
                    label={row.pair.matchedBy === "id" ? row.pair.label : `${row.pair.label} (paired by ${row.pair.matchedBy})`}
                    colour={receiverColour(index)}
                    overall={row.overall}
                    values={row.insertionLoss}
                  />
                ))}
              </tbody>
            </table>
          </div>
          <UnresolvedBandsNote excluded={result.unresolved} />
          <Note>
            dB, octave bands both runs resolve. Levels are compared as band exposure (energy over each whole run){result.durationsDiffer ? "; the runs last differently long, which this allows for as long as the sound has died away in both" : ""}. Receivers without a partner in the other run are left out.
          </Note>
        </>
      )}
    </AnalysisPanel>
  );
}
