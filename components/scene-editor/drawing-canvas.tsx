"use client";
// The drawing canvas: the scene in metres (y up) on a static layer, and an interaction overlay on
// which a person selects, drags, and draws solids, barriers, treated surfaces, sources, receivers and
// receiver lines. Every change goes out through `onApply` as a whole new scene; the canvas keeps only
// the view and the gesture in progress.
import { forwardRef, useCallback, useEffect, useImperativeHandle, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent as ReactKeyboardEvent } from "react";

import type { Point, Scene } from "@/lib/fdtd/scene";

import { CANVAS_COLOURS, RULER_SIZE } from "./canvas-style";
import { renderOverlay, type DrawingPreview } from "./render-overlay";
import { renderStaticLayer } from "./render-static-layer";
import { addDrawingPoint, closesOutline, finishDrawing, finishesOnClick, type DrawingSettings } from "./model/drawing";
import type { Selection } from "./model/editor-state";
import { DRAW_ORDER, entitiesOf, entityPoints, sameRef, type EntityRef } from "./model/entities";
import { hitTest, type Hit } from "./model/hit-testing";
import { addReceiver, addSource, insertVertex, moveVertex, tidyCoordinate, translateEntity } from "./model/scene-edits";
import { drawingBounds, type PmlBandWidths } from "./model/scene-extent";
import { constrainDirection, decimalsForStep, gridStepForZoom, snap, snapPoint, type SnapKind } from "./model/snapping";
import { isPathTool, type ToolId } from "./model/tools";
import { fitBounds, panBy, screenToWorld, wheelZoomFactor, zoomAt, type ScreenSize, type Viewport } from "./model/viewport";

/** Pick radius and vertex-snap radius in CSS pixels. */
const PICK_PIXELS = 7;
const VERTEX_SNAP_PIXELS = 9;
/** A press must travel this far (CSS px) before it becomes a drag, so a click never nudges anything. */
const DRAG_THRESHOLD_PIXELS = 3;

export interface ApplyOptions {
  mergeKey?: string | null;
  select?: Selection | null;
}

export interface DrawingCanvasProps {
  scene: Scene;
  /** PML band widths in metres (from the derived cell size). */
  bands: PmlBandWidths;
  selection: Selection | null;
  tool: ToolId;
  readOnly: boolean;
  snapping: boolean;
  showGrid: boolean;
  showLabels: boolean;
  settings: DrawingSettings;
  onApply: (scene: Scene, options?: ApplyOptions) => void;
  onSelect: (selection: Selection | null) => void;
  /** A drag ended: the next edit is a new undo step. */
  onEndGesture: () => void;
  /** Short messages for the status line (e.g. why a click did nothing). */
  onNotice?: (message: string) => void;
}

export interface DrawingCanvasHandle {
  /** Zooms so that the whole grid, PML included, fills the canvas. */
  fit: () => void;
  zoomBy: (factor: number) => void;
  /** Offers a key press to the gesture in progress; true when the canvas used it. */
  handleKey: (event: KeyboardEvent | ReactKeyboardEvent) => boolean;
  /** Grid step the canvas currently snaps to, m. */
  snapStep: () => number;
  /** Whether a shape is being drawn. */
  isDrawing: () => boolean;
}

type Drag =
  | { kind: "pan"; startScreen: Point; startView: Viewport; pointerId: number }
  | {
      kind: "move" | "vertex";
      ref: EntityRef;
      vertex: number;
      /** Scene before the drag: every move is applied to it afresh, so snapping never accumulates error. */
      original: Scene;
      startWorld: Point;
      /** The point that follows the snapped pointer: the grabbed vertex, or the entity's first point. */
      anchor: Point;
      startScreen: Point;
      started: boolean;
      mergeKey: string;
      pointerId: number;
    };

function isTextTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName) || target.closest(".monaco-editor") !== null;
}

let dragCounter = 0;

