import { describe, expect, it } from "vitest";

import { lineAndColumn, locateJsonPath, parseJsonRanges } from "@/components/scene-editor/model/json-locator";
import { formatSceneJson } from "@/components/scene-editor/model/scene-text";
import { parseScene } from "@/lib/fdtd/scene";

import { barrierScene } from "./scene-fixtures";

function textAt(text: string, range: { start: number; end: number } | null): string {
  if (!range) throw new Error("not located");
  return text.slice(range.start, range.end);
}

describe("locating a JSON path in text", () => {
  const text = '{\n  "a": { "b": [10, {"c": "x}]\\"y"}, 30] },\n  "d": true\n}';

  it("finds scalars, array items and nested values, strings with escapes and brackets included", () => {
    expect(textAt(text, locateJsonPath(text, ["a", "b", 0]))).toBe("10");
    expect(textAt(text, locateJsonPath(text, ["a", "b", 1, "c"]))).toBe('"x}]\\"y"');
    expect(textAt(text, locateJsonPath(text, ["a", "b", 2]))).toBe("30");
    expect(textAt(text, locateJsonPath(text, ["d"]))).toBe("true");
  });

  it("marks an object or array by its key rather than its whole body", () => {
    expect(textAt(text, locateJsonPath(text, ["a", "b"]))).toBe('"b"');
    expect(locateJsonPath(text, ["a"])).toMatchObject({ exact: true });
  });

  it("points a missing field at the key of the object it belongs in", () => {
    const located = locateJsonPath(text, ["a", "missing"]);
    expect(located?.exact).toBe(false);
    expect(textAt(text, located)).toBe('"a"');
    expect(textAt(text, locateJsonPath(text, ["nothing", "here"]))).toBe("{");
  });

  it("gives up on text that is not JSON", () => {
    expect(parseJsonRanges('{"a": 1,}')).toBeNull();
    expect(parseJsonRanges("{'a': 1}")).toBeNull();
    expect(parseJsonRanges('{"a": 01}')).toBeNull();
    expect(parseJsonRanges('{"a": 1} x')).toBeNull();
    expect(locateJsonPath("[1, 2", [0])).toBeNull();
  });

  it("accepts everything JSON.parse accepts in a formatted scene", () => {
    const formatted = formatSceneJson(barrierScene());
    expect(parseJsonRanges(formatted)).not.toBeNull();
  });

  it("puts a parseScene problem on the line of the offending field", () => {
    const scene = barrierScene();
    const broken = { ...scene, receivers: [{ ...scene.receivers[0]!, position: { x: 25, y: 1.5 } }] };
    const formatted = formatSceneJson(broken);
    const parsed = parseScene(JSON.parse(formatted));
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    const problem = parsed.problems[0]!;
    expect(problem.path).toBe("receivers[0].position");
    const located = locateJsonPath(formatted, problem.pathSegments);
    const { line } = lineAndColumn(formatted, located!.start);
    expect(formatted.split("\n")[line - 1]).toContain('"position": { "x": 25, "y": 1.5 }');
  });

  it("counts lines and columns from 1", () => {
    expect(lineAndColumn("ab\ncd", 0)).toEqual({ line: 1, column: 1 });
    expect(lineAndColumn("ab\ncd", 4)).toEqual({ line: 2, column: 2 });
  });
});
