// Figures read off receiver traces: peaks, arrival lags, waveform errors, levels.

/** Largest |x_n| for n in [from, to). */
export function peakMagnitude(x: ArrayLike<number>, from = 0, to = x.length): number {
  let peak = 0;
  for (let n = Math.max(0, from); n < Math.min(to, x.length); n++) peak = Math.max(peak, Math.abs(x[n] ?? 0));
  return peak;
}

/**
 * The lag (in samples, refined by a parabola through the three best correlations) by which `signal` trails
 * `reference`: the maximiser of sum_n reference_n signal_{n + lag} over n < end, |lag| <= maxLag.
 */
export function correlationLag(reference: ArrayLike<number>, signal: ArrayLike<number>, maxLag: number, end = reference.length): number {
  const correlation = (lag: number): number => {
    let sum = 0;
    for (let n = 0; n < Math.min(end, reference.length); n++) {
      const m = n + lag;
      if (m >= 0 && m < signal.length) sum += (reference[n] ?? 0) * (signal[m] ?? 0);
    }
    return sum;
  };
  let best = -Infinity;
  let at = 0;
  for (let lag = -maxLag; lag <= maxLag; lag++) {
    const value = correlation(lag);
    if (value > best) {
      best = value;
      at = lag;
    }
  }
  const before = correlation(at - 1);
  const after = correlation(at + 1);
  const curvature = before - 2 * best + after;
  return curvature < 0 ? at + (0.5 * (before - after)) / curvature : at;
}

/** sqrt(sum (simulated - exact)^2 / sum exact^2) over samples n < end: the normalised RMS waveform error. */
export function normalisedRmsError(simulated: ArrayLike<number>, exact: ArrayLike<number>, end = exact.length): number {
  let error = 0;
  let reference = 0;
  for (let n = 0; n < Math.min(end, simulated.length, exact.length); n++) {
    const d = (simulated[n] ?? 0) - (exact[n] ?? 0);
    error += d * d;
    reference += (exact[n] ?? 0) * (exact[n] ?? 0);
  }
  return Math.sqrt(error / reference);
}

/** 20 log10 of an amplitude ratio, dB. */
export function amplitudeRatioDb(ratio: number): number {
  return 20 * Math.log10(ratio);
}

/** Sample times n dt in milliseconds, for plotting traces. */
export function timesInMilliseconds(count: number, timeStep: number): Float64Array {
  const out = new Float64Array(count);
  for (let n = 0; n < count; n++) out[n] = 1000 * n * timeStep;
  return out;
}
