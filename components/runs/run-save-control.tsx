"use client";
// Saving a finished browser run: by hand or automatically (a remembered choice), with the upload's
// state, a link to the saved run, and errors that keep the result on screen and offer a retry.
// Afterwards the run gets a block in the study notebook under its scene.
import Link from "next/link";
import { useCallback, useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/client/api";
import { useSaveRun } from "@/lib/client/run-queries";
import type { Scene } from "@/lib/fdtd/scene";
import type { SimulationResult } from "@/lib/fdtd/simulation";
import type { RunRecord } from "@/lib/http/api-types";
import type { RunSettings } from "@/lib/run-record/settings";
import { useAddRunBlock } from "./add-run-block";
import { useAutoSaveRuns } from "./auto-save-preference";

/** What a run was made from, captured when it started: the saved scene version it can be filed under. */
export interface RunSaveSource {
  studyId: string;
  sceneId: string;
  sceneVersion: number;
  /** The scene handed to the run, after parseScene. */
  scene: Scene;
  /** True when the run was given edits that are not saved as a version: such a run cannot be filed. */
  unsavedEdits: boolean;
}

/** Kept when a full-size payload is refused as too large: fewer and coarser snapshots, coarser maps. */
export const compactRunSettings: RunSettings = { snapshotFrameLimit: 40, snapshotFrameValueLimit: 32 * 1024, mapValueLimit: 256 * 1024 };

type SaveState =
  | { kind: "idle" }
  | { kind: "saving"; compact: boolean }
  | { kind: "saved"; run: RunRecord; block: "adding" | "added" | { failed: string } }
  | { kind: "failed"; error: unknown; compact: boolean };

function describeFailure(error: unknown, compact: boolean): { title: string; advice: string } {
  if (error instanceof ApiError && error.status === 413) {
    return {
      title: "The run is too large to save on this server.",
      advice: compact
        ? "Even with fewer snapshots it is over the limit. Use fewer receivers, a shorter duration or a coarser grid, or ask the administrator to raise the upload limit."
        : "Save it with fewer, coarser snapshots (the traces and levels stay exact), or use a coarser grid or a shorter duration.",
    };
  }
  if (error instanceof ApiError && error.status === 0 && error.code === "network") return { title: "The server could not be reached.", advice: "Check the connection and try again; the result stays here until you leave the page." };
  if (error instanceof ApiError && error.status === 403) return { title: "Your role cannot save runs.", advice: "An owner or editor of the team can." };
  if (error instanceof ApiError && error.status === 400) return { title: "The server refused the run.", advice: `${error.message} If the scene was saved again while this ran, run it again to file it under the new version.` };
  return { title: "The run was not saved.", advice: error instanceof Error ? error.message : "Try again." };
}

export function RunSaveControl({ result, threads, source, canSave }: { result: SimulationResult; threads: number | undefined; source: RunSaveSource | null; canSave: boolean }) {
  const save = useSaveRun(source?.studyId ?? "none");
  const addBlock = useAddRunBlock(source?.studyId ?? "none");
  const [autoSave, setAutoSave] = useAutoSaveRuns();
  const [state, setState] = useState<{ result: SimulationResult; save: SaveState }>({ result, save: { kind: "idle" } });
  const attempted = useRef(new WeakSet<SimulationResult>());
  // A new run starts from scratch: the state of the previous one's upload no longer applies.
  const current = state.result === result ? state.save : ({ kind: "idle" } as const);
  const fileable = canSave && source !== null && !source.unsavedEdits;

  const start = useCallback(
    async (compact: boolean) => {
      if (!source || source.unsavedEdits) return;
      attempted.current.add(result);
      setState({ result, save: { kind: "saving", compact } });
      let run: RunRecord;
      try {
        run = await save.mutateAsync({ sceneId: source.sceneId, sceneVersion: source.sceneVersion, scene: source.scene, result, threads, settings: compact ? compactRunSettings : undefined });
      } catch (error) {
        setState({ result, save: { kind: "failed", error, compact } });
        return;
      }
      setState({ result, save: { kind: "saved", run, block: "adding" } });
      try {
        await addBlock.mutateAsync({ sceneId: source.sceneId, runId: run.id });
        setState({ result, save: { kind: "saved", run, block: "added" } });
      } catch (error) {
        setState({ result, save: { kind: "saved", run, block: { failed: error instanceof Error ? error.message : "unknown error" } } });
      }
    },
    [source, result, threads, save, addBlock],
  );

  useEffect(() => {
    if (autoSave && fileable && result.stoppedBy !== "cancelled" && !attempted.current.has(result)) void start(false);
  }, [autoSave, fileable, result, start]);

  const runLink = current.kind === "saved" && source ? `/studies/${source.studyId}/runs/${current.run.id}` : null;
  const failure = current.kind === "failed" ? describeFailure(current.error, current.compact) : null;
  const tooLarge = current.kind === "failed" && current.error instanceof ApiError && current.error.status === 413;

  return (
    <div data-testid="run-save" className="flex flex-col gap-2 rounded-md border border-rule bg-paper/60 px-3 py-2.5 text-sm">
      <div className="flex flex-wrap items-center gap-3">
        {source?.unsavedEdits ? (
          <p className="text-ink-soft">This run used edits that are not saved. Save the scene first, then run it again to keep the run.</p>
        ) : current.kind === "saved" ? (
          <p role="status" className="text-signal-ok">
            Saved as a run of version {current.run.sceneVersion}.{" "}
            {runLink ? (
              <Link href={runLink} className="font-medium text-tide-700 underline underline-offset-2">
                Open the saved run
              </Link>
            ) : null}
          </p>
        ) : current.kind === "saving" ? (
          <p role="status" className="flex items-center gap-2 text-ink-soft">
            <span aria-hidden className="size-3 animate-spin rounded-full border-2 border-tide-300 border-t-tide-600" />
            Packing and uploading the run{current.compact ? " with fewer snapshots" : ""}…
          </p>
        ) : canSave ? (
          <>
            <Button size="sm" onClick={() => void start(false)} disabled={!fileable}>
              {current.kind === "failed" ? "Try saving again" : "Save run"}
            </Button>
            {tooLarge && !current.compact ? (
              <Button size="sm" variant="secondary" onClick={() => void start(true)}>
                Save with fewer snapshots
              </Button>
            ) : null}
            {source ? <span className="text-muted">Filed under version {source.sceneVersion} of the scene.</span> : <span className="text-muted">The scene this run came from is not known; reload the page.</span>}
          </>
        ) : (
          <p className="text-muted">Your role can look at this run but not save it.</p>
        )}
        {canSave ? (
          <label className="ml-auto flex items-center gap-2 text-xs text-ink-soft">
            <input type="checkbox" checked={autoSave} onChange={(event) => setAutoSave(event.target.checked)} className="accent-tide-600" />
            Save finished runs automatically
          </label>
        ) : null}
      </div>
      {failure ? (
        <div role="alert" className="rounded-md border border-signal-error/30 bg-signal-error-50 px-3 py-2">
          <p className="font-medium text-signal-error">{failure.title}</p>
          <p className="text-ink-soft">{failure.advice} The result stays on screen.</p>
        </div>
      ) : null}
      {current.kind === "saved" && typeof current.block === "object" ? (
        <p role="alert" className="text-signal-warn">
          The run is saved, but its notebook block was not added ({current.block.failed}).{" "}
          <button
            type="button"
            className="font-medium underline underline-offset-2"
            onClick={() => {
              const run = current.run;
              if (!source) return;
              setState({ result, save: { kind: "saved", run, block: "adding" } });
              addBlock.mutate(
                { sceneId: source.sceneId, runId: run.id },
                {
                  onSuccess: () => setState({ result, save: { kind: "saved", run, block: "added" } }),
                  onError: (error) => setState({ result, save: { kind: "saved", run, block: { failed: error.message } } }),
                },
              );
            }}
          >
            Add it again
          </button>
        </p>
      ) : null}
    </div>
  );
}
