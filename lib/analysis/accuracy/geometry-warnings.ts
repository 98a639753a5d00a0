// Geometry the grid draws poorly: walls and solids thinner than THIN_FEATURE_CELLS cells, and openings between
// two features (or a feature and a rigid or impedance side of the domain) narrower than that.
import type { Point, Scene } from "@/lib/fdtd/scene";
import { distanceToSegment, segmentsIntersect } from "@/lib/fdtd/geometry";

import { THIN_FEATURE_CELLS } from "./thresholds";
import { type AccuracyWarning, metres, named } from "./warning";

/** A piece of geometry as line segments and the half thickness around them (m). */
export interface Feature {
  subject: string;
  segments: [Point, Point][];
  halfThickness: number;
}

function polylineSegments(path: readonly Point[], closed: boolean): [Point, Point][] {
  const segments: [Point, Point][] = [];
  for (let k = 0; k + 1 < path.length; k++) segments.push([path[k]!, path[k + 1]!]);
  if (closed && path.length > 2) segments.push([path[path.length - 1]!, path[0]!]);
  return segments;
}

/** Walls, solids and the non-PML sides of the domain as features. */
export function sceneFeatures(scene: Scene): Feature[] {
  const { width, height } = scene.domain;
  const features: Feature[] = [
    ...scene.geometry.walls.map((wall) => ({ subject: named("wall", wall), segments: polylineSegments(wall.path, false), halfThickness: wall.thickness / 2 })),
    ...scene.geometry.solids.map((solid) => ({ subject: named("solid", solid), segments: polylineSegments(solid.polygon, true), halfThickness: 0 })),
  ];
  const sides: Record<keyof Scene["boundary"], [Point, Point]> = {
    left: [{ x: 0, y: 0 }, { x: 0, y: height }],
    right: [{ x: width, y: 0 }, { x: width, y: height }],
    bottom: [{ x: 0, y: 0 }, { x: width, y: 0 }],
    top: [{ x: 0, y: height }, { x: width, y: height }],
  };
  for (const side of ["left", "right", "bottom", "top"] as const) {
    if (scene.boundary[side].kind !== "pml") features.push({ subject: `the ${side} side of the domain`, segments: [sides[side]], halfThickness: 0 });
  }
  return features;
}

function segmentDistance([a, b]: [Point, Point], [c, d]: [Point, Point]): number {
  if (segmentsIntersect(a.x, a.y, b.x, b.y, c, d)) return 0;
  return Math.min(distanceToSegment(a.x, a.y, c, d), distanceToSegment(b.x, b.y, c, d), distanceToSegment(c.x, c.y, a, b), distanceToSegment(d.x, d.y, a, b));
}

/** Clear distance between two features (m): negative or zero when they touch or overlap. */
export function featureGap(first: Feature, second: Feature): number {
  let closest = Infinity;
  for (const s of first.segments) for (const t of second.segments) closest = Math.min(closest, segmentDistance(s, t));
  return closest - first.halfThickness - second.halfThickness;
}

/** Distance (m) from a point to the surface of a feature; negative inside a wall's thickness. */
export function distanceToFeature(point: Point, feature: Feature): number {
  let closest = Infinity;
  for (const [a, b] of feature.segments) closest = Math.min(closest, distanceToSegment(point.x, point.y, a, b));
  return closest - feature.halfThickness;
}

/**
 * Smallest local thickness of a polygon (m): from points along each edge, the distance along the inward normal
 * to the opposite side. Catches a thin arm of a non-convex outline, which the outline's overall width misses.
 */
export function polygonThickness(polygon: readonly Point[]): number {
  const edges = polylineSegments(polygon, true);
  let signedArea = 0;
  for (const [a, b] of edges) signedArea += a.x * b.y - b.x * a.y;
  const inward = signedArea > 0 ? 1 : -1; // counter-clockwise: the interior lies to the left of each edge
  let thinnest = Infinity;
  edges.forEach(([a, b], e) => {
    const length = Math.hypot(b.x - a.x, b.y - a.y);
    if (length === 0) return;
    const nx = (-(b.y - a.y) / length) * inward;
    const ny = ((b.x - a.x) / length) * inward;
    for (const t of [0.25, 0.5, 0.75]) {
      const px = a.x + t * (b.x - a.x);
      const py = a.y + t * (b.y - a.y);
      edges.forEach(([c, d], f) => {
        if (f === e) return;
        // Solve p + s n = c + u (d - c) for s > 0, u in [0, 1].
        const ex = d.x - c.x;
        const ey = d.y - c.y;
        const denominator = nx * -ey - ny * -ex;
        if (Math.abs(denominator) < 1e-15) return;
        const rx = c.x - px;
        const ry = c.y - py;
        const s = (rx * -ey - ry * -ex) / denominator;
        const u = (nx * ry - ny * rx) / denominator;
        if (s > 1e-12 && u >= 0 && u <= 1) thinnest = Math.min(thinnest, s);
      });
    }
  });
  return thinnest;
}

export function geometryWarnings(scene: Scene, cellSize: number): AccuracyWarning[] {
  const warnings: AccuracyWarning[] = [];
  const limit = THIN_FEATURE_CELLS * cellSize;
  const cells = (length: number) => `${(length / cellSize).toFixed(1)} cells`;

  for (const wall of scene.geometry.walls) {
    if (wall.thickness >= limit) continue;
    const screen = wall.surface.kind === "rigid" && wall.thickness < cellSize;
    warnings.push({
      code: "thin-wall",
      subject: named("wall", wall),
      message: screen
        ? `is ${metres(wall.thickness)} thick, ${cells(wall.thickness)}: the grid draws it as a screen of zero thickness on cell faces, whose edge acts about half a cell further towards the open side (measured for this scheme).`
        : `is ${metres(wall.thickness)} thick, ${cells(wall.thickness)}: the grid draws it one or two cells thick depending on where it falls, so its thickness is uncertain by a whole cell.`,
      remedy: screen
        ? "Fine for a thin screen. If its thickness matters (diffraction over a thick top), choose cells smaller than half of it."
        : `Choose cells of at most ${metres(wall.thickness / THIN_FEATURE_CELLS)} (a higher frequency or more points per wavelength), or treat it as a thin rigid screen.`,
    });
  }
  for (const solid of scene.geometry.solids) {
    const thickness = polygonThickness(solid.polygon);
    if (!(thickness < limit)) continue;
    warnings.push({
      code: "thin-solid",
      subject: named("solid", solid),
      message: `is ${metres(thickness)} across at its thinnest, ${cells(thickness)}: the grid keeps only cells whose centre lies inside, so that part may be drawn with gaps or a cell too wide.`,
      remedy: `Choose cells of at most ${metres(thickness / THIN_FEATURE_CELLS)}, or draw that part as a wall.`,
    });
  }
  const features = sceneFeatures(scene);
  for (let a = 0; a < features.length; a++) {
    for (let b = a + 1; b < features.length; b++) {
      const gap = featureGap(features[a]!, features[b]!);
      if (!(gap > 1e-9 * cellSize && gap < limit)) continue;
      warnings.push({
        code: "narrow-opening",
        subject: `${features[a]!.subject} and ${features[b]!.subject}`,
        message: `leave an opening of ${metres(gap)}, ${cells(gap)}: the grid may close it or widen it by a cell, which changes what passes through.`,
        remedy: `Choose cells of at most ${metres(gap / THIN_FEATURE_CELLS)}, or close the opening or widen it if it is not meant to be there.`,
      });
    }
  }
  return warnings;
}
