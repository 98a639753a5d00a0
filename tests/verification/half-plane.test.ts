// Case 6 of issue 3: insertion loss of a thin rigid screen against the exact half-plane solution
// (Macdonald 1915; Bowman, Senior & Uslenghi 1969), one-third octave bands per IEC 61260-1.
// 3 cm cells: at least 10 cells per wavelength up to the upper edge of the 1 kHz band.
import { describe, it } from "vitest";

import { halfPlaneCase } from "@/lib/verification/cases/half-plane";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`thin rigid screen (${halfPlaneCase.resolution})`, () => {
  it("gives the exact half-plane insertion loss within 0.5 dB in every one-third octave band from 250 Hz to 1 kHz, deep in the shadow and near its boundary", () => {
    expectEveryCheckToPass(runAndReport(halfPlaneCase));
  });
});
