// The spectrum the analysis shows: power spectral density of a pressure trace averaged over the whole
// trace (no window), as a level in dB re (20 uPa)^2/Hz. It is the density the band levels integrate:
// summing 10^(L/10) (20 uPa)^2 times the bin width over a band's bins gives that band's mean square, so
// the chart and the band table agree. Bin 0 (0 Hz) is left out, as a log frequency axis cannot show it.
import { type FrequencyWeighting, weightSpectrum } from "./a-weighting";
import { REFERENCE_PRESSURE } from "./bands";
import { binEnergies, realSpectrum } from "./spectrum";

export interface SpectralDensity {
  /** Bin frequencies k / (N dt) for k = 1 .. N/2, Hz. */
  frequencies: Float64Array;
  /** Density level per bin, dB re (20 uPa)^2/Hz; -Infinity where the bin holds no energy. */
  levels: Float64Array;
  binWidth: number;
}

/**
 * PSD_k = E_k / (L df), with E_k the bin energy (sum over bins = sum_n p_n^2), L the trace's length in
 * samples and df the bin width, so that sum_k PSD_k df is the mean square over the trace. `size` (a power
 * of two, at least the length) zero-pads, so traces of different lengths can share one frequency axis.
 */
export function spectralDensity(pressure: ArrayLike<number>, timeStep: number, options: { size?: number; weighting?: FrequencyWeighting } = {}): SpectralDensity {
  if (pressure.length < 2) throw new RangeError("a spectrum needs at least two samples");
  const spectrum = weightSpectrum(realSpectrum(pressure, timeStep, options.size !== undefined ? { size: options.size } : {}), options.weighting ?? "Z");
  const energies = binEnergies(spectrum);
  const reference = REFERENCE_PRESSURE * REFERENCE_PRESSURE;
  const count = energies.length - 1;
  const frequencies = new Float64Array(count);
  const levels = new Float64Array(count);
  for (let k = 1; k <= count; k++) {
    frequencies[k - 1] = k * spectrum.binWidth;
    levels[k - 1] = 10 * Math.log10((energies[k] ?? 0) / (pressure.length * spectrum.binWidth) / reference);
  }
  return { frequencies, levels, binWidth: spectrum.binWidth };
}
