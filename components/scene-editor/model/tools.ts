// The drawing canvas's tools and keyboard commands: one table that the toolbar, the tooltips, the
// help panel and the key handler all read, so a shortcut is never documented in one place and
// different in another.

export type ToolId = "select" | "solid" | "wall" | "surface" | "source" | "receiver" | "receiverLine";

export interface ToolSpec {
  id: ToolId;
  label: string;
  /** Single key that picks the tool (shown upper-case). */
  key: string;
  /** One line on how to use it, shown in the tooltip and the status bar. */
  hint: string;
}

export const TOOLS: readonly ToolSpec[] = [
  { id: "select", label: "Select and move", key: "M", hint: "Click to select, drag to move. Drag a handle to reshape; double-click an edge to add a corner." },
  { id: "solid", label: "Solid", key: "B", hint: "Click each corner. Double-click, Enter or a click on the first corner closes the outline." },
  { id: "wall", label: "Barrier", key: "W", hint: "Click along the centre line. Double-click or Enter ends it. Shift keeps 45° steps." },
  { id: "surface", label: "Treated surface", key: "T", hint: "Click along a face to line it. Double-click or Enter ends it. Shift keeps 45° steps." },
  { id: "source", label: "Source", key: "S", hint: "Click to place a source; it takes the signal of the last source." },
  { id: "receiver", label: "Receiver", key: "R", hint: "Click to place a receiver." },
  { id: "receiverLine", label: "Receiver line", key: "L", hint: "Click the first receiver's position, then the last's." },
];

export function toolSpec(id: ToolId): ToolSpec {
  return TOOLS.find((tool) => tool.id === id)!;
}

/** The tool a bare key press picks, if any (case-insensitive). */
export function toolForKey(key: string): ToolId | null {
  const upper = key.toUpperCase();
  return TOOLS.find((tool) => tool.key === upper)?.id ?? null;
}

/** Tools that build an entity from several clicks. */
export function isPathTool(id: ToolId): boolean {
  return id === "solid" || id === "wall" || id === "surface" || id === "receiverLine";
}

export interface CommandSpec {
  keys: string;
  does: string;
}

/** Everything else the keyboard does, for the help panel. "Mod" is Ctrl, or Cmd on a Mac. */
export const COMMANDS: readonly CommandSpec[] = [
  { keys: "Mod+Z", does: "Undo" },
  { keys: "Shift+Mod+Z  or  Mod+Y", does: "Redo" },
  { keys: "Delete / Backspace", does: "Delete the selection, or the last corner while drawing" },
  { keys: "Escape", does: "Stop drawing, then clear the selection" },
  { keys: "Enter", does: "Finish the outline or line being drawn" },
  { keys: "Arrow keys", does: "Nudge the selection one grid step (Shift: ten)" },
  { keys: "Mod+D", does: "Duplicate the selection" },
  { keys: "F", does: "Zoom to fit the whole grid" },
  { keys: "G", does: "Snapping to the grid on or off (hold Alt to skip it once)" },
  { keys: "Space + drag, middle drag", does: "Pan" },
  { keys: "Wheel", does: "Zoom about the cursor" },
  { keys: "?", does: "Show or hide this list" },
];

/** "Mod" as this platform writes it. */
export function platformKeys(keys: string, isMac: boolean): string {
  return keys.replaceAll("Mod", isMac ? "⌘" : "Ctrl");
}
