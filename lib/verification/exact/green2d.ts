/**
 * Free-field pressure of a coherent line source in the time domain (2D wave equation).
 *
 * For (1/c^2) p_tt - lap p = s(t) delta(x - x0), with s = 0 before `start` and p = 0 before it,
 *
 *   p(r, t) = (1/(2 pi)) int_{start}^{t - r/c} s(tau) / sqrt((t - tau)^2 - r^2/c^2) dtau,
 *
 * i.e. the causal Green's function g(r, t) = H(t - r/c) / (2 pi sqrt(t^2 - r^2/c^2)) convolved with s
 * (Morse & Feshbach, Methods of Theoretical Physics, 1953, ch. 7; Duffy, Green's Functions with
 * Applications, 2001, ch. 3; section numbers from memory). It also follows by integrating the 3D
 * Green's function delta(t - R/c)/(4 pi R) along the line (Hadamard's method of descent): the two
 * points z = +-sqrt(c^2 t^2 - r^2) contribute c / (4 pi sqrt(c^2 t^2 - r^2)) each.
 * Its Fourier transform is the Helmholtz Green's function (i/4) H0^(1)(kr) of ./hankel.ts
 * (time factor e^{-i omega t}).
 *
 * Relation to the acoustic equations: with a volume source Q(t) (m^2/s per metre of line) in
 * dp/dt = -rho0 c^2 div v + rho0 c^2 Q(t) delta(x - x0) and rho0 dv/dt = -grad p, eliminating v gives the
 * equation above with s(t) = rho0 dQ/dt.
 *
 * The kernel has an inverse-square-root singularity at the wavefront tau = t - r/c. The substitution
 * tau = t - r/c - u^2 removes it exactly:
 *
 *   p(r, t) = (1/(2 pi)) int 2 s(t - r/c - u^2) / sqrt(u^2 + 2 r / c) du,
 *
 * a smooth integrand, integrated by adaptive Gauss-Legendre over panels that are `resolution` long in tau
 * (for a sampled signal: one panel per sample interval, so each panel sees a single cubic).
 */
import { integrateOverPanels } from "./quadrature";
import type { SourceSignal } from "./source-signals";

/** Relative accuracy of the quadrature (against the integral of |integrand|). */
const QUADRATURE_TOLERANCE = 1e-11;

/**
 * The 2D Green's function itself, g(r, t) = H(t - r/c) / (2 pi sqrt(t^2 - r^2/c^2)), in 1/s.
 * @param distance r from the line source, m
 * @param soundSpeed c, m/s
 * @param time t since the impulse, s
 */
export function lineSourceImpulseResponse(distance: number, soundSpeed: number, time: number): number {
  const arrival = distance / soundSpeed;
  if (time <= arrival) return 0;
  return 1 / (2 * Math.PI * Math.sqrt(time * time - arrival * arrival));
}

/**
 * p(r, t) for a line source with time function s(t) in free field.
 * @param signal s(t); p comes out in the units of s (the equation's delta has units 1/m^2)
 * @param distance r from the source, m (> 0)
 * @param soundSpeed c, m/s
 * @param time t, s
 */
export function lineSourcePressure(signal: SourceSignal, distance: number, soundSpeed: number, time: number): number {
  if (!(distance > 0)) throw new RangeError(`line source pressure needs a distance > 0, got ${distance}`);
  const retarded = time - distance / soundSpeed;
  const upper = Math.min(signal.end, retarded);
  if (!(upper > signal.start)) return 0;
  const twoDelay = (2 * distance) / soundSpeed;
  // Panels: tau edges at start + j h (so sampled signals get one cubic per panel), cut at `upper`.
  const h = signal.resolution;
  const lastEdge = Math.ceil((upper - signal.start) / h - 1e-9);
  const breakpoints = new Float64Array(lastEdge + 1);
  for (let j = 0; j <= lastEdge; j++) {
    const tau = j === lastEdge ? upper : signal.start + j * h;
    breakpoints[j] = Math.sqrt(Math.max(0, retarded - tau)); // u, descending as tau rises
  }
  const result = new Float64Array(1);
  integrateOverPanels(
    (u, out) => {
      out[0] = (2 * signal.valueAt(retarded - u * u)) / Math.sqrt(u * u + twoDelay);
    },
    breakpoints,
    1,
    result,
    { relativeTolerance: QUADRATURE_TOLERANCE, order: 8 },
  );
  // Breakpoints run from large u to small u: the panel integrals come out negated.
  return -(result[0] ?? 0) / (2 * Math.PI);
}

/**
 * p(r, t) at the times startTime + j / sampleRate, j = 0 .. out.length - 1, written into `out`.
 * @param out receives the pressure trace (same units as lineSourcePressure)
 */
export function lineSourceTrace(signal: SourceSignal, distance: number, soundSpeed: number, startTime: number, sampleRate: number, out: Float64Array): void {
  for (let j = 0; j < out.length; j++) out[j] = lineSourcePressure(signal, distance, soundSpeed, startTime + j / sampleRate);
}