export const DrawingCanvas = forwardRef<DrawingCanvasHandle, DrawingCanvasProps>(function DrawingCanvas(props, ref) {
  const { scene, bands, selection, tool, readOnly, snapping, showGrid, showLabels, settings, onApply, onSelect, onEndGesture, onNotice } = props;
  const containerRef = useRef<HTMLDivElement>(null);
  const staticRef = useRef<HTMLCanvasElement>(null);
  const overlayRef = useRef<HTMLCanvasElement>(null);
  const [size, setSize] = useState<ScreenSize | null>(null);
  const [view, setView] = useState<Viewport | null>(null);
  const [fontsReady, setFontsReady] = useState(0);
  const [cursor, setCursor] = useState<{ world: Point; snapped: SnapKind } | null>(null);
  const [panning, setPanning] = useState(false);
  const [hoverKind, setHoverKind] = useState<Hit["part"]["type"] | null>(null);

  // Gesture state lives in refs: it changes on every pointer move and only the overlay shows it.
  const hover = useRef<Hit | null>(null);
  const drawingPoints = useRef<Point[]>([]);
  const drawingCursor = useRef<Point | null>(null);
  const snapMark = useRef<{ point: Point; kind: SnapKind } | null>(null);
  const drag = useRef<Drag | null>(null);
  const spaceHeld = useRef(false);
  const overlayFrame = useRef<number | null>(null);
  /** The view follows the canvas size (refits) until the person zooms or pans. */
  const autoFit = useRef(true);

  // Latest props for event handlers and the overlay painter, which outlive renders.
  const latest = useRef({ scene, selection, tool, view, size, snapping, settings, readOnly, bands });
  useLayoutEffect(() => {
    latest.current = { scene, selection, tool, view, size, snapping, settings, readOnly, bands };
  });

  const fonts = useMemo(() => {
    void fontsReady;
    if (typeof window === "undefined") return { sans: "sans-serif", mono: "monospace" };
    const style = getComputedStyle(document.documentElement);
    return {
      sans: style.getPropertyValue("--font-sans").trim() || "sans-serif",
      mono: style.getPropertyValue("--font-mono").trim() || "monospace",
    };
  }, [fontsReady]);

  useEffect(() => {
    let live = true;
    void document.fonts?.ready.then(() => live && setFontsReady((n) => n + 1));
    return () => {
      live = false;
    };
  }, []);

  // Canvas size follows its container.
  useEffect(() => {
    const element = containerRef.current;
    if (!element) return;
    const observer = new ResizeObserver(([entry]) => {
      if (!entry) return;
      const { width, height } = entry.contentRect;
      setSize((previous) => (previous && previous.width === width && previous.height === height ? previous : { width, height }));
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  const fitView = useCallback((): Viewport | null => {
    const { scene: current, size: currentSize, bands: currentBands } = latest.current;
    if (!currentSize || currentSize.width < 10 || currentSize.height < 10) return null;
    const bounds = drawingBounds(current, currentBands);
    // Leave room for the rulers on the left and bottom.
    const fitted = fitBounds(bounds, { width: currentSize.width - RULER_SIZE, height: currentSize.height - RULER_SIZE }, 28);
    return { ...fitted, originX: fitted.originX + RULER_SIZE };
  }, []);

  // A new canvas size: refit while the person has not taken the view in hand, otherwise keep the centre.
  const previousSize = useRef<ScreenSize | null>(null);
  useEffect(() => {
    if (!size) return;
    const before = previousSize.current;
    previousSize.current = size;
    if (autoFit.current || !before) {
      const fitted = fitView();
      if (fitted) setView(fitted);
      return;
    }
    setView((current) => (current ? panBy(current, (size.width - before.width) / 2, (size.height - before.height) / 2) : current));
  }, [size, fitView]);

  const gridStep = view ? gridStepForZoom(view.pixelsPerMetre, 14) : 1;
  const decimals = decimalsForStep(gridStep);

  // Static layer: redrawn when the scene, the view, the size or the display options change.
  useEffect(() => {
    const canvas = staticRef.current;
    if (!canvas || !size || !view) return;
    const ratio = window.devicePixelRatio || 1;
    const width = Math.round(size.width * ratio);
    const height = Math.round(size.height * ratio);
    // Resizing reallocates the canvas; only do it when the size really changed.
    if (canvas.width !== width || canvas.height !== height) {
      canvas.width = width;
      canvas.height = height;
    }
    const context = canvas.getContext("2d");
    if (!context) return;
    context.setTransform(ratio, 0, 0, ratio, 0, 0);
    renderStaticLayer(context, { scene, bands, view, size, gridStep, showGrid, showLabels, fontFamily: fonts.sans, monoFontFamily: fonts.mono });
  }, [scene, bands, view, size, gridStep, showGrid, showLabels, fonts]);

  const paintOverlay = useCallback(() => {
    overlayFrame.current = null;
    const canvas = overlayRef.current;
    const { scene: current, selection: currentSelection, tool: currentTool, view: currentView, size: currentSize, settings: currentSettings } = latest.current;
    if (!canvas || !currentSize || !currentView) return;
    const ratio = window.devicePixelRatio || 1;
    const width = Math.round(currentSize.width * ratio);
    const height = Math.round(currentSize.height * ratio);
    if (canvas.width !== width || canvas.height !== height) {
      canvas.width = width;
      canvas.height = height;
    }
    const context = canvas.getContext("2d");
    if (!context) return;
    context.setTransform(ratio, 0, 0, ratio, 0, 0);
    const points = drawingPoints.current;
    const drawing: DrawingPreview | null =
      isPathTool(currentTool) && !latest.current.readOnly
        ? {
            tool: currentTool,
            points,
            cursor: drawingCursor.current,
            closing: drawingCursor.current !== null && closesOutline(currentTool, points, drawingCursor.current, VERTEX_SNAP_PIXELS / currentView.pixelsPerMetre),
            settings: currentSettings,
          }
        : null;
    renderOverlay(context, {
      scene: current,
      view: currentView,
      size: currentSize,
      selection: currentSelection,
      hover: drag.current ? null : hover.current,
      drawing: drawing && (drawing.points.length > 0 || drawing.cursor) ? drawing : null,
      snapMark: snapMark.current,
      fontFamily: fonts.sans,
      monoFontFamily: fonts.mono,
      // One decimal finer than the grid: a segment drawn between grid points may run diagonally.
      decimals: Math.min(3, decimalsForStep(gridStepForZoom(currentView.pixelsPerMetre, 14)) + 1),
    });
  }, [fonts]);

  const requestOverlay = useCallback(() => {
    if (overlayFrame.current === null) overlayFrame.current = requestAnimationFrame(paintOverlay);
  }, [paintOverlay]);

  useEffect(() => {
    requestOverlay();
  }, [scene, selection, tool, view, size, requestOverlay]);

  useEffect(
    () => () => {
      if (overlayFrame.current !== null) cancelAnimationFrame(overlayFrame.current);
      overlayFrame.current = null;
    },
    [],
  );

  // A new tool starts with nothing drawn.
  useEffect(() => {
    drawingPoints.current = [];
    snapMark.current = null;
    requestOverlay();
  }, [tool, requestOverlay]);

  const screenPoint = (event: { clientX: number; clientY: number }): Point => {
    const rect = overlayRef.current!.getBoundingClientRect();
    return { x: event.clientX - rect.left, y: event.clientY - rect.top };
  };

  /** Every drawn point except those of `exclude`, for snapping onto existing corners. */
  const snapVertices = useCallback((exclude: EntityRef | null, excludeIndex: number | null): Point[] => {
    const current = latest.current.scene;
    const points: Point[] = [];
    for (const kind of DRAW_ORDER) {
      for (const entity of entitiesOf(current, kind)) {
        const entityRef = { kind, id: entity.id };
        entityPoints(current, entityRef).forEach((p, k) => {
          if (sameRef(entityRef, exclude) && (excludeIndex === null || excludeIndex === k)) return;
          points.push(p);
        });
      }
    }
    // Domain corners are natural anchors for ground lines and linings.
    const { width, height } = current.domain;
    points.push({ x: 0, y: 0 }, { x: width, y: 0 }, { x: 0, y: height }, { x: width, y: height });
    return points;
  }, []);

  /** Where the pointer lands: snapped (unless Alt is held or snapping is off) or rounded to a pixel's precision. */
  const landing = useCallback(
    (world: Point, free: boolean, exclude: EntityRef | null = null, excludeIndex: number | null = null): { point: Point; kind: SnapKind } => {
      const currentView = latest.current.view!;
      if (latest.current.snapping && !free) {
        return snap(world, {
          gridStep: gridStepForZoom(currentView.pixelsPerMetre, 14),
          vertices: snapVertices(exclude, excludeIndex),
          vertexTolerance: VERTEX_SNAP_PIXELS / currentView.pixelsPerMetre,
        });
      }
      // Without snapping, a pixel's worth of precision: no 12.3456789 m from a hand on a mouse.
      const precision = 10 ** Math.floor(Math.log10(1 / currentView.pixelsPerMetre));
      return { point: snapPoint(world, precision), kind: "none" };
    },
    [snapVertices],
  );

  const finishPath = useCallback(() => {
    const { scene: current, tool: currentTool, settings: currentSettings } = latest.current;
    const added = finishDrawing(current, currentTool, drawingPoints.current, currentSettings);
    drawingPoints.current = [];
    if (added) {
      onApply(added.scene, { select: { ref: added.ref, vertex: null } });
      onEndGesture();
    } else if (currentTool === "solid") {
      onNotice?.("A solid needs three corners that enclose some area.");
    }
    requestOverlay();
  }, [onApply, onEndGesture, onNotice, requestOverlay]);

  const cancelDrawing = useCallback((): boolean => {
    if (drawingPoints.current.length === 0) return false;
    drawingPoints.current = [];
    requestOverlay();
    return true;
  }, [requestOverlay]);

  useImperativeHandle(
    ref,
    () => ({
      fit: () => {
        autoFit.current = true;
        const fitted = fitView();
        if (fitted) setView(fitted);
      },
      zoomBy: (factor: number) => {
        const { view: currentView, size: currentSize } = latest.current;
        if (!currentView || !currentSize) return;
        autoFit.current = false;
        const centre = { x: RULER_SIZE + (currentSize.width - RULER_SIZE) / 2, y: (currentSize.height - RULER_SIZE) / 2 };
        setView((current) => (current ? zoomAt(current, factor, centre) : current));
      },
      handleKey: (event) => {
        if (!isPathTool(latest.current.tool) || drawingPoints.current.length === 0) return false;
        if (event.key === "Enter") {
          finishPath();
          return true;
        }
        if (event.key === "Escape") return cancelDrawing();
        if (event.key === "Backspace" || event.key === "Delete") {
          drawingPoints.current = drawingPoints.current.slice(0, -1);
          requestOverlay();
          return true;
        }
        return false;
      },
      snapStep: () => (latest.current.view ? gridStepForZoom(latest.current.view.pixelsPerMetre, 14) : 1),
      isDrawing: () => drawingPoints.current.length > 0,
    }),
    [fitView, finishPath, cancelDrawing, requestOverlay],
  );

  // Wheel zoom needs a non-passive listener to keep the page from scrolling.
  useEffect(() => {
    const canvas = overlayRef.current;
    if (!canvas) return;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const currentView = latest.current.view;
      if (!currentView) return;
      autoFit.current = false;
      const rect = canvas.getBoundingClientRect();
      const at = { x: event.clientX - rect.left, y: event.clientY - rect.top };
      // Functional updates: several wheel events may arrive before the next render.
      if (event.ctrlKey || Math.abs(event.deltaY) >= Math.abs(event.deltaX)) {
        const factor = wheelZoomFactor(event.deltaY, event.deltaMode);
        setView((current) => (current ? zoomAt(current, factor, at) : current));
      } else {
        setView((current) => (current ? panBy(current, -event.deltaX, 0) : current));
      }
    };
    canvas.addEventListener("wheel", onWheel, { passive: false });
    return () => canvas.removeEventListener("wheel", onWheel);
  }, []);

  // Space held down turns a drag into a pan, wherever the focus is (except in text fields).
  useEffect(() => {
    const down = (event: KeyboardEvent) => {
      if (event.code !== "Space" || isTextTarget(event.target)) return;
      const container = containerRef.current;
      if (!container || !(container.matches(":hover") || container.contains(document.activeElement))) return;
      event.preventDefault();
      if (!spaceHeld.current) {
        spaceHeld.current = true;
        setPanning(true);
      }
    };
    const up = (event: KeyboardEvent) => {
      if (event.code !== "Space") return;
      spaceHeld.current = false;
      if (!drag.current || drag.current.kind !== "pan") setPanning(false);
    };
    window.addEventListener("keydown", down);
    window.addEventListener("keyup", up);
    return () => {
      window.removeEventListener("keydown", down);
      window.removeEventListener("keyup", up);
    };
  }, []);

  const onPointerDown = (event: React.PointerEvent<HTMLCanvasElement>) => {
    const currentView = latest.current.view;
    if (!currentView) return;
    overlayRef.current?.focus({ preventScroll: true });
    const screen = screenPoint(event);
    const world = screenToWorld(currentView, screen);
    const pointerId = event.pointerId;

    if (event.button === 1 || (event.button === 0 && spaceHeld.current)) {
      event.preventDefault();
      drag.current = { kind: "pan", startScreen: screen, startView: currentView, pointerId };
      overlayRef.current?.setPointerCapture(pointerId);
      setPanning(true);
      return;
    }
    if (event.button === 2) {
      // A right click finishes the shape being drawn.
      if (drawingPoints.current.length > 0) finishPath();
      return;
    }
    if (event.button !== 0) return;
    const { scene: current, selection: currentSelection, tool: currentTool, readOnly: locked } = latest.current;
    const tolerance = PICK_PIXELS / currentView.pixelsPerMetre;

    if (locked || currentTool === "select") {
      const hit = hitTest(current, world, tolerance, { selected: currentSelection?.ref ?? null });
      if (!hit) {
        onSelect(null);
        // Dragging on empty canvas pans: the quickest way around a large site.
        drag.current = { kind: "pan", startScreen: screen, startView: currentView, pointerId };
        overlayRef.current?.setPointerCapture(pointerId);
        return;
      }
      const vertex = hit.part.type === "vertex" ? hit.part.index : null;
      onSelect({ ref: hit.ref, vertex });
      if (locked) return;
      const points = entityPoints(current, hit.ref);
      const pointLike = hit.ref.kind === "source" || hit.ref.kind === "receiver";
      const index = vertex ?? 0;
      drag.current = {
        kind: vertex !== null || pointLike ? "vertex" : "move",
        ref: hit.ref,
        vertex: index,
        original: current,
        startWorld: world,
        anchor: points[index] ?? world,
        startScreen: screen,
        started: false,
        mergeKey: `drag-${++dragCounter}`,
        pointerId,
      };
      overlayRef.current?.setPointerCapture(pointerId);
      return;
    }

    const { point } = landing(world, event.altKey);
    if (currentTool === "source" || currentTool === "receiver") {
      const added = currentTool === "source" ? addSource(current, point) : addReceiver(current, point);
      onApply(added.scene, { select: { ref: added.ref, vertex: null } });
      onEndGesture();
      return;
    }
    // Path tools: a click adds a point; Shift holds the new segment to 45-degree steps.
    const points = drawingPoints.current;
    const last = points[points.length - 1];
    const placed = event.shiftKey && last ? constrainDirection(last, point) : point;
    if (closesOutline(currentTool, points, placed, VERTEX_SNAP_PIXELS / currentView.pixelsPerMetre)) {
      finishPath();
      return;
    }
    drawingPoints.current = addDrawingPoint(points, placed);
    if (finishesOnClick(currentTool, drawingPoints.current)) finishPath();
    requestOverlay();
  };

  const onPointerMove = (event: React.PointerEvent<HTMLCanvasElement>) => {
    const currentView = latest.current.view;
    if (!currentView) return;
    const screen = screenPoint(event);
    const world = screenToWorld(currentView, screen);
    const active = drag.current;

    if (active?.kind === "pan") {
      autoFit.current = false;
      setView(panBy(active.startView, screen.x - active.startScreen.x, screen.y - active.startScreen.y));
      return;
    }
    if (active) {
      if (!active.started) {
        if (Math.hypot(screen.x - active.startScreen.x, screen.y - active.startScreen.y) < DRAG_THRESHOLD_PIXELS) return;
        active.started = true;
      }
      // The anchor follows the pointer's travel, then snaps; the whole entity moves by the anchor's snapped travel.
      const target = { x: active.anchor.x + world.x - active.startWorld.x, y: active.anchor.y + world.y - active.startWorld.y };
      const landed = landing(target, event.altKey, active.ref, active.kind === "vertex" ? active.vertex : null);
      snapMark.current = landed.kind === "none" ? null : landed;
      const next =
        active.kind === "vertex"
          ? moveVertex(active.original, active.ref, active.vertex, landed.point)
          : translateEntity(active.original, active.ref, tidyCoordinate(landed.point.x - active.anchor.x), tidyCoordinate(landed.point.y - active.anchor.y));
      onApply(next, { mergeKey: active.mergeKey });
      setCursor({ world: landed.point, snapped: landed.kind });
      requestOverlay();
      return;
    }

    const { scene: current, selection: currentSelection, tool: currentTool, readOnly: locked } = latest.current;
    if (locked || currentTool === "select") {
      const hit = hitTest(current, world, PICK_PIXELS / currentView.pixelsPerMetre, { selected: currentSelection?.ref ?? null });
      const changed = hit?.ref.id !== hover.current?.ref.id || hit?.part.type !== hover.current?.part.type || (hit?.part.type === "edge" && !locked);
      hover.current = hit;
      setHoverKind(hit ? hit.part.type : null);
      snapMark.current = null;
      setCursor({ world, snapped: "none" });
      if (changed) requestOverlay();
      return;
    }
    const landed = landing(world, event.altKey);
    const points = drawingPoints.current;
    const last = points[points.length - 1];
    const placed = event.shiftKey && last && isPathTool(currentTool) ? constrainDirection(last, landed.point) : landed.point;
    drawingCursor.current = placed;
    snapMark.current = landed.kind === "none" ? null : { point: placed, kind: landed.kind };
    setCursor({ world: placed, snapped: landed.kind });
    requestOverlay();
  };

  const endDrag = (event: React.PointerEvent<HTMLCanvasElement>) => {
    const active = drag.current;
    if (!active) return;
    drag.current = null;
    if (overlayRef.current?.hasPointerCapture(event.pointerId)) overlayRef.current.releasePointerCapture(event.pointerId);
    if (active.kind === "pan") {
      if (!spaceHeld.current) setPanning(false);
      return;
    }
    snapMark.current = null;
    if (active.started) onEndGesture();
    requestOverlay();
  };

  const onDoubleClick = (event: React.MouseEvent<HTMLCanvasElement>) => {
    const { tool: currentTool, view: currentView, scene: current, selection: currentSelection, readOnly: locked } = latest.current;
    if (!currentView || locked) return;
    if (isPathTool(currentTool)) {
      if (drawingPoints.current.length > 0) finishPath();
      return;
    }
    if (currentTool !== "select" || !currentSelection) return;
    const world = screenToWorld(currentView, screenPoint(event));
    const hit = hitTest(current, world, PICK_PIXELS / currentView.pixelsPerMetre, { selected: currentSelection.ref });
    if (hit?.part.type === "edge") {
      const at = landing(hit.part.at, true).point;
      const index = hit.part.index + 1;
      onApply(insertVertex(current, hit.ref, index, at), { select: { ref: hit.ref, vertex: index } });
      onEndGesture();
    }
  };

  const onPointerLeave = () => {
    hover.current = null;
    drawingCursor.current = null;
    snapMark.current = null;
    setCursor(null);
    setHoverKind(null);
    requestOverlay();
  };

  const cursorStyle = panning
    ? drag.current?.kind === "pan"
      ? "grabbing"
      : "grab"
    : readOnly || tool === "select"
      ? hoverKind === "vertex"
        ? "pointer"
        : hoverKind === "edge" || hoverKind === "body"
          ? readOnly
            ? "pointer"
            : "move"
          : "default"
      : "crosshair";

  return (
    <div ref={containerRef} className="relative h-full min-h-0 w-full overflow-hidden" style={{ background: CANVAS_COLOURS.outside }}>
      <canvas ref={staticRef} aria-hidden className="absolute inset-0 h-full w-full" />
      <canvas
        ref={overlayRef}
        tabIndex={0}
        role="application"
        aria-label="Scene drawing: metres, y up. Use the tool keys listed in the help, arrows to nudge the selection."
        data-testid="scene-canvas"
        data-pixels-per-metre={view?.pixelsPerMetre}
        data-origin-x={view?.originX}
        data-origin-y={view?.originY}
        className="absolute inset-0 h-full w-full touch-none outline-none"
        style={{ cursor: cursorStyle }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={endDrag}
        onPointerCancel={endDrag}
        onPointerLeave={onPointerLeave}
        onDoubleClick={onDoubleClick}
        onContextMenu={(event) => event.preventDefault()}
      />
      <div
        aria-live="off"
        data-testid="canvas-cursor"
        className="pointer-events-none absolute right-2 top-2 rounded-md border border-rule bg-panel/90 px-2 py-1 font-mono text-[11.5px] text-ink-soft shadow-sm tabular"
      >
        {cursor ? (
          <>
            x {cursor.world.x.toFixed(decimals)} · y {cursor.world.y.toFixed(decimals)} m
            {cursor.snapped !== "none" ? <span className="ml-1.5 text-tide-600">{cursor.snapped === "vertex" ? "on corner" : "on grid"}</span> : null}
          </>
        ) : (
          <span className="text-muted">{snapping ? `snap ${gridStep} m` : "snapping off"}</span>
        )}
      </div>
    </div>
  );
});
