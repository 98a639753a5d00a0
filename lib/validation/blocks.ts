// Notebook blocks: what each kind holds, and the requests that add, edit and reorder them.
import { z } from "zod";

export const notesContentSchema = z.object({
  markdown: z.string().max(100_000, "A notes block can hold at most 100,000 characters."),
});
export const sceneContentSchema = z.object({ sceneId: z.string().uuid("Not a valid scene id.") });
export const runContentSchema = z.object({ runId: z.string().uuid("Not a valid run id.") });
export const chartContentSchema = z.object({
  runIds: z.array(z.string().uuid()).max(12, "A chart can compare at most 12 runs."),
  quantity: z.enum(["trace", "spectrum", "band-levels", "insertion-loss"]),
});

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
