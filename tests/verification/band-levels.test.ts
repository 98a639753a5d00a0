// Case 7 of issue 3: band levels from an FFT (Parseval) of a sum of sines whose band levels are known,
// bands per IEC 61260-1:2014 (base 10). 48 kHz sampling, 2 s record.
import { describe, it } from "vitest";

import { bandLevelsCase } from "@/lib/verification/cases/band-levels";

import { expectEveryCheckToPass, runAndReport } from "./run-case";

describe(`band levels of a known signal (${bandLevelsCase.resolution})`, () => {
  it("gives every one-third octave and octave band level within 0.03 dB of the energy sum of its sines", () => {
    expectEveryCheckToPass(runAndReport(bandLevelsCase));
  });
});
