// Case 1: a Ricker line source in free field against the exact time-domain 2D Green's function convolved
// with the same source term, at receivers along a grid axis and along the diagonal.
import { buildScene, pointReceiver, pointSource } from "../../fdtd/builders";
import { mediumProperties } from "../../fdtd/medium";
import type { SceneInput } from "../../fdtd/scene";
import { lineSourcePressure } from "../exact/green2d";
import { clockSeconds, decimateSeries, makeCheck, makeCurve, makeOutcome, makeRelativeCheck, pointSeries } from "./outcome";
import { CaseProgress } from "./run-scene";
import { rickerPeakTime, rickerSignal, rickerSourceTerm } from "./source-terms";
import { amplitudeRatioDb, correlationLag, normalisedRmsError, peakMagnitude, timesInMilliseconds } from "./trace-analysis";
import type { VerificationCase, VerificationCheck, VerificationCurve } from "./types";

const PEAK_FREQUENCY = 1000;
/**
 * 40 cells per wavelength at f0: the notes (/work/shared/verification-notes.md) give a waveform error of
 * 1.3% at one and 2.7% at two wavelengths along an axis for a correct scheme, under the 3% asked for.
 */
const POINTS_PER_WAVELENGTH = 40;
const AIR = { kind: "air" as const, temperature: 20 };
/** Peak volume rate per unit length of the source, m^2/s. */
const SOURCE_AMPLITUDE = 1;
/** Receiver distances in wavelengths at f0: waveform checks at 1 and 2, spreading from 2 to 4. */
const WAVEFORM_DISTANCES = [1, 2] as const;
const SPREADING_DISTANCES = [2, 4] as const;
/** Free space around the receivers, wavelengths: keeps the PML's echo clear of each pulse. */
const MARGIN_WAVELENGTHS = 3;

/** Tolerances, from the notes unless said otherwise. */
const ARRIVAL_TOLERANCE_STEPS = 0.4; // notes: arrival within 0.4 steps (the issue asks for one step)
const WAVEFORM_TOLERANCE = 0.03; // issue 3: under 3% before any boundary reflection arrives
const AMPLITUDE_TOLERANCE = 0.03; // notes: absolute amplitude within 3% at >= 20 ppw and <= 2 wavelengths
const SPREADING_TOLERANCE_DB = 0.25; // 3% in amplitude (notes), in dB

interface Layout {
  cellSize: number;
  wavelength: number;
  source: { i: number; j: number };
  receivers: { id: string; direction: "axis" | "diagonal"; wavelengths: number; i: number; j: number }[];
  cellsX: number;
  cellsY: number;
}

function layout(): Layout {
  const { soundSpeed } = mediumProperties(AIR);
  const wavelength = soundSpeed / PEAK_FREQUENCY;
  // The cell size deriveGrid computes for a "frequency" resolution, so positions land on cell centres.
  const cellSize = soundSpeed / (PEAK_FREQUENCY * POINTS_PER_WAVELENGTH);
  const margin = MARGIN_WAVELENGTHS * POINTS_PER_WAVELENGTH;
  const source = { i: margin, j: margin };
  const receivers: Layout["receivers"] = [];
  for (const wavelengths of [...new Set([...WAVEFORM_DISTANCES, ...SPREADING_DISTANCES])]) {
    const along = wavelengths * POINTS_PER_WAVELENGTH;
    receivers.push({ id: `axis-${wavelengths}`, direction: "axis", wavelengths, i: source.i + along, j: source.j });
    const diagonal = Math.round(along / Math.SQRT2);
    receivers.push({ id: `diagonal-${wavelengths}`, direction: "diagonal", wavelengths, i: source.i + diagonal, j: source.j + diagonal });
  }
  const cellsX = Math.max(...receivers.map((r) => r.i)) + margin + 1;
  const cellsY = Math.max(...receivers.map((r) => r.j)) + margin + 1;
  return { cellSize, wavelength, source, receivers, cellsX, cellsY };
}

const centre = (index: number, cellSize: number) => (index + 0.5) * cellSize;

