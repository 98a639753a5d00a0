// Notebook blocks: what each kind holds, and the requests that add, edit and reorder them.
import { z } from "zod";

export const notesContentSchema = z.object({
  markdown: z.string().max(100_000, "A notes block can hold at most 100,000 characters."),
});
export const sceneContentSchema = z.object({ sceneId: z.string().uuid("Not a valid scene id.") });
export const runContentSchema = z.object({ runId: z.string().uuid("Not a valid run id.") });
// A parameter sweep's result, kept in a chart block with the definition that produced it, so that
// anyone can read how it was made and run it again. Its cases were run in a browser and not saved as
// runs, so the block carries the numbers themselves (insertion loss rounded to 0.01 dB).

/** Most values and receivers a saved sweep may hold (a sweep runs at most 25 cases: lib/scene-variants/sweep.ts). */
export const MAX_SAVED_SWEEP_VALUES = 25;
export const MAX_SAVED_SWEEP_RECEIVERS = 12;
/** One-third-octave bands from 20 Hz to 20 kHz are 31. */
export const MAX_SAVED_SWEEP_BANDS = 31;

const finiteNumber = () => z.number().finite();
const elementId = z.string().min(1).max(64);

export const sweepParameterSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("wall-height"), wallId: elementId }).strict(),
  z.object({ kind: z.literal("wall-position"), wallId: elementId }).strict(),
  z.object({ kind: z.literal("wall-absorption"), wallId: elementId }).strict(),
  z.object({ kind: z.literal("receiver-height"), receiverId: elementId }).strict(),
  z.object({ kind: z.literal("source-height"), sourceId: elementId }).strict(),
]);

export const sweepReferenceSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("without"), removedIds: z.array(elementId).min(1, "Name at least one element the reference leaves out.").max(500) }).strict(),
  z.object({ kind: z.literal("free-field") }).strict(),
]);

export const sweepDefinitionSchema = z
  .object({
    sceneId: z.string().uuid("Not a valid scene id."),
    sceneVersion: z.number().int().min(1),
    sceneName: z.string().max(200),
    parameter: sweepParameterSchema,
    /** How the parameter was described when the sweep ran ("height of Timber barrier") and its unit. */
    parameterLabel: z.string().max(300),
    unit: z.string().max(20),
    range: z.object({ from: finiteNumber(), to: finiteNumber(), step: finiteNumber().positive("The step must be greater than zero.") }).strict(),
    reference: sweepReferenceSchema,
    bandsPerOctave: z.union([z.literal(1), z.literal(3)]),
    weighting: z.enum(["Z", "A"]),
    receiverIds: z.array(z.string().min(1).max(200)).min(1).max(MAX_SAVED_SWEEP_RECEIVERS),
  })
  .strict();

const bandSchema = z.object({ index: z.number().int(), nominal: finiteNumber().positive(), lower: finiteNumber().positive(), upper: finiteNumber().positive() }).strict();
/** null where a value could not be computed (a case that failed or was not run, a silent band). */
const decibels = finiteNumber().nullable();

export const sweepResultsSchema = z
  .object({
    values: z.array(finiteNumber()).min(1).max(MAX_SAVED_SWEEP_VALUES),
    /** Per value: finished, failed (with the reason) or not run (the sweep was cancelled first). */
    outcomes: z
      .array(z.object({ status: z.enum(["done", "failed", "not-run"]), message: z.string().max(2000).optional() }).strict())
      .max(MAX_SAVED_SWEEP_VALUES),
    receivers: z.array(z.object({ id: z.string().min(1).max(200), label: z.string().max(300) }).strict()).min(1).max(MAX_SAVED_SWEEP_RECEIVERS),
    bands: z.array(bandSchema).max(MAX_SAVED_SWEEP_BANDS),
    /** insertionLoss[value][receiver][band], dB. */
    insertionLoss: z.array(z.array(z.array(decibels).max(MAX_SAVED_SWEEP_BANDS)).max(MAX_SAVED_SWEEP_RECEIVERS)).max(MAX_SAVED_SWEEP_VALUES),
    /** overall[value][receiver]: difference of the overall (band-summed) levels, dB. */
    overall: z.array(z.array(decibels).max(MAX_SAVED_SWEEP_RECEIVERS)).max(MAX_SAVED_SWEEP_VALUES),
    /** Bands left out of the result and why (above the resolved frequency, narrower than the resolution). */
    excludedBands: z.array(z.string().max(300)).max(100).default([]),
    completedAt: z.string().datetime(),
  })
  .strict()
  .superRefine((results, ctx) => {
    const values = results.values.length;
    const receivers = results.receivers.length;
    const bands = results.bands.length;
    if (results.outcomes.length !== values) ctx.addIssue({ code: "custom", path: ["outcomes"], message: `Give one outcome per value (${values}).` });
    if (results.overall.length !== values || results.overall.some((row) => row.length !== receivers)) {
      ctx.addIssue({ code: "custom", path: ["overall"], message: `Give ${values} rows of ${receivers} overall values.` });
    }
    const shaped = results.insertionLoss.length === values && results.insertionLoss.every((row) => row.length === receivers && row.every((cells) => cells.length === bands));
    if (!shaped) ctx.addIssue({ code: "custom", path: ["insertionLoss"], message: `Give ${values} x ${receivers} x ${bands} insertion-loss values (value, receiver, band).` });
  });

export const sweepContentSchema = z
  .object({ definition: sweepDefinitionSchema, results: sweepResultsSchema })
  .strict()
  .superRefine((sweep, ctx) => {
    const ids = sweep.results.receivers.map((receiver) => receiver.id);
    if (ids.length !== sweep.definition.receiverIds.length || ids.some((id, k) => id !== sweep.definition.receiverIds[k])) {
      ctx.addIssue({ code: "custom", path: ["results", "receivers"], message: "The result's receivers must be those the definition names, in its order." });
    }
  });
