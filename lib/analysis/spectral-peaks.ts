// Frequencies of spectral lines (e.g. room modes in a long, lossless record): the largest bin in a search
// range, a parabola through the log magnitudes of its neighbours, then the maximum of the windowed
// discrete-time Fourier transform itself, found by golden-section search.
import { fourierTransformAt, type RealSpectrum } from "./spectrum";

/** Index of the largest magnitude among bins whose frequency lies in [low, high] Hz; -1 if none. */
export function largestBinBetween(magnitude: ArrayLike<number>, binWidth: number, low: number, high: number): number {
  const first = Math.max(1, Math.ceil(low / binWidth));
  const last = Math.min(magnitude.length - 2, Math.floor(high / binWidth));
  let best = -1;
  for (let k = first; k <= last; k++) if (best < 0 || (magnitude[k] ?? 0) > (magnitude[best] ?? 0)) best = k;
  return best;
}

/**
 * Peak position (fractional bin) from a parabola through the log magnitudes of bins k - 1, k, k + 1
 * (exact for a Gaussian-shaped peak, within a few percent of a bin for common windows).
 */
export function parabolicPeakBin(magnitude: ArrayLike<number>, k: number): number {
  const a = Math.log(magnitude[k - 1] ?? 0);
  const b = Math.log(magnitude[k] ?? 0);
  const c = Math.log(magnitude[k + 1] ?? 0);
  const curvature = a - 2 * b + c;
  if (!(curvature < 0) || !Number.isFinite(curvature)) return k;
  return k + (0.5 * (a - c)) / curvature;
}

const INVERSE_GOLDEN_RATIO = (Math.sqrt(5) - 1) / 2;

/**
 * The frequency in [low, high] where |sum_n w_n x_n e^{-2 pi i f n dt}| is largest, by golden-section
 * search (the range must hold a single maximum: give it about one bin around a parabolic estimate).
 * For a long record of undamped sinusoids this is limited only by the window's leakage from other lines.
 */
export function refinePeakFrequency(signal: ArrayLike<number>, timeStep: number, window: ArrayLike<number>, low: number, high: number, iterations = 48): number {
  const power = (f: number) => {
    const z = fourierTransformAt(signal, timeStep, f, window);
    return z.re * z.re + z.im * z.im;
  };
  let a = low;
  let b = high;
  let x1 = b - INVERSE_GOLDEN_RATIO * (b - a);
  let x2 = a + INVERSE_GOLDEN_RATIO * (b - a);
  let p1 = power(x1);
  let p2 = power(x2);
  for (let k = 0; k < iterations; k++) {
    if (p1 > p2) {
      b = x2;
      x2 = x1;
      p2 = p1;
      x1 = b - INVERSE_GOLDEN_RATIO * (b - a);
      p1 = power(x1);
    } else {
      a = x1;
      x1 = x2;
      p1 = p2;
      x2 = a + INVERSE_GOLDEN_RATIO * (b - a);
      p2 = power(x2);
    }
  }
  return 0.5 * (a + b);
}

/** A located spectral line. */
export interface SpectralPeak {
  /** Largest bin in the search range. */
  bin: number;
  /** Parabolic estimate, Hz. */
  parabolicFrequency: number;
  /** Golden-section maximum of the windowed transform, Hz. */
  frequency: number;
}

/**
 * Finds the strongest line between `low` and `high` Hz in `spectrum` (the windowed, zero-padded FFT of
 * `signal`) and refines it. Undefined when the range holds no interior bin.
 */
export function findSpectralPeak(signal: ArrayLike<number>, timeStep: number, window: ArrayLike<number>, spectrum: RealSpectrum, magnitude: ArrayLike<number>, low: number, high: number): SpectralPeak | undefined {
  const bin = largestBinBetween(magnitude, spectrum.binWidth, low, high);
  if (bin < 1) return undefined;
  const parabolicFrequency = parabolicPeakBin(magnitude, bin) * spectrum.binWidth;
  const frequency = refinePeakFrequency(signal, timeStep, window, parabolicFrequency - spectrum.binWidth, parabolicFrequency + spectrum.binWidth);
  return { bin, parabolicFrequency, frequency };
}
