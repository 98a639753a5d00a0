// What a saved run was asked to compute: the scene exactly as it was run (frozen with the run) and
// how its result was kept. Read from the stored payload, so later edits of the scene do not show here.
import { FigureList } from "@/components/ui/figure-list";
import type { Scene } from "@/lib/fdtd/scene";
import type { RunPayloadHeader } from "@/lib/run-record/payload";

const figure = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 4 });

function describeMedium(medium: Scene["medium"]): string {
  return medium.kind === "air" ? `Air at ${figure.format(medium.temperature)} °C` : `Fluid, c = ${figure.format(medium.soundSpeed)} m/s, ρ = ${figure.format(medium.density)} kg/m³`;
}

function describeBoundary(boundary: Scene["boundary"]): string {
  const sides = (["left", "right", "bottom", "top"] as const).map((side) => `${side} ${boundary[side].kind}`);
  return sides.join(", ");
}

function describeDuration(duration: Scene["duration"]): string {
  return duration.kind === "time" ? `${figure.format(duration.seconds * 1000)} ms` : `until ${figure.format(duration.decayDb)} dB of decay, at most ${figure.format(duration.maxSeconds * 1000)} ms`;
}

export function FrozenSceneSettings({ scene, header }: { scene: Scene; header: RunPayloadHeader }) {
  const receiverPoints = scene.receivers.length + scene.receiverLines.reduce((sum, line) => sum + line.count, 0);
  const rows: [string, string][] = [
    ["Domain", `${figure.format(scene.domain.width)} m × ${figure.format(scene.domain.height)} m`],
    ["Medium", describeMedium(scene.medium) + (scene.mediumRegions.length > 0 ? `, ${scene.mediumRegions.length} other regions` : "")],
    ["Cell size", `${figure.format(header.grid.cellSize * 1000)} mm`],
    ["Boundaries", describeBoundary(scene.boundary)],
    ["Geometry", `${scene.geometry.solids.length} solids, ${scene.geometry.walls.length} walls, ${scene.geometry.surfaces.length} surfaces`],
    ["Sources", scene.sources.map((source) => source.label || source.id).join(", ")],
    ["Receivers", `${receiverPoints} (${scene.receivers.length} points, ${scene.receiverLines.length} lines)`],
    ["Duration", describeDuration(scene.duration)],
    ["Snapshots", scene.output.snapshotEverySteps ? `every ${scene.output.snapshotEverySteps} steps` : "none (final field only)"],
    [
      "Kept in storage",
      `${header.snapshots.frameStride === 1 ? "every snapshot" : `one snapshot in ${header.snapshots.frameStride}`}${header.snapshots.cellStride > 1 ? `, one cell in ${header.snapshots.cellStride} along each axis` : ""}; maps ${header.levelMaps && header.levelMaps.block > 1 ? `in blocks of ${header.levelMaps.block} × ${header.levelMaps.block} cells` : "at full resolution"}`,
    ],
  ];
  return (
    <div className="flex flex-col gap-3">
      <FigureList rows={rows} values="text" />
      <details className="text-sm">
        <summary className="cursor-pointer text-tide-700">The scene as run (JSON)</summary>
        <pre className="mt-2 max-h-80 overflow-auto rounded-md border border-rule bg-paper p-3 font-mono text-[12px] leading-relaxed text-ink-soft">{JSON.stringify(header.scene, null, 2)}</pre>
      </details>
    </div>
  );
}
