"use client";
// A scene in the shared view: its sketch to scale, whether it is the reference, and the grid it implies.
// Nothing links into the workbench's editor.
import { useMemo } from "react";
import { SceneSketch } from "@/components/studies/scene-sketch";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
import type { SharedScene } from "@/lib/http/share-link-types";

const number = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });

export function SharedSceneCard({ scene }: { scene: SharedScene }) {
  const parsed = useMemo(() => parseScene(scene.data), [scene.data]);
  const grid = useMemo(() => (parsed.ok ? deriveGrid(parsed.scene) : null), [parsed]);
  return (
    <div className="flex flex-col overflow-hidden rounded-lg border border-rule bg-panel sm:flex-row" data-testid="shared-scene">
      <div className="border-b border-rule bg-paper/60 p-3 sm:w-72 sm:shrink-0 sm:border-b-0 sm:border-r">
        {parsed.ok ? <SceneSketch scene={parsed.scene} className="h-auto w-full" /> : <p className="text-sm text-signal-error">This scene cannot be drawn: {parsed.problems[0]?.message}</p>}
      </div>
      <div className="flex flex-1 flex-col gap-2 p-4">
        <div className="flex flex-wrap items-center gap-2">
          <h3 className="font-semibold text-ink">{scene.name}</h3>
          <span className="text-sm text-muted">version {scene.version}</span>
          {scene.isReference ? <span className="rounded-full bg-night px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide text-white">Reference</span> : null}
        </div>
        {scene.description ? <p className="text-sm leading-relaxed text-ink-soft">{scene.description}</p> : null}
        {parsed.ok && grid ? (
          <dl className="mt-auto grid grid-cols-2 gap-x-3 gap-y-1 text-xs sm:grid-cols-4">
            <Figure label="Section" value={`${number.format(parsed.scene.domain.width)} × ${number.format(parsed.scene.domain.height)} m`} />
            <Figure label="Cell size" value={`${number.format(grid.cellSize * 100)} cm`} />
            <Figure label="Resolved to" value={`${number.format(grid.maxResolvedFrequency)} Hz`} />
            <Figure label="Grid" value={`${grid.nx} × ${grid.ny}`} />
          </dl>
        ) : null}
      </div>
    </div>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-muted">{label}</dt>
      <dd className="tabular whitespace-nowrap font-mono text-[13px] text-ink">{value}</dd>
    </div>
  );
}
