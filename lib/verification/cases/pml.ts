// Case 4: how much of a pulse the PML sends back, at normal incidence and at 45 degrees, isolated by
// subtracting a reference run whose PML is far away.
import { buildScene, pointReceiver, pointSource } from "../../fdtd/builders";
import { mediumProperties } from "../../fdtd/medium";
import { DEFAULT_PML_CELLS, type SceneInput } from "../../fdtd/scene";
import { clockSeconds, decimateSeries, makeCeilingCheck, makeCurve, makeOutcome } from "./outcome";
import { CaseProgress } from "./run-scene";
import { rickerPeakTime, rickerSignal } from "./source-terms";
import { amplitudeRatioDb, peakMagnitude, timesInMilliseconds } from "./trace-analysis";
import type { VerificationCase, VerificationCurve } from "./types";

const AIR = { kind: "air" as const, temperature: 20 };
const PEAK_FREQUENCY = 1000;
const POINTS_PER_WAVELENGTH = 15;
/** Source to PML distance, wavelengths at f0 (the 45-degree receiver is as far from the PML, twice as far up). */
const SOURCE_TO_PML = 2;
/** Free space around source and receivers on the other sides, wavelengths. */
const MARGIN = 3;

/** Issue 3 (common practice for a PML of 10-30 cells): the reflection at least 40 dB down at normal incidence, 30 dB at 45 degrees. */
const NORMAL_LIMIT_DB = -40;
const OBLIQUE_LIMIT_DB = -30;

interface Geometry {
  cellSize: number;
  /** Column index of the PML's inner edge in the close-PML run (domain width in cells). */
  pmlColumn: number;
  height: number;
  source: { x: number; y: number };
  normal: { x: number; y: number };
  oblique: { x: number; y: number };
  /** Run time, s. */
  duration: number;
  /** Domain width of the reference run, m. */
  referenceWidth: number;
}

function geometry(): Geometry {
  const { soundSpeed } = mediumProperties(AIR);
  const cellSize = soundSpeed / (PEAK_FREQUENCY * POINTS_PER_WAVELENGTH);
  const cells = (wavelengths: number) => Math.round(wavelengths * POINTS_PER_WAVELENGTH);
  const sourceColumn = cells(MARGIN);
  const pmlColumn = sourceColumn + cells(SOURCE_TO_PML);
  const sourceRow = cells(MARGIN);
  const centre = (index: number) => (index + 0.5) * cellSize;
  // The source's centre is a = (pmlColumn - sourceColumn - 1/2) cells from the PML; a receiver as far from it
  // and 2a higher sees the specular reflection arrive at 45 degrees.
  const a = pmlColumn - sourceColumn - 0.5;
  const source = { x: centre(sourceColumn), y: centre(sourceRow) };
  const normal = { x: centre(pmlColumn - Math.round(a / 2) - 1), y: source.y };
  const oblique = { x: source.x, y: source.y + 2 * a * cellSize };
  const height = (sourceRow + 2 * a + 0.5 + cells(MARGIN)) * cellSize;
  // Until the pulse reflected towards the 45-degree receiver (path 2 sqrt(2) a) and 3 periods more have passed.
  const duration = (2 * Math.SQRT2 * a * cellSize) / soundSpeed + rickerPeakTime(PEAK_FREQUENCY) + 3 / PEAK_FREQUENCY;
  // The reference's own PML must send nothing back within the run: half the distance sound travels, beyond the mirror points.
  const referenceWidth = pmlColumn * cellSize + 0.5 * soundSpeed * duration + 2 * a * cellSize;
  return { cellSize, pmlColumn, height, source, normal, oblique, duration, referenceWidth };
}

/** Mirror image of a point in the PML's inner edge x = pmlColumn h. */
function mirror(p: { x: number; y: number }, g: Geometry): { x: number; y: number } {
  return { x: 2 * g.pmlColumn * g.cellSize - p.x, y: p.y };
}

