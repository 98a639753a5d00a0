// Requests that create or save a scene. The scene JSON itself is checked by parseScene and the
// server's limits (lib/validation/scene-limits.ts), which name the failing path under "data".
import { z } from "zod";

const sceneName = z.string().trim().min(1, "Give the scene a name.").max(120, "A scene name can be at most 120 characters.");
const sceneDescription = z.string().trim().max(2000, "A description can be at most 2000 characters.").default("");

export const sceneSaveSchema = z.object({
  baseVersion: z.number({ error: "baseVersion is the version you edited." }).int().min(1),
  name: sceneName,
  description: sceneDescription,
  data: z.unknown(),
  note: z.string().trim().max(200, "A change note can be at most 200 characters.").default(""),
});
export type SceneSaveInput = z.infer<typeof sceneSaveSchema>;

export const sceneCreateSchema = z
  .object({
    name: sceneName,
    description: sceneDescription,
    isReference: z.boolean().default(false),
    templateId: z.string().max(64).optional(),
    data: z.unknown().optional(),
  })
  .refine((value) => (value.templateId === undefined) !== (value.data === undefined), {
    message: "Give either a templateId or the scene data, not both.",
    path: ["templateId"],
  });
export type SceneCreateInput = z.infer<typeof sceneCreateSchema>;
