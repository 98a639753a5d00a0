// Comments on saved runs: the request bodies, and the pin that ties a comment to a place and time in
// the run. The shape of a pin is checked here; whether it lies inside this run's domain and duration
// is checked against the run's frozen scene by `pinProblems`, on the server.
import { z } from "zod";
import { receiverSpecs } from "@/lib/fdtd/receivers";
import type { Scene } from "@/lib/fdtd/scene";
import type { FieldIssue } from "@/lib/http/app-error";

export const MAX_COMMENT_LENGTH = 10_000;

const metres = (what: string) => z.number({ message: `${what} must be a number of metres.` }).finite(`${what} must be a finite number of metres.`);
const seconds = z.number({ message: "t must be a number of seconds." }).finite("t must be a finite number of seconds.").min(0, "t cannot be before the start of the run.");

export const fieldPinSchema = z
  .object({
    kind: z.literal("field"),
    /** m from the left edge of the domain. */
    x: metres("x"),
    /** m from the bottom edge of the domain. */
    y: metres("y"),
    /** s from the start of the run. */
    t: seconds,
  })
  .strict();

export const tracePinSchema = z
  .object({
    kind: z.literal("trace"),
    receiverId: z.string().min(1, "Name the receiver.").max(200),
    /** s from the start of the run. */
    t: seconds,
    /** Sound pressure at that time, Pa (as read off the chart). */
    value: z.number().finite("value must be a finite number of pascals.").optional(),
  })
  .strict();

export const commentPinSchema = z.discriminatedUnion("kind", [fieldPinSchema, tracePinSchema], { message: 'A pin is either { kind: "field", x, y, t } or { kind: "trace", receiverId, t }.' });
export type CommentPin = z.output<typeof commentPinSchema>;
export type FieldPin = z.output<typeof fieldPinSchema>;
export type TracePin = z.output<typeof tracePinSchema>;

export const commentBodySchema = z
  .string({ message: "Write a comment." })
  .refine((text) => text.trim().length > 0, "Write a comment.")
  .refine((text) => text.length <= MAX_COMMENT_LENGTH, `A comment can hold at most ${MAX_COMMENT_LENGTH.toLocaleString("en-GB")} characters.`);

export const newCommentSchema = z
  .object({
    body: commentBodySchema,
    /** The thread's first comment, for a reply. */
    parentId: z.string().uuid("Not a valid comment id.").nullish(),
    pin: commentPinSchema.nullish(),
  })
  .strict();
export type NewCommentInput = z.input<typeof newCommentSchema>;

export const commentEditSchema = z.object({ body: commentBodySchema }).strict();

export const commentResolutionSchema = z.object({ resolved: z.boolean({ message: "resolved must be true or false." }) }).strict();

/** What a pin is checked against: the run's domain (m), how long it ran (s) and its receivers' ids. */
export interface RunPinFrame {
  width: number;
  height: number;
  simulatedSeconds: number;
  receiverIds: ReadonlySet<string>;
}

/** The frame of a run from its frozen scene and the time it ran (unbounded when the run kept no summary). */
export function runPinFrame(scene: Scene, simulatedSeconds: number | null): RunPinFrame {
  return {
    width: scene.domain.width,
    height: scene.domain.height,
    simulatedSeconds: simulatedSeconds ?? Number.POSITIVE_INFINITY,
    receiverIds: new Set(receiverSpecs(scene).map((receiver) => receiver.id)),
  };
}

/** Half a nanosecond of slack: a time read off the last snapshot may round just past the end. */
const TIME_SLACK = 5e-10;

/** Where a pin falls outside its run, as issues naming the field ("pin.x"); empty when it fits. */
export function pinProblems(pin: CommentPin, frame: RunPinFrame): FieldIssue[] {
  const issues: FieldIssue[] = [];
  if (pin.t > frame.simulatedSeconds + TIME_SLACK) {
    issues.push({ path: "pin.t", message: `t = ${formatMs(pin.t)} is after the end of the run (${formatMs(frame.simulatedSeconds)}).` });
  }
  if (pin.kind === "field") {
    if (pin.x < 0 || pin.x > frame.width) issues.push({ path: "pin.x", message: `x = ${pin.x} m lies outside the domain (0 to ${frame.width} m).` });
    if (pin.y < 0 || pin.y > frame.height) issues.push({ path: "pin.y", message: `y = ${pin.y} m lies outside the domain (0 to ${frame.height} m).` });
  } else if (!frame.receiverIds.has(pin.receiverId)) {
    issues.push({ path: "pin.receiverId", message: `This run has no receiver "${pin.receiverId}".` });
  }
  return issues;
}

function formatMs(seconds: number): string {
  return `${Number((seconds * 1000).toPrecision(4))} ms`;
}
