// Case 2 of issue 3: rigid rectangular room modes against Rayleigh's formula (The Theory of Sound, vol. 2,
// sec. 267) and the scheme's dispersion relation (Taflove & Hagness, ch. 4). 20 cells per wavelength at the tenth mode.
import { describe, it } from "vitest";

import { roomModesCase } from "@/lib/verification/cases/room-modes";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`rigid room modes (${roomModesCase.resolution})`, () => {
  it("puts the first ten modes within 0.5% of Rayleigh's f_mn and within 2e-7 of the scheme's dispersion relation", () => {
    expectEveryCheckToPass(runAndReport(roomModesCase));
  });
});
