"use client";
// The scene editor: a drawing canvas and a code view of the same scene kept in step, an inspector for
// the selection or the scene's settings, and the numbers the scene implies. It holds the undo history
// and reports every change through `onChange`; saving is the parent's business.
import { lazy, Suspense, useCallback, useEffect, useMemo, useReducer, useRef, useState, type KeyboardEvent as ReactKeyboardEvent } from "react";

import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene, type Scene, type SceneInput } from "@/lib/fdtd/scene";

import { CodeView, type CodeViewHandle } from "./code-view";
import { DerivedNumbers } from "./derived-numbers";
import { DrawingCanvas, type ApplyOptions, type DrawingCanvasHandle } from "./drawing-canvas";
import { EditorToolbar, type ViewMode } from "./editor-toolbar";
import { Inspector } from "./inspector";
import { DEFAULT_DRAWING_SETTINGS, type DrawingSettings } from "./model/drawing";
import { createEditorState, editorReducer, type Selection } from "./model/editor-state";
import { displayName, ENTITY_NAMES, entityPoints, findEntity, hasEditableVertexCount, type EntityRef } from "./model/entities";
import { canRedo, canUndo } from "./model/history";
import { deleteEntity, deletionBlocker, deleteVertex, duplicateEntity, moveVertex, translateEntity } from "./model/scene-edits";
import { pmlBandWidths } from "./model/scene-extent";
import { sameSceneData } from "./model/scene-text";
import { entityAtPath, splitJsonPath } from "./model/scene-paths";
import { platformKeys, toolForKey, toolSpec, type ToolId } from "./model/tools";
import { isMacPlatform } from "./keyboard-help";

// The import dialog and its file readers (DXF, CSV, WAV) load only when someone opens it.
const ImportDialog = lazy(() => import("./import/import-dialog").then((module) => ({ default: module.ImportDialog })));

export interface SceneEditorProps {
  /** The scene to edit; a new object that differs from what the editor last reported starts a fresh history. */
  scene: SceneInput | Scene;
  /** Every change, as a valid scene with its defaults filled in. */
  onChange?: (scene: Scene) => void;
  /** Viewers and reviewers: no tools, no edits; selecting, zooming and reading still work. */
  readOnly?: boolean;
  /** Cell updates per second for the run-time estimate; measured in a worker when absent. */
  cellUpdatesPerSecond?: number;
  initialView?: ViewMode;
  className?: string;
}

function isTextTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName) || target.closest(".monaco-editor") !== null;
}

export function SceneEditor(props: SceneEditorProps) {
  const parsed = useMemo(() => parseScene(props.scene), [props.scene]);
  if (!parsed.ok) {
    return (
      <div role="alert" className="rounded-lg border border-signal-error/30 bg-signal-error-50 px-4 py-3 text-sm text-ink-soft">
        <p className="font-semibold text-signal-error">This scene cannot be opened in the editor</p>
        <ul className="mt-1 list-disc pl-5">
          {parsed.problems.slice(0, 8).map((problem) => (
            <li key={problem.path + problem.message}>
              <span className="font-mono text-[12.5px]">{problem.path || "(scene)"}</span>: {problem.message}
            </li>
          ))}
        </ul>
      </div>
    );
  }
  return <ValidSceneEditor {...props} initialScene={parsed.scene} />;
}

