"use client";
// The import dialog: choose a drawing (.dxf), a coordinate table (.csv) or a recording (.wav), make
// the choices that file needs, and add the result to the scene as one undoable edit. A file that
// cannot be used shows why here, and the scene is left as it was.
import { useEffect, useId, useRef, useState, type KeyboardEvent as ReactKeyboardEvent } from "react";
import { createPortal } from "react-dom";

import type { Scene } from "@/lib/fdtd/scene";
import { IMPORT_FILE_EXTENSIONS } from "@/lib/scene-import/file-kinds";

import { CsvImportPanel } from "./csv-import-panel";
import { DxfImportPanel } from "./dxf-import-panel";
import type { PlannedImport } from "./import-edits";
import type { Refusal } from "./import-footer";
import { loadImportFile, type LoadedImport } from "./load-import-file";
import { WavImportPanel } from "./wav-import-panel";

export interface ImportDialogProps {
  scene: Scene;
  /** The selected source, offered first when a recording is imported. */
  preferredSourceId: string | null;
  /** Applies a new scene as one step of the editor's history; returns why it was refused, or null. */
  onApply: (scene: Scene) => string | null;
  /** Tells the editor what was imported, for its status line. */
  onImported: (notice: string) => void;
  onClose: () => void;
}

const KIND_TITLES: Record<LoadedImport["kind"], string> = { dxf: "Drawing", csv: "Coordinate table", wav: "Recording" };

/** Where the chosen file is; `choice` numbers the file choices, so a panel starts afresh for each file. */
type Reading = { state: "idle" } | { state: "reading"; fileName: string } | { state: "failed"; message: string } | { state: "loaded"; loaded: LoadedImport; choice: number };

export function ImportDialog({ scene, preferredSourceId, onApply, onImported, onClose }: ImportDialogProps) {
  const [reading, setReading] = useState<Reading>({ state: "idle" });
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  // Each file choice gets a number, so a slow read that finishes after a newer choice is dropped.
  const latestChoice = useRef(0);
  const dialog = useRef<HTMLDivElement>(null);
  const titleId = useId();
  const fileInputId = useId();

  // Focus moves into the dialog on opening and back to where it was (the toolbar button) on closing.
  useEffect(() => {
    const before = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    dialog.current?.querySelector<HTMLElement>("input, button")?.focus();
    return () => before?.focus();
  }, []);

  const chooseFile = async (file: File | undefined) => {
    if (!file) return;
    const choice = ++latestChoice.current;
    setRefusal(null);
    setReading({ state: "reading", fileName: file.name });
    const result = await loadImportFile(file);
    if (choice !== latestChoice.current) return;
    setReading(result.ok ? { state: "loaded", loaded: result.loaded, choice } : { state: "failed", message: result.message });
  };

  const apply = (fileName: string) => (plan: PlannedImport) => {
    const refused = onApply(plan.scene);
    if (refused) {
      setRefusal({ plan, message: refused });
      return;
    }
    onImported(`Imported ${plan.added} from ${fileName}.`);
    onClose();
  };

  // Keys stay in the dialog: the editor's shortcuts (Delete, arrows, tool keys) must not act behind it.
  const onKeyDown = (event: ReactKeyboardEvent<HTMLDivElement>) => {
    event.stopPropagation();
    if (event.key === "Escape" && !event.defaultPrevented) {
      event.preventDefault();
      onClose();
    }
  };

  const loaded = reading.state === "loaded" ? reading.loaded : null;
  const panelKey = reading.state === "loaded" ? reading.choice : 0;

  return createPortal(
    <div className="fixed inset-0 z-50 flex items-start justify-center overflow-y-auto bg-night/35 px-4 py-[8vh]" onMouseDown={(event) => event.target === event.currentTarget && onClose()}>
      <div
        ref={dialog}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        data-testid="import-dialog"
        onKeyDown={onKeyDown}
        className="flex w-full max-w-[36rem] flex-col gap-4 rounded-lg border border-rule bg-panel p-5 shadow-[0_18px_48px_-16px_rgba(17,32,41,0.45)]"
      >
        <div className="flex items-baseline justify-between gap-3">
          <h2 id={titleId} className="text-[15px] font-semibold text-ink">
            Import into the scene
          </h2>
          <button type="button" onClick={onClose} className="text-[12.5px] text-muted hover:text-ink">
            Close
          </button>
        </div>

        <div className="flex flex-col gap-1.5">
          <label htmlFor={fileInputId} className="text-[12px] font-medium text-ink-soft">
            File
          </label>
          <input
            id={fileInputId}
            type="file"
            accept={IMPORT_FILE_EXTENSIONS.join(",")}
            data-testid="import-file"
            onChange={(event) => void chooseFile(event.target.files?.[0])}
            className="block w-full text-[12.5px] text-ink-soft file:mr-3 file:h-8 file:rounded-md file:border file:border-rule-strong file:bg-panel file:px-3 file:text-[12.5px] file:font-medium file:text-ink hover:file:border-ink-soft"
          />
          <p className="text-[11.5px] leading-snug text-muted">A drawing (.dxf) adds barriers and solids; a table of x, y (.csv) adds a barrier, a solid or receivers; a recording (.wav) becomes a source&apos;s signal.</p>
        </div>

        {reading.state === "reading" ? (
          <p role="status" className="text-[12.5px] text-muted">
            Reading {reading.fileName}…
          </p>
        ) : null}
        {reading.state === "failed" ? (
          <p role="alert" data-testid="import-problem" className="rounded-md bg-signal-error-50 px-3 py-2 text-[12.5px] leading-snug text-signal-error">
            {reading.message}
          </p>
        ) : null}

        {loaded ? (
          <section className="flex flex-col gap-3" aria-label={`${KIND_TITLES[loaded.kind]} ${loaded.fileName}`}>
            <h3 className="text-[11px] font-semibold uppercase tracking-[0.08em] text-muted">
              {KIND_TITLES[loaded.kind]} · <span className="normal-case tracking-normal text-ink-soft">{loaded.fileName}</span>
            </h3>
            {loaded.kind === "dxf" ? <DxfImportPanel key={panelKey} scene={scene} drawing={loaded.drawing} refusal={refusal} onApply={apply(loaded.fileName)} onCancel={onClose} /> : null}
            {loaded.kind === "csv" ? <CsvImportPanel key={panelKey} scene={scene} text={loaded.text} refusal={refusal} onApply={apply(loaded.fileName)} onCancel={onClose} /> : null}
            {loaded.kind === "wav" ? (
              <WavImportPanel key={panelKey} scene={scene} recording={loaded.recording} preferredSourceId={preferredSourceId} refusal={refusal} onApply={apply(loaded.fileName)} onCancel={onClose} />
            ) : null}
          </section>
        ) : null}
      </div>
    </div>,
    document.body,
  );
}
