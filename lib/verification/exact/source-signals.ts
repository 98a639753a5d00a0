// Source signals s(t) for the time-domain reference solutions: analytic pulses and sampled signals.

/** A source time function that is zero outside [start, end]. */
export interface SourceSignal {
  /** s(t), zero outside [start, end]. */
  valueAt(t: number): number;
  /** Time before which s is zero, s. */
  readonly start: number;
  /** Time after which s is zero (may be Infinity), s. */
  readonly end: number;
  /** A time step that resolves the signal's shape, s; quadrature panels are this long and start at `start`. */
  readonly resolution: number;
}

export interface RickerOptions {
  /** Peak frequency f0 of the amplitude spectrum, Hz. */
  peakFrequency: number;
  /** Time t0 of the peak, s (default 1.5 / f0). */
  delay?: number;
  /** Time the signal is switched on, s (default 0: a solver starts from rest at t = 0). */
  start?: number;
}

/**
 * Ricker wavelet with unit peak:
 *   r(t) = (1 - 2 pi^2 f0^2 (t - t0)^2) exp(-pi^2 f0^2 (t - t0)^2)   for t >= start, else 0.
 * Its amplitude spectrum is proportional to (f/f0)^2 exp(-(f/f0)^2), peaking at f0 (Ricker, "The form and
 * laws of propagation of seismic wavelets", Geophysics 18, 1953). It is cut to zero beyond t0 + 3/f0 and
 * before max(start, t0 - 3/f0), where |r| < 1e-36.
 */
export function rickerWavelet(options: RickerOptions): SourceSignal {
  const f0 = options.peakFrequency;
  if (!(f0 > 0)) throw new RangeError(`Ricker peak frequency must be positive, got ${f0}`);
  const delay = options.delay ?? 1.5 / f0;
  const start = Math.max(options.start ?? 0, delay - 3 / f0);
  const end = delay + 3 / f0;
  return {
    valueAt(t) {
      if (t < start || t > end) return 0;
      const a = Math.PI * f0 * (t - delay);
      const a2 = a * a;
      return (1 - 2 * a2) * Math.exp(-a2);
    },
    start,
    end,
    resolution: 1 / (20 * f0),
  };
}

export interface GaussianPulseOptions {
  /** Standard deviation sigma of the pulse, s. */
  width: number;
  /** Time t0 of the peak, s (default 6 sigma). */
  delay?: number;
  /** Time the signal is switched on, s (default 0). */
  start?: number;
}

/**
 * Gaussian pulse with unit peak: g(t) = exp(-(t - t0)^2 / (2 sigma^2)) for t >= start, else 0.
 * Cut to zero beyond |t - t0| > 12 sigma (g < 1e-31). Its spectrum is proportional to
 * exp(-(2 pi f sigma)^2 / 2), so unlike the Ricker wavelet it carries energy down to 0 Hz.
 */
export function gaussianPulse(options: GaussianPulseOptions): SourceSignal {
  const sigma = options.width;
  if (!(sigma > 0)) throw new RangeError(`Gaussian pulse width must be positive, got ${sigma}`);
  const delay = options.delay ?? 6 * sigma;
  const start = Math.max(options.start ?? 0, delay - 12 * sigma);
  const end = delay + 12 * sigma;
  return {
    valueAt(t) {
      if (t < start || t > end) return 0;
      const u = (t - delay) / sigma;
      return Math.exp(-0.5 * u * u);
    },
    start,
    end,
    resolution: sigma / 4,
  };
}

/**
 * A sampled signal s_j at times startTime + j / sampleRate, zero outside the samples. Between samples it is
 * the cubic through the four nearest samples (Lagrange; samples beyond either end count as zero), so its
 * error is O((f / sampleRate)^4) for a smooth signal of frequency f. The samples should start and end near
 * zero: a signal cut off at a non-zero value has a step that no interpolation represents well.
 */
export function sampledSignal(samples: ArrayLike<number>, sampleRate: number, startTime = 0): SourceSignal {
  if (!(sampleRate > 0)) throw new RangeError(`sample rate must be positive, got ${sampleRate}`);
  const count = samples.length;
  const copy = Float64Array.from(samples);
  const sampleAt = (j: number): number => (j >= 0 && j < count ? (copy[j] ?? 0) : 0);
  const interval = 1 / sampleRate;
  // One interval either side: the cubic reaches from the zeros beyond each end to the first and last samples.
  const start = startTime - interval;
  const end = startTime + count * interval;
  return {
    valueAt(t) {
      if (t <= start || t >= end) return 0;
      const position = (t - startTime) * sampleRate;
      const j = Math.floor(position);
      const x = position - j; // in [0, 1): between samples j and j + 1
      // Lagrange weights for the nodes j - 1, j, j + 1, j + 2.
      const w0 = (-x * (x - 1) * (x - 2)) / 6;
      const w1 = ((x + 1) * (x - 1) * (x - 2)) / 2;
      const w2 = (-(x + 1) * x * (x - 2)) / 2;
      const w3 = ((x + 1) * x * (x - 1)) / 6;
      return w0 * sampleAt(j - 1) + w1 * sampleAt(j) + w2 * sampleAt(j + 1) + w3 * sampleAt(j + 2);
    },
    start,
    end,
    resolution: interval,
  };
}
