// The one schema of a scene: plain, serialisable JSON that the app stores and the solver takes.
// Every way in (request body, file, old saved version) goes through `parseScene`.
//
// Conventions: positions and lengths in metres, origin at the bottom-left corner of the domain,
// x to the right, y up; times in seconds; frequencies in hertz.
import { z } from "zod";

import { MATERIAL_IDS } from "./materials";

/** The scene format version this code writes and reads natively. */
export const SCENE_VERSION = 1;

/** The 2D staggered-grid (Yee) scheme is stable for c dt / h <= 1/sqrt(2) (von Neumann analysis). */
export const COURANT_LIMIT_2D = Math.SQRT1_2;

/** A Courant number safely below the 2D limit (about 0.85 of it). */
export const DEFAULT_COURANT_NUMBER = 0.6;

/** Points per wavelength at the highest frequency of interest: 10 is common practice for second-order schemes. */
export const DEFAULT_POINTS_PER_WAVELENGTH = 10;

/** Default PML thickness in cells (common practice: 10 to 30 cells). */
export const DEFAULT_PML_CELLS = 20;

const finite = () => z.number().finite();
const positive = () => finite().positive();
const nonNegative = () => finite().nonnegative();

export const pointSchema = z
  .object({
    x: finite().describe("metres from the left edge of the domain"),
    y: finite().describe("metres from the bottom edge of the domain"),
  })
  .strict();

const entityId = z
  .string()
  .min(1, "an id must not be empty")
  .max(64, "an id is at most 64 characters")
  .regex(/^[A-Za-z0-9_.:-]+$/, "an id may hold letters, digits and _ . : - only")
  .describe("stable identifier, unique within the scene");

const entityLabel = z.string().max(200, "a label is at most 200 characters").describe("name shown to people");

// ---------------------------------------------------------------------------------------------
// Medium

export const airMediumSchema = z
  .object({
    kind: z.literal("air"),
    temperature: finite()
      .min(-50, "air temperature must be at least -50 C")
      .max(60, "air temperature must be at most 60 C")
      .default(20)
      .describe("degrees Celsius; c = 331.3 sqrt(1 + T/273.15) m/s"),
    density: positive()
      .max(10, "air density above 10 kg/m3 is not plausible")
      .optional()
      .describe("kg/m3; when absent, from the ideal-gas law at 101.325 kPa"),
  })
  .strict();

export const fluidMediumSchema = z
  .object({
    kind: z.literal("fluid"),
    soundSpeed: positive().max(20000, "sound speed above 20000 m/s is not plausible").describe("m/s"),
    density: positive().max(30000, "density above 30000 kg/m3 is not plausible").describe("kg/m3"),
  })
  .strict();

export const mediumSchema = z.discriminatedUnion("kind", [airMediumSchema, fluidMediumSchema]);

// ---------------------------------------------------------------------------------------------
// Surface treatments (locally reacting, real normalised impedance z = Z / (rho c))

export const surfaceTreatmentSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("rigid") }).strict(),
  z
    .object({
      kind: z.literal("impedance"),
      normalisedImpedance: positive().describe("real normalised impedance z = Z/(rho c); 1 absorbs fully at normal incidence"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("absorption"),
      absorptionCoefficient: finite()
        .min(0, "an absorption coefficient is at least 0")
        .max(1, "an absorption coefficient is at most 1")
        .describe("normal-incidence absorption coefficient alpha = 1 - R^2, converted to z >= 1"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("material"),
      material: z.enum(MATERIAL_IDS).describe("an entry of the material table"),
    })
    .strict(),
]);

// ---------------------------------------------------------------------------------------------
// Resolution

const courantNumber = positive()
  .max(COURANT_LIMIT_2D, {
    error: (issue) =>
      `Courant number ${String(issue.input)} is above the 2D stability limit 1/sqrt(2) = 0.7071 of the staggered-grid scheme; use at most 0.7071 (default ${DEFAULT_COURANT_NUMBER})`,
  })
  .default(DEFAULT_COURANT_NUMBER)
  .describe("c dt / h; at most 1/sqrt(2) in 2D");

export const resolutionSchema = z.discriminatedUnion("kind", [
  z
    .object({
      kind: z.literal("frequency"),
      maxFrequency: positive().describe("highest frequency of interest, Hz"),
      pointsPerWavelength: finite()
        .min(4, "fewer than 4 points per wavelength cannot resolve a wave")
        .max(200, "more than 200 points per wavelength is wasteful")
        .default(DEFAULT_POINTS_PER_WAVELENGTH)
        .describe("cells per wavelength at maxFrequency; cell size h = c / (maxFrequency * pointsPerWavelength)"),
      courantNumber,
    })
    .strict(),
  z
    .object({
      kind: z.literal("cellSize"),
      cellSize: positive().describe("cell size h in metres"),
      courantNumber,
    })
    .strict(),
]);

