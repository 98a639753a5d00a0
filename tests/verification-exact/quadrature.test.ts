// Gauss-Legendre rules and the adaptive integrator used by the reference solutions.
import { describe, expect, it } from "vitest";

import { gaussLegendreRule, integrateReal } from "@/lib/verification/exact/quadrature";

describe("Gauss-Legendre quadrature", () => {
  it("has the nodes and weights of A&S Table 25.4 for 2 and 3 points", () => {
    // A&S 25.4.29 / Table 25.4: n = 2: +-1/sqrt(3), weights 1; n = 3: 0, +-sqrt(3/5), weights 8/9, 5/9.
    const two = gaussLegendreRule(2);
    expect(Array.from(two.nodes)).toEqual([expect.closeTo(-1 / Math.sqrt(3), 15), expect.closeTo(1 / Math.sqrt(3), 15)]);
    expect(Array.from(two.weights)).toEqual([expect.closeTo(1, 15), expect.closeTo(1, 15)]);
    const three = gaussLegendreRule(3);
    expect(three.nodes[0]).toBeCloseTo(-Math.sqrt(0.6), 15);
    expect(three.nodes[1]).toBeCloseTo(0, 15);
    expect(three.weights[0]).toBeCloseTo(5 / 9, 15);
    expect(three.weights[1]).toBeCloseTo(8 / 9, 15);
  });

  it("integrates polynomials up to degree 2n - 1 exactly", () => {
    // int_{-1}^{1} x^d dx = 2/(d + 1) for even d, 0 for odd d.
    for (const n of [1, 4, 10, 17]) {
      const rule = gaussLegendreRule(n);
      for (let degree = 0; degree <= 2 * n - 1; degree++) {
        let sum = 0;
        for (let i = 0; i < n; i++) sum += (rule.weights[i] ?? 0) * (rule.nodes[i] ?? 0) ** degree;
        expect(sum).toBeCloseTo(degree % 2 === 0 ? 2 / (degree + 1) : 0, 13);
      }
    }
  });

  it("adapts to an endpoint singularity and to a sharp peak", () => {
    // int_0^1 sqrt(x) dx = 2/3; int_{-1}^{1} a / (x^2 + a^2) dx = 2 atan(1/a) (elementary antiderivatives).
    expect(integrateReal(Math.sqrt, 0, 1, { relativeTolerance: 1e-12 })).toBeCloseTo(2 / 3, 11);
    const a = 1e-5;
    expect(integrateReal((x) => a / (x * x + a * a), -1, 1, { relativeTolerance: 1e-12 }) / (2 * Math.atan(1 / a))).toBeCloseTo(1, 9);
  });
});
