// The body of a fork request, and the fork dialog's form (the same name rule, so both say the same
// thing). Every field of the request may be left out: the origin's study, "<origin> (fork)", the
// origin's current version.
import { z } from "zod";
import { idSchema } from "./ids";

/** Scene names have one limit everywhere (lib/validation/scene-save.ts). */
export const forkNameMaxLength = 120;

const forkNameSchema = z.string().trim().min(1, "Give the fork a name.").max(forkNameMaxLength, `A scene name can be at most ${forkNameMaxLength} characters.`);
const versionSchema = z.number({ error: "fromVersion is a version number of the scene." }).int("A version is a whole number.").min(1, "Versions start at 1.");

export const forkRequestSchema = z
  .object({
    targetStudyId: idSchema.optional(),
    name: forkNameSchema.optional(),
    fromVersion: versionSchema.optional(),
  })
  .strict()
  .default({});
export type ForkRequest = z.infer<typeof forkRequestSchema>;

/** The dialog always sends all three. */
export const forkFormSchema = z.object({
  targetStudyId: idSchema,
  name: forkNameSchema,
  fromVersion: z.coerce.number<string>().pipe(versionSchema),
});

/** The name a fork gets unless the caller gives one. */
export function defaultForkName(originName: string): string {
  const suffix = " (fork)";
  return `${originName.slice(0, forkNameMaxLength - suffix.length)}${suffix}`;
}
