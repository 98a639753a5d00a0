// The JSON header of a saved run's payload: what was run (frozen scene, settings, hash, solver
// version), on what grid, and where each binary section lies. The section layout follows from the
// header alone, so a decoder can check a payload's table against what it must be.
import { z } from "zod";
import { MAX_SNAPSHOT_FRAMES } from "./limits";
import { inputHashPattern } from "./input-hash";
import { runSettingsSchema } from "./settings";

/** The payload format this code writes and reads. */
export const RUN_PAYLOAD_FORMAT = 1;

const finite = () => z.number().finite();
const count = () => z.number().int().nonnegative();
const positiveCount = () => z.number().int().positive();
const text = (max: number) => z.string().max(max);

/** Where a stored field's values lie: value (a, b) at scene position (x0 + a spacing, y0 + b spacing), row-major, a fastest. */
const fieldGeometrySchema = z
  .object({
    width: count(),
    height: count(),
    x0: finite(),
    y0: finite(),
    spacing: finite().positive(),
  })
  .strict();
export type FieldGeometry = z.output<typeof fieldGeometrySchema>;

const quantisedFrameSchema = z
  .object({
    step: count(),
    time: finite().nonnegative(),
    /** Pascals per stored integer: max |p| of the frame / 32767. */
    scale: finite().nonnegative(),
  })
  .strict();
export type QuantisedFrame = z.output<typeof quantisedFrameSchema>;

export const sectionNames = [
  "traces.pressure",
  "traces.velocityX",
  "traces.velocityY",
  "snapshots",
  "finalPressure",
  "levelMaps.peak",
  "levelMaps.rms",
  "intensity.x",
  "intensity.y",
] as const;
export type SectionName = (typeof sectionNames)[number];

const sectionSchema = z
  .object({
    name: z.enum(sectionNames),
    type: z.enum(["float32", "int16"]),
    /** Bytes from the start of the data area (just after the header), a multiple of 4. */
    offset: count(),
    /** Values, not bytes. */
    length: count(),
  })
  .strict();
export type Section = z.output<typeof sectionSchema>;

const mapsSchema = z
  .object({
    field: fieldGeometrySchema,
    /** Time samples averaged into the maps. */
    samples: count(),
    /** Cells per side of the blocks the maps were coarsened into (1: as computed). */
    block: positiveCount(),
  })
  .strict();

export const runPayloadHeaderSchema = z
  .object({
    format: z.literal(RUN_PAYLOAD_FORMAT),
    solverVersion: z.string().min(1).max(200),
    /** The saved version of the scene that was run. */
    sceneVersion: positiveCount(),
    inputHash: z.string().regex(inputHashPattern, "inputHash is 64 lower-case hex digits (SHA-256)"),
    settings: runSettingsSchema,
    /** The scene exactly as run, after parseScene; checked again by whoever reads it. */
    scene: z.record(z.string(), z.unknown()),
    engine: z.object({ kernel: text(200), threads: positiveCount().max(1024) }).strict(),
    grid: z
      .object({
        nx: positiveCount(),
        ny: positiveCount(),
        domainNx: positiveCount(),
        domainNy: positiveCount(),
        /** dx, m. */
        cellSize: finite().positive(),
        /** dt, s. */
        timeStep: finite().positive(),
        /** Steps the scene asked for (the upper limit when it stops on decay). */
        plannedSteps: positiveCount(),
      })
      .strict(),
    run: z
      .object({
        stepsRun: count(),
        simulatedSeconds: finite().nonnegative(),
        stoppedBy: z.enum(["duration", "decay", "cancelled"]),
        setupSeconds: finite().nonnegative(),
        runSeconds: finite().nonnegative(),
        cellUpdatesPerSecond: finite().nonnegative(),
      })
      .strict(),
    warnings: z.array(z.object({ code: text(100), message: text(2000), path: text(500).optional() }).strict()).max(1000),
    sources: z.array(z.object({ id: text(64), label: text(200), x: finite(), y: finite() }).strict()).max(10_000),
    receivers: z.array(z.object({ id: text(200), label: text(300), lineId: text(64).optional(), x: finite(), y: finite() }).strict()).max(1_000_000),
    /** Acoustic energy per unit length at each energy check, J/m. */
    energy: z.array(z.object({ step: count(), time: finite().nonnegative(), joulesPerMetre: finite().nonnegative() }).strict()).max(1_000_000),
    snapshots: z
      .object({
        /** Every k-th snapshot of the run is kept. */
        frameStride: positiveCount(),
        /** Every s-th value of each kept snapshot is kept, in x and y. */
        cellStride: positiveCount(),
        field: fieldGeometrySchema,
        frames: z.array(quantisedFrameSchema).max(MAX_SNAPSHOT_FRAMES),
      })
      .strict(),
    finalPressure: z.object({ cellStride: positiveCount(), field: fieldGeometrySchema, frame: quantisedFrameSchema }).strict(),
    levelMaps: mapsSchema.optional(),
    intensity: mapsSchema.optional(),
    sections: z.array(sectionSchema).max(sectionNames.length),
  })
  .strict();

export type RunPayloadHeader = z.output<typeof runPayloadHeaderSchema>;

const bytesPerValue = { float32: 4, int16: 2 } as const;

/** Rounded up to a multiple of 4, so every float32 section starts aligned. */
export function alignedBytes(bytes: number): number {
  return Math.ceil(bytes / 4) * 4;
}

/**
 * The sections a header implies, in their fixed order, each starting on a 4-byte boundary:
 * traces (receiver after receiver, stepsRun + 1 samples each), snapshots (frame after frame),
 * the final pressure, then the maps when the run has them.
 */
export function sectionLayout(header: Omit<RunPayloadHeader, "sections">): Section[] {
  const traceValues = header.receivers.length * (header.run.stepsRun + 1);
  const frameValues = header.snapshots.field.width * header.snapshots.field.height;
  const mapValues = (maps: RunPayloadHeader["levelMaps"]) => (maps ? maps.field.width * maps.field.height : 0);
  const wanted: [SectionName, Section["type"], number][] = [
    ["traces.pressure", "float32", traceValues],
    ["traces.velocityX", "float32", traceValues],
    ["traces.velocityY", "float32", traceValues],
    ["snapshots", "int16", header.snapshots.frames.length * frameValues],
    ["finalPressure", "int16", header.finalPressure.field.width * header.finalPressure.field.height],
  ];
  if (header.levelMaps) wanted.push(["levelMaps.peak", "float32", mapValues(header.levelMaps)], ["levelMaps.rms", "float32", mapValues(header.levelMaps)]);
  if (header.intensity) wanted.push(["intensity.x", "float32", mapValues(header.intensity)], ["intensity.y", "float32", mapValues(header.intensity)]);
  let offset = 0;
  return wanted.map(([name, type, length]) => {
    const section = { name, type, offset, length };
    offset += alignedBytes(length * bytesPerValue[type]);
    return section;
  });
}

/** Bytes of the data area the sections occupy. */
export function sectionBytes(sections: readonly Section[]): number {
  const last = sections.at(-1);
  return last ? last.offset + alignedBytes(last.length * bytesPerValue[last.type]) : 0;
}
