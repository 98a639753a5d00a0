// The numbers and words of a run's printable report, from the frozen scene and the decoded run: the
// treatments table, the settings, band levels per receiver, insertion loss against a chosen reference
// run, and the review status. Pure, so the page only lays them out.
import { bandLevelTable, type BandLevelTable } from "@/lib/analysis/band-levels";
import { insertionLossTable, RunMismatchError, type InsertionLossTable } from "@/lib/analysis/insertion-loss";
import type { GridPlan } from "@/lib/fdtd/grid";
import { absorptionFromImpedance, MATERIALS } from "@/lib/fdtd/materials";
import { mediumProperties } from "@/lib/fdtd/medium";
import type { Edge, Medium, Scene, Signal, SurfaceTreatment } from "@/lib/fdtd/scene";
import type { RunListItem } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";
import { padTraces } from "@/lib/sweeps/sweep-insertion-loss";

const figure = (value: number, digits = 3) => String(Number(value.toPrecision(digits)));

export interface TreatmentDescription {
  /** "Rigid", "Absorption coefficient", "Normalised impedance", or the material's name. */
  treatment: string;
  /** Normal-incidence absorption coefficient the solver uses, 0 to 1. */
  absorption: number;
  /** Where the value comes from, for a table material. */
  source?: string;
}

export function describeTreatment(treatment: SurfaceTreatment): TreatmentDescription {
  switch (treatment.kind) {
    case "rigid":
      return { treatment: "Rigid", absorption: 0 };
    case "absorption":
      return { treatment: "Absorption coefficient given", absorption: treatment.absorptionCoefficient };
    case "impedance":
      return { treatment: `Normalised impedance z = ${figure(treatment.normalisedImpedance)}`, absorption: absorptionFromImpedance(treatment.normalisedImpedance) };
    case "material": {
      const material = MATERIALS[treatment.material];
      return { treatment: material.label, absorption: material.absorption, source: material.source };
    }
  }
}

export interface TreatmentRow extends TreatmentDescription {
  element: string;
  kind: "Solid" | "Wall" | "Surface" | "Outer side";
}

function edgeTreatment(edge: Edge): TreatmentDescription | null {
  return edge.kind === "pml" ? null : describeTreatment(edge);
}

/** Every solid, wall, treated surface and non-absorbing outer side with what its faces do. */
export function treatmentRows(scene: Scene): TreatmentRow[] {
  const { solids, walls, surfaces } = scene.geometry;
  const sides = (["bottom", "left", "right", "top"] as const).flatMap((side) => {
    const described = edgeTreatment(scene.boundary[side]);
    return described ? [{ element: `${side[0]!.toUpperCase()}${side.slice(1)} side`, kind: "Outer side" as const, ...described }] : [];
  });
  return [
    ...solids.map((solid) => ({ element: solid.label || solid.id, kind: "Solid" as const, ...describeTreatment(solid.surface) })),
    ...walls.map((wall) => ({ element: `${wall.label || wall.id} (${figure(wall.thickness)} m thick)`, kind: "Wall" as const, ...describeTreatment(wall.surface) })),
    ...surfaces.map((surface) => ({ element: surface.label || surface.id, kind: "Surface" as const, ...describeTreatment(surface.treatment) })),
    ...sides,
  ];
}

function mediumWords(medium: Medium): string {
  const { soundSpeed, density } = mediumProperties(medium);
  const base = medium.kind === "air" ? `Air at ${medium.temperature} °C` : "Fluid";
  return `${base}: c = ${figure(soundSpeed, 4)} m/s, ρ = ${figure(density, 3)} kg/m³`;
}

export function signalWords(signal: Signal): string {
  switch (signal.kind) {
    case "ricker":
      return `Ricker wavelet peaking at ${figure(signal.peakFrequency)} Hz`;
    case "gaussianPulse":
      return `Gaussian pulse, σ = ${figure(signal.width * 1000)} ms`;
    case "toneBurst":
      return `Tone burst at ${figure(signal.frequency)} Hz, ${signal.cycles} cycles`;
    case "sine":
      return `Sine at ${figure(signal.frequency)} Hz, ${signal.rampCycles}-cycle fade-in`;
    case "sampled":
      return `Recorded signal, ${signal.samples.length.toLocaleString("en-GB")} samples at ${figure(signal.sampleRate, 5)} Hz`;
  }
}

function edgeWords(edge: Edge): string {
  if (edge.kind === "pml") return `absorbing layer (PML), ${edge.layerCells} cells`;
  const described = describeTreatment(edge);
  return edge.kind === "rigid" ? "rigid" : `${described.treatment} (α = ${figure(described.absorption, 2)})`;
}

