"use client";
// A source's signal as the solver will inject it: the samples over time, one per time step, and their
// magnitude spectrum with the band the grid does not resolve shaded.
import { useMemo } from "react";

import { UPlotChart, type ShadedRange } from "@/components/charts/uplot-chart";
import type { GridPlan } from "@/lib/fdtd/grid";
import type { Signal } from "@/lib/fdtd/scene";
import { SIGNAL_BAND_EDGE_DB } from "@/lib/fdtd/signals";

import { signalPlotData } from "./model/signal-plot";

const WAVEFORM_COLOUR = "#127673";
const SPECTRUM_COLOUR = "#16212b";
const BAND_EDGE_COLOUR = "#b7791f";
const UNDER_RESOLVED_SHADE = "rgba(214, 90, 44, 0.12)";
/** Levels shown on the spectrum, dB below its maximum: deep enough to see the -30 dB edge and a little more. */
const LEVEL_RANGE: readonly [number, number] = [-80, 5];

export function SignalPlot({ signal, grid }: { signal: Signal; grid: Pick<GridPlan, "timeStep" | "steps" | "maxResolvedFrequency"> }) {
  const { timeStep, steps, maxResolvedFrequency } = grid;
  // Only what the signal's samples depend on: moving a receiver must not recompute the spectrum.
  const plot = useMemo(() => signalPlotData(signal, { timeStep, steps, maxResolvedFrequency }), [signal, timeStep, steps, maxResolvedFrequency]);
  const { waveform, spectrum } = plot;

  const waveformData = useMemo(() => [waveform.times.map((t) => t * 1000), waveform.values] as [Float64Array, Float64Array], [waveform]);
  const spectrumData = useMemo(
    () => [spectrum.frequencies, spectrum.levels, new Float64Array(spectrum.frequencies.length).fill(SIGNAL_BAND_EDGE_DB)] as [Float64Array, Float64Array, Float64Array],
    [spectrum],
  );
  const shaded = useMemo<ShadedRange[]>(
    () => (spectrum.maxResolvedFrequency < spectrum.shownUpTo ? [{ from: spectrum.maxResolvedFrequency, to: spectrum.shownUpTo, colour: UNDER_RESOLVED_SHADE, label: "under-resolved" }] : []),
    [spectrum],
  );
  const runMilliseconds = steps * timeStep * 1000;

  return (
    <figure className="flex flex-col gap-2" data-testid="signal-plot">
      <UPlotChart
        ariaLabel={`The signal over the first ${(waveform.times.length * timeStep * 1000).toPrecision(3)} ms, one sample per time step`}
        data={waveformData}
        series={[{ label: "Signal", colour: WAVEFORM_COLOUR }]}
        x={{ label: "Time", unit: "ms" }}
        y={{ label: "Signal" }}
        height={170}
      />
      <UPlotChart
        ariaLabel={`Magnitude spectrum of the injected signal in dB; the grid resolves up to ${Math.round(spectrum.maxResolvedFrequency)} Hz`}
        data={spectrumData}
        series={[
          { label: "Level", colour: SPECTRUM_COLOUR },
          { label: "−30 dB", colour: BAND_EDGE_COLOUR, width: 1, dash: [4, 3] },
        ]}
        x={{ label: "Frequency", unit: "Hz", range: [0, spectrum.shownUpTo] }}
        y={{ label: "Level", unit: "dB", range: LEVEL_RANGE }}
        shadedX={shaded}
        height={170}
      />
      <figcaption className="text-[11.5px] leading-snug text-muted">
        Sampled every {(timeStep * 1e6).toPrecision(3)} µs as the solver injects it, in the signal&apos;s own units (the source&apos;s amplitude scales it). Shaded: above {Math.round(spectrum.maxResolvedFrequency)} Hz the grid has too few cells per wavelength.
        {waveform.cutByRunEnd ? ` The run stops at ${runMilliseconds.toPrecision(3)} ms, before the signal has ended.` : ""}
        {waveform.shortened ? ` Only the first ${waveform.times.length.toLocaleString("en-GB")} steps are shown.` : ""}
      </figcaption>
    </figure>
  );
}
