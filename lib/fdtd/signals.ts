// Source signals: their time functions, when they end, and how high their spectrum reaches.
// Each analytic signal has unit peak (Ricker, Gaussian pulse) or unit carrier amplitude (tone burst, sine);
// a source multiplies it by its amplitude (see lib/fdtd/README.md for the physical meaning).
import type { Signal } from "./scene";

/** Spectrum level, relative to its maximum, below which a signal counts as having no energy (common practice). */
export const SIGNAL_BAND_EDGE_DB = -30;

/** Default time of the Ricker peak: 1.5 / f0 leaves a start value of about 1e-8 of the peak. */
export function rickerDelay(peakFrequency: number, delay: number | undefined): number {
  return delay ?? 1.5 / peakFrequency;
}

/** Ricker wavelet (1 - 2a) exp(-a), a = (pi f0 (t - t0))^2; unit peak at t = t0. */
export function ricker(t: number, peakFrequency: number, delay: number): number {
  const x = Math.PI * peakFrequency * (t - delay);
  const a = x * x;
  return (1 - 2 * a) * Math.exp(-a);
}

/** Standard deviation of the tone burst's Gaussian envelope: +-2 sigma spans `cycles` carrier periods. */
export function toneBurstSigma(frequency: number, cycles: number): number {
  return cycles / (4 * frequency);
}

/** Number of input samples on each side of the windowed-sinc resampling kernel. */
const RESAMPLING_HALF_WIDTH = 16;

/** A signal prepared for one time step: `valueAt(t)` in the signal's own units (unit peak or raw samples). */
export interface SignalEvaluator {
  valueAt(t: number): number;
  /** Time after which the signal is negligible (Infinity for a continuous sine), s. */
  endTime: number;
  /** Frequency above which the amplitude spectrum stays 30 dB below its maximum, Hz. */
  upperFrequency: number;
}

/** Ricker amplitude spectrum relative to its peak at f0: x exp(1 - x), x = (f/f0)^2. Solves for the -30 dB edge above f0. */
function rickerUpperFrequency(peakFrequency: number): number {
  const target = Math.pow(10, SIGNAL_BAND_EDGE_DB / 20);
  let lo = 1;
  let hi = 20;
  for (let k = 0; k < 80; k++) {
    const x = 0.5 * (lo + hi);
    if (x * Math.exp(1 - x) > target) lo = x;
    else hi = x;
  }
  return peakFrequency * Math.sqrt(0.5 * (lo + hi));
}

/** Gaussian exp(-t^2 / (2 sigma^2)) has spectrum exp(-(2 pi f sigma)^2 / 2); frequency where it is 30 dB down. */
function gaussianUpperFrequency(sigma: number): number {
  const nepers = (-SIGNAL_BAND_EDGE_DB / 20) * Math.LN10;
  return Math.sqrt(2 * nepers) / (2 * Math.PI * sigma);
}

/**
 * Prepares a signal for evaluation. `timeStep` is the solver's dt: a sampled signal is resampled to it
 * with a Blackman-windowed sinc whose cut-off is the lower of the two Nyquist frequencies (anti-aliasing
 * when the recording's rate is above the solver's).
 */
export function prepareSignal(signal: Signal, timeStep: number): SignalEvaluator {
  switch (signal.kind) {
    case "ricker": {
      const delay = rickerDelay(signal.peakFrequency, signal.delay);
      const f0 = signal.peakFrequency;
      return { valueAt: (t) => ricker(t, f0, delay), endTime: delay + 1.5 / f0, upperFrequency: rickerUpperFrequency(f0) };
    }
    case "gaussianPulse": {
      const sigma = signal.width;
      const delay = signal.delay ?? 6 * sigma;
      return {
        valueAt: (t) => {
          const u = (t - delay) / sigma;
          return Math.exp(-0.5 * u * u);
        },
        endTime: delay + 6 * sigma,
        upperFrequency: gaussianUpperFrequency(sigma),
      };
    }
    case "toneBurst": {
      const sigma = toneBurstSigma(signal.frequency, signal.cycles);
      const delay = signal.delay ?? 6 * sigma;
      const omega = 2 * Math.PI * signal.frequency;
      return {
        valueAt: (t) => {
          const u = (t - delay) / sigma;
          return Math.sin(omega * (t - delay)) * Math.exp(-0.5 * u * u);
        },
        endTime: delay + 6 * sigma,
        upperFrequency: signal.frequency + gaussianUpperFrequency(sigma),
      };
    }
    case "sine": {
      const omega = 2 * Math.PI * signal.frequency;
      const ramp = signal.rampCycles / signal.frequency;
      return {
        valueAt: (t) => {
          if (t < 0) return 0;
          const s = Math.sin(omega * t);
          return t < ramp ? s * 0.5 * (1 - Math.cos((Math.PI * t) / ramp)) : s;
        },
        endTime: Infinity,
        // A raised-cosine fade-in of length T widens the line by about 2 / T; an abrupt start has no band edge.
        upperFrequency: ramp > 0 ? signal.frequency + 2 / ramp : Infinity,
      };
    }
    case "sampled":
      return prepareSampledSignal(signal.samples, signal.sampleRate, timeStep);
  }
}

function blackman(u: number): number {
  // u in [-1, 1]
  return 0.42 + 0.5 * Math.cos(Math.PI * u) + 0.08 * Math.cos(2 * Math.PI * u);
}

function prepareSampledSignal(samples: readonly number[], sampleRate: number, timeStep: number): SignalEvaluator {
  const cutoff = Math.min(0.5 * sampleRate, 0.5 / timeStep);
  // Kernel half-width in seconds: RESAMPLING_HALF_WIDTH periods of the cut-off's Nyquist rate.
  const halfWidth = RESAMPLING_HALF_WIDTH / (2 * cutoff);
  const gain = (2 * cutoff) / sampleRate;
  const count = samples.length;
  const endTime = (count - 1) / sampleRate + halfWidth;
  return {
    valueAt: (t) => {
      const first = Math.max(0, Math.ceil((t - halfWidth) * sampleRate));
      const last = Math.min(count - 1, Math.floor((t + halfWidth) * sampleRate));
      let sum = 0;
      for (let k = first; k <= last; k++) {
        const tau = t - k / sampleRate;
        const x = 2 * cutoff * tau;
        const sinc = x === 0 ? 1 : Math.sin(Math.PI * x) / (Math.PI * x);
        sum += (samples[k] ?? 0) * gain * sinc * blackman(tau / halfWidth);
      }
      return sum;
    },
    endTime,
    upperFrequency: 0.5 * sampleRate,
  };
}
