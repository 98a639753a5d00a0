// Fresnel integrals against A&S tables, direct quadrature of the defining integral, and the asymptotic series.
import { describe, expect, it } from "vitest";

import { fresnelAuxiliary, fresnelC, fresnelIntegrals, fresnelS } from "@/lib/verification/exact/fresnel";

/** Composite Simpson rule on [0, x] with `intervals` (even) sub-intervals; independent of the library code. */
function simpson(f: (t: number) => number, x: number, intervals: number): number {
  const h = x / intervals;
  let sum = f(0) + f(x);
  for (let i = 1; i < intervals; i++) sum += (i % 2 === 1 ? 4 : 2) * f(i * h);
  return (sum * h) / 3;
}

describe("Fresnel integrals C(x), S(x)", () => {
  it("match A&S Table 7.7 to 7 decimals on both sides of the series/continued-fraction switch at x = 2.5", () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 7.7, rounded to 7 decimals.
    // (Entered from memory and confirmed against mpmath 1.3 fresnelc/fresnels at 15 digits while writing.)
    const table: Array<[number, number, number]> = [
      [0.5, 0.4923442, 0.0647324],
      [1.0, 0.7798934, 0.4382591],
      [1.5, 0.4452612, 0.6975050],
      [2.0, 0.4882534, 0.3434157],
      [2.5, 0.4574130, 0.6191818],
      [3.0, 0.6057208, 0.4963130],
      [4.0, 0.4984260, 0.4205158],
      [5.0, 0.5636312, 0.4991914],
    ];
    for (const [x, c, s] of table) {
      expect(Math.abs(fresnelC(x) - c)).toBeLessThan(6e-8);
      expect(Math.abs(fresnelS(x) - s)).toBeLessThan(6e-8);
    }
  });

  it("agree with Simpson quadrature of int_0^x cos(pi t^2/2) and sin(pi t^2/2) dt to 1e-11 for 0 <= x <= 6", () => {
    // Definition A&S 7.3.1-7.3.2; 40000 Simpson intervals give an error below 1e-11 at x = 6.
    for (const x of [0.1, 0.8, 1.7, 2.4, 2.6, 3.3, 4.5, 6]) {
      const c = simpson((t) => Math.cos(0.5 * Math.PI * t * t), x, 40000);
      const s = simpson((t) => Math.sin(0.5 * Math.PI * t * t), x, 40000);
      const { c: cLib, s: sLib } = fresnelIntegrals(x);
      expect(Math.abs(cLib - c)).toBeLessThan(1e-11);
      expect(Math.abs(sLib - s)).toBeLessThan(1e-11);
    }
  });

  it("are odd functions and tend to 1/2 for large x", () => {
    // A&S 7.3.17 (odd symmetry) and 7.3.20 (C, S -> 1/2 as x -> infinity).
    expect(fresnelC(-1.3)).toBe(-fresnelC(1.3));
    expect(fresnelS(-3.7)).toBe(-fresnelS(3.7));
    expect(Math.abs(fresnelC(1e4) - 0.5)).toBeLessThan(1 / (Math.PI * 1e4) + 1e-12);
    expect(Math.abs(fresnelS(1e4) - 0.5)).toBeLessThan(1 / (Math.PI * 1e4) + 1e-12);
    expect(fresnelIntegrals(Infinity)).toEqual({ c: 0.5, s: 0.5 });
  });

  it("have auxiliary functions f, g that follow the asymptotic series A&S 7.3.27-7.3.28 for large x", () => {
    // pi x f(x) ~ 1 - 1*3/(pi x^2)^2 + ..., pi x g(x) ~ 1/(pi x^2) - 1*3*5/(pi x^2)^3 + ...
    // The next terms, 1*3*5*7/(pi x^2)^4 and 1*3*...*9/(pi x^2)^5, bound the truncation error.
    for (const x of [6, 10, 30, 100]) {
      const w = Math.PI * x * x;
      const { f, g } = fresnelAuxiliary(x);
      const fSeries = (1 - 3 / (w * w)) / (Math.PI * x);
      const gSeries = (1 / w - 15 / (w * w * w)) / (Math.PI * x);
      expect(Math.abs(f - fSeries)).toBeLessThan((2 * 105) / (w ** 4 * Math.PI * x) + 1e-16);
      expect(Math.abs(g - gSeries)).toBeLessThan((2 * 945) / (w ** 5 * Math.PI * x) + 1e-16);
    }
  });

  it("give the same f and g from the power series and from the continued fraction where the two meet", () => {
    // Below x = 2.5, f and g come from the series for C and S (A&S 7.3.11, 7.3.13); above, from A&S 7.1.14.
    // Both are smooth, so values an ulp-scale step either side of the switch must agree.
    const below = fresnelAuxiliary(2.5);
    const above = fresnelAuxiliary(2.5 + 1e-12);
    expect(Math.abs(above.f - below.f)).toBeLessThan(1e-13);
    expect(Math.abs(above.g - below.g)).toBeLessThan(1e-13);
  });
});
