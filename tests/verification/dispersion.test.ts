// Case 5 of issue 3: phase velocity along the axis and the diagonal against the scheme's dispersion relation,
// and the Courant limit (Taflove & Hagness, Computational Electrodynamics, 3rd ed., ch. 4).
// 10 cells per wavelength at f0 = 1 kHz, judged at 20, 10, 6 and 5 cells per wavelength.
import { describe, expect, it } from "vitest";

import { COURANT_LIMIT_2D, parseScene } from "@/lib/fdtd/scene";
import { dispersionCase } from "@/lib/verification/cases/dispersion";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`dispersion and the Courant limit (${dispersionCase.resolution})`, () => {
  it("travels at the phase velocity of the scheme's dispersion relation along the axis and the diagonal, and accepts Courant numbers up to 1/sqrt(2) only", () => {
    expectEveryCheckToPass(runAndReport(dispersionCase));
  });

  it("rejects a scene whose Courant number is just above 1/sqrt(2) and accepts one just below", () => {
    const scene = dispersionCase.scene!();
    const withCourant = (courantNumber: number) => ({ ...scene, resolution: { ...scene.resolution, courantNumber } });
    expect(parseScene(withCourant(COURANT_LIMIT_2D * (1 + 1e-6))).ok).toBe(false);
    expect(parseScene(withCourant(COURANT_LIMIT_2D * (1 - 1e-6))).ok).toBe(true);
  });
});
