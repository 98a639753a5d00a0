"use client";
// Numbered markers over the field view (comment pins), placed in the scene's metres through the same
// transform the overlay draws with. They are buttons, so they can be reached and pressed; the one
// just jumped to is drawn larger and flashes.
import { toPixelX, toPixelY, type ViewLayout, type WorldRect } from "./view-layout";

export interface FieldMarker {
  id: string;
  /** Short text on the marker, e.g. the pin's number. */
  label: string;
  /** Scene coordinates, m. */
  x: number;
  y: number;
  /** Tooltip and accessible name. */
  title: string;
  /** Drawn muted (a resolved thread's pin). */
  muted?: boolean;
}

export function FieldMarkers({
  layout,
  outer,
  markers,
  emphasisedId,
  flashKey,
  onSelect,
}: {
  layout: ViewLayout;
  /** Markers outside what the view shows are left off. */
  outer: WorldRect;
  markers: readonly FieldMarker[];
  emphasisedId?: string | null;
  /** Changes on every jump, so the same marker flashes again. */
  flashKey?: number;
  onSelect?: (id: string) => void;
}) {
  return (
    <>
      {markers
        .filter((marker) => marker.x >= outer.xMin && marker.x <= outer.xMax && marker.y >= outer.yMin && marker.y <= outer.yMax)
        .map((marker) => {
          const emphasised = marker.id === emphasisedId;
          return (
            <button
              key={emphasised ? `${marker.id}:${flashKey ?? 0}` : marker.id}
              type="button"
              title={marker.title}
              aria-label={`Pin ${marker.label}: ${marker.title}`}
              onClick={() => onSelect?.(marker.id)}
              data-testid="field-pin"
              data-emphasised={emphasised || undefined}
              // The marker's point is the tip at the bottom centre of the tag.
              style={{ left: toPixelX(layout, marker.x), top: toPixelY(layout, marker.y) }}
              className={`absolute z-10 flex -translate-x-1/2 -translate-y-full flex-col items-center ${emphasised ? "animate-pulse" : ""}`}
            >
              <span
                className={`tabular flex min-w-5 items-center justify-center rounded-full px-1 font-sans font-semibold leading-none text-white shadow ring-2 ring-white ${
                  emphasised ? "h-6 min-w-6 bg-ember-700 text-[12px]" : marker.muted ? "h-5 bg-muted text-[11px]" : "h-5 bg-ember-500 text-[11px]"
                }`}
              >
                {marker.label}
              </span>
              <span aria-hidden className={`-mt-px h-1.5 w-0.5 ${emphasised ? "bg-ember-700" : marker.muted ? "bg-muted" : "bg-ember-500"}`} />
            </button>
          );
        })}
    </>
  );
}
