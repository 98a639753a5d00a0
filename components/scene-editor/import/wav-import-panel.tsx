"use client";
// Choices for a recording: which source plays it, with what the file holds (length, rate, level).
import { useMemo, useState } from "react";

import type { Scene } from "@/lib/fdtd/scene";
import type { WavRecording } from "@/lib/scene-import/wav";

import { formatNumber, Readout, SelectField, type Choice } from "../inspector-fields";
import { displayName } from "../model/entities";
import { planImport, type PlannedImport } from "./import-edits";
import { ImportFooter, type Refusal } from "./import-footer";

/** Level of a full-scale peak in dB relative to digital full scale. */
function peakDbfs(peakFullScale: number): string {
  return `${(20 * Math.log10(peakFullScale)).toFixed(1)} dBFS`;
}

export function WavImportPanel({
  scene,
  recording,
  preferredSourceId,
  refusal,
  onApply,
  onCancel,
}: {
  scene: Scene;
  recording: WavRecording;
  /** The selected source, if any: the likeliest one to take the recording. */
  preferredSourceId: string | null;
  refusal: Refusal | null;
  onApply: (plan: PlannedImport) => void;
  onCancel: () => void;
}) {
  const [sourceId, setSourceId] = useState(() => (scene.sources.some((source) => source.id === preferredSourceId) ? preferredSourceId! : (scene.sources[0]?.id ?? "")));
  const plan = useMemo(() => planImport(scene, { kind: "wav", recording, sourceId }), [scene, recording, sourceId]);
  const sourceChoices: Choice<string>[] = scene.sources.map((source) => ({ value: source.id, label: displayName(source) }));
  const { sampleRate, samples } = recording.signal;

  return (
    <div className="flex flex-col gap-4" data-testid="import-wav">
      <div className="flex flex-col gap-1 rounded-md bg-paper px-3 py-2.5">
        <Readout label="Duration" value={`${formatNumber(Number(recording.durationSeconds.toPrecision(4)))} s`} />
        <Readout label="Sample rate" value={`${formatNumber(sampleRate)} Hz`} />
        <Readout label="Samples" value={samples.length.toLocaleString("en-GB")} />
        <Readout label="Peak" value={peakDbfs(recording.peakFullScale)} />
        <Readout label="Format" value={recording.channels === 1 ? `${recording.encoding}, mono` : `${recording.encoding}, ${recording.channels} channels (the first is used)`} />
      </div>
      <SelectField label="Replaces the signal of" value={sourceId} choices={sourceChoices} testId="import-source" onChange={setSourceId} />
      <p className="text-[11.5px] leading-snug text-muted">
        The recording is scaled to a peak of 1, so the source&apos;s amplitude sets its peak volume rate. The solver resamples it to its own time step.
      </p>
      <ImportFooter plan={plan} refusal={refusal} onApply={onApply} onCancel={onCancel} />
    </div>
  );
}
