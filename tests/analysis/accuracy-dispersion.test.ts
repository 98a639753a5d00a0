// The phase error the accuracy estimate reports comes from the numerical dispersion relation of the standard
// 2D staggered (Yee) scheme,
//   (1/(c dt))^2 sin^2(omega dt/2) = (1/h)^2 [sin^2(kx h/2) + sin^2(ky h/2)]
// (Taflove & Hagness, Computational Electrodynamics, 3rd ed., 2005, ch. 4; written out in
// lib/verification/exact/dispersion.ts). Along a grid axis it solves in closed form: with S = c dt/h and N
// cells per wavelength, k_numerical / k = N asin(sin(pi S / N) / S) / pi. Grids: h = 1 cm, c = 343 m/s.
import { describe, expect, it } from "vitest";

import { axisPhaseErrorOver, axisPhaseErrorPerWavelength, pointsPerWavelength } from "@/lib/analysis/accuracy";
import { numericalPhaseVelocity } from "@/lib/verification/exact/dispersion";

const H = 0.01;
const C = 343;
const grid = (courant: number) => ({ cellSize: H, timeStep: (courant * H) / C, soundSpeed: C });
const frequencyAt = (cellsPerWavelength: number) => C / (cellsPerWavelength * H);

/** Closed-form axis solution of the relation above, degrees per wavelength. */
const closedForm = (courant: number, cells: number) => 360 * ((cells * Math.asin(Math.sin((Math.PI * courant) / cells) / courant)) / Math.PI - 1);

describe("phase error from the scheme's dispersion relation", () => {
  it("matches the closed-form axis solution at 4, 6, 10 and 20 cells per wavelength and three Courant numbers, to 1e-6 degrees", () => {
    for (const courant of [0.3, 0.6, Math.SQRT1_2]) {
      for (const cells of [4, 6, 10, 20]) {
        expect(axisPhaseErrorPerWavelength(frequencyAt(cells), grid(courant))).toBeCloseTo(closedForm(courant, cells), 6);
      }
    }
  });

  it("gives 3.96 degrees per wavelength at 10 cells per wavelength and Courant 0.6 (the solver's defaults)", () => {
    expect(axisPhaseErrorPerWavelength(frequencyAt(10), grid(0.6))).toBeCloseTo(3.96, 2);
  });

  it("agrees with the small-kh expansion v/c = 1 - (kh)^2 (1 - S^2) / 24 along an axis (expansion of the relation above, derived here) within 3 % at 20 cells per wavelength", () => {
    const kh = (2 * Math.PI) / 20;
    const expected = 360 * (1 / (1 - (kh * kh * (1 - 0.36)) / 24) - 1);
    const actual = axisPhaseErrorPerWavelength(frequencyAt(20), grid(0.6));
    expect(Math.abs(actual / expected - 1)).toBeLessThan(0.03);
  });

  it("is worst along a grid axis: the numerical wave is slowest there at every angle from 0 to 90 degrees (Taflove & Hagness, ch. 4)", () => {
    for (const courant of [0.3, 0.6, Math.SQRT1_2]) {
      const g = { cellSizeX: H, cellSizeY: H, timeStep: (courant * H) / C, soundSpeed: C };
      const f = frequencyAt(8);
      const axis = numericalPhaseVelocity(f, 0, g);
      for (let degrees = 1; degrees <= 90; degrees += 1) expect(numericalPhaseVelocity(f, (degrees * Math.PI) / 180, g)).toBeGreaterThanOrEqual(axis * (1 - 1e-12));
    }
  });

  it("has no dispersion along the diagonal at the Courant limit 1/sqrt(2) (the 2D 'magic time step', Taflove & Hagness, ch. 4), while the axis still lags", () => {
    const g = { cellSizeX: H, cellSizeY: H, timeStep: (Math.SQRT1_2 * H) / C, soundSpeed: C };
    for (const cells of [4, 10, 20]) expect(numericalPhaseVelocity(frequencyAt(cells), Math.PI / 4, g) / C).toBeCloseTo(1, 12);
    expect(axisPhaseErrorPerWavelength(frequencyAt(10), grid(Math.SQRT1_2))).toBeGreaterThan(3);
  });

  it("grows in proportion to the distance travelled", () => {
    const f = frequencyAt(10);
    const wavelength = C / f;
    const perWavelength = axisPhaseErrorPerWavelength(f, grid(0.6));
    expect(axisPhaseErrorOver(25 * wavelength, f, grid(0.6))).toBeCloseTo(25 * perWavelength, 9);
    expect(axisPhaseErrorOver(0, f, grid(0.6))).toBe(0);
  });

  it("is unbounded above the grid's cut-off (about 2.9 cells per wavelength at Courant 0.6)", () => {
    expect(axisPhaseErrorPerWavelength(frequencyAt(2.5), grid(0.6))).toBe(Infinity);
  });

  it("counts cells per wavelength as c / (f h)", () => {
    expect(pointsPerWavelength(3430, { cellSize: H, soundSpeed: C })).toBeCloseTo(10, 12);
  });
});
