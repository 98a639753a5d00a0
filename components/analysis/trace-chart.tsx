"use client";
// Receiver pressure over time: one uPlot line per trace on a shared time axis in milliseconds. Drag to
// zoom in time, double-click to zoom out; the legend reads time and pascals under the cursor. uPlot draws
// one pixel column per run of samples, so traces of hundreds of thousands of samples stay quick.
import { useMemo, useRef } from "react";
import type uPlot from "uplot";

import { UPlotChart, type ChartSeries } from "@/components/charts/uplot-chart";
import { useTracePinLayer } from "@/components/comments/trace-pin-layer";
import { tracesCsv } from "@/lib/analysis/csv";

import { ExportButton, Note } from "./analysis-controls";
import type { AnalysisTrace } from "./analysis-traces";
import { downloadCsv, exportFileName, uplotChartPng } from "./export-files";
import { downloadBlob } from "@/components/field-view/field-view-toolbar";

export interface TraceChartProps {
  traces: readonly AnalysisTrace[];
  /** For file names. */
  runId: string;
  height?: number;
}

/** Samples at t = n dt in ms; traces that end earlier are padded with gaps (null). */
function alignedData(traces: readonly AnalysisTrace[]): uPlot.AlignedData {
  const timeStep = traces[0]!.timeStep;
  const length = Math.max(...traces.map((trace) => trace.pressure.length));
  const time = new Float64Array(length);
  for (let n = 0; n < length; n++) time[n] = n * timeStep * 1000;
  const series = traces.map((trace) => {
    if (trace.pressure.length === length) return trace.pressure;
    const padded: (number | null)[] = Array.from(trace.pressure);
    while (padded.length < length) padded.push(null);
    return padded;
  });
  return [time, ...series] as uPlot.AlignedData;
}

export function TraceChart({ traces, runId, height = 240 }: TraceChartProps) {
  const box = useRef<HTMLDivElement>(null);
  const data = useMemo(() => (traces.length > 0 ? alignedData(traces) : null), [traces]);
  const series = useMemo<ChartSeries[]>(() => traces.map((trace) => ({ label: trace.label, colour: trace.colour, width: 1.25, ...(trace.dash ? { dash: trace.dash } : {}) })), [traces]);
  // Comment pins: only on the saved run page (its pin board); nothing elsewhere.
  const pins = useTracePinLayer({ traces, runId });

  if (!data) {
    return (
      <div className="flex flex-col gap-2">
        {pins.banner}
        <Note>Choose at least one receiver to draw its pressure.</Note>
      </div>
    );
  }
  const timeStep = traces[0]!.timeStep;
  return (
    <div className="flex flex-col gap-2" ref={box}>
      {pins.banner}
      <UPlotChart data={data} series={series} x={{ label: "Time", unit: "ms" }} y={{ label: "Sound pressure", unit: "Pa" }} height={height} zoomX ariaLabel={`Pressure over time at ${traces.map((t) => t.label).join(", ")}`} onPlot={pins.onPlot} />
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Note>Drag across the chart to zoom in time; double-click to zoom out. Sampled every {(timeStep * 1e6).toPrecision(4)} µs ({(1 / timeStep / 1000).toPrecision(4)} kHz).</Note>
        <div className="flex gap-2">
          <ExportButton label="CSV" title="Time and one pressure column per trace drawn, in Pa" onExport={() => downloadCsv(tracesCsv(traces, timeStep), exportFileName(runId, "pressure-traces", "csv"))} />
          <ExportButton
            label="PNG"
            onExport={async () => downloadBlob(await uplotChartPng(box.current!, "Sound pressure (Pa) over time (ms)", traces.map((t) => ({ label: t.label, colour: t.colour, dash: t.dash }))), exportFileName(runId, "pressure-traces", "png"))}
          />
        </div>
      </div>
    </div>
  );
}