/** The run's settings as label and value, in the order a reader checks them. */
export function settingsRows(scene: Scene, grid: GridPlan): [string, string][] {
  const resolution =
    scene.resolution.kind === "frequency"
      ? `Up to ${figure(scene.resolution.maxFrequency)} Hz at ${scene.resolution.pointsPerWavelength} cells per wavelength; Courant number ${scene.resolution.courantNumber}`
      : `Cell size ${figure(scene.resolution.cellSize * 1000)} mm; Courant number ${scene.resolution.courantNumber}`;
  const duration = scene.duration.kind === "time" ? `${figure(scene.duration.seconds * 1000)} ms` : `Until the energy is ${scene.duration.decayDb} dB below its peak, at most ${figure(scene.duration.maxSeconds * 1000)} ms`;
  return [
    ["Domain", `${figure(scene.domain.width)} m wide × ${figure(scene.domain.height)} m high`],
    ["Medium", mediumWords(scene.medium)],
    ...(scene.mediumRegions.length > 0 ? [["Other media", scene.mediumRegions.map((r) => `${r.label || r.id}: ${mediumWords(r.medium)}`).join("; ")] as [string, string]] : []),
    ["Resolution", resolution],
    ["Resolved up to", `${figure(grid.maxResolvedFrequency)} Hz`],
    ["Boundaries", (["left", "right", "bottom", "top"] as const).map((side) => `${side} ${edgeWords(scene.boundary[side])}`).join("; ")],
    ["Duration", duration],
    ...(scene.attenuation ? [["Added attenuation", `${scene.attenuation.dBPerMetre} dB/m`] as [string, string]] : []),
    ...scene.sources.map((source): [string, string] => [`Source: ${source.label || source.id}`, `${signalWords(source.signal)}; amplitude ${source.amplitude} m²/s; at (${source.position.x}, ${source.position.y}) m`]),
  ];
}

export type Outcome<T> = { ok: true; value: T } | { ok: false; message: string };

/** Octave-band levels (unweighted) of every receiver of the run, in the bands the grid resolves. */
export function runBandLevels(run: Pick<DecodedRun, "receivers">, highestResolvedFrequency: number, bandsPerOctave: 1 | 3 = 1): Outcome<BandLevelTable> {
  if (run.receivers.length === 0) return { ok: false, message: "The run has no receivers." };
  try {
    return { ok: true, value: bandLevelTable(run.receivers, { bandsPerOctave, highestResolvedFrequency }) };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/**
 * Insertion loss of this run against a reference run, per receiver and octave band. Both must lie on the
 * same grid with the same receivers; a reference that stopped earlier on decay is padded with silence.
 */
export function runInsertionLoss(run: Pick<DecodedRun, "receivers" | "header">, reference: Pick<DecodedRun, "receivers" | "header">, highestResolvedFrequency: number): Outcome<InsertionLossTable> {
  const a = run.header.grid;
  const b = reference.header.grid;
  if (a.nx !== b.nx || a.ny !== b.ny || a.cellSize !== b.cellSize || a.timeStep !== b.timeStep) {
    return { ok: false, message: `The reference lies on another grid (${b.nx} × ${b.ny} cells of ${figure(b.cellSize * 1000)} mm against ${a.nx} × ${a.ny} of ${figure(a.cellSize * 1000)} mm); insertion loss needs the same grid.` };
  }
  const length = Math.max(...[...run.receivers, ...reference.receivers].map((trace) => trace.pressure.length));
  try {
    const options = { bandsPerOctave: 1 as const, highestResolvedFrequency };
    const withTreatment = bandLevelTable(padTraces(run.receivers, length), options);
    const without = bandLevelTable(padTraces(reference.receivers, length), options);
    return { ok: true, value: insertionLossTable(without, withTreatment) };
  } catch (error) {
    if (error instanceof RunMismatchError || error instanceof RangeError) return { ok: false, message: `This run and the reference cannot be paired: ${error.message}.` };
    throw error;
  }
}

/** The study's other finished runs on the same grid: the candidates for a reference. */
export function referenceCandidates(runs: readonly RunListItem[], run: Pick<RunListItem, "id" | "figures">): RunListItem[] {
  const grid = run.figures?.grid;
  if (!grid) return [];
  return runs.filter((candidate) => {
    const other = candidate.figures?.grid;
    return candidate.id !== run.id && candidate.status === "completed" && other !== undefined && other.nx === grid.nx && other.ny === grid.ny && other.cellSize === grid.cellSize && other.timeStep === grid.timeStep;
  });
}

export interface ReviewStatus {
  status: string;
  reviewerName: string | null;
  reviewedAt: string | null;
  note: string | null;
}

/**
 * The run record's review, when it has one. Reviews are added to run records separately; a record
 * without a review field has not been reviewed.
 */
export function reviewOf(record: unknown): ReviewStatus | null {
  const review = (record as { review?: unknown } | null)?.review;
  if (!review || typeof review !== "object") return null;
  const fields = review as Record<string, unknown>;
  const text = (value: unknown) => (typeof value === "string" && value.length > 0 ? value : null);
  const status = text(fields.status);
  if (!status) return null;
  return { status, reviewerName: text(fields.reviewerName) ?? text(fields.reviewedByName), reviewedAt: text(fields.reviewedAt), note: text(fields.note) ?? text(fields.comment) };
}
