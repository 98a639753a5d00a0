"use client";
// The scene as JSON in Monaco, in step with the canvas. Typing that yields a valid scene updates the
// canvas at once; anything else keeps the text, marks every problem on its line (the JSON Schema's
// checks from Monaco's JSON worker, and parseScene's cross-field checks placed by JSON path) and leaves
// the canvas alone. A change from the canvas reformats the text only when the person is not typing here.
import { Editor, type Monaco as EditorApi } from "@monaco-editor/react";
import type * as MonacoApi from "monaco-editor";
import { forwardRef, memo, useCallback, useEffect, useImperativeHandle, useLayoutEffect, useRef, useState } from "react";

import { parseScene, type Scene, type SceneProblem } from "@/lib/fdtd/scene";

import { lineAndColumn, locateJsonPath } from "./model/json-locator";
import { formatSceneJson, readSceneText, sameSceneData } from "./model/scene-text";
import { loadMonaco, SCENE_MODEL_PREFIX, THEME_NAME, type Monaco } from "./monaco/load-monaco";

/** Owner of the markers this view sets, beside the JSON worker's own. */
const MARKER_OWNER = "rarefact-scene";
/** Pause in typing before the text is read (ms): short enough to feel immediate. */
const READ_DELAY_MS = 180;
/**
 * Pause before the scene's own problems are marked (ms): longer than the JSON worker's validation delay
 * (about 500 ms), so a line the schema already marks is known and not marked twice.
 */
const MARK_DELAY_MS = 750;

type TextStatus = { kind: "in-step" } | { kind: "syntax" } | { kind: "invalid"; problems: SceneProblem[] };

export interface ListedProblem {
  line: number;
  column: number;
  message: string;
  source: "schema" | "scene";
}

export interface CodeViewProps {
  scene: Scene;
  onSceneChange: (scene: Scene) => void;
  /** The person left the text: a burst of typing is over (one undo step in the editor's history). */
  onTypingEnd?: () => void;
  readOnly: boolean;
}

export interface CodeViewHandle {
  /** Scrolls to and selects the field at a JSON path. */
  revealPath: (path: readonly (string | number)[]) => void;
}

let modelCounter = 0;

function markerSignature(markers: readonly MonacoApi.editor.IMarker[]): string {
  return markers.map((m) => `${m.owner}:${m.startLineNumber}:${m.startColumn}:${m.endLineNumber}:${m.endColumn}:${m.message}`).join("|");
}

