// Discrete Fourier spectra of real sampled signals (pressure traces), through fft.js.
// Convention: X_k = sum_n x_n e^{-2 pi i k n / N}, bin k at frequency k / (N dt); only k = 0 .. N/2 are kept.
import FFT from "fft.js";

/** Smallest power of two >= n (and >= 2, the smallest size fft.js accepts). */
export function nextPowerOfTwo(n: number): number {
  let size = 2;
  while (size < n) size *= 2;
  return size;
}

/** One-sided spectrum of a real signal: bins k = 0 .. size/2 (both ends included). */
export interface RealSpectrum {
  /** Transform length N (the signal was zero-padded to it). */
  size: number;
  /** Bin spacing 1 / (N dt), Hz. */
  binWidth: number;
  re: Float64Array;
  im: Float64Array;
}

/**
 * Spectrum of `signal` (sampled every `timeStep` seconds), optionally multiplied by `window` sample by
 * sample, zero-padded to `size` (a power of two, at least the signal length; default the next one).
 */
export function realSpectrum(signal: ArrayLike<number>, timeStep: number, options: { size?: number; window?: ArrayLike<number> } = {}): RealSpectrum {
  const size = options.size ?? nextPowerOfTwo(signal.length);
  if (size < signal.length || nextPowerOfTwo(size) !== size) throw new RangeError(`FFT size ${size} must be a power of two of at least ${signal.length}`);
  const window = options.window;
  if (window && window.length !== signal.length) throw new RangeError(`window of ${window.length} samples for a signal of ${signal.length}`);
  const fft = new FFT(size);
  const input = new Array<number>(size).fill(0);
  for (let n = 0; n < signal.length; n++) input[n] = (signal[n] ?? 0) * (window ? (window[n] ?? 0) : 1);
  const output = fft.createComplexArray() as number[];
  fft.realTransform(output, input);
  const half = size / 2;
  const re = new Float64Array(half + 1);
  const im = new Float64Array(half + 1);
  for (let k = 0; k <= half; k++) {
    re[k] = output[2 * k] ?? 0;
    im[k] = output[2 * k + 1] ?? 0;
  }
  return { size, binWidth: 1 / (size * timeStep), re, im };
}

/**
 * Energy per bin of the one-sided spectrum, scaled so that the bins sum to sum_n x_n^2 (Parseval:
 * sum over all N bins of |X_k|^2 = N sum_n x_n^2). Bins 0 < k < N/2 stand for k and N - k, so they count
 * twice; DC and Nyquist once.
 */
export function binEnergies(spectrum: RealSpectrum): Float64Array {
  const { size, re, im } = spectrum;
  const half = size / 2;
  const energy = new Float64Array(half + 1);
  for (let k = 0; k <= half; k++) {
    const weight = k === 0 || k === half ? 1 : 2;
    energy[k] = (weight * ((re[k] ?? 0) * (re[k] ?? 0) + (im[k] ?? 0) * (im[k] ?? 0))) / size;
  }
  return energy;
}

/** Magnitudes |X_k| of the one-sided spectrum. */
export function magnitudes(spectrum: RealSpectrum): Float64Array {
  const out = new Float64Array(spectrum.re.length);
  for (let k = 0; k < out.length; k++) out[k] = Math.hypot(spectrum.re[k] ?? 0, spectrum.im[k] ?? 0);
  return out;
}

/**
 * The discrete-time Fourier transform sum_n w_n x_n e^{-i omega n dt} at one frequency (any, not only a bin),
 * by a rotating phasor in double precision.
 */
export function fourierTransformAt(signal: ArrayLike<number>, timeStep: number, frequency: number, window?: ArrayLike<number>): { re: number; im: number } {
  const step = -2 * Math.PI * frequency * timeStep;
  // Phasor rotation, renormalised now and then so rounding does not let its length drift.
  const cosStep = Math.cos(step);
  const sinStep = Math.sin(step);
  let c = 1;
  let s = 0;
  let re = 0;
  let im = 0;
  for (let n = 0; n < signal.length; n++) {
    const value = (signal[n] ?? 0) * (window ? (window[n] ?? 0) : 1);
    re += value * c;
    im += value * s;
    const nextC = c * cosStep - s * sinStep;
    s = c * sinStep + s * cosStep;
    c = nextC;
    if ((n & 1023) === 1023) {
      // Re-anchor exactly every 1024 samples.
      const phase = step * (n + 1);
      c = Math.cos(phase);
      s = Math.sin(phase);
    }
  }
  return { re, im };
}
