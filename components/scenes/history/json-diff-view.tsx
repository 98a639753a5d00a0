"use client";
// Two scene texts side by side in Monaco's diff view, read only, unchanged stretches folded away.
// Monaco comes from the app's own loader (never a CDN), like the scene editor's code view.
import { DiffEditor } from "@monaco-editor/react";
import type * as MonacoApi from "monaco-editor";
import { memo, useCallback, useEffect, useRef, useState } from "react";

import { loadMonaco, THEME_NAME } from "@/components/scene-editor/monaco/load-monaco";

const DIFF_OPTIONS: MonacoApi.editor.IDiffEditorConstructionOptions = {
  readOnly: true,
  originalEditable: false,
  domReadOnly: true,
  renderSideBySide: true,
  useInlineViewWhenSpaceIsLimited: true,
  hideUnchangedRegions: { enabled: true, contextLineCount: 3, minimumLineCount: 6 },
  minimap: { enabled: false },
  automaticLayout: true,
  scrollBeyondLastLine: false,
  renderOverviewRuler: false,
  fontFamily: "var(--font-mono), ui-monospace, monospace",
  fontSize: 12.5,
  lineHeight: 19,
  lineNumbersMinChars: 3,
  glyphMargin: false,
  folding: false,
  scrollbar: { verticalScrollbarSize: 10, horizontalScrollbarSize: 10 },
};

function DiffLoading() {
  return (
    <div role="status" className="flex h-full flex-col gap-2 p-4">
      {Array.from({ length: 8 }, (_, k) => (
        <div key={k} className="h-3 animate-pulse rounded bg-paper" style={{ width: `${35 + ((k * 41) % 50)}%` }} />
      ))}
      <span className="sr-only">Loading the comparison</span>
    </div>
  );
}

function JsonDiffViewInner({ original, modified, className = "" }: { original: string; modified: string; className?: string }) {
  const [ready, setReady] = useState(false);
  const [loadError, setLoadError] = useState<string | null>(null);
  const models = useRef<MonacoApi.editor.ITextModel[]>([]);

  useEffect(() => {
    let live = true;
    loadMonaco().then(
      () => live && setReady(true),
      (error: unknown) => live && setLoadError(error instanceof Error ? error.message : String(error)),
    );
    return () => {
      live = false;
    };
  }, []);

  // The wrapper would dispose the two models before the diff widget that still shows them (Monaco
  // reports that as an error), so it keeps them and they are disposed here once the widget is gone.
  const onMount = useCallback((editor: MonacoApi.editor.IStandaloneDiffEditor) => {
    const pair = editor.getModel();
    models.current = pair ? [pair.original, pair.modified] : [];
  }, []);
  useEffect(
    () => () => {
      const owned = models.current;
      queueMicrotask(() => {
        for (const model of owned) if (!model.isDisposed()) model.dispose();
      });
    },
    [],
  );

  if (loadError) return <p className="p-4 text-sm text-signal-error">The comparison could not start: {loadError}</p>;
  return (
    <div className={`overflow-hidden rounded-md border border-rule bg-panel ${className}`} data-testid="version-diff">
      {ready ? (
        <DiffEditor
          original={original}
          modified={modified}
          language="json"
          theme={THEME_NAME}
          options={DIFF_OPTIONS}
          keepCurrentOriginalModel
          keepCurrentModifiedModel
          onMount={onMount}
          loading={<DiffLoading />}
        />
      ) : (
        <DiffLoading />
      )}
    </div>
  );
}

/** Memoised: Monaco is costly to re-render, and its texts change only with the versions compared. */
export const JsonDiffView = memo(JsonDiffViewInner);
