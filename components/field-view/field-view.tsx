"use client";
// The pressure-field view: a WebGL canvas with the field (or a 2D-canvas fallback) and a vector overlay
// with the scene, axes and colour bar, kept at equal scale in metres and letterboxed; a status line reads
// out position, pressure and level under the cursor; `exportPng` (through a ref) saves both layers as one
// image. The renderer is created in an effect and destroyed in its cleanup; each new field only uploads
// its values and draws.
import { memo, useEffect, useImperativeHandle, useMemo, useRef, useState, useSyncExternalStore, type PointerEvent as ReactPointerEvent, type Ref } from "react";

import { deriveGrid } from "@/lib/fdtd/grid";
import type { Scene } from "@/lib/fdtd/scene";
import type { FieldSnapshot, LevelMaps } from "@/lib/fdtd/simulation";

import { colourIndex } from "./field-colouring";
import { createCanvasFieldRenderer } from "./field-fallback";
import {
  differenceDisplay,
  emptyDisplay,
  levelDisplay,
  pressureDisplay,
  readoutAt,
  type DisplayResult,
  type FieldRange,
  type FieldViewMode,
} from "./field-display";
import { OVERLAY_COLOURS, renderFieldOverlay } from "./field-overlay";
import { FieldMarkers, type FieldMarker } from "./field-markers";
import { createWebGlFieldRenderer, type FieldRenderer } from "./field-renderer";
import { cellsPerArrowFor, intensityArrows } from "./intensity-arrows";
import { createRangeScratch, levelDifferenceSnapshot, levelSnapshot, sampleField } from "./levels";
import { computeViewLayout, fieldWorldRect, sceneExtent, toDeviceViewport, toWorld, type ViewLayout } from "./view-layout";
import { isWebGlAvailable, isWebGlAvailableOnServer, reportWebGlUnavailable, subscribeWebGlSupport } from "./webgl-support";

export type { FieldRange, FieldViewMode } from "./field-display";

/** Time-averaged intensity components, W/m^2, on one grid. */
export interface IntensityField {
  x: FieldSnapshot;
  y: FieldSnapshot;
}

export interface FieldViewHandle {
  /** Both layers of the current frame composited into one PNG. */
  exportPng(): Promise<Blob>;
  /** The colour range drawn now, in the mode's unit (Pa or dB); undefined when nothing is drawn. */
  currentRange(): { low: number; high: number } | undefined;
}

export interface FieldViewProps {
  /** The parsed scene (defaults filled) the field belongs to. */
  scene: Scene;
  /** The pressure field to show in "pressure" mode; null before the first snapshot. */
  field: FieldSnapshot | null;
  mode: FieldViewMode;
  /** This run's level maps, for the level modes. */
  levelMaps?: LevelMaps;
  /** The reference run's level maps, for the level difference (insertion loss = reference minus this run). */
  comparison?: LevelMaps;
  /** Which maps the level difference compares (default RMS, the energy-equivalent level). */
  differenceOf?: "peak" | "rms";
  /** Intensity arrows drawn over the level maps. */
  intensity?: IntensityField;
  range: FieldRange;
  className?: string;
  /** "auto" picks WebGL with float textures where possible; the others force a path (for the harness and tests). */
  renderer?: "auto" | "webgl-bytes" | "canvas-2d";
  ref?: Ref<FieldViewHandle>;
  /** Numbered markers in scene metres (comment pins); none by default. */
  markers?: readonly FieldMarker[];
  /** The marker drawn larger (the one just jumped to); flashKey makes it flash again. */
  emphasisedMarkerId?: string | null;
  flashKey?: number;
  onMarkerSelect?: (id: string) => void;
  /** When set, a click on the plot hands back the scene point under it, m (pin mode). */
  onPickPoint?: (point: { x: number; y: number }) => void;
}

const NO_MARKERS: readonly FieldMarker[] = [];

const FALLBACK_MESSAGE = "WebGL is not available in this browser: showing a static image";

interface CanvasSize {
  width: number;
  height: number;
  pixelRatio: number;
}

function sizeCanvas(canvas: HTMLCanvasElement, layout: ViewLayout): void {
  const width = Math.max(1, Math.round(layout.cssWidth * layout.pixelRatio));
  const height = Math.max(1, Math.round(layout.cssHeight * layout.pixelRatio));
  if (canvas.width !== width) canvas.width = width;
  if (canvas.height !== height) canvas.height = height;
}

