import { describe, expect, it } from "vitest";
import { parseScene } from "@/lib/fdtd/scene";
import { sceneTemplates } from "@/lib/scene-templates";
import { checkSceneWithinLimits } from "@/lib/validation/scene-limits";

describe("scene templates", () => {
  for (const template of sceneTemplates) {
    it(`"${template.title}" is a valid scene within the server's limits`, () => {
      const parsed = parseScene(template.scene);
      expect(parsed.ok ? [] : parsed.problems).toEqual([]);
      expect(checkSceneWithinLimits(template.scene).ok).toBe(true);
    });
  }

  it("refuses a scene whose grid is larger than the limit, naming the resolution", () => {
    const huge = { ...sceneTemplates[0]!.scene, resolution: { kind: "frequency", maxFrequency: 20000, pointsPerWavelength: 20 } };
    const check = checkSceneWithinLimits(huge);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.issues.map((issue) => issue.path)).toContain("data.resolution");
  });
});
