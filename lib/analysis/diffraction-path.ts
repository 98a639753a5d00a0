// The path a diffracted ray takes from a source over the top of a barrier to a receiver, in a vertical 2D
// section (x along the ground, y up; barriers stand on the ground, so their diffracting edges are their
// tops). The ray is the taut string from source to receiver over the edges: it bends only over the edges
// that stick up through the chain, so a thick barrier's lower far corner is left out when the ray clears it.

export interface SectionPoint {
  x: number;
  y: number;
}

/** Shadow: the edges block the line of sight. Bright: the receiver sees the source over the barrier. */
export type DiffractionZone = "shadow" | "bright";

export interface DiffractionPath {
  zone: DiffractionZone;
  /**
   * The edges the ray bends over, source side first: one or two in the shadow zone; in the bright zone the
   * one edge whose path is shortest (closest to the line of sight).
   */
  edges: SectionPoint[];
  /** Source to receiver in a straight line, m. */
  directDistance: number;
  /** Source to the first edge, m. */
  sourceToEdge: number;
  /** Last edge to the receiver, m. */
  edgeToReceiver: number;
  /** Between the two edges of a double diffraction, m; 0 for one edge. */
  edgeSpacing: number;
  /** Path over the edges minus the direct distance, m (never negative; see signedPathDifference). */
  pathDifference: number;
  /** pathDifference in the shadow zone, minus it in the bright zone (Maekawa's sign convention). */
  signedPathDifference: number;
}

const distance = (a: SectionPoint, b: SectionPoint) => Math.hypot(b.x - a.x, b.y - a.y);

/** z component of (a - o) x (b - o): negative when o -> a -> b turns clockwise. */
const cross = (o: SectionPoint, a: SectionPoint, b: SectionPoint) => (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);

function checkGeometry(source: SectionPoint, receiver: SectionPoint, edges: readonly SectionPoint[]): void {
  if (edges.length < 1 || edges.length > 2) throw new RangeError(`a barrier has one or two diffracting edges, not ${edges.length}`);
  for (const p of [source, receiver, ...edges]) if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) throw new RangeError("every point needs finite coordinates");
  const low = Math.min(source.x, receiver.x);
  const high = Math.max(source.x, receiver.x);
  for (const edge of edges) {
    if (!(edge.x > low && edge.x < high)) throw new RangeError(`the edge at x = ${edge.x} m does not lie between the source and the receiver (x = ${source.x} and ${receiver.x} m)`);
  }
}

/**
 * The upper chain (upper convex hull) through points ordered along x from the source: the taut string
 * above them. Works in a frame where the source is on the left, so that "above" is a clockwise turn.
 */
function tautChain(source: SectionPoint, receiver: SectionPoint, edges: readonly SectionPoint[]): SectionPoint[] {
  const flip = source.x > receiver.x ? -1 : 1;
  const local = (p: SectionPoint) => ({ x: flip * p.x, y: p.y });
  const ordered = [...edges].sort((a, b) => flip * a.x - flip * b.x);
  const chain: SectionPoint[] = [];
  for (const point of [source, ...ordered, receiver]) {
    while (chain.length >= 2 && cross(local(chain[chain.length - 2]!), local(chain[chain.length - 1]!), local(point)) >= 0) chain.pop();
    chain.push(point);
  }
  return chain;
}

function pathOver(source: SectionPoint, receiver: SectionPoint, edges: SectionPoint[], zone: DiffractionZone): DiffractionPath {
  const first = edges[0]!;
  const last = edges[edges.length - 1]!;
  const directDistance = distance(source, receiver);
  const sourceToEdge = distance(source, first);
  const edgeToReceiver = distance(last, receiver);
  const edgeSpacing = distance(first, last);
  const pathDifference = sourceToEdge + edgeSpacing + edgeToReceiver - directDistance;
  return { zone, edges, directDistance, sourceToEdge, edgeToReceiver, edgeSpacing, pathDifference, signedPathDifference: zone === "shadow" ? pathDifference : -pathDifference };
}

/** The diffracted path from `source` over the barrier's top edge(s) (one, or two for a thick barrier) to `receiver`. */
export function diffractionPath(source: SectionPoint, receiver: SectionPoint, edges: readonly SectionPoint[]): DiffractionPath {
  checkGeometry(source, receiver, edges);
  const bentOver = tautChain(source, receiver, edges).slice(1, -1);
  if (bentOver.length > 0) return pathOver(source, receiver, bentOver, "shadow");
  const candidates = edges.map((edge) => pathOver(source, receiver, [edge], "bright"));
  return candidates.reduce((best, path) => (path.pathDifference < best.pathDifference ? path : best));
}
