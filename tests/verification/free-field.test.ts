// Case 1 of issue 3: free field against the exact time-domain 2D Green's function
// (Morse & Feshbach, Methods of Theoretical Physics, ch. 7). 40 cells per wavelength at f0 = 1 kHz.
import { describe, it } from "vitest";

import { freeFieldCase } from "@/lib/verification/cases/free-field";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`free field (${freeFieldCase.resolution})`, () => {
  it("arrives on time, matches the exact waveform within 3% at one and two wavelengths, and falls 3 dB per doubling of distance", () => {
    expectEveryCheckToPass(runAndReport(freeFieldCase));
  });
});
