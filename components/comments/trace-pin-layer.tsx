"use client";
// Comment pins on the receiver traces (only inside the saved run page's pin board): numbered markers
// drawn on the uPlot canvas after the lines, a jump that zooms the time axis around a pin and puts
// the cursor on it, and pin mode, where a click on the chart pins the nearest trace of this run at
// the time under the pointer. Outside the board it does nothing.
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import type uPlot from "uplot";
import type { AnalysisTrace } from "@/components/analysis/analysis-traces";
import type { TracePin } from "@/lib/validation/comment";
import { useTracePins, type PlacedPin } from "./pin-context";
import { roundPickedPin } from "./pin-format";

const PIN_FILL = "#d65a2c";
const PIN_EMPHASIS = "#a23f1a";
const PIN_MUTED = "#66717c";

interface DrawnPin {
  placed: PlacedPin<TracePin>;
  /** uPlot series index (1 = first trace). */
  series: number;
}

/** The sample index nearest t (s) on a trace sampled every timeStep from 0. */
function sampleIndex(t: number, timeStep: number, length: number): number {
  return Math.max(0, Math.min(length - 1, Math.round(t / timeStep)));
}

function drawPins(plot: uPlot, pins: readonly DrawnPin[], emphasisedId: string | null, font: string): void {
  const { ctx, bbox } = plot;
  const ratio = window.devicePixelRatio || 1;
  ctx.save();
  ctx.beginPath();
  ctx.rect(bbox.left, bbox.top, bbox.width, bbox.height);
  ctx.clip();
  for (const { placed, series } of pins) {
    const value = plot.data[series]?.[plot.valToIdx(placed.pin.t * 1000)];
    if (value === null || value === undefined) continue;
    const x = plot.valToPos(placed.pin.t * 1000, "x", true);
    const y = plot.valToPos(value, "y", true);
    if (x < bbox.left || x > bbox.left + bbox.width) continue;
    const emphasised = placed.commentId === emphasisedId;
    const radius = (emphasised ? 10 : 8) * ratio;
    // A stem from the trace up to the numbered disc keeps the point itself visible.
    const discY = Math.max(bbox.top + radius + 2 * ratio, y - 16 * ratio);
    ctx.strokeStyle = emphasised ? PIN_EMPHASIS : placed.resolved ? PIN_MUTED : PIN_FILL;
    ctx.lineWidth = 1.5 * ratio;
    ctx.beginPath();
    ctx.moveTo(x, y);
    ctx.lineTo(x, discY);
    ctx.stroke();
    ctx.beginPath();
    ctx.arc(x, y, 2.5 * ratio, 0, 2 * Math.PI);
    ctx.fillStyle = ctx.strokeStyle;
    ctx.fill();
    ctx.beginPath();
    ctx.arc(x, discY, radius, 0, 2 * Math.PI);
    ctx.fill();
    ctx.lineWidth = 2 * ratio;
    ctx.strokeStyle = "#ffffff";
    ctx.stroke();
    ctx.fillStyle = "#ffffff";
    ctx.font = `600 ${Math.round((emphasised ? 12 : 11) * ratio)}px ${font}`;
    ctx.textAlign = "center";
    ctx.textBaseline = "middle";
    ctx.fillText(String(placed.number), x, discY + 0.5 * ratio);
  }
  ctx.restore();
}

