// Line source at a rigid half-plane: the integral form against the eigenfunction series, an arbitrary-precision
// reference, the boundary condition, continuity, reciprocity, the Helmholtz equation, geometrical optics and
// the uniform asymptotic theory.
import { describe, expect, it } from "vitest";

import { type Complex, magnitude, subtract } from "@/lib/verification/exact/complex";
import {
  distanceBetween,
  type EdgePolarPosition,
  freeFieldGreenBetween,
  halfPlaneGreen,
  halfPlaneGreenSeries,
  halfPlaneInsertionLoss,
  polarAboutEdge,
} from "@/lib/verification/exact/half-plane";
import { halfPlaneDiffractedUniformAsymptotic, halfPlaneGreenUniformAsymptotic } from "@/lib/verification/exact/half-plane-asymptotic";
import { freeFieldGreen2D } from "@/lib/verification/exact/hankel";

function relativeDifference(a: Complex, b: Complex): number {
  return magnitude(subtract(a, b)) / magnitude(b);
}

/** Geometrical optics on the lit side of both boundaries: direct wave plus the wave reflected by the upper face. */
function directPlusImage(k: number, source: EdgePolarPosition, receiver: EdgePolarPosition): Complex {
  const direct = freeFieldGreenBetween(k, source, receiver);
  const image = freeFieldGreen2D(k, distanceBetween({ radius: source.radius, angle: -source.angle }, receiver));
  return { re: direct.re + image.re, im: direct.im + image.im };
}

