"use client";
// The keyboard help popover: every tool's key and every command, read from the same table the key
// handler uses.
import { useEffect, useRef } from "react";

import { COMMANDS, platformKeys, TOOLS } from "./model/tools";
import { ToolIcon } from "./tool-icons";

export function isMacPlatform(): boolean {
  return typeof navigator !== "undefined" && /Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent);
}

function Keys({ keys }: { keys: string }) {
  return (
    <span className="flex flex-wrap justify-end gap-1">
      {keys.split(/\s{2}or\s{2}/).map((combination, k) => (
        <span key={combination} className="flex items-center gap-1">
          {k > 0 ? <span className="text-[11px] text-muted">or</span> : null}
          <kbd className="whitespace-nowrap rounded border border-rule-strong bg-paper px-1.5 py-px font-mono text-[11px] text-ink shadow-[0_1px_0_rgba(22,33,43,0.08)]">{combination}</kbd>
        </span>
      ))}
    </span>
  );
}

export function KeyboardHelp({ onClose }: { onClose: () => void }) {
  const panel = useRef<HTMLDivElement>(null);
  const mac = isMacPlatform();

  useEffect(() => {
    const onPointerDown = (event: PointerEvent) => {
      if (panel.current && !panel.current.contains(event.target as Node) && !(event.target as HTMLElement).closest("[data-help-toggle]")) onClose();
    };
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") {
        event.stopPropagation();
        onClose();
      }
    };
    window.addEventListener("pointerdown", onPointerDown);
    window.addEventListener("keydown", onKey, true);
    return () => {
      window.removeEventListener("pointerdown", onPointerDown);
      window.removeEventListener("keydown", onKey, true);
    };
  }, [onClose]);

  return (
    <div
      ref={panel}
      role="dialog"
      aria-label="Keyboard shortcuts"
      data-testid="keyboard-help"
      className="absolute right-2 top-[calc(100%+6px)] z-30 w-[25rem] rounded-lg border border-rule bg-panel p-4 shadow-[0_12px_32px_-12px_rgba(17,32,41,0.35)]"
    >
      <div className="mb-3 flex items-baseline justify-between">
        <h2 className="text-[13px] font-semibold text-ink">Keyboard</h2>
        <button type="button" onClick={onClose} className="text-[12px] text-muted hover:text-ink">
          Close
        </button>
      </div>
      <h3 className="mb-1.5 text-[11px] font-semibold uppercase tracking-[0.08em] text-muted">Tools</h3>
      <ul className="mb-3 flex flex-col gap-1">
        {TOOLS.map((tool) => (
          <li key={tool.id} className="flex items-center justify-between gap-3 text-[12.5px] text-ink-soft">
            <span className="flex items-center gap-2">
              <span className="text-ink">
                <ToolIcon tool={tool.id} />
              </span>
              {tool.label}
            </span>
            <Keys keys={tool.key} />
          </li>
        ))}
      </ul>
      <h3 className="mb-1.5 text-[11px] font-semibold uppercase tracking-[0.08em] text-muted">Commands</h3>
      <ul className="flex flex-col gap-1">
        {COMMANDS.map((command) => (
          <li key={command.keys} className="flex items-center justify-between gap-3 text-[12.5px] text-ink-soft">
            <span>{command.does}</span>
            <Keys keys={platformKeys(command.keys, mac)} />
          </li>
        ))}
      </ul>
    </div>
  );
}
