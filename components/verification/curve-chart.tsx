"use client";
// A verification curve drawn by uPlot: simulated and exact series overlaid, each on its own x values
// (a trace against its exact waveform, a spectrum against mode frequencies drawn as points). uPlot wants
// one shared x array, so the series' x values are merged and each series spans the others' gaps. Built
// like components/charts/uplot-chart.tsx: created in an effect, destroyed on unmount, follows its width.
import { memo, useEffect, useMemo, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

/** A curve as the cases make it (numbers) or as a record keeps it (null for a figure that was not finite). */
export interface ChartableCurve {
  title: string;
  xLabel: string;
  yLabel: string;
  series: readonly { name: string; kind: "simulated" | "exact"; x: readonly (number | null)[]; y: readonly (number | null)[]; style?: "line" | "points" }[];
}

const MUTED = "#66717c";
const GRID_LINE = "#efede6";
/** Simulated in the product's teal and inks, exact in ember and warm tones, dashed. */
const SIMULATED_COLOURS = ["#127673", "#2c3a45", "#4f7cc0", "#7a5bb0"];
const EXACT_COLOURS = ["#d65a2c", "#b7791f", "#b03a48", "#8a5a2b"];

/** Merges the series' x values into one ascending array and places each series' y on it (null elsewhere). */
export function alignCurve(curve: ChartableCurve): uPlot.AlignedData {
  const xs = new Set<number>();
  for (const series of curve.series) for (const x of series.x) if (x !== null && Number.isFinite(x)) xs.add(x);
  const merged = Float64Array.from(xs).sort();
  const position = new Map<number, number>();
  merged.forEach((x, k) => position.set(x, k));
  const columns = curve.series.map((series) => {
    const column: (number | null)[] = new Array<number | null>(merged.length).fill(null);
    series.x.forEach((x, k) => {
      const y = series.y[k];
      if (x === null || y === null || y === undefined || !Number.isFinite(y)) return;
      const at = position.get(x);
      if (at !== undefined) column[at] = y;
    });
    return column;
  });
  return [Array.from(merged), ...columns];
}

/** Frequencies spread over more than a decade and a half read better on a logarithmic axis. */
function wantsLogX(data: uPlot.AlignedData): boolean {
  const x = data[0] as number[];
  const first = x[0];
  const last = x[x.length - 1];
  return first !== undefined && last !== undefined && first > 0 && last / first >= 20;
}

function formatValue(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  return Math.abs(value) >= 1e5 || (value !== 0 && Math.abs(value) < 1e-3) ? value.toExponential(3) : String(Number(value.toPrecision(5)));
}

function buildOptions(curve: ChartableCurve, logX: boolean, width: number, height: number, font: string): uPlot.Options {
  const axisFont = `11px ${font}`;
  const axis = (label: string): uPlot.Axis => ({ label, labelFont: axisFont, labelSize: 16, labelGap: 0, font: axisFont, stroke: MUTED, grid: { stroke: GRID_LINE, width: 1 }, ticks: { stroke: GRID_LINE, width: 1, size: 4 } });
  let simulated = 0;
  let exact = 0;
  return {
    width,
    height,
    legend: { show: true, live: true },
    cursor: { drag: { x: true, y: false, setScale: true }, points: { size: 6 } },
    scales: { x: { time: false, ...(logX ? { distr: 3 as const } : {}) }, y: {} },
    axes: [
      { ...axis(curve.xLabel), size: 26 },
      { ...axis(curve.yLabel), size: 52 },
    ],
    series: [
      { label: curve.xLabel, value: (_plot, value) => formatValue(value) },
      ...curve.series.map((series): uPlot.Series => {
        const colour = series.kind === "simulated" ? SIMULATED_COLOURS[simulated++ % SIMULATED_COLOURS.length]! : EXACT_COLOURS[exact++ % EXACT_COLOURS.length]!;
        const points = series.style === "points";
        return {
          label: `${series.name} (${series.kind})`,
          stroke: colour,
          width: points ? 0 : series.kind === "exact" ? 1.5 : 1.75,
          ...(series.kind === "exact" && !points ? { dash: [6, 4] } : {}),
          spanGaps: true,
          // Point series (mode frequencies, band values) are markers only: exact ones as larger hollow rings, so a
          // simulated dot on the same value shows inside its ring.
          points: points ? (series.kind === "exact" ? { show: true, size: 10, width: 1.5, stroke: colour, fill: "rgba(255,255,255,0)" } : { show: true, size: 5, width: 1, stroke: colour, fill: colour }) : { show: false },
          ...(points ? { paths: () => null } : {}),
          value: (_plot, value) => formatValue(value),
        };
      }),
    ],
  };
}

function CurveChartInner({ curve, height = 200 }: { curve: ChartableCurve; height?: number }) {
  const container = useRef<HTMLDivElement>(null);
  const data = useMemo(() => alignCurve(curve), [curve]);
  const logX = wantsLogX(data);

  useEffect(() => {
    const element = container.current;
    if (!element) return;
    const font = getComputedStyle(element).fontFamily || "monospace";
    const plot = new uPlot(buildOptions(curve, logX, Math.max(1, element.clientWidth), height, font), data, element);
    const observer = new ResizeObserver(([entry]) => {
      const width = Math.floor(entry?.contentRect.width ?? 0);
      if (width > 0 && width !== plot.width) plot.setSize({ width, height });
    });
    observer.observe(element);
    return () => {
      observer.disconnect();
      plot.destroy();
    };
  }, [curve, data, logX, height]);

  return (
    <figure className="flex min-w-0 flex-col gap-1 break-inside-avoid">
      <figcaption className="text-[13px] font-medium text-ink-soft">{curve.title}</figcaption>
      <div
        ref={container}
        role="img"
        aria-label={`${curve.title}: ${curve.series.map((s) => `${s.name} (${s.kind})`).join(", ")}, ${curve.yLabel} against ${curve.xLabel}`}
        className="w-full min-w-0 font-mono text-[11px] text-ink-soft [&_.u-legend]:text-[11px]!"
      />
    </figure>
  );
}

/** Memoised: the plot is rebuilt only when the curve itself changes. */
export const CurveChart = memo(CurveChartInner);