describe("rigid half-plane, line source, frequency domain", () => {
  it("gives the same field from the integral form and from the Bessel series of half-integer order", () => {
    // Two routes from the same boundary-value problem (see lib/verification/exact/half-plane.ts): the series
    // needs J and Y of half-integer order; the integral needs only H0. Shadow, lit, near-boundary and low-k
    // cases, k r from 0.1 to 240. Both are limited by the ~1e-8 accuracy of the bessel package.
    const cases: Array<[number, EdgePolarPosition, EdgePolarPosition]> = [
      [1, { radius: 1, angle: 0.7 }, { radius: 2, angle: 4.5 }],
      [5, { radius: 1.3, angle: 2.0 }, { radius: 3, angle: 5.5 }],
      [20, { radius: 1.3, angle: 2.0 }, { radius: 3, angle: 2.0 + Math.PI + 1e-3 }],
      [20, { radius: 1.3, angle: 2.0 }, { radius: 3, angle: 2.0 + Math.PI - 1e-3 }],
      [0.1, { radius: 1.3, angle: 2.0 }, { radius: 3, angle: 0.3 }],
      [40, { radius: 2, angle: 1.0 }, { radius: 1, angle: 0.5 }],
      [60, { radius: 4, angle: 0.5 }, { radius: 1.5, angle: 5.9 }],
    ];
    for (const [k, source, receiver] of cases) {
      expect(relativeDifference(halfPlaneGreen(k, source, receiver), halfPlaneGreenSeries(k, source, receiver))).toBeLessThan(1e-6);
    }
  });

  it("matches the series summed in 20-digit arithmetic by mpmath", () => {
    // Reference: mpmath 1.3 besselj/hankel1 of half-integer order, 400 terms at 20 significant digits.
    const shadow = halfPlaneGreen(5, { radius: 1.3, angle: 2.0 }, { radius: 3, angle: 5.5 });
    expect(Math.abs(shadow.re - -0.014125558003287365)).toBeLessThan(1e-8);
    expect(Math.abs(shadow.im - -0.012334239886479912)).toBeLessThan(1e-8);
    const nearEdge = halfPlaneGreen(1, { radius: 1, angle: 0.7 }, { radius: 2, angle: 4.5 });
    expect(Math.abs(nearEdge.re - -0.04080045461566075)).toBeLessThan(1e-8);
    expect(Math.abs(nearEdge.im - -0.05662823034302989)).toBeLessThan(1e-8);
  });

  it("has zero normal derivative on both faces of the screen (rigid boundary)", () => {
    // dG/dn = (1/r) dG/dtheta at theta = 0 and 2 pi; one-sided 3-point difference with h = 1e-3 rad
    // (truncation O(h^2)). The free field at the same points has |dG/dtheta| / |G| of order 2 to 20.
    const source = { radius: 2, angle: 1.0 };
    for (const route of [halfPlaneGreen, halfPlaneGreenSeries]) {
      for (const k of [1, 10]) {
        for (const face of [0, 2 * Math.PI]) {
          const h = face === 0 ? 1e-3 : -1e-3;
          const at = (angle: number) => route(k, source, { radius: 3, angle });
          const g0 = at(face);
          const g1 = at(face + h);
          const g2 = at(face + 2 * h);
          const slope = Math.hypot((-3 * g0.re + 4 * g1.re - g2.re) / (2 * h), (-3 * g0.im + 4 * g1.im - g2.im) / (2 * h));
          expect(slope / magnitude(g0)).toBeLessThan(1e-3);
        }
      }
    }
  });

  it("is continuous across the shadow and reflection boundaries, where the geometrical waves jump", () => {
    // The total field is continuous (Sommerfeld's solution); the direct or reflected wave alone jumps by
    // |(i/4) H0(k (r + r0))|, so the edge-diffracted part must jump by the opposite amount.
    const k = 8;
    const source = { radius: 2, angle: 1.1 };
    const epsilon = 1e-7;
    for (const boundary of [source.angle + Math.PI, Math.PI - source.angle]) {
      const before = halfPlaneGreen(k, source, { radius: 3, angle: boundary - epsilon });
      const after = halfPlaneGreen(k, source, { radius: 3, angle: boundary + epsilon });
      const on = halfPlaneGreen(k, source, { radius: 3, angle: boundary });
      const jumpOfGeometricalWave = magnitude(freeFieldGreen2D(k, 5));
      expect(magnitude(subtract(after, before)) / jumpOfGeometricalWave).toBeLessThan(1e-5);
      expect(magnitude(subtract(on, before)) / jumpOfGeometricalWave).toBeLessThan(1e-5);
    }
  });

  it("is reciprocal: swapping source and receiver leaves the field unchanged", () => {
    // Reciprocity of the Helmholtz Green's function with a rigid boundary (e.g. Pierce, Acoustics, 1981, ch. 4).
    const a = { radius: 1.7, angle: 0.9 };
    const b = { radius: 4.2, angle: 4.8 };
    for (const k of [0.5, 7, 35]) {
      expect(relativeDifference(halfPlaneGreen(k, a, b), halfPlaneGreen(k, b, a))).toBeLessThan(1e-9);
      expect(relativeDifference(halfPlaneGreenSeries(k, a, b), halfPlaneGreenSeries(k, b, a))).toBeLessThan(1e-9);
    }
  });

  it("satisfies the Helmholtz equation away from source and edge (5-point Laplacian)", () => {
    // Residual of (lap_h + k^2) G relative to k^2 |G|, with h at most 0.05/k and 2% of the distance to the
    // edge or source: truncation ~ (k h)^2 / 12 + (h / distance)^2, rounding ~ 1e-8 / (k h)^2.
    const source = { radius: 2, angle: 1.0 };
    const sourceX = 2 * Math.cos(1.0);
    const sourceY = 2 * Math.sin(1.0);
    const fieldAt = (k: number, x: number, y: number) => {
      let angle = Math.atan2(y, x);
      if (angle < 0) angle += 2 * Math.PI;
      return halfPlaneGreen(k, source, { radius: Math.hypot(x, y), angle });
    };
    for (const k of [1, 5, 20]) {
      for (const [x, y] of [[-1.5, -0.8], [1.2, 2.5], [-0.3, -0.2], [2.5, -0.6]] as const) {
        const nearest = Math.min(Math.hypot(x, y), Math.hypot(x - sourceX, y - sourceY));
        const h = Math.min(0.05 / k, 0.02 * nearest);
        const centre = fieldAt(k, x, y);
        const neighbours = [fieldAt(k, x + h, y), fieldAt(k, x - h, y), fieldAt(k, x, y + h), fieldAt(k, x, y - h)];
        const re = neighbours.reduce((sum, v) => sum + v.re, 0) - 4 * centre.re;
        const im = neighbours.reduce((sum, v) => sum + v.im, 0) - 4 * centre.im;
        const residual = Math.hypot(re / (h * h) + k * k * centre.re, im / (h * h) + k * k * centre.im);
        expect(residual / (k * k * magnitude(centre))).toBeLessThan(1e-3);
      }
    }
  });

  it("tends to direct plus reflected wave in the lit zone far from both boundaries as k grows", () => {
    // Geometrical optics plus an edge wave of relative size O((k r)^{-1/2}) (Keller's geometrical theory of
    // diffraction). Receiver 0.6 rad from the reflection boundary and 2.6 rad from the shadow boundary.
    const source = { radius: 2, angle: 1.0 };
    const receiver = { radius: 4, angle: 1.6 };
    const remainder = (k: number) => relativeDifference(halfPlaneGreen(k, source, receiver), directPlusImage(k, source, receiver));
    const at30 = remainder(30);
    const at300 = remainder(300);
    expect(at30).toBeLessThan(0.1);
    expect(at300).toBeLessThan(0.03);
    // k^{-1/2}: a tenfold k shrinks the remainder about sqrt(10) = 3.2 times.
    expect(at30 / at300).toBeGreaterThan(2.5);
    expect(at30 / at300).toBeLessThan(4.5);
  });

  it("has an edge wave that matches the uniform theory of diffraction to O(1/(k r))", () => {
    // Kouyoumjian & Pathak, Proc. IEEE 62 (1974) 1448: exact minus geometrical optics against their edge wave.
    // Measured: 1.4% at k r0 = 6, 0.2% at k r0 = 60, 0.02% at k r0 = 600.
    const source = { radius: 2, angle: 1.0 };
    const receiver = { radius: 4, angle: 1.6 };
    for (const [k, tolerance] of [[3, 0.03], [30, 0.004], [300, 0.0005]] as const) {
      const edgeWave = subtract(halfPlaneGreen(k, source, receiver), directPlusImage(k, source, receiver));
      expect(relativeDifference(edgeWave, halfPlaneDiffractedUniformAsymptotic(k, source, receiver))).toBeLessThan(tolerance);
    }
  });

  it("agrees with the uniform asymptotic solution in shadow, transition and lit zones within 0.02 dB for k r >= 30", () => {
    // Kouyoumjian & Pathak (1974), hard screen. Source at k r0 = 30, receiver at k r = 50, in the deep
    // shadow, either side of the shadow boundary (+-0.05 rad), on it, and on the reflection boundary.
    // Measured: at most 0.4% of |G| and 0.007 dB of insertion loss.
    const k = 10;
    const source = { radius: 3, angle: 1.2 };
    for (const angle of [2.0, 1.2 + Math.PI - 0.05, 1.2 + Math.PI, 1.2 + Math.PI + 0.05, 5.0, 6.2, Math.PI - 1.2]) {
      const receiver = { radius: 5, angle };
      const exact = halfPlaneGreen(k, source, receiver);
      const asymptotic = halfPlaneGreenUniformAsymptotic(k, source, receiver);
      expect(relativeDifference(asymptotic, exact)).toBeLessThan(0.005);
      expect(Math.abs(20 * Math.log10(magnitude(exact) / magnitude(asymptotic)))).toBeLessThan(0.02);
    }
  });

  it("halves the free field on the shadow boundary for large k r (insertion loss -> 6 dB)", () => {
    // Fresnel diffraction at a straight edge: at the geometrical shadow boundary the amplitude is half the
    // unobstructed one (Born & Wolf, Principles of Optics, section 8.7; Sommerfeld 1896). The remaining
    // edge wave from the image is O((k r)^{-1/2}): measured ratio 0.546 at k r = 30, 0.504 at k r = 3000.
    const source = { radius: 3, angle: 1.0 };
    const receiver = { radius: 3, angle: 1.0 + Math.PI };
    const ratio = (k: number) => magnitude(halfPlaneGreen(k, source, receiver)) / magnitude(freeFieldGreenBetween(k, source, receiver));
    expect(Math.abs(ratio(1000) - 0.5)).toBeLessThan(0.01);
    expect(Math.abs(ratio(10) - 0.5)).toBeGreaterThan(Math.abs(ratio(1000) - 0.5));
    expect(halfPlaneInsertionLoss(1000, source, receiver)).toBeCloseTo(20 * Math.log10(2), 0);
  });

  it("sees the free field at distance r + r0 when the receiver sits on the edge", () => {
    // Only the n = 0 term of the series survives at r = 0 (J_nu(0) = 0 for nu > 0, A&S 9.1.7).
    const source = { radius: 2.5, angle: 2.2 };
    const onEdge = halfPlaneGreen(4, source, { radius: 0, angle: 0 });
    expect(relativeDifference(onEdge, freeFieldGreen2D(4, 2.5))).toBeLessThan(1e-15);
    // Just off the edge the integral form tends to the same value; the first correction is the
    // half-order term, O(J_{1/2}(k r)) = O((k r)^{1/2}) (A&S 10.1.11 with 10.1.1); measured 3e-6 at k r = 4e-9.
    const nearEdge = halfPlaneGreen(4, source, { radius: 1e-9, angle: 3.0 });
    expect(relativeDifference(nearEdge, freeFieldGreen2D(4, 2.5))).toBeLessThan(1e-4);
  });

  it("refuses the series when source and receiver are equally far from the edge, where the integral form still works", () => {
    expect(() => halfPlaneGreenSeries(2, { radius: 1, angle: 1 }, { radius: 1, angle: 5 })).toThrow(RangeError);
    // The series converges like (r< / r>)^{n/2}: 2000 orders at r / r0 = 1.02. Both routes agree there, and
    // the integral form at r = r0 sits between the series values at r0 (1 -+ 2%) (the field is smooth in r).
    const source = { radius: 1, angle: 1 };
    const closeOutside = { radius: 1.02, angle: 5 };
    expect(relativeDifference(halfPlaneGreen(2, source, closeOutside), halfPlaneGreenSeries(2, source, closeOutside))).toBeLessThan(1e-6);
    const inside = halfPlaneGreenSeries(2, source, { radius: 0.98, angle: 5 });
    const outside = halfPlaneGreenSeries(2, source, closeOutside);
    const midpoint = { re: 0.5 * (inside.re + outside.re), im: 0.5 * (inside.im + outside.im) };
    const exact = halfPlaneGreen(2, source, { radius: 1, angle: 5 });
    // Second-order accuracy of the midpoint: |G''| (0.02)^2 / 2; measured 8.5e-4 of |G|.
    expect(relativeDifference(exact, midpoint)).toBeLessThan(2e-3);
  });

  it("places a barrier's source and receiver in edge polar coordinates", () => {
    // Barrier from the ground (y = 0) up to an edge at (10, 3); the screen runs downward from the edge.
    // Hand calculation: source (5, 1) and receiver (15, 1) are sqrt(29) m from the edge, at angles
    // 2 pi - atan2(5, 2) (source side, near the lower face) and atan2(5, 2) (receiver side).
    const edge = { x: 10, y: 3 };
    const down = { x: 0, y: -1 };
    const source = polarAboutEdge(edge, down, { x: 5, y: 1 });
    const receiver = polarAboutEdge(edge, down, { x: 15, y: 1 });
    expect(source.radius).toBeCloseTo(Math.sqrt(29), 12);
    expect(receiver.radius).toBeCloseTo(Math.sqrt(29), 12);
    expect(source.angle).toBeCloseTo(2 * Math.PI - Math.atan2(5, 2), 12);
    expect(receiver.angle).toBeCloseTo(Math.atan2(5, 2), 12);
    expect(distanceBetween(source, receiver)).toBeCloseTo(10, 12);
    // Receiver in the shadow: positive insertion loss.
    expect(halfPlaneInsertionLoss(2, source, receiver)).toBeGreaterThan(5);
  });
});
