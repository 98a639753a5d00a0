"use client";
// The editor's toolbar: drawing tools (hidden when read-only), undo and redo, imports, display toggles,
// zoom, the view switch between drawing, split and code, and the keyboard help.
import type { ReactNode } from "react";

import type { DrawingSettings } from "./model/drawing";
import { platformKeys, TOOLS, type ToolId } from "./model/tools";
import { NumberField } from "./inspector-fields";
import { isMacPlatform, KeyboardHelp } from "./keyboard-help";
import { FitIcon, GridIcon, LabelIcon, MagnetIcon, RedoIcon, ToolIcon, UndoIcon, ZoomIcon } from "./tool-icons";

export type ViewMode = "canvas" | "split" | "code";

function ToolbarButton({
  label,
  shortcut,
  active,
  toggle,
  disabled,
  onClick,
  children,
  testId,
}: {
  label: string;
  shortcut?: string;
  active?: boolean;
  /** A display toggle (lighter "on" look) rather than a tool. */
  toggle?: boolean;
  disabled?: boolean;
  onClick: () => void;
  children: ReactNode;
  testId?: string;
}) {
  const title = shortcut ? `${label} (${shortcut})` : label;
  return (
    <button
      type="button"
      title={title}
      aria-label={label}
      aria-pressed={active}
      aria-keyshortcuts={shortcut}
      disabled={disabled}
      onClick={onClick}
      data-testid={testId}
      className={`relative flex size-8 items-center justify-center rounded-md transition-colors disabled:cursor-not-allowed disabled:opacity-35 ${
        active
          ? toggle
            ? "bg-tide-50 text-tide-700 ring-1 ring-tide-100 hover:bg-tide-100"
            : "bg-night text-white shadow-sm"
          : "text-ink-soft hover:bg-ink/[0.06] hover:text-ink"
      }`}
    >
      {children}
    </button>
  );
}

function Divider() {
  return <span aria-hidden className="mx-1 h-5 w-px bg-rule" />;
}

export interface EditorToolbarProps {
  tool: ToolId;
  onTool: (tool: ToolId) => void;
  readOnly: boolean;
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
  snapping: boolean;
  onSnapping: (on: boolean) => void;
  showGrid: boolean;
  onShowGrid: (on: boolean) => void;
  showLabels: boolean;
  onShowLabels: (on: boolean) => void;
  onZoomIn: () => void;
  onZoomOut: () => void;
  onFit: () => void;
  view: ViewMode;
  onView: (view: ViewMode) => void;
  helpOpen: boolean;
  onHelp: (open: boolean) => void;
  settings: DrawingSettings;
  onSettings: (settings: DrawingSettings) => void;
  /** Opens the import dialog; no button without it, and none when read only. */
  onImport?: () => void;
}

const VIEW_CHOICES: { value: ViewMode; label: string }[] = [
  { value: "canvas", label: "Drawing" },
  { value: "split", label: "Split" },
  { value: "code", label: "Code" },
];

