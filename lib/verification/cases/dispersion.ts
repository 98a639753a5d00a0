// Case 5: phase velocity along a grid axis and along the diagonal, from the phase of the transfer function
// between two receivers on one ray, against the scheme's numerical dispersion relation; and the Courant
// limit that parseScene enforces against the scheme's von Neumann limit.
import { unwrapPhases, wrapPhase } from "../../analysis/phase";
import { realSpectrum, fourierTransformAt } from "../../analysis/spectrum";
import { pointReceiver, pointSource } from "../../fdtd/builders";
import { mediumProperties } from "../../fdtd/medium";
import { parseScene, SCENE_VERSION, type SceneInput } from "../../fdtd/scene";
import { COURANT_LIMIT_2D, numericalPhaseVelocity } from "../exact/dispersion";
import { hankel1 } from "../exact/hankel";
import { clockSeconds, decimateSeries, makeCheck, makeCurve, makeOutcome, makeRelativeCheck } from "./outcome";
import { CaseProgress } from "./run-scene";
import { rickerSignal } from "./source-terms";
import type { CurveSeries, VerificationCase, VerificationCheck } from "./types";

const AIR = { kind: "air" as const, temperature: 20 };
const PEAK_FREQUENCY = 1000;
/** 10 cells per wavelength at f0; the analysis reaches from 40 down to 5 cells per wavelength (0.25 to 2 f0). */
const POINTS_PER_WAVELENGTH = 10;
/** Receivers at 5 and 10 wavelengths (at f0) from the source: far field, 50 cells apart. */
const NEAR_RECEIVER = 5;
const FAR_RECEIVER = 10;
/** Free space beyond the far receivers, wavelengths: room for the pulse before the PML's echo could return. */
const MARGIN = 4;
/** Cells per wavelength at which the phase velocity is judged. */
const JUDGED_RESOLUTIONS = [20, 10, 6, 5] as const;
/** The analysed band, as fractions of f0 (40 to 4.5 cells per wavelength). */
const ANALYSED_BAND = [0.25, 2.2] as const;

/**
 * The estimator's own accuracy (phase of a transfer function over 50 cells, float32 traces) is about 3e-5
 * here; 1e-4 is still 25 to 500 times smaller than the scheme's departure from c at 20 to 5 cells per wavelength.
 */
const PHASE_VELOCITY_TOLERANCE = 1e-4;
/** parseScene's largest accepted Courant number must be the von Neumann limit to rounding. */
const COURANT_TOLERANCE = 1e-9;

function geometry() {
  const { soundSpeed } = mediumProperties(AIR);
  const cellSize = soundSpeed / (PEAK_FREQUENCY * POINTS_PER_WAVELENGTH);
  const half = (FAR_RECEIVER + MARGIN) * POINTS_PER_WAVELENGTH;
  const centre = (index: number) => (index + 0.5) * cellSize;
  const along = (wavelengths: number) => wavelengths * POINTS_PER_WAVELENGTH;
  const diagonal = (wavelengths: number) => Math.round(along(wavelengths) / Math.SQRT2);
  return {
    soundSpeed,
    cellSize,
    size: (2 * half + 1) * cellSize,
    source: { x: centre(half), y: centre(half) },
    receivers: [
      { id: "axis-near", x: centre(half + along(NEAR_RECEIVER)), y: centre(half) },
      { id: "axis-far", x: centre(half + along(FAR_RECEIVER)), y: centre(half) },
      { id: "diagonal-near", x: centre(half + diagonal(NEAR_RECEIVER)), y: centre(half + diagonal(NEAR_RECEIVER)) },
      { id: "diagonal-far", x: centre(half + diagonal(FAR_RECEIVER)), y: centre(half + diagonal(FAR_RECEIVER)) },
    ],
  };
}

function dispersionScene(courantNumber = 0.6): SceneInput {
  const g = geometry();
  return {
    version: SCENE_VERSION,
    name: "Verification: dispersion",
    domain: { width: g.size, height: g.size },
    medium: AIR,
    resolution: { kind: "frequency", maxFrequency: PEAK_FREQUENCY, pointsPerWavelength: POINTS_PER_WAVELENGTH, courantNumber },
    sources: [pointSource("source", g.source.x, g.source.y, rickerSignal(PEAK_FREQUENCY))],
    receivers: g.receivers.map((r) => pointReceiver(r.id, r.x, r.y)),
    // Until the PML's first echo could reach the far axis receiver (it sits MARGIN wavelengths from the edge).
    duration: { kind: "time", seconds: ((FAR_RECEIVER + 2 * MARGIN) * POINTS_PER_WAVELENGTH * g.cellSize) / g.soundSpeed },
    output: { levelMaps: false },
  };
}

