"use client";
// "Make a reference and run it": the frozen scene without the chosen elements (or as free field), saved as a
// new scene of the study, run in a browser worker with progress and cancel, and saved as a run that then
// serves as the insertion-loss reference. A scene already saved is reused when the run is tried again.
import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useMemo, useRef, useState } from "react";

import { runSceneInWorker } from "@/components/run/run-in-worker";
import { Button } from "@/components/ui/button";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import type { RunRecord, SceneRecord } from "@/lib/http/api-types";
import { fetchJson } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/queries";
import { runQueryKeys } from "@/lib/client/run-queries";
import { saveRunRecord } from "@/lib/client/run-records";
import type { RunSettings } from "@/lib/run-record/settings";
import { defaultRemovedIds, freeFieldScene, removableElements, sceneWithout } from "@/lib/scene-variants/reference-scene";

export interface ReferenceMakerProps {
  studyId: string;
  /** The frozen scene of the run being analysed. */
  scene: Scene;
  /** The run's settings, so the reference keeps its maps on the same grid. */
  settings: RunSettings;
  onReady: (run: RunRecord) => void;
}

type Phase =
  | { kind: "idle" }
  | { kind: "saving-scene" }
  | { kind: "running"; fraction: number; simulatedSeconds: number }
  | { kind: "saving-run" }
  | { kind: "failed"; message: string }
  | { kind: "cancelled" }
  | { kind: "done"; run: RunRecord };

const KIND_NAMES = { wall: "wall", solid: "solid", surface: "surface treatment" } as const;

export function ReferenceMaker({ studyId, scene, settings, onReady }: ReferenceMakerProps) {
  const client = useQueryClient();
  const elements = useMemo(() => removableElements(scene), [scene]);
  const [mode, setMode] = useState<"without" | "free-field">(elements.length > 0 ? "without" : "free-field");
  const [removed, setRemoved] = useState<string[]>(() => defaultRemovedIds(scene));
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [savedScene, setSavedScene] = useState<{ record: SceneRecord; key: string } | null>(null);
  const abort = useRef<AbortController | null>(null);
  useEffect(() => () => abort.current?.abort(), []);

  const built = useMemo(() => (mode === "free-field" ? freeFieldScene(scene) : sceneWithout(scene, removed)), [mode, removed, scene]);
  const builtKey = JSON.stringify({ mode, removed: [...removed].sort() });
  const [name, setName] = useState("");
  const shownName = name || (built.ok ? built.scene.name : "");
  const busy = phase.kind === "saving-scene" || phase.kind === "running" || phase.kind === "saving-run";

  const start = async () => {
    if (!built.ok) return;
    const controller = new AbortController();
    abort.current = controller;
    try {
      let record = savedScene && savedScene.key === builtKey ? savedScene.record : null;
      if (!record) {
        setPhase({ kind: "saving-scene" });
        const response = await fetchJson<{ scene: SceneRecord }>(`/api/studies/${studyId}/scenes`, {
          method: "POST",
          json: { name: shownName.trim().slice(0, 120) || "Reference", description: "Reference for insertion loss, made from a saved run.", isReference: true, data: built.scene },
        });
        record = response.scene;
        setSavedScene({ record, key: builtKey });
        void client.invalidateQueries({ queryKey: queryKeys.study(studyId) });
      }
      const parsed = parseScene(record.data);
      if (!parsed.ok) throw new Error(`the saved reference scene is not valid: ${parsed.problems[0]?.message ?? "unknown problem"}`);
      setPhase({ kind: "running", fraction: 0, simulatedSeconds: 0 });
      const { result, threads } = await runSceneInWorker(parsed.scene, {
        signal: controller.signal,
        onProgress: (progress) => setPhase({ kind: "running", fraction: progress.fraction, simulatedSeconds: progress.simulatedSeconds }),
      });
      setPhase({ kind: "saving-run" });
      const run = await saveRunRecord({ sceneId: record.id, sceneVersion: record.version, scene: parsed.scene, result, threads, settings });
      await client.invalidateQueries({ queryKey: runQueryKeys.studyRuns(studyId) });
      setPhase({ kind: "done", run });
      onReady(run);
    } catch (error) {
      if (error instanceof DOMException && error.name === "AbortError") setPhase({ kind: "cancelled" });
      else setPhase({ kind: "failed", message: error instanceof Error ? error.message : String(error) });
    } finally {
      abort.current = null;
    }
  };

  return (
    <div className="flex flex-col gap-2 rounded-md border border-rule px-3 py-2 text-[13px]" data-testid="reference-maker">
      <p className="font-medium text-ink">Make a reference and run it</p>
      <div className="flex flex-wrap gap-4">
        <label className="flex items-center gap-2">
          <input type="radio" name="reference-kind" checked={mode === "without"} disabled={busy || elements.length === 0} onChange={() => setMode("without")} />
          Without chosen elements
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" name="reference-kind" checked={mode === "free-field"} disabled={busy} onChange={() => setMode("free-field")} />
          Free field (no geometry, absorbing on every side)
        </label>
      </div>
      {mode === "without" ? (
        <fieldset className="flex flex-col gap-1" disabled={busy}>
          <legend className="sr-only">Elements to leave out</legend>
          {elements.map((element) => (
            <label key={element.id} className="flex items-center gap-2">
              <input
                type="checkbox"
                checked={removed.includes(element.id)}
                onChange={(event) => setRemoved(event.target.checked ? [...removed, element.id] : removed.filter((id) => id !== element.id))}
              />
              {element.label} <span className="text-muted">({KIND_NAMES[element.kind]})</span>
            </label>
          ))}
        </fieldset>
      ) : null}
      {!built.ok ? (
        <p role="alert" className="text-signal-error">
          {built.message}
        </p>
      ) : (
        <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
          Name of the new scene
          <input value={shownName} disabled={busy} maxLength={120} onChange={(event) => setName(event.target.value)} className="h-8 max-w-lg rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink" />
        </label>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button size="sm" disabled={busy || !built.ok} onClick={() => void start()}>
          {savedScene && savedScene.key === builtKey ? "Run the saved reference scene" : "Make the reference and run it"}
        </Button>
        {busy ? (
          <Button size="sm" variant="secondary" onClick={() => abort.current?.abort()}>
            Cancel
          </Button>
        ) : null}
        <PhaseText phase={phase} />
      </div>
      {phase.kind === "running" ? (
        <progress className="h-1.5 w-full max-w-lg accent-tide-600" max={1} value={phase.fraction} aria-label="Reference run progress" />
      ) : null}
    </div>
  );
}

function PhaseText({ phase }: { phase: Phase }) {
  switch (phase.kind) {
    case "idle":
      return <span className="text-muted">The scene is saved in this study, run in this browser, and the run saved.</span>;
    case "saving-scene":
      return <span role="status">Saving the reference scene…</span>;
    case "running":
      return (
        <span role="status" className="tabular-nums">
          Running: {(phase.fraction * 100).toFixed(0)} % ({(phase.simulatedSeconds * 1000).toFixed(1)} ms simulated)
        </span>
      );
    case "saving-run":
      return <span role="status">Saving the reference run…</span>;
    case "cancelled":
      return <span role="status">Cancelled. The reference scene stays saved; run it again when you like.</span>;
    case "failed":
      return (
        <span role="alert" className="text-signal-error">
          {phase.message}
        </span>
      );
    case "done":
      return <span role="status" className="text-signal-ok">Saved and chosen as the reference.</span>;
  }
}
