"use client";
// A scene as a card: its sketch to scale, what kind of variant it is, and the grid it implies.
import Link from "next/link";
import { useMemo } from "react";
import { formatBytes } from "@/components/scenes/grid-figures";
import { formatWhen } from "@/lib/client/format";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene } from "@/lib/fdtd/scene";
import type { SceneListItem } from "@/lib/http/api-types";
import { SceneSketch } from "./scene-sketch";

const number = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });

export function SceneCard({ item, studyId }: { item: SceneListItem; studyId: string }) {
  const parsed = useMemo(() => parseScene(item.data), [item.data]);
  const grid = useMemo(() => (parsed.ok ? deriveGrid(parsed.scene) : null), [parsed]);

  return (
    <li className="relative flex flex-col overflow-hidden rounded-lg border border-rule bg-panel shadow-[0_1px_0_rgba(22,33,43,0.04)] transition hover:border-tide-300 hover:shadow-md">
      <div className="border-b border-rule bg-paper/60 p-3">
        {parsed.ok ? (
          <SceneSketch scene={parsed.scene} className="h-auto w-full" />
        ) : (
          <p className="flex h-32 items-center justify-center text-sm text-signal-error">This scene no longer validates: {parsed.problems[0]?.message}</p>
        )}
      </div>
      <div className="flex flex-1 flex-col gap-3 p-4">
        <div className="flex items-start justify-between gap-3">
          <h3 className="font-semibold leading-snug text-ink">
            <Link href={`/studies/${studyId}/scenes/${item.id}`} className="hover:text-tide-700 after:absolute after:inset-0">
              {item.name}
            </Link>
          </h3>
          {item.isReference ? (
            <span className="shrink-0 rounded-full bg-night px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide text-white">Reference</span>
          ) : (
            <span className="shrink-0 rounded-full bg-tide-50 px-2 py-0.5 text-[11px] font-medium uppercase tracking-wide text-tide-700 ring-1 ring-tide-100">
              Variant
            </span>
          )}
        </div>
        {item.description ? <p className="text-sm leading-relaxed text-ink-soft">{item.description}</p> : null}
        {grid ? (
          <dl className="mt-auto grid grid-cols-3 gap-x-3 gap-y-2 border-t border-rule pt-3 text-xs">
            <Figure label="Cell size" value={`${number.format(grid.cellSize * 100)} cm`} />
            <Figure label="Resolved to" value={`${number.format(grid.maxResolvedFrequency)} Hz`} />
            <Figure label="Grid" value={`${grid.nx} × ${grid.ny}`} />
            <Figure label="Steps" value={grid.steps.toLocaleString("en-GB")} />
            <Figure label="Courant" value={grid.courantNumber.toFixed(2)} />
            <Figure label="Memory" value={formatBytes(grid.memoryBytes)} />
          </dl>
        ) : null}
        <p className="text-xs text-muted">
          Version {item.version} · {item.updatedByName ? `${item.updatedByName}, ` : ""}
          {formatWhen(item.updatedAt)}
        </p>
      </div>
    </li>
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

