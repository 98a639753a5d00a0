// Case 3 of issue 3: normal-incidence reflection from a locally reacting wall against (z - 1)/(z + 1)
// (Kuttruff, Room Acoustics, ch. 2). 20 cells per wavelength at f0 = 500 Hz, judged from 13 to 40.
import { describe, it } from "vitest";

import { impedanceWallCase } from "@/lib/verification/cases/impedance-wall";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`impedance wall (${impedanceWallCase.resolution})`, () => {
  it("reflects with R = (z - 1)/(z + 1) within 0.02 for z = 0.5, 1, 2, 5, 10 and a rigid wall", () => {
    expectEveryCheckToPass(runAndReport(impedanceWallCase));
  });
});