const CodeViewInner = forwardRef<CodeViewHandle, CodeViewProps>(function CodeView({ scene, onSceneChange, onTypingEnd, readOnly }, ref) {
  const [monaco, setMonaco] = useState<Monaco | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [status, setStatus] = useState<TextStatus>({ kind: "in-step" });
  const [problems, setProblems] = useState<ListedProblem[]>([]);
  const [behind, setBehind] = useState(false);
  const [modelPath] = useState(() => `${SCENE_MODEL_PREFIX}${++modelCounter}.json`);

  const editorRef = useRef<MonacoApi.editor.IStandaloneCodeEditor | null>(null);
  const monacoRef = useRef<EditorApi | null>(null);
  /** The scene the text last stood for (pushed from the text, or written into it). */
  const textScene = useRef<Scene>(scene);
  /** True while the view itself replaces the text, so the change is not read back as typing. */
  const writing = useRef(false);
  const readTimer = useRef<number | null>(null);
  const markTimer = useRef<number | null>(null);
  const sceneProblems = useRef<SceneProblem[]>([]);
  /** The JSON worker's markers when ours were last placed: ours depend on them (no line marked twice). */
  const schemaMarkersSeen = useRef("");
  const latest = useRef({ scene, onSceneChange, onTypingEnd });
  useLayoutEffect(() => {
    latest.current = { scene, onSceneChange, onTypingEnd };
  });
  const [initialText] = useState(() => formatSceneJson(scene));

  useEffect(() => {
    let live = true;
    loadMonaco().then(
      (loaded) => live && setMonaco(loaded),
      (error: unknown) => live && setLoadError(error instanceof Error ? error.message : String(error)),
    );
    return () => {
      live = false;
    };
  }, []);

  /** Every marker on the model, ours and the JSON worker's, as a sorted list for the panel. */
  const listProblems = useCallback(() => {
    const api = monacoRef.current;
    const model = editorRef.current?.getModel();
    if (!api || !model) return;
    const markers = api.editor.getModelMarkers({ resource: model.uri });
    setProblems(
      markers
        .map((m) => ({ line: m.startLineNumber, column: m.startColumn, message: m.message, source: m.owner === MARKER_OWNER ? ("scene" as const) : ("schema" as const) }))
        .sort((a, b) => a.line - b.line || a.column - b.column),
    );
  }, []);

  /**
   * Marks parseScene's problems at their JSON paths, leaving out lines the schema already marks
   * (the same complaint twice in one hover helps nobody).
   */
  const refreshSceneMarkers = useCallback(() => {
    const api = monacoRef.current;
    const model = editorRef.current?.getModel();
    if (!api || !model) return;
    const text = model.getValue();
    const schemaMarkers = api.editor.getModelMarkers({ resource: model.uri }).filter((m) => m.owner !== MARKER_OWNER);
    schemaMarkersSeen.current = markerSignature(schemaMarkers);
    const schemaLines = new Set(schemaMarkers.map((m) => m.startLineNumber));
    const markers: MonacoApi.editor.IMarkerData[] = [];
    for (const problem of sceneProblems.current) {
      const located = locateJsonPath(text, problem.pathSegments);
      if (!located) continue;
      const start = lineAndColumn(text, located.start);
      const end = lineAndColumn(text, located.end);
      if (schemaLines.has(start.line)) continue;
      // The field is there, so "required: expected number" can only mean "expected number".
      const message = located.exact ? problem.message.replace(/^required: /, "") : problem.message;
      markers.push({
        severity: api.MarkerSeverity.Error,
        message: problem.path ? `${message} (at ${problem.path})` : message,
        startLineNumber: start.line,
        startColumn: start.column,
        endLineNumber: end.line,
        endColumn: end.column,
        source: "scene",
      });
    }
    api.editor.setModelMarkers(model, MARKER_OWNER, markers);
  }, []);

  /** Reads the text: pushes a valid scene to the canvas, otherwise shows why not. */
  const readText = useCallback(() => {
    readTimer.current = null;
    const model = editorRef.current?.getModel();
    if (!model) return;
    const reading = readSceneText(model.getValue());
    if (reading.kind === "valid") {
      sceneProblems.current = [];
      setStatus({ kind: "in-step" });
      setBehind(false);
      textScene.current = reading.scene;
      if (!sameSceneData(reading.scene, latest.current.scene)) latest.current.onSceneChange(reading.scene);
    } else if (reading.kind === "invalid") {
      sceneProblems.current = reading.problems;
      setStatus({ kind: "invalid", problems: reading.problems });
    } else {
      sceneProblems.current = [];
      setStatus({ kind: "syntax" });
    }
    if (markTimer.current !== null) window.clearTimeout(markTimer.current);
    if (sceneProblems.current.length === 0) refreshSceneMarkers();
    else markTimer.current = window.setTimeout(refreshSceneMarkers, MARK_DELAY_MS);
  }, [refreshSceneMarkers]);

  /** Replaces the text with the scene, keeping the scroll position and Monaco's own undo stack. */
  const writeScene = useCallback((next: Scene) => {
    const editor = editorRef.current;
    const model = editor?.getModel();
    if (!editor || !model) return;
    const text = formatSceneJson(next);
    textScene.current = next;
    if (model.getValue() !== text) {
      const viewState = editor.saveViewState();
      writing.current = true;
      editor.pushUndoStop();
      editor.executeEdits("canvas", [{ range: model.getFullModelRange(), text }]);
      editor.pushUndoStop();
      writing.current = false;
      if (viewState) editor.restoreViewState(viewState);
    }
    sceneProblems.current = [];
    refreshSceneMarkers();
    setStatus({ kind: "in-step" });
    setBehind(false);
  }, [refreshSceneMarkers]);

  // A scene from elsewhere (canvas, inspector, undo): show it unless the person is typing here or the
  // text holds an unfinished edit that would be lost.
  useEffect(() => {
    const editor = editorRef.current;
    if (!editor) return;
    if (sameSceneData(scene, textScene.current)) return;
    if (editor.hasTextFocus() || status.kind !== "in-step") {
      setBehind(true);
      return;
    }
    writeScene(scene);
  }, [scene, status.kind, writeScene]);

  useImperativeHandle(
    ref,
    () => ({
      revealPath: (path) => {
        const editor = editorRef.current;
        const model = editor?.getModel();
        if (!editor || !model) return;
        const located = locateJsonPath(model.getValue(), path);
        if (!located) return;
        const start = model.getPositionAt(located.start);
        const end = model.getPositionAt(located.end);
        editor.setSelection({ startLineNumber: start.lineNumber, startColumn: start.column, endLineNumber: end.lineNumber, endColumn: end.column });
        editor.revealRangeInCenter({ startLineNumber: start.lineNumber, startColumn: start.column, endLineNumber: end.lineNumber, endColumn: end.column });
      },
    }),
    [],
  );

  const onMount = useCallback(
    (editor: MonacoApi.editor.IStandaloneCodeEditor, api: EditorApi) => {
      editorRef.current = editor;
      monacoRef.current = api;
      const disposables = [
        api.editor.onDidChangeMarkers((uris) => {
          const model = editor.getModel();
          if (!model || !uris.some((uri) => uri.toString() === model.uri.toString())) return;
          // Re-place ours only when the schema's changed; our own change must not set them again (a loop).
          const schemaMarkers = api.editor.getModelMarkers({ resource: model.uri }).filter((m) => m.owner !== MARKER_OWNER);
          if (markerSignature(schemaMarkers) !== schemaMarkersSeen.current) refreshSceneMarkers();
          listProblems();
        }),
        editor.onDidBlurEditorText(() => {
          latest.current.onTypingEnd?.();
          // Leaving the text: catch up with the canvas if the text is a valid scene that fell behind.
          const reading = readSceneText(editor.getModel()?.getValue() ?? "");
          if (reading.kind === "valid" && !sameSceneData(reading.scene, latest.current.scene)) {
            if (sameSceneData(reading.scene, textScene.current)) writeScene(latest.current.scene);
          }
        }),
      ];
      editor.onDidDispose(() => {
        for (const d of disposables) d.dispose();
        editorRef.current = null;
      });
      // The model may outlive an earlier mount (React development remounts): start from the current scene.
      if (!sameSceneData(readSceneTextScene(editor.getModel()?.getValue()), latest.current.scene)) writeScene(latest.current.scene);
      refreshSceneMarkers();
      listProblems();
    },
    [listProblems, refreshSceneMarkers, writeScene],
  );

  const onChange = useCallback(() => {
    if (writing.current) return;
    if (readTimer.current !== null) window.clearTimeout(readTimer.current);
    readTimer.current = window.setTimeout(readText, READ_DELAY_MS);
  }, [readText]);

  useEffect(
    () => () => {
      if (readTimer.current !== null) window.clearTimeout(readTimer.current);
      if (markTimer.current !== null) window.clearTimeout(markTimer.current);
    },
    [],
  );

  const goTo = (problem: ListedProblem) => {
    const editor = editorRef.current;
    if (!editor) return;
    editor.setPosition({ lineNumber: problem.line, column: problem.column });
    editor.revealLineInCenter(problem.line);
    editor.focus();
  };

  const showCanvasScene = () => {
    writeScene(latest.current.scene);
    editorRef.current?.focus();
  };

  return (
    <div className="flex h-full min-h-0 flex-col bg-panel" data-testid="code-view">
      <div className="relative min-h-0 flex-1">
        {loadError ? (
          <p className="p-4 text-sm text-signal-error">The code editor could not start: {loadError}</p>
        ) : monaco ? (
          <Editor
            path={modelPath}
            defaultLanguage="json"
            defaultValue={initialText}
            theme={THEME_NAME}
            onMount={onMount}
            onChange={onChange}
            loading={<CodeLoading />}
            options={{
              readOnly,
              minimap: { enabled: false },
              fontFamily: "var(--font-mono), ui-monospace, monospace",
              fontSize: 12.5,
              lineHeight: 19,
              tabSize: 2,
              insertSpaces: true,
              scrollBeyondLastLine: false,
              automaticLayout: true,
              renderLineHighlight: "line",
              glyphMargin: false,
              folding: true,
              lineNumbersMinChars: 3,
              fixedOverflowWidgets: true,
              padding: { top: 10, bottom: 10 },
              scrollbar: { verticalScrollbarSize: 10, horizontalScrollbarSize: 10 },
              overviewRulerBorder: false,
              hover: { delay: 250 },
              quickSuggestions: { strings: true, other: true, comments: false },
            }}
          />
        ) : (
          <CodeLoading />
        )}
      </div>
      <CodeStatus status={status} problems={problems} behind={behind} onGoTo={goTo} onShowCanvasScene={showCanvasScene} />
    </div>
  );
});