export type SweepParameterInput = z.infer<typeof sweepParameterSchema>;
export type SweepReference = z.infer<typeof sweepReferenceSchema>;
export type SweepDefinition = z.infer<typeof sweepDefinitionSchema>;
export type SweepResults = z.output<typeof sweepResultsSchema>;
export type SweepContent = z.output<typeof sweepContentSchema>;

/** Most runs one chart compares, and most receivers it draws (the analysis draws at most 8 at once). */
export const MAX_CHART_RUNS = 12;
export const MAX_CHART_RECEIVERS = 12;

export const chartQuantitySchema = z.enum(["trace", "spectrum", "band-levels", "insertion-loss", "sweep"]);
export type ChartQuantity = z.infer<typeof chartQuantitySchema>;

/**
 * A chart compares saved runs (runIds) by a quantity, or, for "sweep", holds a sweep's definition and result.
 * The display options are the choices made in the run's analysis when the chart was added; all optional, so
 * charts stored before they existed stay valid. runIds[0] is the run analysed: for traces and spectra the
 * others are drawn over it, for insertion loss the second is the reference. runLabels keep how each run was
 * named then, so a chart can still say which run was deleted.
 */
export const chartContentSchema = z
  .object({
    runIds: z.array(z.string().uuid("Not a valid run id.")).max(MAX_CHART_RUNS, `A chart can compare at most ${MAX_CHART_RUNS} runs.`),
    quantity: chartQuantitySchema,
    sweep: sweepContentSchema.optional(),
    receiverIds: z
      .array(z.string().min(1, "A receiver id cannot be empty.").max(200))
      .min(1, "Name at least one receiver, or leave the list out.")
      .max(MAX_CHART_RECEIVERS, `A chart can draw at most ${MAX_CHART_RECEIVERS} receivers.`)
      .optional(),
    bandsPerOctave: z.union([z.literal(1), z.literal(3)], { error: "Bands per octave: 1 (octave) or 3 (one-third octave)." }).optional(),
    weighting: z.enum(["Z", "A"], { error: "Weighting: Z (none) or A." }).optional(),
    title: z.string().trim().min(1, "A title cannot be empty; leave it out instead.").max(200, "A chart title can hold at most 200 characters.").optional(),
    runLabels: z.array(z.string().max(300)).max(MAX_CHART_RUNS).optional(),
  })
  .superRefine((chart, ctx) => {
    if (chart.quantity === "sweep") {
      if (!chart.sweep) ctx.addIssue({ code: "custom", path: ["sweep"], message: "A sweep chart needs its definition and results." });
      // A sweep keeps its receivers, bands and weighting in its definition; a second copy could disagree.
      for (const key of ["receiverIds", "bandsPerOctave", "weighting", "runLabels"] as const) {
        if (chart[key] !== undefined) ctx.addIssue({ code: "custom", path: [key], message: "A sweep chart keeps its options in its definition." });
      }
      return;
    }
    if (chart.sweep) ctx.addIssue({ code: "custom", path: ["sweep"], message: "Only a sweep chart holds a sweep." });
    // Charts of no run were accepted before and may be stored (the notebook says they draw nothing), so only
    // an insertion loss that names runs must name both.
    if (chart.quantity === "insertion-loss" && chart.runIds.length > 0 && chart.runIds.length !== 2) {
      ctx.addIssue({ code: "custom", path: ["runIds"], message: "An insertion-loss chart names exactly two runs: the run, then its reference." });
    }
    if (new Set(chart.runIds).size !== chart.runIds.length) ctx.addIssue({ code: "custom", path: ["runIds"], message: "Name each run once." });
    if (chart.receiverIds && new Set(chart.receiverIds).size !== chart.receiverIds.length) ctx.addIssue({ code: "custom", path: ["receiverIds"], message: "Name each receiver once." });
    if (chart.runLabels && chart.runLabels.length !== chart.runIds.length) ctx.addIssue({ code: "custom", path: ["runLabels"], message: "Give one label per run, in the order of runIds." });
    const banded = chart.quantity === "band-levels" || chart.quantity === "insertion-loss";
    if (!banded) {
      for (const key of ["bandsPerOctave", "weighting"] as const) {
        if (chart[key] !== undefined) ctx.addIssue({ code: "custom", path: [key], message: "Bands and weighting apply to band-level and insertion-loss charts only." });
      }
    }
  });
export type ChartContent = z.output<typeof chartContentSchema>;

export const blockCreateSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("notes"), content: notesContentSchema, afterBlockId: z.string().uuid().nullable().default(null) }),
  z.object({ kind: z.literal("scene"), content: sceneContentSchema, afterBlockId: z.string().uuid().nullable().default(null) }),
  z.object({ kind: z.literal("run"), content: runContentSchema, afterBlockId: z.string().uuid().nullable().default(null) }),
  z.object({ kind: z.literal("chart"), content: chartContentSchema, afterBlockId: z.string().uuid().nullable().default(null) }),
]);
export type BlockCreateInput = z.infer<typeof blockCreateSchema>;

export const blockUpdateSchema = z
  .object({
    baseVersion: z.number().int().min(1),
    markdown: z.string().max(100_000, "A notes block can hold at most 100,000 characters.").optional(),
    collapsed: z.boolean().optional(),
  })
  .refine((value) => value.markdown !== undefined || value.collapsed !== undefined, { message: "Nothing to change.", path: ["markdown"] });
export type BlockUpdateInput = z.infer<typeof blockUpdateSchema>;

export const blockOrderSchema = z.object({
  blockIds: z.array(z.string().uuid()).min(1).max(500),
});