function FieldViewComponent({
  scene,
  field,
  mode,
  levelMaps,
  comparison,
  differenceOf = "rms",
  intensity,
  range,
  className = "",
  renderer: rendererChoice = "auto",
  ref,
  markers = NO_MARKERS,
  emphasisedMarkerId = null,
  flashKey,
  onMarkerSelect,
  onPickPoint,
}: FieldViewProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  const fieldCanvasRef = useRef<HTMLCanvasElement>(null);
  const overlayCanvasRef = useRef<HTMLCanvasElement>(null);
  const rendererRef = useRef<FieldRenderer | null>(null);
  const redrawRef = useRef<() => void>(() => {});
  const drawnRangeRef = useRef<{ low: number; high: number } | undefined>(undefined);
  const [size, setSize] = useState<CanvasSize | null>(null);
  const [hover, setHover] = useState<{ x: number; y: number } | null>(null);
  const [fontsLoaded, setFontsLoaded] = useState(0);

  const webGlAvailable = useSyncExternalStore(subscribeWebGlSupport, isWebGlAvailable, isWebGlAvailableOnServer);
  const backend = !webGlAvailable || rendererChoice === "canvas-2d" ? "canvas-2d" : rendererChoice === "webgl-bytes" ? "webgl-bytes" : "webgl";

  const grid = useMemo(() => deriveGrid(scene), [scene]);
  const extent = useMemo(() => sceneExtent(scene, grid), [scene, grid]);
  const layout = useMemo(() => (size ? computeViewLayout(size.width, size.height, size.pixelRatio, extent.outer) : undefined), [size, extent]);
  // Histogram scratch for the automatic ranges, reused for every frame.
  const scratch = useMemo(() => createRangeScratch(), []);

  // Level maps in dB are computed once per run and mode, not per frame.
  const levels = useMemo(() => {
    if (!levelMaps || (mode !== "peak-level" && mode !== "rms-level")) return null;
    return levelSnapshot(mode === "peak-level" ? levelMaps.peak : levelMaps.rms);
  }, [levelMaps, mode]);
  const difference = useMemo((): { map: FieldSnapshot } | { problem: string } | null => {
    if (mode !== "level-difference" || !levelMaps || !comparison) return null;
    try {
      const pick = (maps: LevelMaps) => (differenceOf === "peak" ? maps.peak : maps.rms);
      return { map: levelDifferenceSnapshot(pick(comparison), pick(levelMaps)) };
    } catch (error) {
      return { problem: error instanceof Error ? error.message : String(error) };
    }
  }, [mode, levelMaps, comparison, differenceOf]);

  const result = useMemo((): DisplayResult => {
    switch (mode) {
      case "pressure":
        return field ? { kind: "ready", display: pressureDisplay(field, range, scratch) } : emptyDisplay(mode);
      case "peak-level":
      case "rms-level":
        return levels && levelMaps
          ? { kind: "ready", display: levelDisplay(levels, mode === "peak-level" ? "peak" : "rms", levelMaps.samples, grid.timeStep, range, scratch) }
          : emptyDisplay(mode);
      case "level-difference":
        if (!levelMaps) return emptyDisplay(mode, "This run kept no level maps.");
        if (!difference) return emptyDisplay(mode);
        return "map" in difference ? { kind: "ready", display: differenceDisplay(difference.map, differenceOf, range, scratch) } : emptyDisplay(mode, difference.problem);
    }
  }, [mode, field, levels, levelMaps, difference, differenceOf, range, scratch, grid.timeStep]);

  // Arrows belong on the peak and RMS level maps; they are decimated for the current zoom once, not per frame.
  const arrows = useMemo(() => {
    if (!intensity || !layout || (mode !== "peak-level" && mode !== "rms-level")) return undefined;
    return intensityArrows(intensity.x, intensity.y, cellsPerArrowFor(intensity.x.spacing, layout.pixelsPerMetre));
  }, [intensity, layout, mode]);

  // Follow the container's size (CSS px) and the device pixel ratio (which changes when the window moves to
  // another screen or the page is zoomed, without any resize of the container).
  useEffect(() => {
    const container = containerRef.current;
    if (!container) return;
    // The canvases fill the padding box (absolute, inset 0): clientWidth/Height, borders excluded.
    const measure = () => {
      setSize((old) => {
        const next = { width: container.clientWidth, height: container.clientHeight, pixelRatio: window.devicePixelRatio || 1 };
        return old && old.width === next.width && old.height === next.height && old.pixelRatio === next.pixelRatio ? old : next;
      });
    };
    const observer = new ResizeObserver(measure);
    observer.observe(container);
    let ratioQuery: MediaQueryList | undefined;
    const watchRatio = () => {
      ratioQuery?.removeEventListener("change", onRatioChange);
      ratioQuery = window.matchMedia(`(resolution: ${window.devicePixelRatio || 1}dppx)`);
      ratioQuery.addEventListener("change", onRatioChange);
    };
    function onRatioChange() {
      measure();
      watchRatio();
    }
    watchRatio();
    return () => {
      observer.disconnect();
      ratioQuery?.removeEventListener("change", onRatioChange);
    };
  }, []);

  // Canvas text needs the web font loaded; redraw the overlay once it is.
  useEffect(() => {
    let live = true;
    document.fonts?.ready.then(() => {
      if (live) setFontsLoaded((n) => n + 1);
    });
    return () => {
      live = false;
    };
  }, []);

  // The field renderer: created once per canvas and backend, destroyed in cleanup.
  useEffect(() => {
    const canvas = fieldCanvasRef.current;
    if (!canvas) return;
    let renderer: FieldRenderer;
    if (backend === "canvas-2d") {
      renderer = createCanvasFieldRenderer(canvas);
    } else {
      try {
        renderer = createWebGlFieldRenderer(canvas, { forceByteTextures: backend === "webgl-bytes" });
      } catch {
        // The probe said yes but the context or shaders said no: every view falls back and says so.
        reportWebGlUnavailable();
        return;
      }
    }
    rendererRef.current = renderer;
    return () => {
      rendererRef.current = null;
      renderer.destroy();
    };
  }, [backend]);

  // Field layer: upload and draw whenever the values, range or layout change.
  useEffect(() => {
    const canvas = fieldCanvasRef.current;
    const draw = () => {
      const renderer = rendererRef.current;
      if (!canvas || !renderer || !layout) return;
      sizeCanvas(canvas, layout);
      if (result.kind !== "ready") {
        drawnRangeRef.current = undefined;
        renderer.clear();
        return;
      }
      const { values, low, high, scale } = result.display;
      drawnRangeRef.current = { low, high };
      renderer.render({
        values: values.values,
        width: values.width,
        height: values.height,
        low,
        high,
        scale,
        viewport: toDeviceViewport(layout, fieldWorldRect(values)),
        clip: toDeviceViewport(layout, extent.domain),
      });
    };
    redrawRef.current = draw;
    draw();
  }, [result, layout, extent, backend]);

  // Overlay layer: scene, axes, caption, colour bar, arrows.
  useEffect(() => {
    const canvas = overlayCanvasRef.current;
    const context = canvas?.getContext("2d");
    if (!canvas || !context || !layout) return;
    sizeCanvas(canvas, layout);
    const display = result.kind === "ready" ? result.display : undefined;
    // Arrows switch to light strokes where the colour under them is dark (OKLab lightness below 0.6).
    const isDarkAt = display
      ? (x: number, y: number) => {
          const value = sampleField(display.values, x, y);
          return value !== undefined && display.scale.okLab[colourIndex(value, display.low, display.high)]![0] < 0.6;
        }
      : undefined;
    renderFieldOverlay(context, {
      layout,
      extent,
      scene,
      title: display?.title ?? (result.kind === "empty" ? result.title : ""),
      detail: display?.detail,
      colourBar: display?.colourBar,
      arrows,
      isDarkAt,
      fontFamily: getComputedStyle(canvas).fontFamily || "sans-serif",
    });
  }, [result, layout, extent, scene, arrows, fontsLoaded]);

  useImperativeHandle(
    ref,
    () => ({
      async exportPng() {
        const fieldCanvas = fieldCanvasRef.current;
        const overlayCanvas = overlayCanvasRef.current;
        if (!fieldCanvas || !overlayCanvas) throw new Error("the field view is not mounted");
        // Without preserveDrawingBuffer the WebGL picture is only readable in the task that drew it.
        redrawRef.current();
        const out = document.createElement("canvas");
        out.width = overlayCanvas.width;
        out.height = overlayCanvas.height;
        const context = out.getContext("2d");
        if (!context) throw new Error("no 2D canvas to compose the PNG on");
        context.fillStyle = OVERLAY_COLOURS.panel;
        context.fillRect(0, 0, out.width, out.height);
        context.drawImage(fieldCanvas, 0, 0, out.width, out.height);
        context.drawImage(overlayCanvas, 0, 0);
        return new Promise<Blob>((resolve, reject) => out.toBlob((blob) => (blob ? resolve(blob) : reject(new Error("the browser could not encode the PNG"))), "image/png"));
      },
      currentRange() {
        return drawnRangeRef.current;
      },
    }),
    [],
  );

  const pointAt = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    if (!layout) return null;
    const box = event.currentTarget.getBoundingClientRect();
    const cssX = event.clientX - box.left;
    const cssY = event.clientY - box.top;
    const inside = cssX >= layout.plot.x && cssX <= layout.plot.x + layout.plot.width && cssY >= layout.plot.y && cssY <= layout.plot.y + layout.plot.height;
    return inside ? toWorld(layout, cssX, cssY) : null;
  };
  const onPointerMove = (event: ReactPointerEvent<HTMLCanvasElement>) => setHover(pointAt(event));

  const readout = hover ? readoutAt({ mode, field, levelMaps, comparison, differenceOf }, hover.x, hover.y) : null;

  return (
    <div className={`flex min-h-0 flex-col gap-2 ${className}`}>
      {!webGlAvailable ? (
        <p role="status" className="flex items-center gap-2 rounded-md border border-signal-warn/30 bg-ember-50 px-3 py-2 text-sm text-ink-soft">
          <span aria-hidden className="inline-flex size-5 shrink-0 items-center justify-center rounded-full bg-signal-warn text-xs font-bold text-white">
            !
          </span>
          {FALLBACK_MESSAGE}
        </p>
      ) : null}
      <div ref={containerRef} className="relative min-h-[240px] flex-1 overflow-hidden rounded-lg border border-rule bg-panel">
        <canvas
          key={backend}
          ref={fieldCanvasRef}
          data-layer="field"
          data-renderer={backend}
          className="absolute inset-0 block h-full w-full"
          role="img"
          aria-label={`${result.kind === "ready" ? result.display.title : result.title} over ${scene.name || "the scene"}`}
        />
        <canvas
          ref={overlayCanvasRef}
          data-layer="overlay"
          className="absolute inset-0 block h-full w-full cursor-crosshair font-sans"
          onPointerMove={onPointerMove}
          onPointerLeave={() => setHover(null)}
          onPointerUp={
            onPickPoint
              ? (event) => {
                  const point = pointAt(event);
                  if (point) onPickPoint(point);
                }
              : undefined
          }
          aria-hidden
        />
        {layout && markers.length > 0 ? <FieldMarkers layout={layout} outer={extent.outer} markers={markers} emphasisedId={emphasisedMarkerId} flashKey={flashKey} onSelect={onMarkerSelect} /> : null}
        {result.kind === "empty" && layout ? (
          <div
            className="pointer-events-none absolute flex items-center justify-center p-4 text-center text-sm text-muted"
            style={{ left: layout.plot.x, top: layout.plot.y, width: layout.plot.width, height: layout.plot.height }}
          >
            <span className="rounded-md bg-panel/90 px-3 py-2 shadow-sm ring-1 ring-rule">{result.message}</span>
          </div>
        ) : null}
      </div>
      <p className="tabular flex h-5 flex-wrap items-center gap-x-4 overflow-hidden font-mono text-[12px] text-ink-soft" aria-live="off" data-readout>
        {readout ? (
          readout.map((item) => (
            <span key={item.label} className="whitespace-nowrap">
              <span className="text-muted">{item.label}</span> {item.value}
            </span>
          ))
        ) : (
          <span className="font-sans text-muted">Point at the field to read position, pressure and level.</span>
        )}
      </p>
    </div>
  );
}

/** The field view, memoised: it redraws only when its inputs change. */
export const FieldView = memo(FieldViewComponent);
