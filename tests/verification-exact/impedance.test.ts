// Plane-wave reflection at a locally reacting surface: hand values, the wall's boundary condition applied to
// the incident-plus-reflected field, and the oblique-incidence special angles.
import { describe, expect, it } from "vitest";

import {
  impedanceFromAbsorption,
  normalIncidenceAbsorption,
  normalIncidenceReflection,
  obliqueIncidenceAbsorption,
  obliqueIncidenceReflection,
} from "@/lib/verification/exact/impedance";

const SOUND_SPEED = 343;
const DENSITY = 1.204;

describe("locally reacting surface of real normalised impedance z", () => {
  it("reflects (z - 1)/(z + 1) and absorbs 4z/(z + 1)^2 at normal incidence (hand values)", () => {
    // Kuttruff, Room Acoustics, ch. 2: z = 1 absorbs fully; z = 2 and z = 1/2 both give |R| = 1/3, alpha = 8/9;
    // z = 3 gives R = 1/2, alpha = 3/4.
    expect(normalIncidenceReflection(1)).toBe(0);
    expect(normalIncidenceAbsorption(1)).toBe(1);
    expect(normalIncidenceReflection(2)).toBeCloseTo(1 / 3, 15);
    expect(normalIncidenceReflection(0.5)).toBeCloseTo(-1 / 3, 15);
    expect(normalIncidenceAbsorption(2)).toBeCloseTo(8 / 9, 15);
    expect(normalIncidenceAbsorption(0.5)).toBeCloseTo(8 / 9, 15);
    expect(normalIncidenceReflection(3)).toBeCloseTo(0.5, 15);
    expect(normalIncidenceAbsorption(3)).toBeCloseTo(0.75, 15);
    expect(normalIncidenceReflection(Infinity)).toBe(1);
  });

  it("makes incident plus reflected wave satisfy p = Z v_n on the wall at any angle", () => {
    // Independent route: build p = e^{ik(-x cos t + y sin t)} + R e^{ik(x cos t + y sin t)} in x >= 0 (wall at x = 0,
    // fluid at rest, time factor e^{-i omega t}), take v = grad p / (i omega rho) by central differences, and check
    // p / v_n = z rho c with v_n the velocity into the wall (-x). Euler's equation rho dv/dt = -grad p.
    const frequency = 500;
    const k = (2 * Math.PI * frequency) / SOUND_SPEED;
    const omega = 2 * Math.PI * frequency;
    const h = 1e-6;
    for (const z of [0.4, 1, 2.5, 12]) {
      for (const angle of [0, 0.3, 1.0, 1.4]) {
        const reflection = obliqueIncidenceReflection(z, angle);
        const pressure = (x: number) => {
          const incidentPhase = -k * x * Math.cos(angle);
          const reflectedPhase = k * x * Math.cos(angle);
          return { re: Math.cos(incidentPhase) + reflection * Math.cos(reflectedPhase), im: Math.sin(incidentPhase) + reflection * Math.sin(reflectedPhase) };
        };
        const p0 = pressure(0);
        const ahead = pressure(h);
        const behind = pressure(-h);
        const gradientRe = (ahead.re - behind.re) / (2 * h);
        const gradientIm = (ahead.im - behind.im) / (2 * h);
        // v_x = dp/dx / (i omega rho) = (gradientIm - i gradientRe) / (omega rho); v_n = -v_x.
        const normalRe = -gradientIm / (omega * DENSITY);
        const normalIm = gradientRe / (omega * DENSITY);
        // Z = p / v_n should be real: z rho c.
        const denominator = normalRe * normalRe + normalIm * normalIm;
        const impedanceRe = (p0.re * normalRe + p0.im * normalIm) / denominator;
        const impedanceIm = (p0.im * normalRe - p0.re * normalIm) / denominator;
        expect(impedanceRe / (z * DENSITY * SOUND_SPEED)).toBeCloseTo(1, 6);
        expect(Math.abs(impedanceIm) / (z * DENSITY * SOUND_SPEED)).toBeLessThan(1e-6);
      }
    }
  });

  it("inverts absorption to the impedance z >= 1 with that absorption", () => {
    for (const z of [1, 1.5, 4, 40]) expect(impedanceFromAbsorption(normalIncidenceAbsorption(z))).toBeCloseTo(z, 9);
    // The root below 1 absorbs the same: the inverse returns its reciprocal.
    expect(impedanceFromAbsorption(normalIncidenceAbsorption(0.25))).toBeCloseTo(4, 12);
    expect(impedanceFromAbsorption(0)).toBe(Infinity);
    expect(() => impedanceFromAbsorption(1.2)).toThrow(RangeError);
  });

  it("absorbs fully at cos(theta) = 1/z, reflects -1 at grazing incidence, and reduces to normal incidence at 0", () => {
    // Kuttruff, Room Acoustics, ch. 2: a locally reacting wall with z > 1 has an angle of total absorption.
    for (const z of [1.5, 3, 10]) {
      const angle = Math.acos(1 / z);
      expect(Math.abs(obliqueIncidenceReflection(z, angle))).toBeLessThan(1e-15);
      expect(obliqueIncidenceAbsorption(z, angle)).toBeCloseTo(1, 15);
      expect(obliqueIncidenceReflection(z, 0.5 * Math.PI)).toBeCloseTo(-1, 13); // cos(pi/2) is 6e-17 in doubles
      expect(obliqueIncidenceReflection(z, 0)).toBe(normalIncidenceReflection(z));
    }
  });

  it("keeps absorption within [0, 1] for every impedance and angle", () => {
    for (const z of [0.01, 0.3, 1, 3, 100]) {
      for (let angle = 0; angle <= 0.5 * Math.PI; angle += Math.PI / 36) {
        const alpha = obliqueIncidenceAbsorption(z, angle);
        expect(alpha).toBeGreaterThanOrEqual(0);
        expect(alpha).toBeLessThanOrEqual(1);
      }
    }
  });
});