function freeFieldScene(): SceneInput {
  const { cellSize, wavelength, source, receivers, cellsX, cellsY } = layout();
  const farthest = Math.max(...SPREADING_DISTANCES) * wavelength;
  const { soundSpeed } = mediumProperties(AIR);
  return buildScene({
    name: "Verification: free field",
    domain: { width: cellsX * cellSize, height: cellsY * cellSize },
    medium: AIR,
    resolution: { kind: "frequency", maxFrequency: PEAK_FREQUENCY, pointsPerWavelength: POINTS_PER_WAVELENGTH },
    sources: [pointSource("source", centre(source.i, cellSize), centre(source.j, cellSize), rickerSignal(PEAK_FREQUENCY), SOURCE_AMPLITUDE)],
    receivers: receivers.map((r) => pointReceiver(r.id, centre(r.i, cellSize), centre(r.j, cellSize))),
    // Until the farthest pulse and the start of its tail have passed.
    duration: { kind: "time", seconds: farthest / soundSpeed + (MARGIN_WAVELENGTHS * 2) / PEAK_FREQUENCY },
    output: { levelMaps: false },
  });
}

/** Earliest time a wave reflected at any of the four domain edges can reach the receiver, s. */
function firstEdgeReflection(source: { x: number; y: number }, receiver: { x: number; y: number }, width: number, height: number, soundSpeed: number): number {
  const images = [
    { x: -source.x, y: source.y },
    { x: 2 * width - source.x, y: source.y },
    { x: source.x, y: -source.y },
    { x: source.x, y: 2 * height - source.y },
  ];
  return Math.min(...images.map((image) => Math.hypot(receiver.x - image.x, receiver.y - image.y))) / soundSpeed;
}

