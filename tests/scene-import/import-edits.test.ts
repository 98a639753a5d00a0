import { describe, expect, it } from "vitest";

import { planImport, type ImportRequest, type PlannedImport } from "@/components/scene-editor/import/import-edits";
import { createEditorState, editorReducer } from "@/components/scene-editor/model/editor-state";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import { readDxf, type DxfDrawing } from "@/lib/scene-import/dxf";
import { importKindOf, MAX_IMPORT_BYTES } from "@/lib/scene-import/file-kinds";
import { importWav, type WavRecording } from "@/lib/scene-import/wav";

import { MONO_FLOAT_32 } from "../fixtures/import/wav-fixture-signals";
import { barrierScene, deepFreeze } from "../scene-editor/scene-fixtures";
import { fixtureBytes, fixtureText } from "./fixture-files";

function sitePlan(): DxfDrawing {
  const read = readDxf(fixtureText("site-plan-mm.dxf"));
  if (!read.ok) throw new Error(read.message);
  return read.drawing;
}

function burst(): WavRecording {
  const read = importWav(fixtureBytes(MONO_FLOAT_32.file));
  if (!read.ok) throw new Error(read.message);
  return read.recording;
}

function planned(scene: Scene, request: ImportRequest): PlannedImport {
  const plan = planImport(scene, request);
  if (!plan.ok) throw new Error(plan.message);
  return plan;
}

/** The scene survives a JSON round trip through parseScene unchanged, as a save and reload would do. */
function expectValid(scene: Scene): void {
  const parsed = parseScene(JSON.parse(JSON.stringify(scene)));
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => `${p.path}: ${p.message}`).join("; "));
  expect(parsed.scene).toEqual(JSON.parse(JSON.stringify(scene)));
}

type DxfRequest = Extract<ImportRequest, { kind: "dxf" }>;

const siteRequest = (drawing: DxfDrawing): DxfRequest => ({
  kind: "dxf",
  drawing,
  placement: { wallLayers: ["BARRIERS", "FENCE"], solidLayers: ["BUILDINGS"], wallThickness: 0.15 },
});

describe("applying a drawing", () => {
  it("adds barriers and solids named like drawn ones, in metres, as a scene that validates", () => {
    const before = deepFreeze(barrierScene());
    const { scene, added } = planned(before, siteRequest(sitePlan()));
    expect(added).toBe("3 barriers and 2 solids");
    expect(scene.geometry.walls.map((wall) => [wall.id, wall.label, wall.thickness])).toEqual([
      ["barrier", "Barrier", 0.2],
      ["barrier-1", "Barrier 1", 0.15],
      ["barrier-2", "Barrier 2", 0.15],
      ["barrier-3", "Barrier 3", 0.15],
    ]);
    expect(scene.geometry.solids.map((solid) => solid.id)).toEqual(["block", "solid-1", "solid-2"]);
    expect(scene.geometry.solids[1]!.polygon).toEqual([{ x: 2, y: 1 }, { x: 6, y: 1 }, { x: 6, y: 4 }, { x: 2, y: 4 }]);
    expect(scene.geometry.solids[1]!.surface).toEqual({ kind: "rigid" });
    expectValid(scene);
  });

  it("is one step of the editor's history: one undo takes the whole import back", () => {
    const before = barrierScene();
    const { scene } = planned(before, siteRequest(sitePlan()));
    const applied = editorReducer(createEditorState(before), { type: "apply", scene });
    expect(applied.history.past).toHaveLength(1);
    expect(editorReducer(applied, { type: "undo" }).history.present).toBe(before);
  });

  it("gives the message and leaves the scene as it was when the drawing leaves the domain", () => {
    const before = deepFreeze(barrierScene());
    const request = siteRequest(sitePlan());
    const plan = planImport(before, { ...request, placement: { ...request.placement, units: "m" } });
    expect(plan).toEqual({ ok: false, message: expect.stringMatching(/^In metres, the chosen layers span x 500 to 16000 m/) });
    expect(before).toEqual(barrierScene());
  });
});

describe("applying a coordinate table", () => {
  it("adds a barrier of the chosen thickness", () => {
    const { scene, added } = planned(barrierScene(), { kind: "csv", text: fixtureText("barrier-path.csv"), target: "wall", wallThickness: 0.25 });
    expect(added).toBe("a barrier of 3 points");
    expect(scene.geometry.walls.at(-1)).toEqual({ id: "barrier-1", label: "Barrier 1", path: [{ x: 2, y: 0 }, { x: 2, y: 3.5 }, { x: 6.25, y: 3.5 }], thickness: 0.25, surface: { kind: "rigid" } });
    expectValid(scene);
  });

  it("adds receivers with fresh ids, labelled by their names", () => {
    const { scene, added } = planned(barrierScene(), { kind: "csv", text: fixtureText("receivers-semicolon.csv"), target: "receivers", wallThickness: 0.2 });
    expect(added).toBe("3 receivers");
    expect(scene.receivers.map((receiver) => [receiver.id, receiver.label])).toEqual([
      ["garden", "Garden"],
      ["receiver-1", "Garden north"],
      ["receiver-2", "Garden south"],
      ["receiver-3", "Window, first floor"],
    ]);
    expectValid(scene);
  });

  it("gives the row's message and no scene for a bad table", () => {
    const plan = planImport(deepFreeze(barrierScene()), { kind: "csv", text: fixtureText("bad-number.csv"), target: "solid", wallThickness: 0.2 });
    expect(plan).toEqual({ ok: false, message: "Row 3, column 2 (“y”): “abc” is not a number." });
  });

  it("refuses a barrier thickness that is not positive", () => {
    const plan = planImport(barrierScene(), { kind: "csv", text: fixtureText("barrier-path.csv"), target: "wall", wallThickness: -1 });
    expect(plan).toEqual({ ok: false, message: "The barrier thickness must be a number above 0 m." });
  });
});

describe("applying a recording", () => {
  it("replaces the chosen source's signal with the sampled one", () => {
    const recording = burst();
    const { scene, added } = planned(barrierScene(), { kind: "wav", recording, sourceId: "road" });
    expect(added).toBe("a new signal for Road");
    expect(scene.sources[0]!.signal).toEqual(recording.signal);
    expect(scene.sources[0]!.amplitude).toBe(1);
    expectValid(scene);
  });

  it("asks for a source when the chosen one is not in the scene", () => {
    expect(planImport(barrierScene(), { kind: "wav", recording: burst(), sourceId: "gone" })).toEqual({
      ok: false,
      message: "Choose the source whose signal the recording replaces.",
    });
  });
});

describe("choosing the import for a file", () => {
  it("goes by the file's extension, in any case", () => {
    expect(importKindOf("Plan.DXF", 10)).toEqual({ ok: true, kind: "dxf" });
    expect(importKindOf("points.txt", 10)).toEqual({ ok: true, kind: "csv" });
    expect(importKindOf("clip.wav", 10)).toEqual({ ok: true, kind: "wav" });
  });

  it("refuses other files and files over the size limit", () => {
    expect(importKindOf("plan.dwg", 10)).toEqual({ ok: false, message: "“plan.dwg” is not a file this import reads: choose a drawing (.dxf), a coordinate table (.csv) or a recording (.wav)." });
    expect(importKindOf("clip.wav", MAX_IMPORT_BYTES.wav + 1)).toEqual({ ok: false, message: "“clip.wav” is 20.0 MB; at most 20 MB are read for a .wav file." });
  });
});
