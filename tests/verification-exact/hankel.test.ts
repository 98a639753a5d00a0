// Hankel functions and the 2D Helmholtz Green's function against A&S tables, identities and asymptotics.
import { describe, expect, it } from "vitest";

import { magnitude, phase } from "@/lib/verification/exact/complex";
import { besselJ, besselY, freeFieldGreen2D, hankel1, hankel1Asymptotic, hankel2 } from "@/lib/verification/exact/hankel";

describe("Bessel and Hankel functions of order 0 and 1", () => {
  it("match A&S Table 9.1 (J0, J1, Y0, Y1) to 1e-7", () => {
    // Abramowitz & Stegun (1964), Table 9.1, rounded to 10 decimals (entered from memory and confirmed
    // against mpmath 1.3 besselj/bessely at 15 digits while writing). The bessel package reaches ~4e-8.
    const table: Array<[number, number, number, number, number]> = [
      // x, J0, J1, Y0, Y1
      [1, 0.7651976866, 0.4400505857, 0.0882569642, -0.7812128213],
      [2, 0.2238907791, 0.5767248078, 0.5103756726, -0.1070324315],
      [5, -0.1775967713, -0.3275791376, -0.3085176252, 0.1478631434],
      [10, -0.2459357645, 0.0434727462, 0.0556711673, 0.2490154242],
    ];
    for (const [x, j0, j1, y0, y1] of table) {
      expect(Math.abs(besselJ(0, x) - j0)).toBeLessThan(1e-7);
      expect(Math.abs(besselJ(1, x) - j1)).toBeLessThan(1e-7);
      expect(Math.abs(besselY(0, x) - y0)).toBeLessThan(1e-7);
      expect(Math.abs(besselY(1, x) - y1)).toBeLessThan(1e-7);
    }
  });

  it("satisfy the Wronskian J1 Y0 - J0 Y1 = 2/(pi x) to 1e-7 relative over 0.1 <= x <= 300", () => {
    // A&S 9.1.16 with nu = 0 and J_{-1} = -J_1 (A&S 9.1.5).
    for (let x = 0.1; x <= 300; x *= 1.37) {
      const wronskian = besselJ(1, x) * besselY(0, x) - besselJ(0, x) * besselY(1, x);
      expect(Math.abs(wronskian * ((Math.PI * x) / 2) - 1)).toBeLessThan(1e-7);
    }
  });

  it("have H^(2) = conj(H^(1)) for real arguments", () => {
    // A&S 9.1.3-9.1.4.
    for (const x of [0.3, 4.2, 17]) {
      const h1 = hankel1(1, x);
      const h2 = hankel2(1, x);
      expect(h2.re).toBe(h1.re);
      expect(h2.im).toBe(-h1.im);
    }
  });

  it("approach the large-argument form sqrt(2/(pi x)) e^{i(x - pi/4)} with the first correction -i/(8x)", () => {
    // A&S 9.2.3 (leading term) and 9.2.5/9.2.9-9.2.10 (P ~ 1 - 9/(128 x^2), Q ~ -1/(8x) + 75/(1024 x^3)).
    for (const x of [20, 50, 200]) {
      const h = hankel1(0, x);
      const amplitude = Math.sqrt(2 / (Math.PI * x));
      // Remove the leading behaviour: ratio = H0 / (amplitude e^{i(x - pi/4)}) = P + i Q.
      const angle = x - Math.PI / 4;
      const re = (h.re * Math.cos(angle) + h.im * Math.sin(angle)) / amplitude;
      const im = (h.im * Math.cos(angle) - h.re * Math.sin(angle)) / amplitude;
      expect(Math.abs(re - (1 - 9 / (128 * x * x)))).toBeLessThan(1e-6);
      expect(Math.abs(im - (-1 / (8 * x) + 75 / (1024 * x ** 3)))).toBeLessThan(1e-6);
    }
  });

  it("agree with the complex-argument asymptotic expansion (DLMF 10.17.5) on the real axis for x >= 25", () => {
    // Two independent routes: rational approximations (bessel package) and the Hankel expansion.
    for (const order of [0, 1]) {
      for (const x of [25, 40, 90, 250]) {
        const direct = hankel1(order, x);
        const expansion = hankel1Asymptotic(order, { re: x, im: 0 });
        const error = Math.hypot(direct.re - expansion.re, direct.im - expansion.im);
        expect(error / magnitude(expansion)).toBeLessThan(2e-7);
      }
    }
  });

  it("agree with the integral H0^(1)(z) = (2/(pi i)) int_0^inf e^{i z cosh t} dt off the real axis", () => {
    // DLMF 10.9.10 with nu = 0 (absolutely convergent for Im z > 0), by Simpson's rule on [0, 5]:
    // e^{-Im z cosh 5} < 1e-30 there. This checks the expansion where the half-plane integral uses it.
    for (const z of [{ re: 25, im: 2 }, { re: 40, im: 0.5 }, { re: 60, im: 8 }]) {
      const upper = 5;
      const intervals = 200000;
      const h = upper / intervals;
      let re = 0;
      let im = 0;
      for (let i = 0; i <= intervals; i++) {
        const t = i * h;
        const weight = i === 0 || i === intervals ? 1 : i % 2 === 1 ? 4 : 2;
        const c = Math.cosh(t);
        const modulus = Math.exp(-z.im * c);
        re += weight * modulus * Math.cos(z.re * c);
        im += weight * modulus * Math.sin(z.re * c);
      }
      re *= h / 3;
      im *= h / 3;
      // (2/(pi i)) (re + i im) = (2/pi) (im - i re)
      const reference = { re: (2 / Math.PI) * im, im: (-2 / Math.PI) * re };
      const expansion = hankel1Asymptotic(0, z);
      const error = Math.hypot(expansion.re - reference.re, expansion.im - reference.im);
      expect(error / magnitude(reference)).toBeLessThan(1e-9);
    }
  });
});