export function useTracePinLayer({ traces, runId }: { traces: readonly AnalysisTrace[]; runId: string }): { onPlot?: (plot: uPlot | null) => void; banner: ReactNode } {
  const board = useTracePins();
  const [plot, setPlot] = useState<uPlot | null>(null);
  const active = board !== null && board.runId === runId;

  // This run's traces (not the overlaid runs'), by receiver, with their uPlot series index.
  const ownSeries = useMemo(() => {
    const map = new Map<string, { series: number; trace: AnalysisTrace }>();
    traces.forEach((trace, index) => {
      if (trace.key === `${runId}:${trace.receiverId}`) map.set(trace.receiverId, { series: index + 1, trace });
    });
    return map;
  }, [traces, runId]);
  const boardPins = active ? board.pins : null;
  const drawn = useMemo<DrawnPin[]>(
    () =>
      (boardPins ?? []).flatMap((placed) => {
        const own = ownSeries.get(placed.pin.receiverId);
        return own ? [{ placed, series: own.series }] : [];
      }),
    [boardPins, ownSeries],
  );

  const [expiredNonce, setExpiredNonce] = useState<number | null>(null);
  const focus = active ? board.focus : null;
  const emphasisedId = focus && focus.nonce !== expiredNonce ? focus.placed.commentId : null;

  // The draw hook and click handler read the latest state through a ref: they are attached once per plot.
  const picking = active && board.picking;
  const pick = board?.pick;
  const select = board?.selectComment;
  const latest = useRef({ drawn, emphasisedId, picking, ownSeries, pick, select });
  useEffect(() => {
    latest.current = { drawn, emphasisedId, picking, ownSeries, pick, select };
    plot?.redraw(false, false);
  }, [drawn, emphasisedId, picking, ownSeries, pick, select, plot]);

  useEffect(() => {
    if (!plot || !active) return;
    const font = getComputedStyle(plot.root).fontFamily || "sans-serif";
    const draw = (chart: uPlot) => drawPins(chart, latest.current.drawn, latest.current.emphasisedId, font);
    const hooks = (plot.hooks.draw ??= []);
    hooks.push(draw);
    const onClick = (event: MouseEvent) => {
      const { picking, ownSeries: series, drawn: pins, pick, select } = latest.current;
      const left = event.offsetX;
      const top = event.offsetY;
      if (picking && pick) {
        const index = plot.posToIdx(left);
        let best: { receiverId: string; value: number; distance: number; timeStep: number } | null = null;
        for (const [receiverId, { series: seriesIndex, trace }] of series) {
          const value = plot.data[seriesIndex]?.[index];
          if (value === null || value === undefined) continue;
          const distance = Math.abs(plot.valToPos(value, "y") - top);
          if (!best || distance < best.distance) best = { receiverId, value, distance, timeStep: trace.timeStep };
        }
        if (best) pick(roundPickedPin({ kind: "trace", receiverId: best.receiverId, t: index * best.timeStep, value: best.value }));
        return;
      }
      // Outside pin mode, a click on a marker's disc brings its comment into view.
      for (const { placed, series: seriesIndex } of pins) {
        const x = plot.valToPos(placed.pin.t * 1000, "x");
        const value = plot.data[seriesIndex]?.[plot.valToIdx(placed.pin.t * 1000)];
        if (value === null || value === undefined) continue;
        const y = Math.max(10, plot.valToPos(value, "y") - 16);
        if (Math.hypot(left - x, top - y) <= 11) {
          select?.(placed.commentId);
          return;
        }
      }
    };
    plot.over.addEventListener("click", onClick);
    plot.redraw(false, false);
    return () => {
      plot.over.removeEventListener("click", onClick);
      const at = hooks.indexOf(draw);
      if (at >= 0) hooks.splice(at, 1);
    };
  }, [plot, active]);

  // A chip asked for a pin on one of these traces: zoom the time axis around it and put the cursor there.
  // It waits until the receiver is drawn (the analysis adds it to the chosen receivers if needed).
  const handledNonce = useRef<number | null>(null);
  const focusNonce = focus?.nonce;
  const focusTime = focus?.placed.pin.t;
  const focusDrawn = focus ? ownSeries.get(focus.placed.pin.receiverId) : undefined;
  useEffect(() => {
    if (!plot || focusNonce === undefined || focusTime === undefined || !focusDrawn || handledNonce.current === focusNonce) return;
    handledNonce.current = focusNonce;
    const times = plot.data[0];
    const end = Number(times[times.length - 1] ?? 0);
    const tMs = focusTime * 1000;
    const half = Math.max(end * 0.05, 40 * focusDrawn.trace.timeStep * 1000);
    plot.setScale("x", { min: Math.max(0, tMs - half), max: Math.min(end, tMs + half) });
    const value = plot.data[focusDrawn.series]?.[sampleIndex(focusTime, focusDrawn.trace.timeStep, times.length)];
    if (value !== null && value !== undefined) plot.setCursor({ left: plot.valToPos(tMs, "x"), top: plot.valToPos(value, "y") });
    plot.root.scrollIntoView({ behavior: "smooth", block: "center" });
  }, [plot, focusNonce, focusTime, focusDrawn]);
  useEffect(() => {
    if (focusNonce === undefined) return;
    const timer = setTimeout(() => setExpiredNonce(focusNonce), 4000);
    return () => clearTimeout(timer);
  }, [focusNonce]);

  const onPlot = useCallback((created: uPlot | null) => setPlot(created), []);
  if (!active) return { banner: null };
  const banner = board.picking ? (
    <p role="status" className="flex flex-wrap items-center gap-3 rounded-md border border-ember-100 bg-ember-50 px-3 py-2 text-sm text-ember-700" data-testid="trace-pin-mode">
      {ownSeries.size === 0 ? "Choose a receiver of this run above, then click a point on its trace." : "Click a point on a trace of this run to pin your comment to that receiver and time."}
      <button type="button" onClick={board.stopPicking} className="ml-auto font-medium underline underline-offset-2">
        Stop pinning
      </button>
    </p>
  ) : null;
  return { onPlot, banner };
}
