// Does a payload describe a run of its own frozen scene? The grid, the receivers, the step count,
// the snapshot and map shapes all follow from the scene and the settings; a payload that disagrees
// was damaged or made by other code, and is not saved as a run of that scene.
import { deriveGrid } from "@/lib/fdtd/grid";
import { receiverSpecs } from "@/lib/fdtd/receivers";
import type { Scene } from "@/lib/fdtd/scene";
import type { FieldIssue } from "@/lib/http/app-error";
import { cellStrideForLimit, frameStrideForLimit, thinnedLength } from "./decimate";
import type { FieldGeometry, RunPayloadHeader } from "./header";

/** Times and positions are recomputed the same way on both sides; this only absorbs last-digit noise. */
function close(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b), 1e-300);
}

function sameGeometry(field: FieldGeometry, width: number, height: number, origin: number, spacing: number): boolean {
  return field.width === width && field.height === height && close(field.x0, origin) && close(field.y0, origin) && close(field.spacing, spacing);
}

/** Every disagreement between a payload's header and its scene (parsed), as field issues; empty when they agree. */
export function checkPayloadAgainstScene(header: RunPayloadHeader, scene: Scene): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const problem = (path: string, message: string) => issues.push({ path, message });
  const grid = deriveGrid(scene);
  const { nx: domainNx, ny: domainNy } = grid.domainCells;
  const g = header.grid;
  if (g.nx !== grid.nx || g.ny !== grid.ny || g.domainNx !== domainNx || g.domainNy !== domainNy || !close(g.cellSize, grid.cellSize) || !close(g.timeStep, grid.timeStep) || g.plannedSteps !== grid.steps) {
    problem("grid", `the grid (${g.nx} x ${g.ny} cells, dx ${g.cellSize} m, dt ${g.timeStep} s) is not the one the scene implies (${grid.nx} x ${grid.ny}, dx ${grid.cellSize} m, dt ${grid.timeStep} s)`);
    return issues;
  }

  const { stepsRun, stoppedBy, simulatedSeconds } = header.run;
  if (stepsRun > grid.steps) problem("run.stepsRun", `${stepsRun} steps run; the scene asks for at most ${grid.steps}`);
  if (stoppedBy === "duration" && stepsRun !== grid.steps) problem("run.stepsRun", `a run that reached its duration has ${grid.steps} steps, not ${stepsRun}`);
  if (stoppedBy === "decay" && scene.duration.kind !== "decay") problem("run.stoppedBy", "the scene does not stop on decay");
  if (!close(simulatedSeconds, stepsRun * grid.timeStep)) problem("run.simulatedSeconds", `${stepsRun} steps of ${grid.timeStep} s are not ${simulatedSeconds} s`);

  const specs = receiverSpecs(scene);
  if (specs.length !== header.receivers.length) {
    problem("receivers", `the payload has ${header.receivers.length} receivers; the scene has ${specs.length}`);
  } else {
    specs.forEach((spec, index) => {
      const receiver = header.receivers[index]!;
      if (receiver.id !== spec.id || receiver.label !== spec.label || receiver.lineId !== spec.lineId || !close(receiver.x, spec.position.x) || !close(receiver.y, spec.position.y)) {
        problem(`receivers[${index}]`, `receiver "${receiver.id}" is not the scene's receiver "${spec.id}" at (${spec.position.x}, ${spec.position.y}) m`);
      }
    });
  }

  const { settings } = header;
  const every = scene.output.snapshotEverySteps;
  const frames = header.snapshots.frames;
  if (every === undefined) {
    if (frames.length > 0) problem("snapshots", "the scene asks for no snapshots");
  } else {
    const taken = Math.floor(stepsRun / every);
    const frameStride = frameStrideForLimit(taken, settings.snapshotFrameLimit);
    const kept = Math.floor(taken / frameStride);
    if (header.snapshots.frameStride !== frameStride || frames.length !== kept) {
      problem("snapshots", `a run of ${stepsRun} steps with a snapshot every ${every} keeps ${kept} frames (every ${frameStride}); the payload has ${frames.length} (every ${header.snapshots.frameStride})`);
    }
    frames.forEach((frame, index) => {
      if (frame.step !== (index + 1) * frameStride * every || !close(frame.time, frame.step * grid.timeStep)) problem(`snapshots.frames[${index}]`, `frame ${index} is not at step ${(index + 1) * frameStride * every}`);
    });
    if (kept > 0) {
      const sceneStride = scene.output.snapshotCellStride;
      const width = thinnedLength(domainNx, sceneStride);
      const height = thinnedLength(domainNy, sceneStride);
      const cellStride = cellStrideForLimit(width, height, settings.snapshotFrameValueLimit);
      const spacing = grid.cellSize * sceneStride * cellStride;
      if (header.snapshots.cellStride !== cellStride || !sameGeometry(header.snapshots.field, thinnedLength(width, cellStride), thinnedLength(height, cellStride), 0.5 * grid.cellSize, spacing)) {
        problem("snapshots.field", "the snapshot frames do not have the shape the scene and settings imply");
      }
    }
  }

  const finalStride = cellStrideForLimit(domainNx, domainNy, settings.snapshotFrameValueLimit);
  if (header.finalPressure.cellStride !== finalStride || !sameGeometry(header.finalPressure.field, thinnedLength(domainNx, finalStride), thinnedLength(domainNy, finalStride), 0.5 * grid.cellSize, grid.cellSize * finalStride)) {
    problem("finalPressure.field", "the final pressure field does not have the shape the scene and settings imply");
  }

  const mapBlock = cellStrideForLimit(domainNx, domainNy, settings.mapValueLimit);
  const mapOrigin = 0.5 * grid.cellSize + ((mapBlock - 1) / 2) * grid.cellSize;
  const mapsMatch = (maps: RunPayloadHeader["levelMaps"]) =>
    !maps || (maps.block === mapBlock && sameGeometry(maps.field, thinnedLength(domainNx, mapBlock), thinnedLength(domainNy, mapBlock), mapOrigin, grid.cellSize * mapBlock));
  if (scene.output.levelMaps !== Boolean(header.levelMaps)) problem("levelMaps", scene.output.levelMaps ? "the scene asks for level maps; the payload has none" : "the scene asks for no level maps");
  if (header.intensity && !scene.output.levelMaps) problem("intensity", "intensity is kept only with the level maps");
  if (!mapsMatch(header.levelMaps)) problem("levelMaps.field", "the level maps do not have the shape the scene and settings imply");
  if (!mapsMatch(header.intensity)) problem("intensity.field", "the intensity maps do not have the shape the scene and settings imply");
  return issues;
}