/** Unwrapped phase of H0^(1)(x), x > 0: x - pi/4 plus the small wrapped correction. */
function hankelPhase(x: number): number {
  const h = hankel1(0, x);
  const nominal = x - Math.PI / 4;
  return nominal + wrapPhase(Math.atan2(h.im, h.re) - nominal);
}

/**
 * The wavenumber k whose cylindrical wave H0(k r) gains `phase` radians from r1 to r2 (bisection around k0).
 * The Hankel phase, not just k (r2 - r1), so the near-field correction 1/(8 k r) does not bias k.
 */
function wavenumberFromPhase(phase: number, near: number, far: number, k0: number): number {
  let lo = 0.7 * k0;
  let hi = 1.3 * k0;
  for (let iteration = 0; iteration < 100; iteration++) {
    const middle = 0.5 * (lo + hi);
    if (hankelPhase(middle * far) - hankelPhase(middle * near) < phase) lo = middle;
    else hi = middle;
  }
  return 0.5 * (lo + hi);
}

/** Largest Courant number parseScene accepts, by bisection on acceptance. */
function largestAcceptedCourantNumber(): number {
  let accepted = 0.5;
  let rejected = 1.0;
  if (!parseScene(dispersionScene(accepted)).ok || parseScene(dispersionScene(rejected)).ok) return NaN;
  for (let iteration = 0; iteration < 60; iteration++) {
    const middle = 0.5 * (accepted + rejected);
    if (parseScene(dispersionScene(middle)).ok) accepted = middle;
    else rejected = middle;
  }
  return accepted;
}

