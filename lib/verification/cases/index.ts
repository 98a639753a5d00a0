// The verification cases, in the order of issue 3. The same list runs under `npm test` (tests/verification)
// and on the verification page (in a Web Worker). Tolerances marked "notes" come from measurements of a
// correct second-order staggered scheme against exact solutions (the team's verification notes).
import { bandLevelsCase } from "./band-levels";
import { dispersionCase } from "./dispersion";
import { freeFieldCase } from "./free-field";
import { halfPlaneCase } from "./half-plane";
import { impedanceWallCase } from "./impedance-wall";
import { pmlCase } from "./pml";
import { roomModesCase } from "./room-modes";
import type { VerificationCase } from "./types";

export const verificationCases: readonly VerificationCase[] = [freeFieldCase, roomModesCase, impedanceWallCase, pmlCase, dispersionCase, halfPlaneCase, bandLevelsCase];

/** The case with this id, or undefined. */
export function verificationCaseById(id: string): VerificationCase | undefined {
  return verificationCases.find((c) => c.id === id);
}

export type { VerificationCase, VerificationCheck, VerificationCurve, VerificationOutcome, VerificationProgress, VerificationRunOptions } from "./types";
