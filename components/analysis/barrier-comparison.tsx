"use client";
// The textbook estimates set beside the simulated insertion loss: per receiver and octave band the path
// difference over the barrier's top, the Fresnel number, Maekawa's chart value and ISO 9613-2's D_z,
// from the frozen scene's geometry; the user picks which wall or solid is the barrier, and which source.
import { useMemo, useState } from "react";

import { POINT_SOURCE_CAVEAT } from "@/lib/analysis/barrier-estimates";
import { barrierCandidates, barrierEstimatesPerReceiver, likelyBarrier } from "@/lib/analysis/barrier-geometry";
import type { InsertionLossTable } from "@/lib/analysis/insertion-loss";
import type { Scene } from "@/lib/fdtd/scene";
import type { DecodedRun } from "@/lib/run-record/payload";

import { Note } from "./analysis-controls";
import { formatHz } from "./band-bar-chart";

export interface BarrierComparisonProps {
  scene: Scene;
  run: DecodedRun;
  receiverIds: readonly string[];
  /** Simulated octave-band insertion loss of the same receivers, when a reference is chosen. */
  octaveInsertionLoss?: InsertionLossTable;
}

const cell = "px-2 py-0.5 text-right tabular-nums";

export function BarrierComparison({ scene, run, receiverIds, octaveInsertionLoss }: BarrierComparisonProps) {
  const candidates = useMemo(() => barrierCandidates(scene), [scene]);
  const sources = run.header.sources;
  const [sourceId, setSourceId] = useState(sources[0]?.id ?? "");
  const source = sources.find((s) => s.id === sourceId) ?? sources[0];
  const receivers = useMemo(() => run.header.receivers.filter((r) => receiverIds.includes(r.id)).map((r) => ({ id: r.id, label: r.label || r.id, x: r.x, y: r.y })), [run, receiverIds]);
  const [barrierId, setBarrierId] = useState<string | null>(null);
  const barrier = candidates.find((c) => c.id === barrierId) ?? likelyBarrier(candidates, source, receivers);
  const estimates = useMemo(() => (barrier && source ? barrierEstimatesPerReceiver(barrier, source, receivers) : []), [barrier, source, receivers]);

  if (candidates.length === 0) return <Note>The scene has no wall or solid, so there is no barrier to estimate.</Note>;
  if (!source) return <Note>The run has no source, so no path over the barrier can be drawn.</Note>;

  return (
    <div className="flex flex-col gap-2" data-testid="barrier-comparison">
      <div className="flex flex-wrap items-center gap-3 text-[13px] text-ink-soft">
        <label className="flex items-center gap-2">
          Barrier
          <select value={barrier?.id ?? ""} onChange={(event) => setBarrierId(event.target.value)} className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink">
            {candidates.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label} ({c.kind}, top {c.edges.map((e) => `${e.x.toFixed(2)}, ${e.y.toFixed(2)} m`).join(" and ")})
              </option>
            ))}
          </select>
        </label>
        {sources.length > 1 ? (
          <label className="flex items-center gap-2">
            Source
            <select value={source.id} onChange={(event) => setSourceId(event.target.value)} className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink">
              {sources.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.label || s.id}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>
      {receivers.length === 0 ? <Note>Choose at least one receiver above.</Note> : null}
      <div className="grid gap-3 lg:grid-cols-2">
        {estimates.map((entry) => {
          const simulated = octaveInsertionLoss?.receivers.find((r) => r.receiverId === entry.receiver.id);
          return (
            <div key={entry.receiver.id} className="rounded-md border border-rule px-2 py-1.5">
              <p className="text-[13px] font-medium text-ink">{entry.receiver.label}</p>
              {!entry.ok ? (
                <Note>{entry.reason}.</Note>
              ) : (
                <>
                  <p className="text-[12px] text-ink-soft">
                    {entry.estimates.path.zone === "shadow" ? "In the shadow" : "In sight of the source (bright zone)"}; path difference {entry.estimates.path.signedPathDifference >= 0 ? "" : "−"}
                    {entry.estimates.path.pathDifference.toFixed(3)} m over {entry.estimates.path.edges.length === 2 ? "two edges" : "the top edge"}; K_met {entry.estimates.kMet.toFixed(3)}.
                  </p>
                  <table className="mt-1 w-full border-collapse font-mono text-[12px]">
                    <thead>
                      <tr className="border-b border-rule-strong text-ink-soft">
                        <th className="px-2 py-0.5 text-left font-sans font-medium">Octave</th>
                        <th className={`${cell} font-medium`} title="N = 2 δ / λ, signed (negative in the bright zone)">
                          Fresnel N
                        </th>
                        <th className={`${cell} font-medium`}>Maekawa (dB)</th>
                        <th className={`${cell} font-medium`} title="ISO 9613-2 barrier attenuation, C2 = 20, capped at 20 dB (25 dB for two edges)">
                          ISO D_z (dB)
                        </th>
                        <th className={`${cell} font-medium`}>Simulated IL (dB)</th>
                      </tr>
                    </thead>
                    <tbody>
                      {entry.estimates.bands.map((band) => {
                        const index = octaveInsertionLoss?.bands.findIndex((b) => b.index === band.band.index) ?? -1;
                        const il = simulated && index >= 0 ? simulated.insertionLoss[index] : undefined;
                        return (
                          <tr key={band.band.index} className="border-b border-rule">
                            <td className="px-2 py-0.5 font-sans">{formatHz(band.band.nominal)}</td>
                            <td className={cell}>{band.fresnelNumber.toFixed(2)}</td>
                            <td className={cell}>{band.maekawa.toFixed(1)}</td>
                            <td className={cell}>
                              {band.iso.value.toFixed(1)}
                              {band.iso.capped ? "*" : ""}
                            </td>
                            <td className={cell} title={il === undefined ? (octaveInsertionLoss ? "band not resolved by the grid" : "choose a reference run") : undefined}>
                              {il !== undefined && Number.isFinite(il) ? il.toFixed(1) : "–"}
                            </td>
                          </tr>
                        );
                      })}
                    </tbody>
                  </table>
                </>
              )}
            </div>
          );
        })}
      </div>
      <Note>
        Wavelengths at the nominal octave centres with c = 340 m/s; * marks D_z held at the standard&apos;s cap. {POINT_SOURCE_CAVEAT}
      </Note>
    </div>
  );
}
