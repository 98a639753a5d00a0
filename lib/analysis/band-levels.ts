// Octave and one-third-octave band levels of receiver pressure traces, dB re 20 uPa, optionally A- or
// C-weighted, kept to the bands the grid resolves. A band level is the equivalent (energy-mean) level over
// the whole trace: band energy from the FFT (Parseval, bands.ts) divided by the trace's length.
import { type FrequencyWeighting, weightSpectrum } from "./a-weighting";
import { bandEnergies, bandsBetween, type FrequencyBand, levelFromMeanSquare } from "./bands";
import { realSpectrum } from "./spectrum";
import { hannWindow, windowPowerSum } from "./windows";

/** What the analysis needs from a receiver trace (the solver's ReceiverTrace has these and more). */
export interface PressureTrace {
  id: string;
  label: string;
  /** Seconds between samples. */
  timeStep: number;
  /** Sound pressure, Pa. */
  pressure: ArrayLike<number>;
}

export type BandsPerOctave = 1 | 3;

/** "rectangular" suits a transient that dies out within the trace; "hann" a steady signal cut mid-way. */
export type TraceWindow = "rectangular" | "hann";

export interface BandLevelOptions {
  bandsPerOctave: BandsPerOctave;
  /** Highest frequency the grid resolves (GridPlan.maxResolvedFrequency), Hz: bands reaching above it are left out. */
  highestResolvedFrequency: number;
  weighting?: FrequencyWeighting;
  window?: TraceWindow;
  /** Range of midband frequencies to consider, Hz (default 20 Hz to 20 kHz). */
  lowestMidband?: number;
  highestMidband?: number;
}

export type BandExclusionReason = "above-resolved-frequency" | "above-nyquist" | "narrower-than-resolution";

export interface ExcludedBand {
  band: FrequencyBand;
  reason: BandExclusionReason;
  /** A sentence for the interface. */
  message: string;
}

export interface ReceiverBandLevels {
  receiverId: string;
  label: string;
  /** One level per entry of BandLevelTable.bands, dB re 20 uPa. */
  levels: Float64Array;
  /** Energy sum of the reported bands, dB re 20 uPa. */
  overall: number;
}

export interface BandLevelTable {
  bandsPerOctave: BandsPerOctave;
  weighting: FrequencyWeighting;
  /** The bands reported, low to high. */
  bands: FrequencyBand[];
  /** Bands in the requested range that were left out, and why. */
  excluded: ExcludedBand[];
  /** Length of the traces the levels are averaged over, s. */
  averagingTime: number;
  receivers: ReceiverBandLevels[];
}

/**
 * A band narrower than the trace's frequency resolution 1 / T cannot be told apart from its neighbours:
 * its energy would come from one or two natural bins smeared over the band edges.
 */
export function exclusionOf(band: FrequencyBand, highestResolved: number, nyquist: number, resolution: number): ExcludedBand | undefined {
  const hz = (f: number) => `${f >= 100 ? f.toFixed(0) : f.toPrecision(3)} Hz`;
  if (band.upper > nyquist) {
    return { band, reason: "above-nyquist", message: `upper edge ${hz(band.upper)} is above the Nyquist frequency ${hz(nyquist)}` };
  }
  if (band.upper > highestResolved) {
    return { band, reason: "above-resolved-frequency", message: `upper edge ${hz(band.upper)} is above the highest resolved frequency ${hz(highestResolved)}` };
  }
  if (band.upper - band.lower < resolution) {
    return { band, reason: "narrower-than-resolution", message: `bandwidth ${hz(band.upper - band.lower)} is narrower than the trace's frequency resolution ${hz(resolution)} (1 / duration)` };
  }
  return undefined;
}

/** Splits the candidate bands into those reported and those left out (with the reason). */
export function selectBands(options: BandLevelOptions, timeStep: number, sampleCount: number): { bands: FrequencyBand[]; excluded: ExcludedBand[] } {
  const candidates = bandsBetween(options.lowestMidband ?? 20, options.highestMidband ?? 20000, options.bandsPerOctave);
  const nyquist = 1 / (2 * timeStep);
  const resolution = 1 / (sampleCount * timeStep);
  const bands: FrequencyBand[] = [];
  const excluded: ExcludedBand[] = [];
  for (const band of candidates) {
    const exclusion = exclusionOf(band, options.highestResolvedFrequency, nyquist, resolution);
    if (exclusion) excluded.push(exclusion);
    else bands.push(band);
  }
  return { bands, excluded };
}

/** Energy sum of levels, dB (NaN entries ignored; -Infinity when nothing is left). */
export function sumLevels(levels: ArrayLike<number>): number {
  let sum = 0;
  for (let k = 0; k < levels.length; k++) {
    const level = levels[k] ?? NaN;
    if (!Number.isNaN(level)) sum += Math.pow(10, level / 10);
  }
  return 10 * Math.log10(sum);
}

/** Mean-square band pressures of one trace: band energy over the window's power sum (N for no window). */
function bandMeanSquares(trace: PressureTrace, bands: readonly FrequencyBand[], weighting: FrequencyWeighting, windowKind: TraceWindow): Float64Array {
  const window = windowKind === "hann" ? hannWindow(trace.pressure.length) : undefined;
  const spectrum = weightSpectrum(realSpectrum(trace.pressure, trace.timeStep, window ? { window } : {}), weighting);
  const powerSum = window ? windowPowerSum(window) : trace.pressure.length;
  return bandEnergies(spectrum, bands).map((energy) => energy / powerSum);
}

/** Band levels of one trace in the given bands. */
export function receiverBandLevels(trace: PressureTrace, bands: readonly FrequencyBand[], weighting: FrequencyWeighting = "Z", window: TraceWindow = "rectangular"): ReceiverBandLevels {
  const levels = bandMeanSquares(trace, bands, weighting, window).map(levelFromMeanSquare);
  return { receiverId: trace.id, label: trace.label, levels, overall: sumLevels(levels) };
}

/** The traces must share one sampling so that one list of bands fits them all. */
function commonSampling(traces: readonly PressureTrace[]): { timeStep: number; sampleCount: number } {
  const first = traces[0];
  if (!first) throw new RangeError("band levels need at least one receiver trace");
  for (const trace of traces) {
    if (trace.timeStep !== first.timeStep || trace.pressure.length !== first.pressure.length) {
      throw new RangeError(`receiver "${trace.id}" is sampled differently from "${first.id}" (time step or length)`);
    }
  }
  if (first.pressure.length < 2) throw new RangeError(`receiver "${first.id}" has fewer than two samples`);
  return { timeStep: first.timeStep, sampleCount: first.pressure.length };
}

/** Band levels of every receiver of a run, in the bands the grid resolves. */
export function bandLevelTable(traces: readonly PressureTrace[], options: BandLevelOptions): BandLevelTable {
  const { timeStep, sampleCount } = commonSampling(traces);
  const { bands, excluded } = selectBands(options, timeStep, sampleCount);
  const weighting = options.weighting ?? "Z";
  const receivers = traces.map((trace) => receiverBandLevels(trace, bands, weighting, options.window ?? "rectangular"));
  return { bandsPerOctave: options.bandsPerOctave, weighting, bands, excluded, averagingTime: sampleCount * timeStep, receivers };
}