function run(options?: Parameters<VerificationCase["run"]>[0]) {
  const started = clockSeconds();
  const progress = new CaseProgress(options, 2);
  const result = progress.run("pulse along the axis and the diagonal", dispersionScene());
  const { timeStep, soundSpeed, cellSize } = result.grid;
  const grid = { cellSizeX: cellSize, cellSizeY: cellSize, timeStep, soundSpeed };
  const source = result.sources[0]!;
  const checks: VerificationCheck[] = [];
  const series: CurveSeries[] = [];

  for (const [direction, angle] of [
    ["axis", 0],
    ["diagonal", Math.PI / 4],
  ] as const) {
    const near = result.receivers.find((r) => r.id === `${direction}-near`)!;
    const far = result.receivers.find((r) => r.id === `${direction}-far`)!;
    const r1 = Math.hypot(near.position.x - source.x, near.position.y - source.y);
    const r2 = Math.hypot(far.position.x - source.x, far.position.y - source.y);
    const size = 4 * 2 ** Math.ceil(Math.log2(near.pressure.length));
    const a = realSpectrum(near.pressure, timeStep, { size });
    const b = realSpectrum(far.pressure, timeStep, { size });
    // Transfer far/near; the transform's time factor e^{-i w t} makes an outgoing wave's phase -theta(k r),
    // so the phase gained from r1 to r2 is -arg(B conj(A)).
    const first = Math.ceil((ANALYSED_BAND[0] * PEAK_FREQUENCY) / a.binWidth);
    const last = Math.floor((ANALYSED_BAND[1] * PEAK_FREQUENCY) / a.binWidth);
    const frequencies: number[] = [];
    const wrapped: number[] = [];
    for (let k = first; k <= last; k++) {
      const re = b.re[k]! * a.re[k]! + b.im[k]! * a.im[k]!;
      const im = b.im[k]! * a.re[k]! - b.re[k]! * a.im[k]!;
      frequencies.push(k * a.binWidth);
      wrapped.push(-Math.atan2(im, re));
    }
    // At 40 cells per wavelength the scheme's speed is within 0.1% of c: the nominal phase picks the branch.
    const unwrapped = unwrapPhases(wrapped, (2 * Math.PI * frequencies[0]! * (r2 - r1)) / soundSpeed);
    const measuredRatio = frequencies.map((f, n) => (2 * Math.PI * f) / wavenumberFromPhase(unwrapped[n]!, r1, r2, (2 * Math.PI * f) / soundSpeed) / soundSpeed);
    const schemeRatio = frequencies.map((f) => numericalPhaseVelocity(f, angle, grid) / soundSpeed);
    const pointsPerWavelength = frequencies.map((f) => soundSpeed / (f * cellSize));
    series.push(decimateSeries(`${direction}, FDTD`, "simulated", pointsPerWavelength, measuredRatio));
    series.push(decimateSeries(`${direction}, dispersion relation`, "exact", pointsPerWavelength, schemeRatio));

    for (const ppw of JUDGED_RESOLUTIONS) {
      const f = soundSpeed / (ppw * cellSize);
      // The exact frequency's phase, on the branch of the unwrapped curve at the nearest bin.
      const za = fourierTransformAt(near.pressure, timeStep, f);
      const zb = fourierTransformAt(far.pressure, timeStep, f);
      const phase = -Math.atan2(zb.im * za.re - zb.re * za.im, zb.re * za.re + zb.im * za.im);
      const bin = Math.min(unwrapped.length - 1, Math.max(0, Math.round(f / a.binWidth) - first));
      const onBranch = phase + 2 * Math.PI * Math.round((unwrapped[bin]! - phase) / (2 * Math.PI));
      const k0 = (2 * Math.PI * f) / soundSpeed;
      const measured = (2 * Math.PI * f) / wavenumberFromPhase(onBranch, r1, r2, k0);
      const scheme = numericalPhaseVelocity(f, angle, grid);
      checks.push(
        makeRelativeCheck(
          `phase velocity along the ${direction} at ${ppw} cells per wavelength (${f.toFixed(1)} Hz) against the dispersion relation (the relation is ${(100 * (scheme / soundSpeed - 1)).toFixed(3)}% from c)`,
          measured,
          scheme,
          PHASE_VELOCITY_TOLERANCE,
          "m/s",
        ),
      );
    }
  }
  const resolutionRange = ANALYSED_BAND.map((fraction) => soundSpeed / (fraction * PEAK_FREQUENCY * cellSize));
  series.push(decimateSeries("continuum, c", "exact", resolutionRange, [1, 1]));

  progress.report("Courant limit", 0);
  checks.push(makeCheck("largest Courant number c dt / h that parseScene accepts, against the 2D von Neumann limit 1/sqrt(2)", largestAcceptedCourantNumber(), COURANT_LIMIT_2D, COURANT_TOLERANCE, ""));
  progress.next("done");
  const curves = [makeCurve("Phase velocity against resolution", "cells per wavelength", "phase velocity / c", series)];
  return makeOutcome(checks, curves, started);
}

export const dispersionCase: VerificationCase = {
  id: "dispersion",
  title: "Numerical dispersion along the axis and the diagonal; the Courant limit",
  whatIsChecked:
    "A Ricker pulse at 10 cells per wavelength at f0 travels past two receivers on a grid axis and two on the diagonal, 5 and 10 wavelengths from the source. The phase of the transfer function between each pair gives the phase velocity at every frequency from 40 down to 5 cells per wavelength; at 20, 10, 6 and 5 cells per wavelength it must match the phase velocity of the scheme's dispersion relation, which runs up to 5% below c along the axis and much less along the diagonal. The largest Courant number the scene parser accepts must be the scheme's stability limit 1/sqrt(2).",
  reference: {
    name: "Dispersion relation of the 2D staggered leapfrog scheme, (1/(c dt))^2 sin^2(w dt/2) = (1/h)^2 [sin^2(kx h/2) + sin^2(ky h/2)], and its stability limit c dt/h <= 1/sqrt(2)",
    source: "Taflove & Hagness, Computational Electrodynamics: The Finite-Difference Time-Domain Method, 3rd ed. (2005), ch. 4 (2D numerical dispersion and stability); Abramowitz & Stegun 9.2.3 (phase of H0 in the far field)",
  },
  resolution: `${POINTS_PER_WAVELENGTH} cells per wavelength at f0 = ${PEAK_FREQUENCY} Hz; judged at ${JUDGED_RESOLUTIONS.join(", ")} cells per wavelength; Courant number 0.6`,
  scene: () => dispersionScene(),
  run,
};
