// What the server tells open pages when something changes: either an activity (the same record as
// the feed: a run saved, a comment written, a review decided, ...) or a change of who has a study
// open. Small on purpose: PostgreSQL NOTIFY payloads are limited to 8000 bytes, and pages refetch
// what they show rather than trusting a pushed copy.
import { z } from "zod";

export const liveEventChannel = "rarefact_live";

export const liveEventSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("activity"),
    id: z.string(),
    teamId: z.string(),
    studyId: z.string().nullable(),
    actorId: z.string().nullable(),
    /** Past-tense verb, as in the activity table: "run.saved", "comment.added", "run.signed_off". */
    action: z.string(),
    subjectType: z.string(),
    subjectId: z.string(),
    /** The run a comment or review belongs to, so a run page can tell whether it is concerned. */
    runId: z.string().nullable().optional(),
    at: z.string(),
  }),
  z.object({
    kind: z.literal("presence"),
    teamId: z.string(),
    studyId: z.string(),
    at: z.string(),
  }),
  /** A server-side run changed state or progressed (progress at most every ~2 s per job). */
  z.object({
    kind: z.literal("job"),
    teamId: z.string(),
    studyId: z.string(),
    jobId: z.string(),
    sweepId: z.string().nullable(),
    state: z.enum(["queued", "running", "completed", "failed", "cancelled"]),
    at: z.string(),
  }),
]);
export type LiveEvent = z.infer<typeof liveEventSchema>;
export type ActivityLiveEvent = Extract<LiveEvent, { kind: "activity" }>;
export type JobLiveEvent = Extract<LiveEvent, { kind: "job" }>;

/** Parses a NOTIFY payload; anything malformed is dropped rather than sent to pages. */
export function parseLiveEvent(payload: string): LiveEvent | null {
  try {
    const parsed = liveEventSchema.safeParse(JSON.parse(payload));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}
