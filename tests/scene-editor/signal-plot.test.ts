import { describe, expect, it } from "vitest";
import { injectedSpectrum, injectedWaveform, MAX_PLOTTED_STEPS, signalPlotData, SPECTRUM_FLOOR_DB } from "@/components/scene-editor/model/signal-plot";
import { deriveGrid, type GridPlan } from "@/lib/fdtd/grid";
import type { Signal } from "@/lib/fdtd/scene";
import { prepareSignal, ricker } from "@/lib/fdtd/signals";
import { barrierScene } from "./scene-fixtures";

// The barrier scene: 500 Hz at 10 cells per wavelength, Courant 0.6, 0.1 s of run.
const grid: GridPlan = deriveGrid(barrierScene());

function levelAt(spectrum: { frequencies: Float64Array; levels: Float64Array }, frequency: number): number {
  let best = 0;
  for (let k = 1; k < spectrum.frequencies.length; k++) {
    if (Math.abs(spectrum.frequencies[k]! - frequency) < Math.abs(spectrum.frequencies[best]! - frequency)) best = k;
  }
  return spectrum.levels[best]!;
}

function peakFrequency(spectrum: { frequencies: Float64Array; levels: Float64Array }): number {
  let best = 0;
  for (let k = 1; k < spectrum.levels.length; k++) if (spectrum.levels[k]! > spectrum.levels[best]!) best = k;
  return spectrum.frequencies[best]!;
}

describe("the waveform the solver injects", () => {
  it("samples the signal at the middle of each time step, as the sources do", () => {
    const { times, values } = injectedWaveform({ kind: "ricker", peakFrequency: 180 }, grid);
    const delay = 1.5 / 180;
    for (const n of [0, 1, 17, times.length - 1]) {
      expect(times[n]).toBeCloseTo((n + 0.5) * grid.timeStep, 15);
      expect(values[n]).toBe(ricker((n + 0.5) * grid.timeStep, 180, delay));
    }
  });

  it("covers a pulse until it has ended, and no further than the run", () => {
    const signal: Signal = { kind: "ricker", peakFrequency: 180 };
    const { endTime } = prepareSignal(signal, grid.timeStep);
    const whole = injectedWaveform(signal, grid);
    expect(whole.times[whole.times.length - 1]!).toBeGreaterThanOrEqual(endTime);
    expect(whole.times.length).toBeLessThan(grid.steps);
    expect(whole.cutByRunEnd).toBe(false);

    const shortRun = injectedWaveform(signal, { timeStep: grid.timeStep, steps: 40 });
    expect(shortRun.times.length).toBe(40);
    expect(shortRun.cutByRunEnd).toBe(true);
  });

  it("shows only the first steps of a continuous sine in a long run, and says so", () => {
    const long = injectedWaveform({ kind: "sine", frequency: 200, rampCycles: 3 }, { timeStep: grid.timeStep, steps: 3 * MAX_PLOTTED_STEPS });
    expect(long.times.length).toBe(MAX_PLOTTED_STEPS);
    expect(long.shortened).toBe(true);
    // A continuous signal is meant to run as long as the run: nothing is cut off.
    expect(long.cutByRunEnd).toBe(false);
  });
});

describe("the spectrum of the injected samples", () => {
  it("peaks at a Ricker pulse's peak frequency and is 30 dB down at its analytic band edge", () => {
    const signal: Signal = { kind: "ricker", peakFrequency: 180 };
    const { spectrum } = signalPlotData(signal, grid);
    const binWidth = spectrum.frequencies[1]!;
    expect(Math.abs(peakFrequency(spectrum) - 180)).toBeLessThanOrEqual(binWidth);
    expect(Math.max(...spectrum.levels)).toBe(0);
    expect(levelAt(spectrum, spectrum.upperFrequency)).toBeCloseTo(-30, 0);
  });

  it("reaches past the resolved band (to mark what lies above it) but not past Nyquist", () => {
    const { spectrum } = signalPlotData({ kind: "ricker", peakFrequency: 180 }, grid);
    expect(spectrum.maxResolvedFrequency).toBe(grid.maxResolvedFrequency);
    expect(spectrum.shownUpTo).toBeCloseTo(2 * grid.maxResolvedFrequency, 9);
    expect(spectrum.frequencies[spectrum.frequencies.length - 1]!).toBeLessThanOrEqual(spectrum.shownUpTo);
    const wide = signalPlotData({ kind: "ricker", peakFrequency: 3000 }, grid).spectrum;
    expect(wide.shownUpTo).toBe(0.5 / grid.timeStep);
  });

  it("puts a tone burst's energy at its carrier", () => {
    const { spectrum } = signalPlotData({ kind: "toneBurst", frequency: 400, cycles: 8 }, grid);
    expect(Math.abs(peakFrequency(spectrum) - 400)).toBeLessThanOrEqual(spectrum.frequencies[1]!);
  });

  it("handles a recording, resampled to the time step like the solver does", () => {
    // 60 ms of a 300 Hz tone under a Hann window, recorded at 8 kHz.
    const sampleRate = 8000;
    const count = 480;
    const samples = Array.from({ length: count }, (_, k) => Math.sin((2 * Math.PI * 300 * k) / sampleRate) * Math.sin((Math.PI * k) / (count - 1)) ** 2);
    const signal: Signal = { kind: "sampled", sampleRate, samples };
    const { waveform, spectrum } = signalPlotData(signal, grid);
    const evaluator = prepareSignal(signal, grid.timeStep);
    expect(waveform.values[100]).toBe(evaluator.valueAt(100.5 * grid.timeStep));
    expect(Math.abs(peakFrequency(spectrum) - 300)).toBeLessThanOrEqual(2 * spectrum.frequencies[1]!);
    // The view follows the samples' own band, not the recording's Nyquist frequency.
    expect(spectrum.shownUpTo).toBeCloseTo(2 * grid.maxResolvedFrequency, 9);
  });

  it("floors the levels of a silent signal instead of dividing by zero", () => {
    const silent: Signal = { kind: "sampled", sampleRate: 8000, samples: [0, 0, 0, 0] };
    const waveform = injectedWaveform(silent, grid);
    const spectrum = injectedSpectrum(silent, waveform, grid);
    expect(spectrum.levels.every((level) => level === SPECTRUM_FLOOR_DB)).toBe(true);
  });
});
