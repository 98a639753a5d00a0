// Requests about a scene's saved versions: the version number in the path, and the body of a restore.
import { z } from "zod";

export const versionNumberSchema = z.coerce.number().int("A version is a whole number.").min(1, "Versions start at 1.");

export const sceneRestoreSchema = z.object({
  /** The latest version the caller has seen: a restore over a newer one answers 409, like a save. */
  baseVersion: z.number({ error: "baseVersion is the latest version you have seen." }).int().min(1),
});
export type SceneRestoreInput = z.infer<typeof sceneRestoreSchema>;
