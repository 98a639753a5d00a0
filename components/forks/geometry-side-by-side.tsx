// Two scenes drawn side by side at one scale: each drawing's width is its share of the wider
// scene's extent, so a metre is as long in both and a taller barrier looks taller.
import { SceneSketch } from "@/components/studies/scene-sketch";
import type { Scene } from "@/lib/fdtd/scene";

/** The sketch's viewBox width: the domain plus its padding (scene-sketch.tsx pads 4 % of the larger side). */
function drawnWidth(scene: Scene): number {
  return scene.domain.width + 2 * 0.04 * Math.max(scene.domain.width, scene.domain.height);
}

export function GeometrySideBySide({ sides }: { sides: readonly { title: string; caption: string; scene: Scene }[] }) {
  const widest = Math.max(...sides.map((side) => drawnWidth(side.scene)));
  return (
    <div className="grid gap-4 md:grid-cols-2">
      {sides.map((side) => (
        <figure key={side.title} className="flex flex-col gap-2 rounded-lg border border-rule bg-panel p-3">
          <figcaption className="text-sm">
            <span className="font-semibold text-ink">{side.title}</span> <span className="text-muted">{side.caption}</span>
          </figcaption>
          <div style={{ width: `${(100 * drawnWidth(side.scene)) / widest}%` }}>
            <SceneSketch scene={side.scene} className="h-auto w-full" />
          </div>
          <p className="text-[12px] text-muted">
            {side.scene.domain.width} m × {side.scene.domain.height} m
          </p>
        </figure>
      ))}
    </div>
  );
}
