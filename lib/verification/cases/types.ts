// The shape of a verification case: one definition that `npm test` runs in Node and the verification
// page runs in a Web Worker. A case builds its scene(s), runs the solver, compares with an exact
// solution and reports every figure it judged, with the tolerance it used.
import type { KernelProvider } from "../../fdtd/kernel-provider";
import type { SceneInput } from "../../fdtd/scene";

/** One judged figure: |error| must not exceed `tolerance`. */
export interface VerificationCheck {
  label: string;
  /** In `unit`. */
  measured: number;
  expected: number;
  /** measured - expected, or the relative or derived error that `errorUnit` names. */
  error: number;
  tolerance: number;
  /** Unit of measured and expected. */
  unit: string;
  /** Unit of error and tolerance: `unit` itself, or "relative" for (measured - expected) / expected. */
  errorUnit: string;
  pass: boolean;
}

export interface CurveSeries {
  name: string;
  kind: "simulated" | "exact";
  x: number[];
  y: number[];
  /** How to draw it: joined by lines (default) or as separate points (mode frequencies, band values). */
  style?: "line" | "points";
}

/** A plot for the page; every series holds at most about 1000 points. */
export interface VerificationCurve {
  title: string;
  xLabel: string;
  yLabel: string;
  series: CurveSeries[];
}

export interface VerificationOutcome {
  checks: VerificationCheck[];
  curves: VerificationCurve[];
  /** Every check passed. */
  pass: boolean;
  /** Wall-clock time of the run, s. */
  seconds: number;
}

export interface VerificationProgress {
  /** 0 .. 1 over the whole case. */
  fraction: number;
  /** What is running, e.g. "free-field run" or "exact solution". */
  stage: string;
}

export interface VerificationRunOptions {
  onProgress?: (progress: VerificationProgress) => void;
  /** Kernel that steps the case's simulations; the solver's default (WebAssembly where supported) otherwise. */
  kernel?: KernelProvider;
}

export interface VerificationCase {
  /** Stable identifier, used in URLs and test names. */
  id: string;
  title: string;
  /** What the case checks, in plain words for an engineer. */
  whatIsChecked: string;
  /** The published solution compared with, and where it is written down. */
  reference: { name: string; source: string };
  /** Grid resolution, e.g. "20 cells per wavelength at f0 = 500 Hz". */
  resolution: string;
  /**
   * The principal scene (the one the page shows); cases that compare several runs describe the others
   * in `whatIsChecked` and build them from this one. Absent when the case runs no simulation.
   */
  scene?: () => SceneInput;
  run(options?: VerificationRunOptions): VerificationOutcome;
}