function pmlScene(width: number, withMirrorReceivers: boolean): SceneInput {
  const g = geometry();
  const pml = { kind: "pml" as const, layerCells: DEFAULT_PML_CELLS };
  const receivers = [pointReceiver("normal", g.normal.x, g.normal.y), pointReceiver("oblique", g.oblique.x, g.oblique.y)];
  if (withMirrorReceivers) {
    const n = mirror(g.normal, g);
    const o = mirror(g.oblique, g);
    receivers.push(pointReceiver("normal-mirror", n.x, n.y), pointReceiver("oblique-mirror", o.x, o.y));
  }
  return buildScene({
    name: withMirrorReceivers ? "Verification: PML reference (far PML)" : "Verification: PML reflection",
    domain: { width, height: g.height },
    medium: AIR,
    resolution: { kind: "frequency", maxFrequency: PEAK_FREQUENCY, pointsPerWavelength: POINTS_PER_WAVELENGTH },
    boundary: { left: pml, right: pml, bottom: pml, top: pml },
    sources: [pointSource("source", g.source.x, g.source.y, rickerSignal(PEAK_FREQUENCY))],
    receivers,
    duration: { kind: "time", seconds: g.duration },
    output: { levelMaps: false },
  });
}

function run(options?: Parameters<VerificationCase["run"]>[0]) {
  const started = clockSeconds();
  const progress = new CaseProgress(options, 2);
  const g = geometry();
  const close = progress.run("run with the PML close", pmlScene(g.pmlColumn * g.cellSize, false));
  const reference = progress.run("reference run with the PML far away", pmlScene(g.referenceWidth, true));
  const timeStep = close.grid.timeStep;
  const trace = (result: typeof close, id: string) => result.receivers.find((r) => r.id === id)!.pressure;
  const checks = [];
  const curves: VerificationCurve[] = [];
  for (const [id, label, limit] of [
    ["normal", "normal incidence", NORMAL_LIMIT_DB],
    ["oblique", "45 degrees incidence", OBLIQUE_LIMIT_DB],
  ] as const) {
    const withPml = trace(close, id);
    const free = trace(reference, id);
    // What the PML sent back: the difference of the two runs at the same receiver.
    const reflected = withPml.map((v, n) => v - free[n]!);
    // What a perfect mirror would send back: the reference pulse at the receiver's mirror image.
    const incident = trace(reference, `${id}-mirror`);
    const level = amplitudeRatioDb(peakMagnitude(reflected) / peakMagnitude(incident));
    checks.push(makeCeilingCheck(`reflection from a ${DEFAULT_PML_CELLS}-cell PML at ${label}: peak of the reflected pulse relative to the pulse a perfect mirror would return`, level, limit, "dB"));
    const times = timesInMilliseconds(withPml.length, timeStep);
    const reference0 = peakMagnitude(incident);
    const asLevel = (x: ArrayLike<number>) => Array.from(x, (v) => Math.max(-160, amplitudeRatioDb(Math.abs(v) / reference0)));
    curves.push(
      makeCurve(`PML at ${label}`, "time (ms)", "|p| (dB re the peak a perfect mirror would return)", [
        decimateSeries("reflected by the PML (FDTD difference)", "simulated", times, asLevel(reflected)),
        decimateSeries("returned by a perfect mirror (FDTD, mirror receiver)", "simulated", times, asLevel(incident)),
        decimateSeries("limit", "exact", [times[0]!, times[times.length - 1]!], [limit, limit]),
      ]),
    );
  }
  return makeOutcome(checks, curves, started);
}

export const pmlCase: VerificationCase = {
  id: "pml",
  title: "PML: reflection at normal and at 45 degrees incidence",
  whatIsChecked:
    "A Ricker pulse meets the default 20-cell PML two wavelengths from the source. The same scene is run again with that PML moved far away; the difference of the two runs at a receiver is what the PML reflected. It is compared with the pulse a perfect mirror would have returned (the reference run's pressure at the receiver's mirror image), for a receiver between source and PML (normal incidence) and one whose specular reflection arrives at 45 degrees.",
  reference: {
    name: "Reflection-free continuation of the same scene (the reference run) and the image principle for a plane mirror",
    source: "Berenger, J. Comput. Phys. 114 (1994) 185-200 (the perfectly matched layer); limits common practice (issue 3)",
  },
  resolution: `${POINTS_PER_WAVELENGTH} cells per wavelength at f0 = ${PEAK_FREQUENCY} Hz; PML ${DEFAULT_PML_CELLS} cells`,
  scene: () => pmlScene(geometry().pmlColumn * geometry().cellSize, false),
  run,
};