// ---------------------------------------------------------------------------------------------
// Geometry

export const solidSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    polygon: z.array(pointSchema).min(3, "a polygon needs at least 3 points").describe("outline, either winding"),
    surface: surfaceTreatmentSchema.default({ kind: "rigid" }).describe("treatment of every face of the solid"),
  })
  .strict();

export const wallSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    path: z.array(pointSchema).min(2, "a wall needs at least 2 points").describe("centre line"),
    thickness: positive().describe("metres; walls thinner than one cell are drawn one cell face thick"),
    surface: surfaceTreatmentSchema.default({ kind: "rigid" }).describe("treatment of every face of the wall"),
  })
  .strict();

export const surfaceSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    path: z
      .array(pointSchema)
      .min(2, "a surface needs at least 2 points")
      .describe("polyline lining existing boundaries: every solid, wall or rigid outer face within one cell of it takes the treatment"),
    treatment: surfaceTreatmentSchema,
  })
  .strict();

export const mediumRegionSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    polygon: z.array(pointSchema).min(3, "a polygon needs at least 3 points"),
    medium: mediumSchema,
  })
  .strict();

export const geometrySchema = z
  .object({
    solids: z.array(solidSchema).default([]),
    walls: z.array(wallSchema).default([]),
    surfaces: z.array(surfaceSchema).default([]),
  })
  .strict();

// ---------------------------------------------------------------------------------------------
// Outer boundary, one condition per side

export const pmlEdgeSchema = z
  .object({
    kind: z.literal("pml"),
    layerCells: z
      .number()
      .int("a PML thickness is a whole number of cells")
      .min(4, "a PML thinner than 4 cells reflects too much")
      .max(200, "a PML thicker than 200 cells is wasteful")
      .default(DEFAULT_PML_CELLS)
      .describe("cells added outside the domain"),
  })
  .strict();

export const edgeSchema = z.discriminatedUnion("kind", [
  pmlEdgeSchema,
  ...surfaceTreatmentSchema.options,
]);

const pmlDefault = { kind: "pml" as const, layerCells: DEFAULT_PML_CELLS };

export const boundarySchema = z
  .object({
    left: edgeSchema.default(pmlDefault),
    right: edgeSchema.default(pmlDefault),
    bottom: edgeSchema.default(pmlDefault),
    top: edgeSchema.default(pmlDefault),
  })
  .strict();

// ---------------------------------------------------------------------------------------------
// Source signals. Each analytic signal has unit peak (or unit amplitude); the source's
// `amplitude` scales it. See lib/fdtd/README.md for the physical normalisation.

export const signalSchema = z.discriminatedUnion("kind", [
  z
    .object({
      kind: z.literal("ricker"),
      peakFrequency: positive().describe("Hz; energy reaches to about 2.5 times this"),
      delay: nonNegative().optional().describe("time of the peak, s; default 1.5 / peakFrequency"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("gaussianPulse"),
      width: positive().describe("standard deviation sigma of exp(-(t - delay)^2 / (2 sigma^2)), s"),
      delay: nonNegative().optional().describe("time of the peak, s; default 6 sigma"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("toneBurst"),
      frequency: positive().describe("carrier frequency, Hz"),
      cycles: positive().max(1000).default(4).describe("carrier periods within +-2 sigma of the Gaussian envelope"),
      delay: nonNegative().optional().describe("centre of the envelope, s; default 6 sigma"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("sine"),
      frequency: positive().describe("Hz"),
      rampCycles: nonNegative().max(1000).default(3).describe("raised-cosine fade-in length in periods"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("sampled"),
      sampleRate: positive().describe("samples per second"),
      samples: z.array(finite()).min(1, "a sampled signal needs at least one sample").max(10_000_000),
    })
    .strict(),
]);

export const sourceSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    position: pointSchema,
    amplitude: finite()
      .default(1)
      .describe("peak volume-injection rate per unit length Q, m^2/s (the signal is scaled by it)"),
    signal: signalSchema,
  })
  .strict();

// ---------------------------------------------------------------------------------------------
// Receivers

export const receiverSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    position: pointSchema,
  })
  .strict();

export const receiverLineSchema = z
  .object({
    id: entityId,
    label: entityLabel,
    from: pointSchema,
    to: pointSchema,
    count: z.number().int("a receiver count is a whole number").min(2, "a receiver line needs at least 2 receivers").max(10_000),
  })
  .strict();

// ---------------------------------------------------------------------------------------------
// Losses, duration, output