function readSceneTextScene(text: string | undefined): Scene | null {
  if (!text) return null;
  try {
    const parsed = parseScene(JSON.parse(text));
    return parsed.ok ? parsed.scene : null;
  } catch {
    return null;
  }
}

function CodeLoading() {
  return (
    <div role="status" className="flex h-full flex-col gap-2 p-4">
      {Array.from({ length: 9 }, (_, k) => (
        <div key={k} className="h-3 animate-pulse rounded bg-paper" style={{ width: `${30 + ((k * 37) % 55)}%` }} />
      ))}
      <span className="sr-only">Loading the code editor</span>
    </div>
  );
}

function CodeStatus({
  status,
  problems,
  behind,
  onGoTo,
  onShowCanvasScene,
}: {
  status: TextStatus;
  problems: ListedProblem[];
  behind: boolean;
  onGoTo: (problem: ListedProblem) => void;
  onShowCanvasScene: () => void;
}) {
  const inStep = status.kind === "in-step" && problems.length === 0;
  return (
    <div className="border-t border-rule bg-paper/70" data-testid="code-status">
      <div className="flex items-center gap-2 px-3 py-1.5 text-[12px]">
        <span aria-hidden className={`inline-block size-2 rounded-full ${inStep ? "bg-signal-ok" : "bg-signal-error"}`} />
        <span className={`min-w-0 truncate ${inStep ? "text-ink-soft" : "font-medium text-signal-error"}`} data-testid="code-status-text">
          {inStep
            ? "Valid scene, in step with the drawing"
            : status.kind === "syntax"
              ? "Not JSON yet · the drawing keeps the last valid scene"
              : `${problems.length || (status.kind === "invalid" ? status.problems.length : 0)} problem${problems.length === 1 ? "" : "s"} · the drawing keeps the last valid scene`}
        </span>
        {behind && status.kind !== "in-step" ? (
          <button
            type="button"
            onClick={onShowCanvasScene}
            title="The drawing has changed since: replace this text with the drawing's scene"
            className="ml-auto shrink-0 rounded px-1.5 py-0.5 font-medium text-tide-700 hover:bg-tide-50"
          >
            Discard my text
          </button>
        ) : null}
      </div>
      {problems.length > 0 ? (
        <ul className="max-h-28 overflow-y-auto border-t border-rule px-1 py-1" aria-label="Problems in the scene text" data-testid="code-problems">
          {problems.map((problem, index) => (
            <li key={`${problem.line}-${problem.column}-${index}`}>
              <button type="button" onClick={() => onGoTo(problem)} className="flex w-full items-baseline gap-2 rounded px-2 py-0.5 text-left text-[12px] hover:bg-panel">
                <span className="w-14 shrink-0 font-mono text-[11px] text-muted">
                  {problem.line}:{problem.column}
                </span>
                <span className="text-ink-soft">{problem.message}</span>
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** Memoised: Monaco is costly to re-render, and its props rarely change. */
export const CodeView = memo(CodeViewInner);
