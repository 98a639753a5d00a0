// Case 6: insertion loss of a thin rigid screen (a half-plane: only its top edge diffracts) in one-third
// octave bands at receivers in the shadow zone, against the exact half-plane solution.
import { bandEnergies, bandsBetween, type FrequencyBand } from "../../analysis/bands";
import { realSpectrum } from "../../analysis/spectrum";
import { buildScene, pointReceiver, pointSource } from "../../fdtd/builders";
import type { SceneInput } from "../../fdtd/scene";
import { freeFieldGreenBetween, halfPlaneGreen, polarAboutEdge } from "../exact/half-plane";
import { gaussLegendreRule } from "../exact/quadrature";
import { clockSeconds, decimateSeries, makeCheck, makeCurve, makeOutcome, pointSeries } from "./outcome";
import { CaseProgress } from "./run-scene";
import { rickerSignal } from "./source-terms";
import type { VerificationCase, VerificationCheck, VerificationCurve } from "./types";

const AIR = { kind: "air" as const, temperature: 20 };
/**
 * 3 cm cells: 10.2 cells per wavelength at 1122 Hz, the upper edge of the highest band judged (1 kHz), so
 * every band is resolved with at least 10 cells per wavelength.
 */
const CELL_SIZE = 0.03;
const LOWEST_BAND = 250;
const HIGHEST_BAND = 1000;
const PEAK_FREQUENCY = 500;
/** Positions in cells (centres at (i + 1/2) h); the screen stands on the x-face line i = SCREEN_COLUMN. */
const DOMAIN_CELLS = { x: 233, y: 117 };
const SCREEN_COLUMN = 100;
/** The screen's top edge: y = SCREEN_TOP_ROW h = 1.98 m; faces of rows below it are blocked. */
const SCREEN_TOP_ROW = 66;
const SOURCE_CELL = { i: 66, j: 16 };
const RECEIVER_CELLS = [
  { id: "deep-shadow", i: 133, j: 16 },
  { id: "far-low", i: 166, j: 33 },
  { id: "mid-shadow", i: 150, j: 53 },
  { id: "near-shadow-boundary", i: 120, j: 80 },
] as const;
/** Long enough for the free-field tail of the lowest band to die away (the record is then a whole transient). */
const DURATION = 0.06;
/** Gauss-Legendre nodes per band for the exact band energies. */
const QUADRATURE_NODES = 12;

/** Notes: insertion loss within 0.4 dB of the exact solution at >= 10 cells per wavelength (issue 3 asks for 1.5 dB). */
const INSERTION_LOSS_TOLERANCE_DB = 0.5;

const centre = (index: number) => (index + 0.5) * CELL_SIZE;
const edge = { x: SCREEN_COLUMN * CELL_SIZE, y: SCREEN_TOP_ROW * CELL_SIZE };
/** The screen runs down from its edge (and on through the bottom PML). */
const SCREEN_DIRECTION = { x: 0, y: -1 };

function screenScene(withScreen: boolean): SceneInput {
  return buildScene({
    name: withScreen ? "Verification: thin rigid screen" : "Verification: thin rigid screen, free-field run",
    domain: { width: DOMAIN_CELLS.x * CELL_SIZE, height: DOMAIN_CELLS.y * CELL_SIZE },
    medium: AIR,
    resolution: { kind: "cellSize", cellSize: CELL_SIZE },
    geometry: withScreen ? { walls: [{ id: "screen", label: "Screen", path: [{ x: edge.x, y: 0 }, edge], thickness: 0.001 }] } : {},
    sources: [pointSource("source", centre(SOURCE_CELL.i), centre(SOURCE_CELL.j), rickerSignal(PEAK_FREQUENCY))],
    receivers: RECEIVER_CELLS.map((r) => pointReceiver(r.id, centre(r.i), centre(r.j))),
    duration: { kind: "time", seconds: DURATION },
    output: { levelMaps: false },
  });
}

/**
 * Weight of frequency f in a band energy: |S(f)|^2 of the source term s = rho dQ/dt with Q a Ricker wavelet,
 * |Q(f)| ~ (f/f0)^2 exp(-(f/f0)^2) (Ricker, Geophysics 18, 1953), so |S|^2 ~ f^6 exp(-2 (f/f0)^2).
 */
function sourceWeight(f: number): number {
  const x = f / PEAK_FREQUENCY;
  return Math.pow(x, 6) * Math.exp(-2 * x * x);
}