export const attenuationSchema = z
  .object({
    dBPerMetre: nonNegative()
      .max(100, "more than 100 dB/m of ad hoc attenuation is not plausible")
      .describe("plane-wave attenuation, the same at every frequency (equal damping of pressure and velocity)"),
  })
  .strict();

export const durationSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("time"), seconds: positive().describe("simulated time, s") }).strict(),
  z
    .object({
      kind: z.literal("decay"),
      decayDb: positive().max(200).describe("stop when the acoustic energy in the domain is this many dB below its peak"),
      maxSeconds: positive().describe("stop at this simulated time in any case, s"),
    })
    .strict(),
]);

export const outputSchema = z
  .object({
    snapshotEverySteps: z
      .number()
      .int("a snapshot interval is a whole number of steps")
      .min(1)
      .optional()
      .describe("keep a pressure snapshot every N steps; none when absent (the final field is always available)"),
    snapshotCellStride: z
      .number()
      .int("a snapshot stride is a whole number of cells")
      .min(1)
      .max(64)
      .default(1)
      .describe("keep every k-th cell in x and y of each snapshot"),
    levelMaps: z.boolean().default(true).describe("accumulate per-cell running peak and mean-square pressure"),
  })
  .strict();

// ---------------------------------------------------------------------------------------------
// The scene

const sceneObjectSchema = z
  .object({
    version: z.literal(SCENE_VERSION),
    name: z.string().max(200).default(""),
    domain: z
      .object({
        width: positive().describe("metres"),
        height: positive().describe("metres"),
      })
      .strict(),
    medium: mediumSchema.default({ kind: "air", temperature: 20 }),
    mediumRegions: z.array(mediumRegionSchema).default([]).describe("polygons filled with another medium; later ones win"),
    resolution: resolutionSchema,
    geometry: geometrySchema.default({ solids: [], walls: [], surfaces: [] }),
    boundary: boundarySchema.default({ left: pmlDefault, right: pmlDefault, bottom: pmlDefault, top: pmlDefault }),
    sources: z.array(sourceSchema).min(1, "a scene needs at least one source"),
    receivers: z.array(receiverSchema).default([]),
    receiverLines: z.array(receiverLineSchema).default([]),
    attenuation: attenuationSchema.optional(),
    duration: durationSchema,
    output: outputSchema.default({ snapshotCellStride: 1, levelMaps: true }),
  })
  .strict();

/** Cross-field checks that a single field's schema cannot express: unique ids, points inside the domain. */
export const sceneSchema = sceneObjectSchema.superRefine((scene, ctx) => {
  const { width, height } = scene.domain;
  const seen = new Map<string, string>();
  const checkId = (id: string, path: (string | number)[]) => {
    const first = seen.get(id);
    if (first !== undefined) {
      ctx.addIssue({ code: "custom", path: [...path, "id"], message: `id "${id}" is already used by ${first}` });
    } else {
      seen.set(id, path.join("."));
    }
  };
  const checkInside = (p: { x: number; y: number }, path: (string | number)[], what: string) => {
    if (p.x < 0 || p.x > width || p.y < 0 || p.y > height) {
      ctx.addIssue({
        code: "custom",
        path,
        message: `${what} at (${p.x}, ${p.y}) m lies outside the domain [0, ${width}] x [0, ${height}] m`,
      });
    }
  };

  scene.mediumRegions.forEach((r, i) => checkId(r.id, ["mediumRegions", i]));
  scene.geometry.solids.forEach((s, i) => checkId(s.id, ["geometry", "solids", i]));
  scene.geometry.walls.forEach((w, i) => checkId(w.id, ["geometry", "walls", i]));
  scene.geometry.surfaces.forEach((s, i) => checkId(s.id, ["geometry", "surfaces", i]));
  scene.sources.forEach((s, i) => {
    checkId(s.id, ["sources", i]);
    checkInside(s.position, ["sources", i, "position"], "source");
  });
  scene.receivers.forEach((r, i) => {
    checkId(r.id, ["receivers", i]);
    checkInside(r.position, ["receivers", i, "position"], "receiver");
  });
  scene.receiverLines.forEach((r, i) => {
    checkId(r.id, ["receiverLines", i]);
    checkInside(r.from, ["receiverLines", i, "from"], "receiver line start");
    checkInside(r.to, ["receiverLines", i, "to"], "receiver line end");
  });
  if (scene.duration.kind === "decay" && scene.sources.some((s) => s.signal.kind === "sine")) {
    ctx.addIssue({
      code: "custom",
      path: ["duration", "kind"],
      message: "a continuous sine never lets the energy decay: give the duration in seconds",
    });
  }
});

