// What a saved verification record holds and what attaching one to a run needs. Shared by the page (it
// thins its outcomes to fit before posting) and the route handlers, which refuse anything larger.
import { z } from "zod";
import { idSchema } from "./ids";

/** Most points a saved curve series keeps; enough to see a waveform or a spectrum's peaks on screen and paper. */
export const MAX_SAVED_SERIES_POINTS = 400;
export const MAX_SAVED_CASES = 32;
export const MAX_SAVED_CHECKS_PER_CASE = 200;
export const MAX_SAVED_CURVES_PER_CASE = 12;
export const MAX_SAVED_SERIES_PER_CURVE = 16;
/** The largest request body a record may arrive in; seven cases thinned to MAX_SAVED_SERIES_POINTS take about 250 KiB. */
export const VERIFICATION_BODY_LIMIT_BYTES = 1024 * 1024;

/** A figure; NaN and infinities (a check that could not be measured) travel in JSON as null. */
const figure = z.number().nullable();
const shortText = (max: number) => z.string().max(max, `At most ${max} characters.`);

export const savedCheckSchema = z.object({
  label: z.string().min(1, "A check needs a label.").max(300, "At most 300 characters."),
  measured: figure,
  expected: figure,
  error: figure,
  tolerance: figure,
  unit: shortText(40),
  errorUnit: shortText(40),
  pass: z.boolean(),
});

export const savedSeriesSchema = z
  .object({
    name: shortText(120),
    kind: z.enum(["simulated", "exact"]),
    x: z.array(figure).max(MAX_SAVED_SERIES_POINTS, `At most ${MAX_SAVED_SERIES_POINTS} points per series.`),
    y: z.array(figure).max(MAX_SAVED_SERIES_POINTS, `At most ${MAX_SAVED_SERIES_POINTS} points per series.`),
    style: z.enum(["line", "points"]).optional(),
  })
  .refine((series) => series.x.length === series.y.length, { message: "x and y must have the same length.", path: ["y"] });

export const savedCurveSchema = z.object({
  title: shortText(200),
  xLabel: shortText(120),
  yLabel: shortText(120),
  series: z.array(savedSeriesSchema).max(MAX_SAVED_SERIES_PER_CURVE, `At most ${MAX_SAVED_SERIES_PER_CURVE} series per curve.`),
});

export const savedCaseOutcomeSchema = z.object({
  caseId: z.string().regex(/^[a-z0-9][a-z0-9-]{0,59}$/, "Not a verification case id."),
  title: z.string().min(1, "A case needs a title.").max(200, "At most 200 characters."),
  pass: z.boolean(),
  seconds: z.number().min(0, "Not a duration.").max(86_400, "Not a duration."),
  checks: z.array(savedCheckSchema).max(MAX_SAVED_CHECKS_PER_CASE, `At most ${MAX_SAVED_CHECKS_PER_CASE} checks per case.`),
  curves: z.array(savedCurveSchema).max(MAX_SAVED_CURVES_PER_CASE, `At most ${MAX_SAVED_CURVES_PER_CASE} curves per case.`),
});

export const verificationRecordInputSchema = z.object({
  solverVersion: z.string().trim().min(1, "The solver version is required.").max(200, "At most 200 characters."),
  browser: z.string().trim().min(1, "The browser is required.").max(500, "At most 500 characters."),
  kernel: z.string().trim().min(1, "The kernel is required.").max(80, "At most 80 characters."),
  outcomes: z
    .array(savedCaseOutcomeSchema)
    .min(1, "Run at least one case before saving.")
    .max(MAX_SAVED_CASES, `At most ${MAX_SAVED_CASES} cases.`)
    .refine((outcomes) => new Set(outcomes.map((o) => o.caseId)).size === outcomes.length, "Each case may appear once."),
});
export type VerificationRecordInput = z.infer<typeof verificationRecordInputSchema>;
export type SavedCaseOutcome = z.infer<typeof savedCaseOutcomeSchema>;
export type SavedCheck = z.infer<typeof savedCheckSchema>;
export type SavedCurve = z.infer<typeof savedCurveSchema>;
export type SavedSeries = z.infer<typeof savedSeriesSchema>;

export const runEvidenceAttachSchema = z.object({
  verificationId: idSchema,
});
export type RunEvidenceAttachInput = z.infer<typeof runEvidenceAttachSchema>;
