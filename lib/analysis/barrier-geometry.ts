// The geometry the textbook barrier estimates need, read from a frozen scene: which walls and solids could
// be the barrier and where their diffracting top edges are, and the estimates per receiver with the reason
// when one cannot be made (the barrier is not between source and receiver).
import type { Scene } from "@/lib/fdtd/scene";
import { barrierEstimates, type BarrierEstimateOptions, type BarrierEstimates } from "./barrier-estimates";
import type { SectionPoint } from "./diffraction-path";

/** A wall or solid that may be the barrier, with its top edge(s) in the section. */
export interface BarrierCandidate {
  id: string;
  kind: "wall" | "solid";
  label: string;
  /** One edge (a thin wall, a peaked top) or two (the corners of a flat-topped solid), left to right. */
  edges: SectionPoint[];
}

/**
 * A thin wall diffracts at its highest point. A wall's thickness is ignored: ISO 9613-2 treats a barrier
 * thinner than a wavelength or so as one edge (from memory), and the walls of a section are usually that.
 */
function wallEdges(path: readonly SectionPoint[]): SectionPoint[] {
  const top = path.reduce((best, point) => (point.y > best.y ? point : best));
  return [{ x: top.x, y: top.y }];
}

/**
 * A solid diffracts at the outermost of its highest vertices: two edges for a flat top (a building, an
 * earth bund with a crest), one when a single vertex is highest. Vertices within a millimetre count as level.
 */
function solidEdges(polygon: readonly SectionPoint[]): SectionPoint[] {
  const highest = Math.max(...polygon.map((point) => point.y));
  const level = polygon.filter((point) => highest - point.y <= 1e-3).sort((a, b) => a.x - b.x);
  const first = level[0]!;
  const last = level[level.length - 1]!;
  return last.x - first.x > 1e-3 ? [{ x: first.x, y: first.y }, { x: last.x, y: last.y }] : [{ x: first.x, y: first.y }];
}

/** Every wall, then every solid, as a possible barrier. */
export function barrierCandidates(scene: Scene): BarrierCandidate[] {
  return [
    ...scene.geometry.walls.map((wall) => ({ id: wall.id, kind: "wall" as const, label: wall.label || wall.id, edges: wallEdges(wall.path) })),
    ...scene.geometry.solids.map((solid) => ({ id: solid.id, kind: "solid" as const, label: solid.label || solid.id, edges: solidEdges(solid.polygon) })),
  ];
}

/** Whether the candidate's edges all lie strictly between the source and the receiver along x. */
export function standsBetween(candidate: BarrierCandidate, source: SectionPoint, receiver: SectionPoint): boolean {
  const low = Math.min(source.x, receiver.x);
  const high = Math.max(source.x, receiver.x);
  return candidate.edges.every((edge) => edge.x > low && edge.x < high);
}

/**
 * The barrier a reader most likely means: the first wall, else the first solid, that stands between the
 * source and most receivers; undefined when the scene has neither.
 */
export function likelyBarrier(candidates: readonly BarrierCandidate[], source: SectionPoint | undefined, receivers: readonly SectionPoint[]): BarrierCandidate | undefined {
  if (!source || receivers.length === 0) return candidates[0];
  const score = (candidate: BarrierCandidate) => receivers.filter((receiver) => standsBetween(candidate, source, receiver)).length;
  const best = Math.max(0, ...candidates.map(score));
  return candidates.find((candidate) => best > 0 && score(candidate) === best) ?? candidates[0];
}

export interface ReceiverPoint extends SectionPoint {
  id: string;
  label: string;
}

export type ReceiverBarrierEstimate = { receiver: ReceiverPoint; ok: true; estimates: BarrierEstimates } | { receiver: ReceiverPoint; ok: false; reason: string };

/** Maekawa and ISO 9613-2 estimates for each receiver, or why none can be made for it. */
export function barrierEstimatesPerReceiver(
  candidate: BarrierCandidate,
  source: SectionPoint,
  receivers: readonly ReceiverPoint[],
  options: BarrierEstimateOptions = {},
): ReceiverBarrierEstimate[] {
  return receivers.map((receiver) => {
    if (!standsBetween(candidate, source, receiver)) {
      return { receiver, ok: false, reason: `${candidate.label} does not stand between the source and this receiver` };
    }
    try {
      return { receiver, ok: true, estimates: barrierEstimates(source, { x: receiver.x, y: receiver.y }, candidate.edges, options) };
    } catch (error) {
      return { receiver, ok: false, reason: error instanceof Error ? error.message : String(error) };
    }
  });
}
