/**
 * Fresnel integrals C(x) = int_0^x cos(pi t^2 / 2) dt and S(x) = int_0^x sin(pi t^2 / 2) dt
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, 7.3.1 and 7.3.2), and the
 * auxiliary functions f, g defined by (A&S 7.3.5, 7.3.6)
 *
 *   C(x) = 1/2 + f(x) sin(pi x^2 / 2) - g(x) cos(pi x^2 / 2)
 *   S(x) = 1/2 - f(x) cos(pi x^2 / 2) - g(x) sin(pi x^2 / 2).
 *
 * Small |x| (<= 2.5): the power series A&S 7.3.11 and 7.3.13. The largest term there is about
 * e^{pi x^2 / 2} / sqrt(pi^2 x^2), so at most 4 of 16 digits cancel.
 * Larger |x|: A&S 7.3.22, C(x) + i S(x) = (1 + i)/2 erf(z) with z = (sqrt(pi)/2)(1 - i) x, where
 * erfc(z) = e^{-z^2} / sqrt(pi) K(z) and K(z) is the continued fraction A&S 7.1.14,
 * K(z) = 1/(z + (1/2)/(z + 1/(z + (3/2)/(z + 2/(z + ...))))), valid for Re z > 0. Then
 * g + i f = (1 + i)/(2 sqrt(pi)) K(z) exactly, so f and g come without cancellation.
 * Both branches reach about 1e-14 absolute (checked against A&S Table 7.7 in the tests).
 */

/** Argument above which the continued fraction replaces the power series. */
const SERIES_LIMIT = 2.5;

export interface FresnelPair {
  /** C(x). */
  readonly c: number;
  /** S(x). */
  readonly s: number;
}

export interface FresnelAuxiliary {
  /** f(x) of A&S 7.3.5; f ~ 1/(pi x) for large x. */
  readonly f: number;
  /** g(x) of A&S 7.3.6; g ~ 1/(pi^2 x^3) for large x. */
  readonly g: number;
}

/** C(x) and S(x) for any real x (both are odd functions). */
export function fresnelIntegrals(x: number): FresnelPair {
  if (Number.isNaN(x)) return { c: NaN, s: NaN };
  const sign = x < 0 ? -1 : 1;
  const ax = Math.abs(x);
  if (ax === Infinity) return { c: 0.5 * sign, s: 0.5 * sign };
  if (ax <= SERIES_LIMIT) {
    const { c, s } = fresnelSeries(ax);
    return { c: sign * c, s: sign * s };
  }
  const { f, g } = auxiliaryFromContinuedFraction(ax);
  const phase = 0.5 * Math.PI * ax * ax;
  const sinPhase = Math.sin(phase);
  const cosPhase = Math.cos(phase);
  return { c: sign * (0.5 + f * sinPhase - g * cosPhase), s: sign * (0.5 - f * cosPhase - g * sinPhase) };
}

export function fresnelC(x: number): number {
  return fresnelIntegrals(x).c;
}

export function fresnelS(x: number): number {
  return fresnelIntegrals(x).s;
}

/** The auxiliary functions f(x), g(x) for x >= 0 (A&S 7.3.5, 7.3.6). */
export function fresnelAuxiliary(x: number): FresnelAuxiliary {
  if (!(x >= 0)) throw new RangeError(`fresnelAuxiliary needs x >= 0, got ${x}`);
  if (x === Infinity) return { f: 0, g: 0 };
  if (x > SERIES_LIMIT) return auxiliaryFromContinuedFraction(x);
  // Invert A&S 7.3.5-6: g + i f = ((1 + i)/2 - (C + i S)) e^{-i pi x^2 / 2}; no cancellation for small x.
  const { c, s } = fresnelSeries(x);
  const phase = 0.5 * Math.PI * x * x;
  const re = 0.5 - c;
  const im = 0.5 - s;
  const cosPhase = Math.cos(phase);
  const sinPhase = Math.sin(phase);
  return { g: re * cosPhase + im * sinPhase, f: im * cosPhase - re * sinPhase };
}

