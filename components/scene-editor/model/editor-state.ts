// The editor's document state: the undo history of scenes and what is selected. A reducer, so the
// canvas, the inspector and the code view all change the scene the same way, and undo restores
// exactly what was there.
import type { Scene } from "@/lib/fdtd/scene";

import { findEntity, type EntityRef } from "./entities";
import { canRedo, canUndo, closeMergeRun, createHistory, record, redo, resetHistory, undo, type History } from "./history";

export interface Selection {
  ref: EntityRef;
  /** A selected handle (point index) of the entity, for Delete and the inspector's vertex list. */
  vertex: number | null;
}

export interface EditorState {
  history: History;
  selection: Selection | null;
}

export type EditorAction =
  /** A new scene from any view; `mergeKey` joins a gesture's edits into one undo step. */
  | { type: "apply"; scene: Scene; mergeKey?: string | null; select?: Selection | null }
  | { type: "undo" }
  | { type: "redo" }
  | { type: "select"; selection: Selection | null }
  /** Ends a gesture: the next edit is a new undo step. */
  | { type: "endGesture" }
  /** A scene from outside (loaded, or replaced after a conflict): history starts over. */
  | { type: "reset"; scene: Scene };

export function createEditorState(scene: Scene, historyLimit?: number): EditorState {
  return { history: createHistory(scene, historyLimit), selection: null };
}

/** The selection if it still names something in `scene` (a handle index beyond the points is dropped). */
export function validSelection(scene: Scene, selection: Selection | null): Selection | null {
  if (!selection) return null;
  const entity = findEntity(scene, selection.ref);
  if (!entity) return null;
  return selection;
}

export function editorReducer(state: EditorState, action: EditorAction): EditorState {
  switch (action.type) {
    case "apply": {
      const history = record(state.history, action.scene, { mergeKey: action.mergeKey ?? null });
      const selection = action.select !== undefined ? action.select : state.selection;
      if (history === state.history && selection === state.selection) return state;
      return { history, selection: validSelection(history.present, selection) };
    }
    case "undo": {
      if (!canUndo(state.history)) return state;
      const history = undo(state.history);
      return { history, selection: validSelection(history.present, state.selection) };
    }
    case "redo": {
      if (!canRedo(state.history)) return state;
      const history = redo(state.history);
      return { history, selection: validSelection(history.present, state.selection) };
    }
    case "select": {
      const selection = validSelection(state.history.present, action.selection);
      return { ...state, selection };
    }
    case "endGesture": {
      const history = closeMergeRun(state.history);
      return history === state.history ? state : { ...state, history };
    }
    case "reset":
      return { history: resetHistory(state.history, action.scene), selection: validSelection(action.scene, state.selection) };
  }
}
