import { describe, expect, it } from "vitest";

import { editorReducer, createEditorState } from "@/components/scene-editor/model/editor-state";
import { canRedo, canUndo, closeMergeRun, createHistory, record, redo, undo } from "@/components/scene-editor/model/history";
import { addReceiver, translateEntity } from "@/components/scene-editor/model/scene-edits";

import { barrierScene } from "./scene-fixtures";

const garden = { kind: "receiver", id: "garden" } as const;

describe("undo and redo", () => {
  it("undoes and redoes a sequence of edits in order", () => {
    const s0 = barrierScene();
    const s1 = translateEntity(s0, garden, 1, 0);
    const s2 = translateEntity(s1, garden, 1, 0);
    let history = record(record(createHistory(s0), s1), s2);
    history = undo(history);
    expect(history.present).toBe(s1);
    history = undo(history);
    expect(history.present).toBe(s0);
    expect(canUndo(history)).toBe(false);
    history = redo(history);
    expect(history.present).toBe(s1);
    history = redo(history);
    expect(history.present).toBe(s2);
    expect(canRedo(history)).toBe(false);
  });

  it("forgets the redo steps when a new edit is made after undoing", () => {
    const s0 = barrierScene();
    const s1 = translateEntity(s0, garden, 1, 0);
    const s2 = translateEntity(s0, garden, 0, 1);
    const history = record(undo(record(createHistory(s0), s1)), s2);
    expect(history.present).toBe(s2);
    expect(canRedo(history)).toBe(false);
    expect(undo(history).present).toBe(s0);
  });

  it("records nothing for an edit that returned the same scene", () => {
    const history = createHistory(barrierScene());
    expect(record(history, history.present)).toBe(history);
  });

  it("keeps at most `limit` steps, dropping the oldest", () => {
    let history = createHistory(barrierScene(), 3);
    const scenes = [history.present];
    for (let k = 1; k <= 5; k++) {
      const next = translateEntity(history.present, garden, 0.5, 0);
      scenes.push(next);
      history = record(history, next);
    }
    expect(history.past).toHaveLength(3);
    history = undo(undo(undo(history)));
    expect(history.present).toBe(scenes[2]);
    expect(canUndo(history)).toBe(false);
  });

  it("merges a gesture's edits with the same key into one undo step", () => {
    const s0 = barrierScene();
    let history = createHistory(s0);
    let scene = s0;
    for (let k = 0; k < 10; k++) {
      scene = translateEntity(scene, garden, 0.1, 0);
      history = record(history, scene, { mergeKey: "drag-1" });
    }
    expect(history.past).toHaveLength(1);
    expect(undo(history).present).toBe(s0);
  });

  it("starts a new step when the key changes or the run is closed", () => {
    const s0 = barrierScene();
    const s1 = translateEntity(s0, garden, 1, 0);
    const s2 = translateEntity(s1, garden, 1, 0);
    const s3 = translateEntity(s2, garden, 1, 0);
    let history = record(createHistory(s0), s1, { mergeKey: "drag-1" });
    history = record(history, s2, { mergeKey: "drag-2" });
    history = record(closeMergeRun(history), s3, { mergeKey: "drag-2" });
    expect(history.past).toEqual([s0, s1, s2]);
  });
});

describe("editor state", () => {
  it("drops the selection when undo removes the selected entity", () => {
    const start = createEditorState(barrierScene());
    const added = addReceiver(start.history.present, { x: 4, y: 4 });
    let state = editorReducer(start, { type: "apply", scene: added.scene, select: { ref: added.ref, vertex: null } });
    expect(state.selection?.ref).toEqual(added.ref);
    state = editorReducer(state, { type: "undo" });
    expect(state.selection).toBeNull();
    state = editorReducer(state, { type: "redo" });
    expect(state.history.present).toBe(added.scene);
  });

  it("refuses to select something that is not in the scene", () => {
    const state = editorReducer(createEditorState(barrierScene()), { type: "select", selection: { ref: { kind: "wall", id: "nowhere" }, vertex: null } });
    expect(state.selection).toBeNull();
  });

  it("starts the history over when a scene arrives from outside", () => {
    const start = createEditorState(barrierScene());
    const moved = editorReducer(start, { type: "apply", scene: translateEntity(start.history.present, garden, 1, 1) });
    const replaced = barrierScene();
    const state = editorReducer(moved, { type: "reset", scene: replaced });
    expect(state.history.present).toBe(replaced);
    expect(canUndo(state.history)).toBe(false);
  });
});