describe("2D free-field Green's function (i/4) H0^(1)(kr)", () => {
  it("carries a unit source: the outward flux of grad G through a small circle is -1", () => {
    // (lap + k^2) G = -delta and the divergence theorem: 2 pi r dG/dr -> -1 as r -> 0;
    // dG/dr = -(i/4) k H1^(1)(kr) (A&S 9.1.28).
    const k = 3;
    for (const r of [1e-5, 1e-6]) {
      const h1 = hankel1(1, k * r);
      // 2 pi r * (-(i/4) k (J1 + i Y1)) = (pi k r / 2) (Y1 - i J1); the correction is O((k r)^2 ln(k r)).
      const fluxRe = 0.5 * Math.PI * k * r * h1.im;
      const fluxIm = -0.5 * Math.PI * k * r * h1.re;
      expect(Math.abs(fluxRe + 1)).toBeLessThan(1e-7);
      expect(Math.abs(fluxIm)).toBeLessThan(1e-8);
    }
  });

  it("is an outgoing wave for the time factor e^{-i omega t}: its phase grows by k per metre far out", () => {
    // With p = Re{G e^{-i omega t}}, constant phase k r - omega t moves outward (A&S 9.2.3 for the phase).
    const k = 2;
    const r = 40;
    const delta = 0.01;
    let change = phase(freeFieldGreen2D(k, r + delta)) - phase(freeFieldGreen2D(k, r));
    if (change < -Math.PI) change += 2 * Math.PI;
    expect(change / delta).toBeCloseTo(k, 3);
  });

  it("satisfies the Helmholtz equation away from the source (5-point Laplacian, k h = 0.05)", () => {
    // Residual of (lap_h + k^2) G relative to k^2 |G|: truncation (k h)^2 / 12 ~ 2e-4 plus rounding.
    const k = 5;
    const h = 0.05 / k;
    for (const [x, y] of [[0.7, 0.2], [2.1, -1.4]] as const) {
      const g = (px: number, py: number) => freeFieldGreen2D(k, Math.hypot(px, py));
      const centre = g(x, y);
      const neighbours = [g(x + h, y), g(x - h, y), g(x, y + h), g(x, y - h)];
      const re = neighbours.reduce((sum, v) => sum + v.re, 0) - 4 * centre.re;
      const im = neighbours.reduce((sum, v) => sum + v.im, 0) - 4 * centre.im;
      const residual = Math.hypot(re / (h * h) + k * k * centre.re, im / (h * h) + k * k * centre.im);
      expect(residual / (k * k * magnitude(centre))).toBeLessThan(1e-3);
    }
  });
});
