// Runs of Bessel functions of integer and half-integer order (used by the half-plane series).
import { describe, expect, it } from "vitest";

import { besselJRun, besselYRun, type OrderRun } from "@/lib/verification/exact/bessel-sequences";

function run(kind: OrderRun, x: number, count: number): { j: Float64Array; y: Float64Array } {
  const j = new Float64Array(count);
  const y = new Float64Array(count);
  besselJRun(kind, x, j);
  besselYRun(kind, x, y);
  return { j, y };
}

describe("Bessel function runs J_nu, Y_nu for nu = 0, 1, 2, ... and 1/2, 3/2, ...", () => {
  it("match arbitrary-precision values at low and high order, below and above the turning point", () => {
    // Reference: mpmath 1.3 besselj/bessely at 20 significant digits.
    const reference: Array<[OrderRun, number, number, number, number]> = [
      // run, index m (order nu0 + m), x, J, Y
      ["halfInteger", 40, 12.5, 1.2675896298571641e-17, -651886459991377.48],
      ["integer", 20, 3.3, 8.0739106125446895e-15, -1998693563673.9811],
      ["integer", 7, 47.1, -0.033534894856129832, -0.11199398140349893],
      ["halfInteger", 100, 150, 0.016091099782758304, 0.073875700358445349],
      ["halfInteger", 3, 0.05, 2.1236623038279169e-7, -428296.85763447501],
    ];
    for (const [kind, m, x, j, y] of reference) {
      const values = run(kind, x, m + 1);
      // Relative 1e-7: the integer run starts from the bessel package's J0, J1, Y0, Y1 (about 4e-8).
      expect(Math.abs((values.j[m] ?? 0) / j - 1)).toBeLessThan(1e-7);
      expect(Math.abs((values.y[m] ?? 0) / y - 1)).toBeLessThan(1e-7);
    }
  });

  it("reproduce the elementary half-integer forms J_{5/2}, Y_{5/2}", () => {
    // A&S 10.1.11-10.1.12 with J_{n+1/2} = sqrt(2x/pi) j_n (A&S 10.1.1):
    // j_2 = (3/x^3 - 1/x) sin x - 3 cos x / x^2, y_2 = -(3/x^3 - 1/x) cos x - 3 sin x / x^2.
    for (const x of [0.4, 2.7, 9.1, 33]) {
      const values = run("halfInteger", x, 3);
      const scale = Math.sqrt((2 * x) / Math.PI);
      const j2 = (3 / x ** 3 - 1 / x) * Math.sin(x) - (3 * Math.cos(x)) / (x * x);
      const y2 = -(3 / x ** 3 - 1 / x) * Math.cos(x) - (3 * Math.sin(x)) / (x * x);
      expect(values.j[2]).toBeCloseTo(scale * j2, 12);
      expect(values.y[2]).toBeCloseTo(scale * y2, 12);
    }
  });

  it("satisfy the Wronskian J_{nu+1} Y_nu - J_nu Y_{nu+1} = 2/(pi x) along the whole run", () => {
    // A&S 9.1.16; checks the Miller ratios (J beyond the turning point) against the upward Y recurrence.
    for (const kind of ["integer", "halfInteger"] as const) {
      for (const x of [0.5, 7.3, 60]) {
        const count = Math.ceil(x) + 40;
        const values = run(kind, x, count);
        for (let m = 0; m + 1 < count; m++) {
          const jNext = values.j[m + 1] ?? 0;
          const yNext = values.y[m + 1] ?? 0;
          if (!Number.isFinite(yNext) || Math.abs(yNext) > 1e200) break;
          const wronskian = jNext * (values.y[m] ?? 0) - (values.j[m] ?? 0) * yNext;
          expect(Math.abs(wronskian * ((Math.PI * x) / 2) - 1)).toBeLessThan(1e-6);
        }
      }
    }
  });
});
