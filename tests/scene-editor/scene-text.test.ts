import { describe, expect, it } from "vitest";

import { formatSceneJson, readSceneText, sameSceneData } from "@/components/scene-editor/model/scene-text";

import { barrierScene } from "./scene-fixtures";

describe("scene text for the code view", () => {
  it("formats a scene as JSON that reads back to the same data", () => {
    const scene = barrierScene();
    const text = formatSceneJson(scene);
    expect(JSON.parse(text)).toEqual(scene);
    expect(text.endsWith("}\n")).toBe(true);
  });

  it("keeps a point on one line and breaks what does not fit", () => {
    const text = formatSceneJson(barrierScene());
    expect(text).toContain('"position": { "x": 2, "y": 0.5 }');
    expect(text).toContain('"domain": { "width": 20, "height": 8 }');
    for (const line of text.split("\n")) expect(line.length).toBeLessThanOrEqual(88);
  });

  it("wraps a long sampled signal several numbers to a line", () => {
    const samples = Array.from({ length: 100 }, (_, k) => Math.round(1000 * Math.sin(k / 5)) / 1000);
    const text = formatSceneJson({ signal: { kind: "sampled", sampleRate: 8000, samples } });
    expect(JSON.parse(text).signal.samples).toEqual(samples);
    expect(text.split("\n").length).toBeGreaterThan(8);
    expect(text.split("\n").length).toBeLessThan(20);
  });

  it("tells apart broken JSON, an invalid scene and a valid one", () => {
    expect(readSceneText('{"version": 1,').kind).toBe("syntax");
    const invalid = readSceneText(JSON.stringify({ ...barrierScene(), sources: [] }));
    expect(invalid.kind).toBe("invalid");
    if (invalid.kind === "invalid") expect(invalid.problems[0]?.path).toBe("sources");
    const valid = readSceneText(formatSceneJson(barrierScene()));
    expect(valid.kind).toBe("valid");
  });

  it("compares scenes by their data, whatever the key order", () => {
    const scene = barrierScene();
    const reordered = Object.fromEntries(Object.entries(scene).reverse());
    expect(Object.keys(reordered)[0]).not.toBe(Object.keys(scene)[0]);
    expect(sameSceneData(scene, reordered)).toBe(true);
    expect(sameSceneData(scene, { ...scene, name: "other" })).toBe(false);
  });
});