/** Power series A&S 7.3.11 (C) and 7.3.13 (S), summed until the terms stop changing the result. */
function fresnelSeries(x: number): FresnelPair {
  const halfPiXSquared = 0.5 * Math.PI * x * x;
  const step = halfPiXSquared * halfPiXSquared;
  // term_n of C: (-1)^n (pi/2)^{2n} x^{4n+1} / ((2n)! (4n+1)); of S: (-1)^n (pi/2)^{2n+1} x^{4n+3} / ((2n+1)! (4n+3)).
  let powerC = x; // (-1)^n (pi x^2 / 2)^{2n} x / (2n)!
  let powerS = x * halfPiXSquared; // (-1)^n (pi x^2 / 2)^{2n+1} x / (2n+1)!
  let c = 0;
  let s = 0;
  for (let n = 0; n < 200; n++) {
    const termC = powerC / (4 * n + 1);
    const termS = powerS / (4 * n + 3);
    c += termC;
    s += termS;
    if (Math.abs(termC) <= 1e-17 * Math.abs(c) && Math.abs(termS) <= 1e-17 * Math.abs(s)) break;
    powerC *= -step / ((2 * n + 1) * (2 * n + 2));
    powerS *= -step / ((2 * n + 2) * (2 * n + 3));
  }
  return { c, s };
}

/**
 * f and g from g + i f = (1 + i)/(2 sqrt(pi)) K(z), z = (sqrt(pi)/2)(1 - i) x, with K the continued
 * fraction of A&S 7.1.14 evaluated by the modified Lentz method (partial numerators 1, 1/2, 1, 3/2, ...;
 * every partial denominator is z).
 */
function auxiliaryFromContinuedFraction(x: number): FresnelAuxiliary {
  const zRe = 0.5 * Math.sqrt(Math.PI) * x;
  const zIm = -zRe;
  const tiny = 1e-300;
  // K = 1 / (z + a_1 / (z + a_2 / ...)); Lentz on the tail T = z + a_1/(z + ...), then K = 1/T.
  let fRe = zRe;
  let fIm = zIm;
  let cRe = fRe;
  let cIm = fIm;
  let dRe = 0;
  let dIm = 0;
  for (let n = 1; n < 1000; n++) {
    const a = 0.5 * n;
    // d = 1 / (z + a d)
    let denRe = zRe + a * dRe;
    const denIm = zIm + a * dIm;
    if (denRe === 0 && denIm === 0) denRe = tiny;
    const denNorm = denRe * denRe + denIm * denIm;
    dRe = denRe / denNorm;
    dIm = -denIm / denNorm;
    // c = z + a / c
    const cNorm = cRe * cRe + cIm * cIm;
    cRe = zRe + (a * cRe) / cNorm;
    cIm = zIm - (a * cIm) / cNorm;
    if (cRe === 0 && cIm === 0) cRe = tiny;
    const deltaRe = cRe * dRe - cIm * dIm;
    const deltaIm = cRe * dIm + cIm * dRe;
    const nextRe = fRe * deltaRe - fIm * deltaIm;
    const nextIm = fRe * deltaIm + fIm * deltaRe;
    fRe = nextRe;
    fIm = nextIm;
    if (Math.abs(deltaRe - 1) + Math.abs(deltaIm) < 1e-16) break;
  }
  // K = 1 / T
  const tNorm = fRe * fRe + fIm * fIm;
  const kRe = fRe / tNorm;
  const kIm = -fIm / tNorm;
  const factor = 1 / (2 * Math.sqrt(Math.PI));
  // (1 + i)(kRe + i kIm) = (kRe - kIm) + i (kRe + kIm)
  return { g: factor * (kRe - kIm), f: factor * (kRe + kIm) };
}