export function EditorToolbar(props: EditorToolbarProps) {
  const mac = isMacPlatform();
  const canvasVisible = props.view !== "code";
  return (
    <div role="toolbar" aria-label="Scene editor" className="relative flex h-11 shrink-0 items-center gap-0.5 border-b border-rule bg-panel px-2">
      {!props.readOnly ? (
        <>
          <div className="flex items-center gap-0.5" role="group" aria-label="Tools">
            {TOOLS.map((tool) => (
              <ToolbarButton key={tool.id} label={tool.label} shortcut={tool.key} active={props.tool === tool.id} disabled={!canvasVisible} onClick={() => props.onTool(tool.id)} testId={`tool-${tool.id}`}>
                <ToolIcon tool={tool.id} />
              </ToolbarButton>
            ))}
          </div>
          {props.tool === "wall" || props.tool === "receiverLine" ? (
            <div className="ml-2 w-32" data-testid="drawing-setting">
              {props.tool === "wall" ? (
                <NumberField
                  label=""
                  ariaLabel="Thickness of new barriers"
                  unit="m thick"
                  value={props.settings.wallThickness}
                  min={0}
                  exclusiveMin
                  onCommit={(wallThickness) => {
                    if (wallThickness === undefined) return "required";
                    props.onSettings({ ...props.settings, wallThickness });
                    return null;
                  }}
                />
              ) : (
                <NumberField
                  label=""
                  ariaLabel="Receivers on a new receiver line"
                  unit="receivers"
                  value={props.settings.receiverLineCount}
                  integer
                  min={2}
                  max={10_000}
                  onCommit={(receiverLineCount) => {
                    if (receiverLineCount === undefined) return "required";
                    props.onSettings({ ...props.settings, receiverLineCount });
                    return null;
                  }}
                />
              )}
            </div>
          ) : null}
          <Divider />
          <ToolbarButton label="Undo" shortcut={platformKeys("Mod+Z", mac)} disabled={!props.canUndo} onClick={props.onUndo} testId="undo">
            <UndoIcon />
          </ToolbarButton>
          <ToolbarButton label="Redo" shortcut={platformKeys("Shift+Mod+Z", mac)} disabled={!props.canRedo} onClick={props.onRedo} testId="redo">
            <RedoIcon />
          </ToolbarButton>
          {props.onImport ? (
            <>
              <Divider />
              <button
                type="button"
                title="Import a drawing (.dxf), coordinates (.csv) or a recording (.wav)"
                onClick={props.onImport}
                data-testid="import-open"
                className="flex h-8 items-center rounded-md px-2.5 text-[12.5px] font-medium text-ink-soft transition-colors hover:bg-ink/[0.06] hover:text-ink"
              >
                Import…
              </button>
            </>
          ) : null}
          <Divider />
          <ToolbarButton label={props.snapping ? "Snapping on" : "Snapping off"} shortcut="G" active={props.snapping} toggle onClick={() => props.onSnapping(!props.snapping)} disabled={!canvasVisible}>
            <MagnetIcon />
          </ToolbarButton>
        </>
      ) : (
        <span className="mr-2 rounded-full bg-paper px-2.5 py-1 text-[12px] font-medium text-ink-soft ring-1 ring-rule">Read only</span>
      )}
      <ToolbarButton label="Grid lines" active={props.showGrid} toggle onClick={() => props.onShowGrid(!props.showGrid)} disabled={!canvasVisible}>
        <GridIcon />
      </ToolbarButton>
      <ToolbarButton label="Labels" active={props.showLabels} toggle onClick={() => props.onShowLabels(!props.showLabels)} disabled={!canvasVisible}>
        <LabelIcon />
      </ToolbarButton>
      <Divider />
      <ToolbarButton label="Zoom out" onClick={props.onZoomOut} disabled={!canvasVisible}>
        <ZoomIcon direction="out" />
      </ToolbarButton>
      <ToolbarButton label="Zoom to fit" shortcut="F" onClick={props.onFit} disabled={!canvasVisible} testId="zoom-fit">
        <FitIcon />
      </ToolbarButton>
      <ToolbarButton label="Zoom in" onClick={props.onZoomIn} disabled={!canvasVisible}>
        <ZoomIcon direction="in" />
      </ToolbarButton>

      <div className="ml-auto flex items-center gap-2">
        <div role="radiogroup" aria-label="View" className="flex rounded-md border border-rule-strong bg-paper p-0.5">
          {VIEW_CHOICES.map((choice) => (
            <button
              key={choice.value}
              type="button"
              role="radio"
              aria-checked={props.view === choice.value}
              data-testid={`view-${choice.value}`}
              onClick={() => props.onView(choice.value)}
              className={`rounded-[5px] px-2.5 py-1 text-[12.5px] font-medium transition-colors ${
                props.view === choice.value ? "bg-panel text-ink shadow-sm ring-1 ring-rule-strong" : "text-muted hover:text-ink"
              }`}
            >
              {choice.label}
            </button>
          ))}
        </div>
        <button
          type="button"
          data-help-toggle
          aria-expanded={props.helpOpen}
          title="Keyboard shortcuts (?)"
          onClick={() => props.onHelp(!props.helpOpen)}
          className={`flex size-8 items-center justify-center rounded-full border text-[13px] font-semibold transition-colors ${
            props.helpOpen ? "border-night bg-night text-white" : "border-rule-strong text-ink-soft hover:border-ink-soft hover:text-ink"
          }`}
        >
          ?
        </button>
      </div>
      {props.helpOpen ? <KeyboardHelp onClose={() => props.onHelp(false)} /> : null}
    </div>
  );
}
