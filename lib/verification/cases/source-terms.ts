// The right-hand side s(t) of (1/c^2) p_tt - lap p = s(t) delta(x - x0) produced by a solver source, as a
// signal for the exact time-domain solutions. A solver source injects the volume rate per unit length
// Q(t) = amplitude * signal(t) (m^2/s) into dp/dt = -rho c^2 div v + rho c^2 Q delta (lib/fdtd/sources.ts),
// so s(t) = rho dQ/dt.
import type { SourceSignal } from "../exact/source-signals";

/** Periods of f0 from the start to the Ricker peak: the pulse then starts at about 1e-8 of its peak. */
const RICKER_DELAY_PERIODS = 1.5;

/** A Ricker source signal for a scene, its delay given explicitly so the exact solution uses the same. */
export function rickerSignal(peakFrequency: number): { kind: "ricker"; peakFrequency: number; delay: number } {
  return { kind: "ricker", peakFrequency, delay: rickerPeakTime(peakFrequency) };
}

/** Time of the Ricker peak of `rickerSignal`, s. */
export function rickerPeakTime(peakFrequency: number): number {
  return RICKER_DELAY_PERIODS / peakFrequency;
}

/**
 * s(t) = rho * amplitude * d/dt [(1 - 2a) exp(-a)], a = (pi f0 (t - t0))^2, for a solver Ricker source
 * switched on at t = 0: d/dt = 2 pi f0 x (2a - 3) exp(-a) with x = pi f0 (t - t0).
 * @param density rho of the medium at the source, kg/m^3
 * @param amplitude the source's peak volume rate per unit length, m^2/s
 * @param peakFrequency f0, Hz
 * @param delay t0, the time of the peak, s (as in the scene's signal)
 */
export function rickerSourceTerm(density: number, amplitude: number, peakFrequency: number, delay: number): SourceSignal {
  const t0 = delay;
  // Beyond 4 / f0 from the peak, a > 157 and the term is below 1e-60 of its peak.
  const end = t0 + 4 / peakFrequency;
  const scale = density * amplitude * 2 * Math.PI * peakFrequency;
  return {
    valueAt(t) {
      if (t < 0 || t > end) return 0;
      const x = Math.PI * peakFrequency * (t - t0);
      const a = x * x;
      return scale * x * (2 * a - 3) * Math.exp(-a);
    },
    start: 0,
    end,
    resolution: 1 / (40 * peakFrequency),
  };
}