/** Exact insertion loss of a band: 10 log10 of the source-weighted band energies, free field over screened. */
function exactBandInsertionLoss(band: FrequencyBand, receiver: { x: number; y: number }, source: { x: number; y: number }, soundSpeed: number): number {
  const rule = gaussLegendreRule(QUADRATURE_NODES);
  const sourcePolar = polarAboutEdge(edge, SCREEN_DIRECTION, source);
  const receiverPolar = polarAboutEdge(edge, SCREEN_DIRECTION, receiver);
  let free = 0;
  let screened = 0;
  for (let q = 0; q < rule.nodes.length; q++) {
    const f = 0.5 * (band.lower + band.upper) + 0.5 * (band.upper - band.lower) * rule.nodes[q]!;
    const k = (2 * Math.PI * f) / soundSpeed;
    const weight = rule.weights[q]! * sourceWeight(f);
    const g0 = freeFieldGreenBetween(k, sourcePolar, receiverPolar);
    const g = halfPlaneGreen(k, sourcePolar, receiverPolar);
    free += weight * (g0.re * g0.re + g0.im * g0.im);
    screened += weight * (g.re * g.re + g.im * g.im);
  }
  return 10 * Math.log10(free / screened);
}

function run(options?: Parameters<VerificationCase["run"]>[0]) {
  const started = clockSeconds();
  const progress = new CaseProgress(options, 3);
  const freeRun = progress.run("free-field run", screenScene(false));
  const screenedRun = progress.run("run with the screen", screenScene(true));
  const { timeStep, soundSpeed } = freeRun.grid;
  const bands = bandsBetween(LOWEST_BAND, HIGHEST_BAND, 3);
  const source = freeRun.sources[0]!;
  const checks: VerificationCheck[] = [];
  const curves: VerificationCurve[] = [];
  RECEIVER_CELLS.forEach((cell, index) => {
    progress.report("exact half-plane solution", index / RECEIVER_CELLS.length);
    const free = freeRun.receivers.find((r) => r.id === cell.id)!;
    const screened = screenedRun.receivers.find((r) => r.id === cell.id)!;
    // Zero-padding to 8 times the record samples each band's spectrum finely (the record holds the whole transient).
    const size = 8 * 2 ** Math.ceil(Math.log2(free.pressure.length));
    const freeEnergy = bandEnergies(realSpectrum(free.pressure, timeStep, { size }), bands);
    const screenedEnergy = bandEnergies(realSpectrum(screened.pressure, timeStep, { size }), bands);
    const simulated: number[] = [];
    const exact: number[] = [];
    bands.forEach((band, b) => {
      const measured = 10 * Math.log10(freeEnergy[b]! / screenedEnergy[b]!);
      const expected = exactBandInsertionLoss(band, free.position, source, soundSpeed);
      simulated.push(measured);
      exact.push(expected);
      const ppw = soundSpeed / (band.upper * CELL_SIZE);
      checks.push(makeCheck(`insertion loss at ${cell.id} (${free.position.x.toFixed(3)}, ${free.position.y.toFixed(3)}) m, ${band.nominal} Hz one-third octave (${ppw.toFixed(1)} cells per wavelength at its upper edge)`, measured, expected, INSERTION_LOSS_TOLERANCE_DB, "dB"));
    });
    const centres = bands.map((band) => band.nominal);
    curves.push(
      makeCurve(`Insertion loss at ${cell.id} (${free.position.x.toFixed(2)}, ${free.position.y.toFixed(2)}) m`, "one-third octave band (Hz)", "insertion loss (dB)", [
        pointSeries("FDTD", "simulated", centres, simulated),
        decimateSeries("exact half-plane", "exact", centres, exact),
      ]),
    );
  });
  progress.next("done");
  return makeOutcome(checks, curves, started);
}

export const halfPlaneCase: VerificationCase = {
  id: "half-plane",
  title: "Thin rigid screen: insertion loss in the shadow zone",
  whatIsChecked:
    "A thin rigid screen 1.98 m high runs down through the bottom PML, so only its top edge diffracts: a half-plane. A Ricker line source stands 1 m in front of it; four receivers behind it lie in the shadow zone, from deep shadow to near the shadow boundary. The insertion loss (free-field run against screened run, band energies from the FFT of each trace) in every one-third octave band from 250 Hz to 1 kHz is compared with the exact half-plane solution, integrated over each band with the source spectrum as weight.",
  reference: {
    name: "Exact field of a line source at a rigid half-plane (Macdonald's solution)",
    source: "Macdonald, Proc. London Math. Soc. (1915); Bowman, Senior & Uslenghi, Electromagnetic and Acoustic Scattering by Simple Shapes (1969), half-plane chapter; bands per IEC 61260-1:2014 (base-10 midband frequencies)",
  },
  resolution: `${CELL_SIZE} m cells: at least 10 cells per wavelength up to 1122 Hz, the upper edge of the 1 kHz band; Courant number 0.6`,
  scene: () => screenScene(true),
  run,
};
