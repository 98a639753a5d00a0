import { z } from "zod";
import { idSchema } from "./ids";

/** A page of a feed: `before` is the last entry already shown (the answer's `nextBefore`). */
export const feedPageQuerySchema = z.object({
  before: idSchema.optional(),
  limit: z.coerce.number().int("Must be a whole number.").min(1, "At least 1.").max(100, "At most 100.").default(30),
});

export function searchParamsObject(url: string): Record<string, string> {
  return Object.fromEntries(new URL(url).searchParams.entries());
}
