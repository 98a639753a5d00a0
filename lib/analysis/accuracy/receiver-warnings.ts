// Receivers the grid records poorly: within NEAR_SURFACE_CELLS cells of a wall, solid or reflecting side of
// the domain, and inside or near a PML (whose absorbing profile starts at the domain's edge).
import type { GridPlan } from "@/lib/fdtd/grid";
import { pointInPolygon } from "@/lib/fdtd/geometry";
import type { ReceiverSpec } from "@/lib/fdtd/receivers";
import type { Scene } from "@/lib/fdtd/scene";

import { distanceToFeature, sceneFeatures } from "./geometry-warnings";
import { NEAR_SURFACE_CELLS } from "./thresholds";
import { type AccuracyWarning, metres, named } from "./warning";

/** Lists at most a few names, then how many more. */
export function listNames(names: readonly string[], shown = 4): string {
  if (names.length <= shown) return names.join(", ");
  return `${names.slice(0, shown).join(", ")} and ${names.length - shown} more`;
}

export function receiverWarnings(scene: Scene, grid: Pick<GridPlan, "cellSize" | "pmlCells" | "domainCells">, receivers: readonly ReceiverSpec[]): AccuracyWarning[] {
  const h = grid.cellSize;
  const near = NEAR_SURFACE_CELLS * h;
  const features = sceneFeatures(scene);
  const nearSurface: { receiver: ReceiverSpec; subject: string; distance: number }[] = [];
  const inPml: ReceiverSpec[] = [];
  const nearPml: { receiver: ReceiverSpec; distance: number }[] = [];
  // The PML begins where the domain's whole cells end (the grid extends the domain to whole cells).
  const pmlEdges = { left: 0, bottom: 0, right: grid.domainCells.nx * h, top: grid.domainCells.ny * h };

  for (const receiver of receivers) {
    const { x, y } = receiver.position;
    let closest: { subject: string; distance: number } | undefined;
    for (const feature of features) {
      const distance = distanceToFeature(receiver.position, feature);
      if (!closest || distance < closest.distance) closest = { subject: feature.subject, distance };
    }
    // Inside a solid the grid already warns (receiver-in-solid); near its outline is what concerns us here.
    const insideSolid = scene.geometry.solids.some((solid) => pointInPolygon(x, y, solid.polygon));
    if (closest && !insideSolid && closest.distance < near) nearSurface.push({ receiver, ...closest });

    const toPml = Math.min(
      grid.pmlCells.left > 0 ? x - pmlEdges.left : Infinity,
      grid.pmlCells.right > 0 ? pmlEdges.right - x : Infinity,
      grid.pmlCells.bottom > 0 ? y - pmlEdges.bottom : Infinity,
      grid.pmlCells.top > 0 ? pmlEdges.top - y : Infinity,
    );
    if (toPml <= 0) inPml.push(receiver);
    else if (toPml < near) nearPml.push({ receiver, distance: toPml });
  }

  const warnings: AccuracyWarning[] = [];
  // One warning per surface, so that a receiver line along a floor does not give a hundred.
  const bySurface = new Map<string, { receiver: ReceiverSpec; distance: number }[]>();
  for (const { receiver, subject, distance } of nearSurface) bySurface.set(subject, [...(bySurface.get(subject) ?? []), { receiver, distance: Math.max(0, distance) }]);
  for (const [subject, entries] of bySurface) {
    const closest = Math.min(...entries.map((entry) => entry.distance));
    const one = entries.length === 1;
    warnings.push({
      code: "receiver-near-surface",
      subject: one ? named("receiver", entries[0]!.receiver) : `${entries.length} receivers`,
      message: `${one ? "lies" : `(${listNames(entries.map((entry) => entry.receiver.label || entry.receiver.id))}) lie`} ${one ? "" : "as close as "}${metres(closest)} (${(closest / h).toFixed(1)} cells) from ${subject}: the surface sits on the grid to within half a cell, so the reflected sound and any interference at the receiver are off by that much.`,
      remedy: `Move ${one ? "it" : "them"} at least ${NEAR_SURFACE_CELLS} cells (${metres(near)}) away, or choose smaller cells.`,
    });
  }
  if (inPml.length > 0) {
    warnings.push({
      code: "receiver-in-pml",
      subject: inPml.length === 1 ? named("receiver", inPml[0]!) : `${inPml.length} receivers`,
      message: `${inPml.length === 1 ? "lies" : `(${listNames(inPml.map((r) => r.label || r.id))}) lie`} inside a PML, where the field is being absorbed: ${inPml.length === 1 ? "its" : "their"} levels are too low.`,
      remedy: "Move the receivers inside the domain, or enlarge the domain.",
    });
  }
  if (nearPml.length > 0) {
    const closest = Math.min(...nearPml.map((entry) => entry.distance));
    warnings.push({
      code: "receiver-near-pml",
      subject: nearPml.length === 1 ? named("receiver", nearPml[0]!.receiver) : `${nearPml.length} receivers`,
      message: `${nearPml.length === 1 ? "lies" : `(${listNames(nearPml.map((entry) => entry.receiver.label || entry.receiver.id))}) lie`} within ${NEAR_SURFACE_CELLS} cells of a PML (closest ${metres(closest)}): the layer's small reflection is strongest at its inner edge.`,
      remedy: `Keep receivers at least ${NEAR_SURFACE_CELLS} cells (${metres(near)}) from the domain's open sides, or enlarge the domain.`,
    });
  }
  return warnings;
}
