// Case 4 of issue 3: reflection from the PML (Berenger, J. Comput. Phys. 114, 1994), isolated by a reference
// run with the PML far away. 15 cells per wavelength at f0 = 1 kHz, the default 20-cell layer.
import { describe, it } from "vitest";

import { pmlCase } from "@/lib/verification/cases/pml";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`PML (${pmlCase.resolution})`, () => {
  it("reflects at least 40 dB less than a mirror at normal incidence and 30 dB less at 45 degrees", () => {
    expectEveryCheckToPass(runAndReport(pmlCase));
  });
});
