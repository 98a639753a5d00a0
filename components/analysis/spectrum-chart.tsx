"use client";
// Spectra of receiver pressure: power spectral density over the whole trace in dB re (20 uPa)^2/Hz on a
// log frequency axis, the same quantity the band levels integrate. Frequencies above the grid's highest
// resolved frequency are shaded: the scheme's dispersion makes them unreliable.
import { useMemo, useRef } from "react";
import type uPlot from "uplot";

import { UPlotChart, type ChartSeries, type ShadedRange } from "@/components/charts/uplot-chart";
import { downloadBlob } from "@/components/field-view/field-view-toolbar";
import { spectralDensity } from "@/lib/analysis/spectral-density";
import { nextPowerOfTwo } from "@/lib/analysis/spectrum";

import { ExportButton, Note } from "./analysis-controls";
import type { AnalysisTrace } from "./analysis-traces";
import { exportFileName, uplotChartPng } from "./export-files";

export interface SpectrumChartProps {
  traces: readonly AnalysisTrace[];
  /** GridPlan.maxResolvedFrequency of the run, Hz. */
  highestResolvedFrequency: number;
  runId: string;
  height?: number;
}

/** Dynamic range shown below the loudest bin, dB: numerical noise far below it only flattens the picture. */
const SHOWN_RANGE_DB = 90;

interface SpectrumData {
  data: uPlot.AlignedData;
  range: [number, number];
  nyquist: number;
}

function spectrumData(traces: readonly AnalysisTrace[]): SpectrumData {
  // One FFT size for all, so every trace's bins fall on the same frequencies.
  const size = nextPowerOfTwo(Math.max(...traces.map((trace) => trace.pressure.length)));
  const densities = traces.map((trace) => spectralDensity(trace.pressure, trace.timeStep, { size }));
  let loudest = -Infinity;
  for (const density of densities) for (const level of density.levels) if (level > loudest) loudest = level;
  const top = Number.isFinite(loudest) ? Math.ceil((loudest + 5) / 10) * 10 : 0;
  const series = densities.map((density) => Array.from(density.levels, (level) => (Number.isFinite(level) ? level : null)));
  return { data: [densities[0]!.frequencies, ...series] as uPlot.AlignedData, range: [top - SHOWN_RANGE_DB, top], nyquist: 1 / (2 * traces[0]!.timeStep) };
}

export function SpectrumChart({ traces, highestResolvedFrequency, runId, height = 240 }: SpectrumChartProps) {
  const box = useRef<HTMLDivElement>(null);
  const spectrum = useMemo(() => (traces.length > 0 ? spectrumData(traces) : null), [traces]);
  const series = useMemo<ChartSeries[]>(() => traces.map((trace) => ({ label: trace.label, colour: trace.colour, width: 1.25, ...(trace.dash ? { dash: trace.dash } : {}) })), [traces]);
  const shading = useMemo<ShadedRange[]>(
    () => (spectrum && highestResolvedFrequency < spectrum.nyquist ? [{ from: highestResolvedFrequency, to: spectrum.nyquist, colour: "rgba(120, 120, 120, 0.16)", label: "under-resolved" }] : []),
    [spectrum, highestResolvedFrequency],
  );

  if (!spectrum) return <Note>Choose at least one receiver to draw its spectrum.</Note>;
  return (
    <div className="flex flex-col gap-2" ref={box}>
      <UPlotChart
        data={spectrum.data}
        series={series}
        x={{ label: "Frequency", unit: "Hz", log: true }}
        y={{ label: "PSD level", unit: "dB re (20 µPa)²/Hz", range: spectrum.range }}
        shadedX={shading}
        height={height}
        zoomX
        ariaLabel={`Power spectral density at ${traces.map((t) => t.label).join(", ")}`}
      />
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Note>
          Power spectral density averaged over the whole trace (no window, unweighted), dB re (20 µPa)²/Hz: summed over a band it gives that band&apos;s level in the band table.
          Resolved up to {highestResolvedFrequency.toFixed(0)} Hz (the grid&apos;s cells per wavelength); the shaded part above is under-resolved and shown for completeness only.
        </Note>
        <ExportButton
          label="PNG"
          onExport={async () => downloadBlob(await uplotChartPng(box.current!, "Power spectral density, dB re (20 µPa)²/Hz", traces.map((t) => ({ label: t.label, colour: t.colour, dash: t.dash }))), exportFileName(runId, "spectra", "png"))}
        />
      </div>
    </div>
  );
}
