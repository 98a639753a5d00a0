"use client";
// Loads Monaco from the installed monaco-editor package (never a CDN): workers bundled from
// node_modules, the React wrapper's loader pointed at this copy, the house theme, and the scene's
// JSON Schema attached to every scene model. Runs once per page; every code view awaits the same promise.
import { loader } from "@monaco-editor/react";
import type * as MonacoApi from "monaco-editor";

import { sceneJsonSchema } from "@/lib/fdtd/scene";

export type Monaco = typeof MonacoApi;

/** Scene models are named `.../rarefact-scene-<n>.json`; the schema applies to every one of them. */
export const SCENE_MODEL_PREFIX = "inmemory://rarefact/rarefact-scene-";
const SCENE_SCHEMA_URI = "inmemory://rarefact/schemas/scene.schema.json";
export const THEME_NAME = "rarefact-paper";

let loading: Promise<Monaco> | null = null;

declare global {
  interface Window {
    MonacoEnvironment?: { getWorker(workerId: string, label: string): Worker };
  }
}

function defineTheme(monaco: Monaco): void {
  monaco.editor.defineTheme(THEME_NAME, {
    base: "vs",
    inherit: true,
    rules: [
      { token: "string.key.json", foreground: "0d5f5d" },
      { token: "string.value.json", foreground: "a23f1a" },
      { token: "number.json", foreground: "16212b" },
      { token: "number", foreground: "16212b" },
      { token: "keyword.json", foreground: "127673", fontStyle: "bold" },
      { token: "delimiter", foreground: "66717c" },
    ],
    colors: {
      "editor.background": "#ffffff",
      "editor.foreground": "#16212b",
      "editorGutter.background": "#fbfaf7",
      "editorLineNumber.foreground": "#a3abb2",
      "editorLineNumber.activeForeground": "#3a4753",
      "editor.lineHighlightBackground": "#f7f6f1",
      "editor.lineHighlightBorder": "#00000000",
      "editor.selectionBackground": "#cfe8e6",
      "editor.inactiveSelectionBackground": "#e5f1f0",
      "editorCursor.foreground": "#127673",
      "editorIndentGuide.background1": "#efede6",
      "editorIndentGuide.activeBackground1": "#c9c5b8",
      "editorBracketMatch.background": "#eaf5f4",
      "editorBracketMatch.border": "#7cc3bd",
      "editorError.foreground": "#b42318",
      "editorWarning.foreground": "#b7791f",
      "editorHoverWidget.background": "#ffffff",
      "editorHoverWidget.border": "#dedbd1",
      "editorWidget.background": "#ffffff",
      "editorWidget.border": "#dedbd1",
      "scrollbarSlider.background": "#16212b1a",
      "scrollbarSlider.hoverBackground": "#16212b33",
      "focusBorder": "#1f8f8a",
    },
  });
}

/** Monaco, ready to create scene editors. */
export function loadMonaco(): Promise<Monaco> {
  loading ??= (async () => {
    window.MonacoEnvironment = {
      getWorker(_workerId: string, label: string) {
        if (label === "json") return new Worker(new URL("./json.worker.ts", import.meta.url), { type: "module", name: "rarefact-monaco-json" });
        return new Worker(new URL("./editor.worker.ts", import.meta.url), { type: "module", name: "rarefact-monaco-editor" });
      },
    };
    const monaco = await import("monaco-editor");
    loader.config({ monaco });
    defineTheme(monaco);
    monaco.json.jsonDefaults.setDiagnosticsOptions({
      validate: true,
      allowComments: false,
      enableSchemaRequest: false,
      schemaValidation: "error",
      schemas: [{ uri: SCENE_SCHEMA_URI, fileMatch: ["rarefact-scene-*.json"], schema: sceneJsonSchema() }],
    });
    // Once the page's fonts are in, Monaco must measure IBM Plex Mono again or the cursor drifts.
    void document.fonts?.ready.then(() => monaco.editor.remeasureFonts());
    return monaco;
  })();
  return loading;
}
