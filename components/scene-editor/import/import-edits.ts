// Applying an import to a scene. Pure functions built from the editor's own edits, so imported
// entities get ids and labels the same way drawn ones do (`barrier-3`, "Barrier 3"). `planImport`
// gives the whole new scene, checked against the scene schema, or a message and no scene: the editor
// applies it as one step of its history, so one undo takes the whole import back.
import { parseScene, type Point, type Scene, type SurfaceTreatment } from "@/lib/fdtd/scene";
import { importCsv, type CsvReceiver, type CsvTarget } from "@/lib/scene-import/csv";
import { placeDxf, type DxfDrawing, type DxfPlacement } from "@/lib/scene-import/dxf";
import type { ImportResult } from "@/lib/scene-import/geometry";
import type { WavRecording } from "@/lib/scene-import/wav";

import { displayName, findEntity } from "../model/entities";
import { addReceiver, addSolid, addWall, setEntityLabel, setSourceSignal } from "../model/scene-edits";

export interface ImportedGeometry {
  walls: readonly { path: readonly Point[]; thickness: number }[];
  solids: readonly { polygon: readonly Point[] }[];
}

/** Adds barriers, then solids, each with a fresh id; their faces are rigid until treated in the inspector. */
export function addImportedGeometry(scene: Scene, geometry: ImportedGeometry, surface: SurfaceTreatment = { kind: "rigid" }): Scene {
  let next = scene;
  for (const wall of geometry.walls) next = addWall(next, wall.path, wall.thickness, surface).scene;
  for (const solid of geometry.solids) next = addSolid(next, solid.polygon, surface).scene;
  return next;
}

/** Adds one receiver per row, labelled with its name when the table gave one. */
export function addImportedReceivers(scene: Scene, receivers: readonly CsvReceiver[]): Scene {
  let next = scene;
  for (const receiver of receivers) {
    const added = addReceiver(next, receiver.position);
    next = receiver.name === null ? added.scene : setEntityLabel(added.scene, added.ref, receiver.name);
  }
  return next;
}

export interface PlannedImport {
  scene: Scene;
  /** What the import adds or changes, for a preview and a notice: "3 barriers and 2 solids". */
  added: string;
}

/** Everything the dialog has gathered for one import. */
export type ImportRequest =
  | { kind: "dxf"; drawing: DxfDrawing; placement: DxfPlacement }
  | { kind: "csv"; text: string; target: CsvTarget; wallThickness: number }
  | { kind: "wav"; recording: WavRecording; sourceId: string };

function plural(count: number, one: string, many: string): string {
  return `${count} ${count === 1 ? one : many}`;
}

function planGeometry(scene: Scene, request: Extract<ImportRequest, { kind: "dxf" }>): ImportResult<PlannedImport> {
  const placed = placeDxf(request.drawing, request.placement, scene.domain);
  if (!placed.ok) return placed;
  const parts = [placed.walls.length > 0 ? plural(placed.walls.length, "barrier", "barriers") : "", placed.solids.length > 0 ? plural(placed.solids.length, "solid", "solids") : ""].filter(Boolean);
  return { ok: true, scene: addImportedGeometry(scene, placed), added: parts.join(" and ") };
}

function planTable(scene: Scene, request: Extract<ImportRequest, { kind: "csv" }>): ImportResult<PlannedImport> {
  if (request.target === "wall" && (!(request.wallThickness > 0) || !Number.isFinite(request.wallThickness))) {
    return { ok: false, message: "The barrier thickness must be a number above 0 m." };
  }
  const table = importCsv(request.text, request.target, scene.domain);
  if (!table.ok) return table;
  switch (table.target) {
    case "wall":
      return {
        ok: true,
        scene: addImportedGeometry(scene, { walls: [{ path: table.path, thickness: request.wallThickness }], solids: [] }),
        added: `a barrier of ${table.path.length} points`,
      };
    case "solid":
      return { ok: true, scene: addImportedGeometry(scene, { walls: [], solids: [{ polygon: table.polygon }] }), added: `a solid of ${table.polygon.length} corners` };
    case "receivers":
      return { ok: true, scene: addImportedReceivers(scene, table.receivers), added: plural(table.receivers.length, "receiver", "receivers") };
  }
}

function planSignal(scene: Scene, request: Extract<ImportRequest, { kind: "wav" }>): ImportResult<PlannedImport> {
  const source = findEntity(scene, { kind: "source", id: request.sourceId });
  if (!source) return { ok: false, message: "Choose the source whose signal the recording replaces." };
  return { ok: true, scene: setSourceSignal(scene, source.id, request.recording.signal), added: `a new signal for ${displayName(source)}` };
}

/**
 * The scene with the import applied and a phrase saying what was added, or why nothing can be.
 * The result is checked with `parseScene`, so what the editor receives is always a valid scene.
 */
export function planImport(scene: Scene, request: ImportRequest): ImportResult<PlannedImport> {
  const plan = request.kind === "dxf" ? planGeometry(scene, request) : request.kind === "csv" ? planTable(scene, request) : planSignal(scene, request);
  if (!plan.ok) return plan;
  const check = parseScene(plan.scene);
  if (!check.ok) {
    const problem = check.problems[0]!;
    return { ok: false, message: `The imported scene would not be valid: ${problem.path ? `${problem.path}: ` : ""}${problem.message}` };
  }
  return plan;
}
