// What a source's signal looks like to the solver: sampled once per time step at the middle of the
// step, (n + 1/2) dt, as lib/fdtd/sources.ts injects it, for as long as the signal lasts or the run
// goes on; and the magnitude spectrum of those samples in dB below its maximum, beside the band the
// grid resolves. Pure functions over the scene's signal and derived grid.
import { magnitudes, nextPowerOfTwo, realSpectrum } from "@/lib/analysis/spectrum";
import type { GridPlan } from "@/lib/fdtd/grid";
import type { Signal } from "@/lib/fdtd/scene";
import { prepareSignal, SIGNAL_BAND_EDGE_DB } from "@/lib/fdtd/signals";

/** At most this many steps are plotted (a continuous sine in a long run goes on for millions). */
export const MAX_PLOTTED_STEPS = 1 << 15;
/** Spectra are zero-padded to at least this length, so that a short pulse's spectrum reads as a curve. */
const MIN_SPECTRUM_SIZE = 1 << 12;
/** Levels are shown down to this many dB below the maximum; lower is rounding noise on the page. */
export const SPECTRUM_FLOOR_DB = -100;
/** Room after a pulse's end, as a fraction of it, so the plot shows the signal settle to zero. */
const TAIL_MARGIN = 0.05;

export interface InjectedWaveform {
  /** Times at which the solver evaluates the signal, (n + 1/2) dt, s. */
  times: Float64Array;
  /** The signal at those times, in its own units (unit peak, or the recording's sample values). */
  values: Float64Array;
  /** The run stops before a pulse or recording has ended (it will be cut off); never set for a continuous sine. */
  cutByRunEnd: boolean;
  /** Only the first MAX_PLOTTED_STEPS steps are shown. */
  shortened: boolean;
}

export interface InjectedSpectrum {
  /** Bin frequencies from 0 up to `shownUpTo`, Hz. */
  frequencies: Float64Array;
  /** Magnitude at each bin, dB relative to the largest, floored at SPECTRUM_FLOOR_DB. */
  levels: Float64Array;
  /** Highest frequency the grid resolves (its cells per wavelength in the slowest medium), Hz. */
  maxResolvedFrequency: number;
  /** Where the signal's spectrum stays 30 dB below its maximum (Infinity for an abrupt start), Hz. */
  upperFrequency: number;
  /** Right end of the frequency axis: past the resolved band and the samples' -30 dB band, below Nyquist, Hz. */
  shownUpTo: number;
}

export interface SignalPlotData {
  waveform: InjectedWaveform;
  spectrum: InjectedSpectrum;
}

/** The samples the solver injects, from the first step until the signal has ended or the run stops. */
export function injectedWaveform(signal: Signal, grid: Pick<GridPlan, "timeStep" | "steps">): InjectedWaveform {
  const dt = grid.timeStep;
  const evaluator = prepareSignal(signal, dt);
  const signalSteps = Number.isFinite(evaluator.endTime) ? Math.ceil((evaluator.endTime * (1 + TAIL_MARGIN)) / dt) + 1 : Infinity;
  const cutByRunEnd = Number.isFinite(signalSteps) && signalSteps > grid.steps;
  const wanted = Math.min(signalSteps, grid.steps);
  const count = Math.max(1, Math.min(wanted, MAX_PLOTTED_STEPS));
  const times = new Float64Array(count);
  const values = new Float64Array(count);
  for (let n = 0; n < count; n++) {
    const t = (n + 0.5) * dt;
    times[n] = t;
    values[n] = evaluator.valueAt(t);
  }
  return { times, values, cutByRunEnd, shortened: wanted > MAX_PLOTTED_STEPS };
}

/** Magnitude spectrum of the injected samples in dB below its peak, up to a little past the bands of interest. */
export function injectedSpectrum(signal: Signal, waveform: InjectedWaveform, grid: Pick<GridPlan, "timeStep" | "maxResolvedFrequency">): InjectedSpectrum {
  const dt = grid.timeStep;
  const { upperFrequency } = prepareSignal(signal, dt);
  const size = nextPowerOfTwo(Math.max(4 * waveform.values.length, MIN_SPECTRUM_SIZE));
  const spectrum = realSpectrum(waveform.values, dt, { size });
  const magnitude = magnitudes(spectrum);
  let peak = 0;
  for (const value of magnitude) peak = Math.max(peak, value);

  const allLevels = new Float64Array(magnitude.length);
  let lastAboveEdge = 0;
  for (let k = 0; k < magnitude.length; k++) {
    const relative = peak > 0 ? (magnitude[k] ?? 0) / peak : 0;
    allLevels[k] = relative > 0 ? Math.max(SPECTRUM_FLOOR_DB, 20 * Math.log10(relative)) : SPECTRUM_FLOOR_DB;
    if (allLevels[k]! >= SIGNAL_BAND_EDGE_DB) lastAboveEdge = k;
  }

  // Twice the resolved band shows what lies beyond it; samples with energy further up widen the view.
  // (The samples' own band edge, not the analytic one: a recording's is only known from its samples.)
  const nyquist = 0.5 / dt;
  const shownUpTo = Math.min(nyquist, Math.max(2 * grid.maxResolvedFrequency, 1.2 * lastAboveEdge * spectrum.binWidth));
  const bins = Math.min(magnitude.length, Math.floor(shownUpTo / spectrum.binWidth) + 1);
  const frequencies = new Float64Array(bins);
  for (let k = 0; k < bins; k++) frequencies[k] = k * spectrum.binWidth;
  return { frequencies, levels: allLevels.slice(0, bins), maxResolvedFrequency: grid.maxResolvedFrequency, upperFrequency, shownUpTo };
}

export function signalPlotData(signal: Signal, grid: Pick<GridPlan, "timeStep" | "steps" | "maxResolvedFrequency">): SignalPlotData {
  const waveform = injectedWaveform(signal, grid);
  return { waveform, spectrum: injectedSpectrum(signal, waveform, grid) };
}