/** A valid current scene, every default filled in. */
export type Scene = z.output<typeof sceneSchema>;
/** What a person or the app may write: defaults may be left out. */
export type SceneInput = z.input<typeof sceneSchema>;
export type Point = z.output<typeof pointSchema>;
export type Medium = z.output<typeof mediumSchema>;
export type SurfaceTreatment = z.output<typeof surfaceTreatmentSchema>;
export type Resolution = z.output<typeof resolutionSchema>;
export type Solid = z.output<typeof solidSchema>;
export type Wall = z.output<typeof wallSchema>;
export type Surface = z.output<typeof surfaceSchema>;
export type MediumRegion = z.output<typeof mediumRegionSchema>;
export type Edge = z.output<typeof edgeSchema>;
export type EdgeSide = keyof z.output<typeof boundarySchema>;
export type Boundary = z.output<typeof boundarySchema>;
export type Signal = z.output<typeof signalSchema>;
export type Source = z.output<typeof sourceSchema>;
export type Receiver = z.output<typeof receiverSchema>;
export type ReceiverLine = z.output<typeof receiverLineSchema>;
export type Attenuation = z.output<typeof attenuationSchema>;
export type Duration = z.output<typeof durationSchema>;
export type SceneOutput = z.output<typeof outputSchema>;

/** One reason why an input is not a valid scene. */
export interface SceneProblem {
  /** JSON path in dotted form with indices, e.g. `sources[0].signal.peakFrequency`; empty for the root. */
  path: string;
  /** The same path as keys and indices. */
  pathSegments: (string | number)[];
  message: string;
}

export type ParseSceneResult = { ok: true; scene: Scene } | { ok: false; problems: SceneProblem[] };

/** Formats a path as `a.b[2].c`. */
export function formatJsonPath(segments: readonly PropertyKey[]): string {
  let out = "";
  for (const segment of segments) {
    if (typeof segment === "number") out += `[${segment}]`;
    else out += out === "" ? String(segment) : `.${String(segment)}`;
  }
  return out;
}

/** Zod's message, except for a missing field, which reads better as "required". */
function problemMessage(issue: z.core.$ZodIssue): string {
  if (issue.code === "invalid_type" && issue.input === undefined) return `required: expected ${issue.expected}`;
  return issue.message;
}

function problemsFromZod(error: z.ZodError): SceneProblem[] {
  return error.issues.map((issue) => {
    const segments = issue.path.map((s) => (typeof s === "symbol" ? String(s) : s));
    return { path: formatJsonPath(segments), pathSegments: segments, message: problemMessage(issue) };
  });
}

/**
 * Older scene versions and how to bring each up to the next one. Empty while version 1 is the only one:
 * when version 2 arrives, add `1: (v1) => v2` here and keep version-1 files readable.
 */
const migrations: Record<number, (old: Record<string, unknown>) => Record<string, unknown>> = {};

/**
 * The single way in for untrusted input: migrates older versions, validates, fills defaults.
 * Returns the valid current scene, or every problem with its JSON path.
 */
export function parseScene(input: unknown): ParseSceneResult {
  if (typeof input !== "object" || input === null || Array.isArray(input)) {
    return { ok: false, problems: [{ path: "", pathSegments: [], message: "a scene is a JSON object" }] };
  }
  let current = input as Record<string, unknown>;
  const version = current.version;
  if (version === undefined) {
    return { ok: false, problems: [{ path: "version", pathSegments: ["version"], message: `a scene needs "version": ${SCENE_VERSION}` }] };
  }
  if (typeof version !== "number" || !Number.isInteger(version) || version < 1 || version > SCENE_VERSION) {
    return {
      ok: false,
      problems: [
        {
          path: "version",
          pathSegments: ["version"],
          message: `unsupported scene version ${JSON.stringify(version)}; this solver reads versions 1 to ${SCENE_VERSION}`,
        },
      ],
    };
  }
  for (let v = version; v < SCENE_VERSION; v++) {
    const migrate = migrations[v];
    if (!migrate) {
      return { ok: false, problems: [{ path: "version", pathSegments: ["version"], message: `no migration from scene version ${v}` }] };
    }
    current = migrate(current);
  }
  const result = sceneSchema.safeParse(current);
  if (result.success) return { ok: true, scene: result.data };
  return { ok: false, problems: problemsFromZod(result.error) };
}

/** Like `parseScene` but throws one error listing every problem; for code that builds scenes itself. */
export function parseSceneOrThrow(input: unknown): Scene {
  const result = parseScene(input);
  if (result.ok) return result.scene;
  throw new Error(`invalid scene:\n${result.problems.map((p) => `  ${p.path || "(root)"}: ${p.message}`).join("\n")}`);
}

/** JSON Schema of what may be written (defaults optional), for the scene editor and users' scripts. */
export function sceneJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(sceneObjectSchema, { io: "input", unrepresentable: "any" }) as Record<string, unknown>;
}
