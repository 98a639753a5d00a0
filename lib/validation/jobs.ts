// Requests that send work to the server's run queue.
import { z } from "zod";
import { runSettingsSchema } from "@/lib/run-record/settings";
import { sweepDefinitionSchema } from "./blocks";

export const queueRunSchema = z
  .object({
    /** The saved version to run; the scene's latest when left out. */
    sceneVersion: z.number().int("A version is a whole number.").min(1, "Versions start at 1.").optional(),
    settings: runSettingsSchema.optional(),
  })
  .strict();
export type QueueRunRequest = z.infer<typeof queueRunSchema>;

export const queueSweepSchema = z.object({ definition: sweepDefinitionSchema }).strict();
export type QueueSweepRequest = z.infer<typeof queueSweepSchema>;

export const jobListQuerySchema = z.object({
  /** Finished jobs older than this many days are left out of the study's queue view. */
  days: z.coerce.number().int().min(1).max(365).default(14),
});
