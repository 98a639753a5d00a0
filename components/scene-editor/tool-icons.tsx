// Small line icons for the editor's toolbar, drawn for Rarefact on a 20-unit grid.
import type { ReactNode } from "react";

import type { ToolId } from "./model/tools";

function Icon({ children, className = "size-[18px]" }: { children: ReactNode; className?: string }) {
  return (
    <svg viewBox="0 0 20 20" className={className} aria-hidden fill="none" stroke="currentColor" strokeWidth={1.5} strokeLinecap="round" strokeLinejoin="round">
      {children}
    </svg>
  );
}

export function ToolIcon({ tool }: { tool: ToolId }) {
  switch (tool) {
    case "select":
      return (
        <Icon>
          <path d="M5 3.5l9.5 6.2-4.3.8 2.6 5-1.9 1-2.6-5-3.3 2.9z" fill="currentColor" fillOpacity={0.12} />
        </Icon>
      );
    case "solid":
      return (
        <Icon>
          <path d="M3.5 16.5V8l6-4.5 7 3.5v9.5z" fill="currentColor" fillOpacity={0.3} />
        </Icon>
      );
    case "wall":
      return (
        <Icon>
          <path d="M2.5 16.5h15" opacity={0.5} />
          <rect x="8.5" y="3.5" width="3" height="13" fill="currentColor" stroke="none" rx="0.5" />
        </Icon>
      );
    case "surface":
      return (
        <Icon>
          <path d="M3 15.5h14" strokeWidth={2.6} strokeDasharray="3 2" />
          <path d="M3 11.5c2-2 3.5 2 5.5 0s3.5 2 5.5 0 2.5 1.2 3 1" opacity={0.55} />
        </Icon>
      );
    case "source":
      return (
        <Icon>
          <circle cx="6" cy="10" r="2.6" fill="currentColor" />
          <path d="M10.5 6.5a5 5 0 0 1 0 7M13.5 4a8.5 8.5 0 0 1 0 12" />
        </Icon>
      );
    case "receiver":
      return (
        <Icon>
          <path d="M10 4l5.2 9H4.8z" fill="currentColor" />
          <path d="M10 13v3.5" />
        </Icon>
      );
    case "receiverLine":
      return (
        <Icon>
          <path d="M3 14.5L17 5.5" strokeDasharray="1 2.4" />
          <circle cx="3.5" cy="14.2" r="1.6" fill="currentColor" stroke="none" />
          <circle cx="10" cy="10" r="1.6" fill="currentColor" stroke="none" />
          <circle cx="16.5" cy="5.8" r="1.6" fill="currentColor" stroke="none" />
        </Icon>
      );
  }
}

export function UndoIcon() {
  return (
    <Icon>
      <path d="M7.5 5L4 8.5 7.5 12" />
      <path d="M4.5 8.5h7a4.5 4.5 0 0 1 0 9H9" />
    </Icon>
  );
}

export function RedoIcon() {
  return (
    <Icon>
      <path d="M12.5 5L16 8.5 12.5 12" />
      <path d="M15.5 8.5h-7a4.5 4.5 0 0 0 0 9H11" />
    </Icon>
  );
}

export function FitIcon() {
  return (
    <Icon>
      <path d="M3.5 7V3.5H7M13 3.5h3.5V7M16.5 13v3.5H13M7 16.5H3.5V13" />
      <rect x="7" y="7.5" width="6" height="5" rx="0.5" opacity={0.6} />
    </Icon>
  );
}

export function ZoomIcon({ direction }: { direction: "in" | "out" }) {
  return (
    <Icon>
      <path d="M5 10h10" />
      {direction === "in" ? <path d="M10 5v10" /> : null}
    </Icon>
  );
}

export function MagnetIcon() {
  return (
    <Icon>
      <path d="M5 3.5v6.5a5 5 0 0 0 10 0V3.5h-3v6.5a2 2 0 0 1-4 0V3.5z" />
      <path d="M5 6.5h3M12 6.5h3" />
    </Icon>
  );
}

export function GridIcon() {
  return (
    <Icon>
      <rect x="3.5" y="3.5" width="13" height="13" rx="1" />
      <path d="M3.5 8h13M3.5 12h13M8 3.5v13M12 3.5v13" opacity={0.6} />
    </Icon>
  );
}

export function LabelIcon() {
  return (
    <Icon>
      <path d="M3.5 5.5h8l5 4.5-5 4.5h-8z" />
      <path d="M6.5 10h4" opacity={0.7} />
    </Icon>
  );
}
