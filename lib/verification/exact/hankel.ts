/**
 * Hankel functions of order 0 and 1 and the 2D free-field Green's function of the Helmholtz equation.
 *
 * Time convention: harmonic fields are Re{P e^{-i omega t}}, so outgoing waves are H^(1)(kr) and
 *   (lap + k^2) G = -delta(x - x0)   has the outgoing solution   G(r) = (i/4) H0^(1)(k r)
 * (e.g. Morse & Feshbach, Methods of Theoretical Physics, 1953, ch. 7; the normalisation follows from
 * H0^(1)(x) ~ (2i/pi) ln x as x -> 0, A&S 9.1.8, since -ln(r)/(2 pi) is the Green's function of -lap).
 * Under the opposite convention e^{+i omega t} the same field is (-i/4) H0^(2)(kr), its complex conjugate.
 *
 * H^(1)_n = J_n + i Y_n and H^(2)_n = J_n - i Y_n (A&S 9.1.3, 9.1.4). Real arguments use J and Y of the
 * `bessel` package (rational approximations, about 1e-8 absolute, 6e-8 relative to the envelope
 * sqrt(2/(pi x))). Complex arguments of large modulus use the asymptotic expansion (DLMF 10.17.5,
 * A&S 9.2.7): H^(1)_nu(z) ~ sqrt(2/(pi z)) e^{i(z - nu pi/2 - pi/4)} sum_k i^k a_k(nu) / z^k,
 * a_k(nu) = ((4nu^2 - 1^2)(4nu^2 - 3^2)...(4nu^2 - (2k-1)^2)) / (k! 8^k), valid for -pi < arg z < 2pi.
 */
import BESSEL from "bessel";

import { type Complex, complex, multiply, scale, sqrt as complexSqrt } from "./complex";

/** J_n(x) for integer n >= 0 (bessel package). */
export function besselJ(order: number, x: number): number {
  return BESSEL.besselj(x, order);
}

/** Y_n(x) for integer n >= 0, x > 0 (bessel package). */
export function besselY(order: number, x: number): number {
  return BESSEL.bessely(x, order);
}

/** H^(1)_n(x) = J_n(x) + i Y_n(x), integer order n >= 0, real x > 0. */
export function hankel1(order: number, x: number): Complex {
  return complex(besselJ(order, x), besselY(order, x));
}

/** H^(2)_n(x) = J_n(x) - i Y_n(x), integer order n >= 0, real x > 0. */
export function hankel2(order: number, x: number): Complex {
  return complex(besselJ(order, x), -besselY(order, x));
}

/**
 * 2D free-field Green's function G = (i/4) H0^(1)(k r) of (lap + k^2) G = -delta, time factor e^{-i omega t}.
 * @param wavenumber k = omega / c, rad/m (> 0)
 * @param distance r from the source, m (> 0)
 */
export function freeFieldGreen2D(wavenumber: number, distance: number): Complex {
  const h = hankel1(0, wavenumber * distance);
  return complex(-0.25 * h.im, 0.25 * h.re);
}

/**
 * H^(1)_nu(z) from the large-argument expansion (DLMF 10.17.5), summed up to its smallest term.
 * For |z| >= 20 the truncation error is below about e^{-2|z|} relative, i.e. at rounding level.
 * @param order nu (any real order)
 * @param z complex argument of large modulus, -pi < arg z < pi (principal square root)
 */
export function hankel1Asymptotic(order: number, z: Complex): Complex {
  const mu = 4 * order * order;
  // 1/z
  const norm = z.re * z.re + z.im * z.im;
  const inverse = complex(z.re / norm, -z.im / norm);
  let term = complex(1, 0); // i^k a_k(nu) / z^k
  let sumRe = 1;
  let sumIm = 0;
  let previousMagnitude = Infinity;
  for (let k = 1; k < 200; k++) {
    const odd = 2 * k - 1;
    // term_k = term_{k-1} * i (mu - (2k-1)^2) / (8k z)
    const factor = (mu - odd * odd) / (8 * k);
    if (factor === 0) break; // half-integer orders: the series terminates
    const next = multiply(multiply(term, complex(0, factor)), inverse);
    const magnitude = Math.hypot(next.re, next.im);
    if (magnitude >= previousMagnitude) break; // divergent tail starts: stop at the smallest term
    term = next;
    sumRe += term.re;
    sumIm += term.im;
    previousMagnitude = magnitude;
    if (magnitude < 1e-17 * Math.hypot(sumRe, sumIm)) break;
  }
  // sqrt(2/(pi z)) e^{i(z - nu pi/2 - pi/4)}
  const chi = -0.5 * order * Math.PI - 0.25 * Math.PI;
  const modulus = Math.exp(-z.im);
  const phasor = complex(modulus * Math.cos(z.re + chi), modulus * Math.sin(z.re + chi));
  const amplitude = complexSqrt(scale(inverse, 2 / Math.PI));
  return multiply(multiply(amplitude, phasor), complex(sumRe, sumIm));
}
