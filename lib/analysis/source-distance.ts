// The distance air absorption acts over for a receiver: the straight line to the nearest source in the
// section. With several sources the nearest usually dominates the level; the interface says which it took.
import type { SectionPoint } from "./diffraction-path";

export interface NamedPoint extends SectionPoint {
  id: string;
  label: string;
}

/** The nearest source to `receiver` and its distance, m; undefined when there is no source. */
export function nearestSource(receiver: SectionPoint, sources: readonly NamedPoint[]): { source: NamedPoint; distance: number } | undefined {
  let best: { source: NamedPoint; distance: number } | undefined;
  for (const source of sources) {
    const distance = Math.hypot(source.x - receiver.x, source.y - receiver.y);
    if (!best || distance < best.distance) best = { source, distance };
  }
  return best;
}
