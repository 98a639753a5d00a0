// What a read-only link needs to be made, and what a link's secret looks like. Shared by the owner's
// form (message beside the field) and the route handlers.
import { z } from "zod";

export const shareLinkCreateSchema = z.object({
  label: z
    .string({ error: "Label is required." })
    .trim()
    .min(1, "Give the link a label, e.g. who it is for.")
    .max(80, "A label can be at most 80 characters."),
});
export type ShareLinkCreateInput = z.infer<typeof shareLinkCreateSchema>;

/** A link's secret: 32 random bytes in base64url without padding, always 43 characters. */
export const shareTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "Not a valid link.");
