"use client";
// A line chart drawn by uPlot: one x array shared by any number of series, axis labels with units,
// and optional shaded stretches of x (a band the grid does not resolve, a time window). The chart
// follows its container's width, is created in an effect and destroyed on unmount; new data only
// updates the plot, new series or axes rebuild it.
import { memo, useEffect, useMemo, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

export interface ChartSeries {
  label: string;
  /** CSS colour of the line. */
  colour: string;
  /** Line width, CSS pixels. */
  width?: number;
  dash?: number[];
  /** CSS colour filled between the line and the axis. */
  fill?: string;
}

export interface ChartAxis {
  label: string;
  /** Shown after the label, "Time (ms)", and beside values in the legend. */
  unit?: string;
  /** Fixed [min, max]; otherwise the data decide. */
  range?: readonly [number, number];
  /** Logarithmic scale (values must be positive). */
  log?: boolean;
}

export interface ShadedRange {
  from: number;
  to: number;
  /** CSS colour, usually translucent. */
  colour: string;
  /** Written at the top of the stretch when it is wide enough. */
  label?: string;
}

export interface UPlotChartProps {
  /** [x values, ...one array of y values per series], all the same length. */
  data: uPlot.AlignedData;
  series: readonly ChartSeries[];
  x: ChartAxis;
  y: ChartAxis;
  shadedX?: readonly ShadedRange[];
  /** Plot height in CSS pixels (the legend adds to it). */
  height?: number;
  /** Live values of the series under the cursor, below the plot. */
  legend?: boolean;
  /** Drag across the plot to zoom in x, double-click to zoom out (default off). */
  zoomX?: boolean;
  /** What the chart shows, for people who cannot see it. */
  ariaLabel: string;
  className?: string;
  /** Told of the uPlot instance after each build (and null when it is destroyed), for extra drawing and clicks. */
  onPlot?: (plot: uPlot | null) => void;
}

const MUTED = "#66717c";
const GRID_LINE = "#efede6";
const NO_SHADING: readonly ShadedRange[] = [];

function axisTitle(axis: ChartAxis): string {
  return axis.unit ? `${axis.label} (${axis.unit})` : axis.label;
}

function formatValue(value: number | null | undefined, unit: string | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  const shown = Math.abs(value) >= 1e5 || (value !== 0 && Math.abs(value) < 1e-3) ? value.toExponential(2) : String(Number(value.toPrecision(4)));
  return unit ? `${shown} ${unit}` : shown;
}

/** Paints the shaded stretches under the grid and the lines. */
function paintShading(plot: uPlot, ranges: readonly ShadedRange[], font: string): void {
  const { ctx, bbox } = plot;
  const scale = plot.scales.x;
  if (scale?.min === undefined || scale.max === undefined) return;
  ctx.save();
  for (const range of ranges) {
    const from = Math.max(range.from, scale.min);
    const to = Math.min(range.to, scale.max);
    if (!(to > from)) continue;
    const left = plot.valToPos(from, "x", true);
    const right = plot.valToPos(to, "x", true);
    ctx.fillStyle = range.colour;
    ctx.fillRect(left, bbox.top, right - left, bbox.height);
    if (range.label) {
      const ratio = window.devicePixelRatio || 1;
      ctx.font = `${Math.round(10.5 * ratio)}px ${font}`;
      const padding = 4 * ratio;
      if (ctx.measureText(range.label).width + 2 * padding <= right - left) {
        ctx.fillStyle = MUTED;
        ctx.textAlign = "left";
        ctx.textBaseline = "top";
        ctx.fillText(range.label, left + padding, bbox.top + padding);
      }
    }
  }
  ctx.restore();
}

function buildOptions(props: { series: readonly ChartSeries[]; x: ChartAxis; y: ChartAxis; height: number; legend: boolean; zoomX?: boolean }, width: number, font: string, shading: { current: readonly ShadedRange[] }): uPlot.Options {
  const axisFont = `11px ${font}`;
  const axis = (title: string): uPlot.Axis => ({
    label: title,
    labelFont: axisFont,
    labelSize: 16,
    labelGap: 0,
    font: axisFont,
    stroke: MUTED,
    grid: { stroke: GRID_LINE, width: 1 },
    ticks: { stroke: GRID_LINE, width: 1, size: 4 },
  });
  const scale = (axisSpec: ChartAxis): uPlot.Scale => ({
    ...(axisSpec.log ? { distr: 3 as const } : {}),
    ...(axisSpec.range ? { range: [axisSpec.range[0], axisSpec.range[1]] as uPlot.Range.MinMax } : {}),
  });
  return {
    width,
    height: props.height,
    legend: { show: props.legend, live: true },
    cursor: { drag: { x: props.zoomX === true, y: false, setScale: props.zoomX === true }, points: { size: 6 } },
    scales: { x: { time: false, ...scale(props.x) }, y: scale(props.y) },
    axes: [{ ...axis(axisTitle(props.x)), size: 26 }, { ...axis(axisTitle(props.y)), size: 44 }],
    series: [
      { label: props.x.label, value: (_plot, value) => formatValue(value, props.x.unit) },
      ...props.series.map(
        (series): uPlot.Series => ({
          label: series.label,
          stroke: series.colour,
          width: series.width ?? 1.5,
          ...(series.dash ? { dash: series.dash } : {}),
          ...(series.fill ? { fill: series.fill } : {}),
          points: { show: false },
          value: (_plot, value) => formatValue(value, props.y.unit),
        }),
      ),
    ],
    hooks: { drawClear: [(plot) => paintShading(plot, shading.current, font)] },
  };
}

function UPlotChartInner({ data, series, x, y, shadedX = NO_SHADING, height = 160, legend = true, zoomX = false, ariaLabel, className = "", onPlot }: UPlotChartProps) {
  const container = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const latestData = useRef(data);
  const shading = useRef<readonly ShadedRange[]>(shadedX);
  const onPlotRef = useRef(onPlot);
  useEffect(() => {
    onPlotRef.current = onPlot;
  }, [onPlot]);

  // Callers build their series and axes inline: rebuild the plot only when what they say changes
  // (everything in them is plain JSON, so the text stands for the content).
  const shapeKey = JSON.stringify({ series, x, y, height, legend, zoomX });
  const shape = useMemo(() => JSON.parse(shapeKey) as { series: ChartSeries[]; x: ChartAxis; y: ChartAxis; height: number; legend: boolean; zoomX: boolean }, [shapeKey]);

  useEffect(() => {
    const element = container.current;
    if (!element) return;
    const font = getComputedStyle(element).fontFamily || "monospace";
    const created = new uPlot(buildOptions(shape, Math.max(1, element.clientWidth), font, shading), latestData.current, element);
    plot.current = created;
    onPlotRef.current?.(created);
    const observer = new ResizeObserver(([entry]) => {
      const width = Math.floor(entry?.contentRect.width ?? 0);
      if (width > 0 && width !== created.width) created.setSize({ width, height: shape.height });
    });
    observer.observe(element);
    // Axis text is measured in the page's mono face: measure again once it has arrived.
    void document.fonts?.ready.then(() => {
      if (plot.current === created) created.redraw(false, true);
    });
    return () => {
      observer.disconnect();
      created.destroy();
      plot.current = null;
      onPlotRef.current?.(null);
    };
  }, [shape]);

  useEffect(() => {
    latestData.current = data;
    plot.current?.setData(data);
  }, [data]);

  useEffect(() => {
    shading.current = shadedX;
    plot.current?.redraw(false);
  }, [shadedX]);

  return <div ref={container} role="img" aria-label={ariaLabel} className={`w-full min-w-0 font-mono text-[11px] text-ink-soft [&_.u-legend]:text-[11px]! [&_.u-legend_th]:font-medium! ${className}`} data-testid="uplot-chart" />;
}

/** Memoised: a chart redraws only when its data, series, axes or shading change. */
export const UPlotChart = memo(UPlotChartInner);
