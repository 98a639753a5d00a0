// Data windows for spectral analysis (Harris, "On the use of windows for harmonic analysis with the
// discrete Fourier transform", Proc. IEEE 66, 51-83, 1978).

/** Symmetric Hann window of `length` samples: 0.5 - 0.5 cos(2 pi n / (length - 1)); a single sample is 1. */
export function hannWindow(length: number): Float64Array {
  const w = new Float64Array(length).fill(1);
  if (length > 1) for (let n = 0; n < length; n++) w[n] = 0.5 - 0.5 * Math.cos((2 * Math.PI * n) / (length - 1));
  return w;
}

/**
 * Symmetric 4-term Blackman-Harris window (Harris 1978, the -92 dB sidelobe variant): highest sidelobe
 * 92 dB below the main lobe, so a strong neighbouring spectral line barely biases a peak estimate.
 */
export function blackmanHarrisWindow(length: number): Float64Array {
  const a0 = 0.35875;
  const a1 = 0.48829;
  const a2 = 0.14128;
  const a3 = 0.01168;
  const w = new Float64Array(length).fill(1);
  if (length === 1) return w;
  for (let n = 0; n < length; n++) {
    const x = (2 * Math.PI * n) / (length - 1);
    w[n] = a0 - a1 * Math.cos(x) + a2 * Math.cos(2 * x) - a3 * Math.cos(3 * x);
  }
  return w;
}

/** Sum of squared window values: the power gain that turns windowed bin energies back into signal energy. */
export function windowPowerSum(window: ArrayLike<number>): number {
  let sum = 0;
  for (let n = 0; n < window.length; n++) sum += (window[n] ?? 0) * (window[n] ?? 0);
  return sum;
}
