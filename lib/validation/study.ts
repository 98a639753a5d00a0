// What a study needs to be created or edited. Shared by the form (messages beside the fields)
// and the route handler (400 naming the field), so both say the same thing.
import { z } from "zod";

export const studyInputSchema = z.object({
  title: z
    .string({ error: "Title is required." })
    .trim()
    .min(3, "Title needs at least 3 characters.")
    .max(120, "Title can be at most 120 characters."),
  description: z.string().trim().max(2000, "Description can be at most 2000 characters.").default(""),
  siteReference: z
    .string()
    .trim()
    .max(60, "Site or project reference can be at most 60 characters.")
    .regex(/^[\p{L}\p{N} ._\/#()-]*$/u, "Use letters, digits, spaces and . _ / # ( ) - only.")
    .default(""),
});
export type StudyInput = z.infer<typeof studyInputSchema>;