function ValidSceneEditor({ scene: incoming, initialScene, onChange, readOnly = false, cellUpdatesPerSecond, initialView = "canvas", className = "" }: SceneEditorProps & { initialScene: Scene }) {
  const [state, dispatch] = useReducer(editorReducer, initialScene, (scene) => createEditorState(scene));
  const scene = state.history.present;
  const selection = state.selection;
  const [tool, setTool] = useState<ToolId>("select");
  const [view, setView] = useState<ViewMode>(initialView);
  const [codeMounted, setCodeMounted] = useState(initialView !== "canvas");
  const [snapping, setSnapping] = useState(true);
  const [showGrid, setShowGrid] = useState(true);
  const [showLabels, setShowLabels] = useState(true);
  const [helpOpen, setHelpOpen] = useState(false);
  const [importOpen, setImportOpen] = useState(false);
  const [settings, setSettings] = useState<DrawingSettings>(DEFAULT_DRAWING_SETTINGS);
  const [notice, setNotice] = useState<string | null>(null);
  const canvas = useRef<DrawingCanvasHandle>(null);
  const code = useRef<CodeViewHandle>(null);

  const grid = useMemo(() => deriveGrid(scene), [scene]);
  const bands = useMemo(() => pmlBandWidths(scene, grid.cellSize), [scene, grid.cellSize]);
  const activeTool: ToolId = readOnly ? "select" : tool;

  // Report changes to the parent; remember what was reported so it is not mistaken for a new scene.
  const reported = useRef<unknown>(incoming);
  const lastPresent = useRef(scene);
  useEffect(() => {
    if (scene === lastPresent.current) return;
    lastPresent.current = scene;
    reported.current = scene;
    onChange?.(scene);
  }, [scene, onChange]);

  // A scene from the parent that is not one we reported (another version loaded): start over with it.
  useEffect(() => {
    if (incoming === reported.current) return;
    reported.current = incoming;
    const next = parseScene(incoming);
    if (next.ok && !sameSceneData(next.scene, lastPresent.current)) {
      lastPresent.current = next.scene;
      dispatch({ type: "reset", scene: next.scene });
    }
  }, [incoming]);

  useEffect(() => {
    if (!notice) return;
    const timer = window.setTimeout(() => setNotice(null), 4500);
    return () => window.clearTimeout(timer);
  }, [notice]);

  /** Applies a scene if it is valid; returns the first problem otherwise. Every view edits through here. */
  const tryApply = useCallback(
    (next: Scene, select?: Selection | null, mergeKey?: string | null): string | null => {
      if (readOnly) return "This scene is read only.";
      const check = parseScene(next);
      if (!check.ok) {
        const first = check.problems[0]!;
        return first.message;
      }
      dispatch({ type: "apply", scene: next, mergeKey, ...(select !== undefined ? { select } : {}) });
      return null;
    },
    [readOnly],
  );

  const applyFromCanvas = useCallback(
    (next: Scene, options: ApplyOptions = {}) => {
      const refused = tryApply(next, options.select, options.mergeKey);
      if (refused) setNotice(refused);
    },
    [tryApply],
  );

  const applyFromCode = useCallback((next: Scene) => dispatch({ type: "apply", scene: next, mergeKey: "code" }), []);
  const select = useCallback((next: Selection | null) => dispatch({ type: "select", selection: next }), []);
  const endGesture = useCallback(() => dispatch({ type: "endGesture" }), []);

  const deleteSelected = useCallback(
    (ref: EntityRef, vertex: number | null = null) => {
      if (vertex !== null && hasEditableVertexCount(ref.kind)) {
        const next = deleteVertex(scene, ref, vertex);
        if (next === scene) setNotice(`A ${ENTITY_NAMES[ref.kind].toLowerCase()} cannot lose more points.`);
        else tryApply(next, { ref, vertex: null });
        return;
      }
      const blocker = deletionBlocker(scene, ref);
      if (blocker) {
        setNotice(blocker);
        return;
      }
      const entity = findEntity(scene, ref);
      tryApply(deleteEntity(scene, ref), null);
      if (entity) setNotice(`Deleted ${ENTITY_NAMES[ref.kind].toLowerCase()} “${displayName(entity)}”; ${platformKeys("Mod+Z", isMacPlatform())} brings it back.`);
    },
    [scene, tryApply],
  );

  const duplicate = useCallback(
    (ref: EntityRef) => {
      const step = canvas.current?.snapStep() ?? 0.5;
      const result = duplicateEntity(scene, ref, { x: step * 2, y: 0 });
      if (result) tryApply(result.scene, { ref: result.ref, vertex: null });
    },
    [scene, tryApply],
  );

  const changeView = useCallback((next: ViewMode) => {
    setView(next);
    if (next !== "canvas") setCodeMounted(true);
  }, []);

  const showPath = useCallback(
    (path: string) => {
      const segments = splitJsonPath(path);
      const ref = entityAtPath(scene, segments);
      select(ref ? { ref, vertex: null } : null);
      if (view !== "canvas") code.current?.revealPath(segments);
    },
    [scene, select, view],
  );

  const onKeyDown = (event: ReactKeyboardEvent<HTMLDivElement>) => {
    if (isTextTarget(event.target) || event.defaultPrevented) return;
    if (canvas.current?.handleKey(event)) {
      event.preventDefault();
      return;
    }
    const mod = event.ctrlKey || event.metaKey;
    const key = event.key;
    if (mod && key.toLowerCase() === "z") {
      event.preventDefault();
      dispatch({ type: event.shiftKey ? "redo" : "undo" });
      return;
    }
    if (mod && key.toLowerCase() === "y") {
      event.preventDefault();
      dispatch({ type: "redo" });
      return;
    }
    if (mod && key.toLowerCase() === "d") {
      event.preventDefault();
      if (selection && !readOnly) duplicate(selection.ref);
      return;
    }
    if (mod || event.altKey) return;
    if (key === "?") {
      setHelpOpen((open) => !open);
      return;
    }
    if (key === "Escape") {
      if (selection) select(null);
      else setTool("select");
      return;
    }
    if ((key === "Delete" || key === "Backspace") && selection && !readOnly) {
      event.preventDefault();
      deleteSelected(selection.ref, selection.vertex);
      return;
    }
    if (key.startsWith("Arrow") && selection && !readOnly) {
      event.preventDefault();
      const step = (canvas.current?.snapStep() ?? 0.1) * (event.shiftKey ? 10 : 1);
      const dx = key === "ArrowLeft" ? -step : key === "ArrowRight" ? step : 0;
      const dy = key === "ArrowDown" ? -step : key === "ArrowUp" ? step : 0;
      // A selected handle moves alone; otherwise the whole entity moves.
      const handle = selection.vertex !== null ? entityPoints(scene, selection.ref)[selection.vertex] : undefined;
      const next = handle ? moveVertex(scene, selection.ref, selection.vertex!, { x: handle.x + dx, y: handle.y + dy }) : translateEntity(scene, selection.ref, dx, dy);
      tryApply(next, undefined, `nudge:${selection.ref.kind}:${selection.ref.id}:${selection.vertex ?? "all"}`);
      return;
    }
    if (event.shiftKey) return;
    if (key.toLowerCase() === "f") {
      canvas.current?.fit();
      return;
    }
    if (key.toLowerCase() === "g" && !readOnly) {
      setSnapping((on) => !on);
      return;
    }
    const picked = toolForKey(key);
    if (picked && !readOnly && view !== "code") {
      setTool(picked);
      if (picked !== "select") select(null);
    }
  };

  const canvasVisible = view !== "code";
  const codeVisible = view !== "canvas";
  const hint = readOnly ? "Read only: click to inspect, drag to pan, wheel to zoom." : toolSpec(activeTool).hint;

  return (
    <div
      className={`flex h-full min-h-[560px] flex-col overflow-hidden rounded-lg border border-rule bg-panel shadow-[0_1px_0_rgba(22,33,43,0.04)] ${className}`}
      onKeyDown={onKeyDown}
      data-testid="scene-editor"
    >
      <EditorToolbar
        tool={activeTool}
        onTool={(next) => {
          setTool(next);
          if (next !== "select") select(null);
        }}
        readOnly={readOnly}
        canUndo={canUndo(state.history)}
        canRedo={canRedo(state.history)}
        onUndo={() => dispatch({ type: "undo" })}
        onRedo={() => dispatch({ type: "redo" })}
        snapping={snapping}
        onSnapping={setSnapping}
        showGrid={showGrid}
        onShowGrid={setShowGrid}
        showLabels={showLabels}
        onShowLabels={setShowLabels}
        onZoomIn={() => canvas.current?.zoomBy(1.4)}
        onZoomOut={() => canvas.current?.zoomBy(1 / 1.4)}
        onFit={() => canvas.current?.fit()}
        view={view}
        onView={changeView}
        helpOpen={helpOpen}
        onHelp={setHelpOpen}
        settings={settings}
        onSettings={setSettings}
        onImport={() => setImportOpen(true)}
      />
      {importOpen && !readOnly ? (
        <Suspense fallback={null}>
          <ImportDialog
            scene={scene}
            preferredSourceId={selection?.ref.kind === "source" ? selection.ref.id : null}
            onApply={(next) => tryApply(next)}
            onImported={(message) => setNotice(`${message} ${platformKeys("Mod+Z", isMacPlatform())} undoes it.`)}
            onClose={() => setImportOpen(false)}
          />
        </Suspense>
      ) : null}
      <div className="flex min-h-0 flex-1">
        <div className="flex min-w-0 flex-1 flex-col">
          <div className="flex min-h-0 flex-1">
            <div className={canvasVisible ? "relative min-w-0 flex-[3]" : "hidden"}>
              <DrawingCanvas
                ref={canvas}
                scene={scene}
                bands={bands}
                selection={selection}
                tool={activeTool}
                readOnly={readOnly}
                snapping={snapping}
                showGrid={showGrid}
                showLabels={showLabels}
                settings={settings}
                onApply={applyFromCanvas}
                onSelect={select}
                onEndGesture={endGesture}
                onNotice={setNotice}
              />
            </div>
            {codeMounted ? (
              <div className={codeVisible ? `min-w-0 ${canvasVisible ? "flex-[2] border-l border-rule" : "flex-1"}` : "hidden"}>
                <CodeView ref={code} scene={scene} onSceneChange={applyFromCode} onTypingEnd={endGesture} readOnly={readOnly} />
              </div>
            ) : null}
          </div>
          <DerivedNumbers scene={scene} cellUpdatesPerSecond={cellUpdatesPerSecond} onShowPath={showPath} />
          <div className="flex h-8 shrink-0 items-center gap-3 border-t border-rule bg-panel px-3 text-[12px]" data-testid="editor-status">
            {notice ? (
              <span role="status" className="font-medium text-ember-700">
                {notice}
              </span>
            ) : (
              <span className="truncate text-muted">
                {!readOnly ? <span className="mr-1.5 font-medium text-ink-soft">{toolSpec(activeTool).label}:</span> : null}
                {hint}
              </span>
            )}
            <span className="ml-auto shrink-0 font-mono text-[11.5px] text-muted">
              {scene.geometry.solids.length + scene.geometry.walls.length + scene.geometry.surfaces.length} shapes · {scene.sources.length} source{scene.sources.length === 1 ? "" : "s"} ·{" "}
              {scene.receivers.length + scene.receiverLines.reduce((n, line) => n + line.count, 0)} receivers
            </span>
          </div>
        </div>
        <aside className="flex w-[21rem] shrink-0 flex-col border-l border-rule bg-panel">
          <div className="min-h-0 flex-1 overflow-y-auto overscroll-contain">
            <Inspector
            scene={scene}
            grid={grid}
            selection={selection}
            readOnly={readOnly}
            tryApply={(next, nextSelection) => tryApply(next, nextSelection)}
            onSelect={select}
            onDelete={(ref) => deleteSelected(ref)}
            onDuplicate={duplicate}
            />
          </div>
        </aside>
      </div>
    </div>
  );
}