function run(options?: Parameters<VerificationCase["run"]>[0]) {
  const started = clockSeconds();
  const progress = new CaseProgress(options, 2);
  const scene = freeFieldScene();
  const result = progress.run("free-field run", scene);
  const { timeStep, soundSpeed, density } = result.grid;
  const { wavelength } = layout();
  const sourcePosition = result.sources[0]!;
  const sourceTerm = rickerSourceTerm(density, SOURCE_AMPLITUDE, PEAK_FREQUENCY, rickerPeakTime(PEAK_FREQUENCY));
  const pulseEnd = rickerPeakTime(PEAK_FREQUENCY) + 1.5 / PEAK_FREQUENCY;

  const checks: VerificationCheck[] = [];
  const curves: VerificationCurve[] = [];
  const peaks = new Map<string, { simulated: number; exact: number; distance: number }>();
  const receivers = layout().receivers;
  receivers.forEach((receiver, index) => {
    progress.report("exact solution", index / receivers.length);
    const trace = result.receivers.find((r) => r.id === receiver.id)!;
    const distance = Math.hypot(trace.position.x - sourcePosition.x, trace.position.y - sourcePosition.y);
    // Compare only before any wave reflected by the PML could arrive (it is tiny, but the check says "free field").
    const windowEnd = firstEdgeReflection(sourcePosition, trace.position, scene.domain.width, scene.domain.height, soundSpeed);
    if (windowEnd < distance / soundSpeed + pulseEnd) throw new Error(`free-field case layout: the PML echo reaches ${receiver.id} before its pulse has passed`);
    const samples = Math.min(trace.pressure.length, Math.floor(windowEnd / timeStep));
    const exact = new Float64Array(samples);
    for (let n = 0; n < samples; n++) exact[n] = lineSourcePressure(sourceTerm, distance, soundSpeed, n * timeStep);
    const simulated = trace.pressure.subarray(0, samples);
    const where = `${receiver.direction === "axis" ? "along the x axis" : "along the diagonal"}, ${receiver.wavelengths} wavelength${receiver.wavelengths > 1 ? "s" : ""} (${distance.toFixed(3)} m)`;
    peaks.set(receiver.id, { simulated: peakMagnitude(simulated), exact: peakMagnitude(exact), distance });

    if ((WAVEFORM_DISTANCES as readonly number[]).includes(receiver.wavelengths)) {
      const lag = correlationLag(exact, simulated, 20);
      checks.push(makeCheck(`arrival time ${where}: lag of the simulated pulse behind the exact one`, lag, 0, ARRIVAL_TOLERANCE_STEPS, "time steps"));
      const waveformError = normalisedRmsError(simulated, exact);
      checks.push(makeCheck(`waveform ${where}: normalised RMS error before the first edge reflection (${(1000 * windowEnd).toFixed(2)} ms)`, waveformError, 0, WAVEFORM_TOLERANCE, "ratio"));
      const peak = peaks.get(receiver.id)!;
      checks.push(makeRelativeCheck(`peak pressure ${where}`, peak.simulated, peak.exact, AMPLITUDE_TOLERANCE, "Pa"));
      const times = timesInMilliseconds(samples, timeStep);
      curves.push(
        makeCurve(`Pressure ${where}`, "time (ms)", "pressure (Pa)", [
          decimateSeries("FDTD", "simulated", times, simulated),
          decimateSeries("exact 2D Green's function", "exact", times, exact),
        ]),
      );
    }
  });

  // Far-field cylindrical spreading: |H0(kr)| ~ sqrt(2 / (pi k r)) (A&S 9.2.3), so peaks fall 10 log10(2) dB per doubling.
  const doubling = 10 * Math.log10(2);
  for (const direction of ["axis", "diagonal"] as const) {
    const [near, far] = SPREADING_DISTANCES.map((d) => peaks.get(`${direction}-${d}`)!);
    const drop = amplitudeRatioDb(near!.simulated / far!.simulated);
    const ratio = far!.distance / near!.distance;
    // The receivers sit on cell centres, so the distance ratio is 2 only to a cell; the law is 10 log10(ratio).
    checks.push(makeCheck(`peak level drop ${direction === "axis" ? "along the axis" : "along the diagonal"} from ${SPREADING_DISTANCES[0]} to ${SPREADING_DISTANCES[1]} wavelengths (distance ratio ${ratio.toFixed(4)})`, drop, 10 * Math.log10(ratio), SPREADING_TOLERANCE_DB, "dB"));
  }
  const byDistance = [...peaks.values()].sort((a, b) => a.distance - b.distance);
  curves.push(
    makeCurve("Peak pressure against distance", "distance (wavelengths at f0)", "peak pressure (dB re its value at 1 wavelength)", [
      pointSeries("FDTD", "simulated", byDistance.map((p) => p.distance / wavelength), byDistance.map((p) => amplitudeRatioDb(p.simulated / byDistance[0]!.exact))),
      pointSeries("exact", "exact", byDistance.map((p) => p.distance / wavelength), byDistance.map((p) => amplitudeRatioDb(p.exact / byDistance[0]!.exact))),
      decimateSeries(`${doubling.toFixed(2)} dB per doubling`, "exact", byDistance.map((p) => p.distance / wavelength), byDistance.map((p) => -10 * Math.log10(p.distance / byDistance[0]!.distance))),
    ]),
  );
  progress.next("done");
  return makeOutcome(checks, curves, started);
}

export const freeFieldCase: VerificationCase = {
  id: "free-field",
  title: "Free field: a line source against the exact 2D Green's function",
  whatIsChecked:
    "A Ricker pulse from a line source in open air (PML on every side). At receivers one and two wavelengths away, along a grid axis and along the diagonal, the simulated pressure is compared sample by sample with the exact solution for the same source: arrival time, waveform (RMS error before any edge reflection could arrive) and peak. Receivers at two and four wavelengths check that the peak falls 3 dB per doubling of distance, as a line source's does.",
  reference: {
    name: "Time-domain 2D Green's function g = H(t - r/c) / (2 pi sqrt(t^2 - r^2/c^2)) convolved with the source term rho dQ/dt",
    source: "Morse & Feshbach, Methods of Theoretical Physics (1953), ch. 7 (2D Green's function of the wave equation); Abramowitz & Stegun, Handbook of Mathematical Functions, 9.2.3 (large-argument Hankel function: 1/sqrt(r) spreading)",
  },
  resolution: `${POINTS_PER_WAVELENGTH} cells per wavelength at f0 = ${PEAK_FREQUENCY} Hz (Ricker peak frequency), Courant number 0.6`,
  scene: freeFieldScene,
  run,
};
