"use client";
// One receiver's pressure as sound: a hearing-level caution first, then in-page playback (Web Audio) and a
// WAV download. The sound is resampled to 48 kHz and scaled to a -1 dBFS peak; its level says nothing
// about how loud the real event would be.
import { useEffect, useMemo, useRef, useState } from "react";

import { Button } from "@/components/ui/button";
import { downloadBlob } from "@/components/field-view/field-view-toolbar";
import { AUDIO_PEAK_DBFS, AUDIO_SAMPLE_RATE, encodeWav, soundFromPressure, wavFileName, type ScaledSound } from "@/lib/analysis/audio-export";
import type { DecodedRun } from "@/lib/run-record/payload";

import { AnalysisPanel, Note } from "./analysis-controls";

export interface ReceiverSoundProps {
  run: DecodedRun;
  runId: string;
  /** Receivers offered first (the ones chosen for the charts); all others follow. */
  receiverIds: readonly string[];
}

export function ReceiverSound({ run, runId, receiverIds }: ReceiverSoundProps) {
  const [receiverId, setReceiverId] = useState<string>(receiverIds[0] ?? run.receivers[0]?.id ?? "");
  const [acknowledged, setAcknowledged] = useState(false);
  const [playing, setPlaying] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const audio = useRef<{ context: AudioContext; source: AudioBufferSourceNode } | null>(null);

  const receiver = run.receivers.find((r) => r.id === receiverId);
  const sound = useMemo((): ScaledSound | string => {
    if (!receiver) return "Choose a receiver.";
    try {
      return soundFromPressure(receiver.pressure, receiver.timeStep);
    } catch (error) {
      return error instanceof Error ? error.message : String(error);
    }
  }, [receiver]);

  const stop = () => {
    const current = audio.current;
    audio.current = null;
    if (current) {
      try {
        current.source.stop();
      } catch {
        // Already ended.
      }
      void current.context.close();
    }
    setPlaying(false);
  };
  useEffect(() => stop, []);

  const play = async () => {
    if (typeof sound === "string") return;
    stop();
    setProblem(null);
    try {
      const context = new AudioContext();
      const buffer = context.createBuffer(1, sound.samples.length, sound.sampleRate);
      buffer.copyToChannel(new Float32Array(sound.samples), 0);
      const source = context.createBufferSource();
      source.buffer = buffer;
      source.connect(context.destination);
      source.onended = () => {
        if (audio.current?.source === source) stop();
      };
      audio.current = { context, source };
      await context.resume();
      source.start();
      setPlaying(true);
    } catch (error) {
      setProblem(`The browser could not play the sound: ${error instanceof Error ? error.message : String(error)}`);
      stop();
    }
  };

  const ordered = [...run.receivers].sort((a, b) => Number(!receiverIds.includes(a.id)) - Number(!receiverIds.includes(b.id)));
  const seconds = typeof sound === "string" ? 0 : sound.samples.length / sound.sampleRate;

  return (
    <AnalysisPanel
      title="Listen to a receiver"
      testId="receiver-sound"
      description={`Mono, resampled from the run's ${(1 / (run.receivers[0]?.timeStep ?? 1) / 1000).toPrecision(4)} kHz to ${AUDIO_SAMPLE_RATE / 1000} kHz, 32-bit float WAV, scaled so the peak is at ${AUDIO_PEAK_DBFS} dBFS.`}
    >
      <label className="flex flex-wrap items-center gap-2 text-[13px] text-ink-soft">
        Receiver
        <select
          value={receiverId}
          onChange={(event) => {
            stop();
            setReceiverId(event.target.value);
          }}
          className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink"
        >
          {ordered.map((r) => (
            <option key={r.id} value={r.id}>
              {r.label || r.id}
            </option>
          ))}
        </select>
      </label>
      <div role="note" aria-label="Hearing caution" className="rounded-md border border-signal-warn/50 bg-ember-50 px-3 py-2 text-[13px] text-ink-soft">
        <p>
          <strong className="font-semibold text-ink">Protect your hearing.</strong> Turn the volume down before playing, and especially before using headphones. The sound is scaled to
          near full scale whatever the simulated level: it is not calibrated to the real event, and how loud it sounds depends only on your equipment.
        </p>
        <label className="mt-2 flex items-center gap-2 font-medium text-ink">
          <input type="checkbox" checked={acknowledged} onChange={(event) => setAcknowledged(event.target.checked)} data-testid="hearing-acknowledge" />I have turned the volume down
          and understand the level is not calibrated.
        </label>
      </div>
      {typeof sound === "string" ? (
        <p role="alert" className="text-sm text-signal-error">
          {sound}
        </p>
      ) : (
        <div className="flex flex-wrap items-center gap-2">
          {playing ? (
            <Button variant="secondary" size="sm" onClick={stop}>
              Stop
            </Button>
          ) : (
            <Button variant="secondary" size="sm" disabled={!acknowledged} onClick={() => void play()}>
              Play ({seconds.toFixed(2)} s)
            </Button>
          )}
          <Button
            variant="secondary"
            size="sm"
            disabled={!acknowledged}
            onClick={() => {
              const bytes = encodeWav(sound);
              downloadBlob(new Blob([new Uint8Array(bytes)], { type: "audio/wav" }), wavFileName(`run-${runId.slice(0, 8)}-${receiver?.label || receiverId}`, sound));
            }}
          >
            Download WAV
          </Button>
          <Note>Full scale (1.0) stands for {Number(sound.pascalsPerFullScale.toPrecision(3))} Pa; the file name says so too.</Note>
        </div>
      )}
      {problem ? (
        <p role="alert" className="text-sm text-signal-error">
          {problem}
        </p>
      ) : null}
    </AnalysisPanel>
  );
}
