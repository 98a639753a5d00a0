// How far the drawing reaches: the domain, the PML bands outside it (true to scale, from the derived
// cell size), and any geometry drawn beyond the domain.
import type { EdgeSide, Scene } from "@/lib/fdtd/scene";

import { DRAW_ORDER, entitiesOf, entityPoints } from "./entities";
import type { Bounds } from "./viewport";

export type PmlBandWidths = Record<EdgeSide, number>;

/** Width in metres of the PML outside each side (0 where the side is not a PML). */
export function pmlBandWidths(scene: Scene, cellSize: number): PmlBandWidths {
  const width = (side: EdgeSide) => {
    const edge = scene.boundary[side];
    return edge.kind === "pml" ? edge.layerCells * cellSize : 0;
  };
  return { left: width("left"), right: width("right"), bottom: width("bottom"), top: width("top") };
}

/** The domain with its PML bands, grown to hold every drawn point. */
export function drawingBounds(scene: Scene, bands: PmlBandWidths): Bounds {
  const bounds = { minX: -bands.left, minY: -bands.bottom, maxX: scene.domain.width + bands.right, maxY: scene.domain.height + bands.top };
  for (const kind of DRAW_ORDER) {
    for (const entity of entitiesOf(scene, kind)) {
      for (const p of entityPoints(scene, { kind, id: entity.id })) {
        bounds.minX = Math.min(bounds.minX, p.x);
        bounds.minY = Math.min(bounds.minY, p.y);
        bounds.maxX = Math.max(bounds.maxX, p.x);
        bounds.maxY = Math.max(bounds.maxY, p.y);
      }
    }
  }
  return bounds;
}
