// The scene as text for the code view, and back: a compact, readable JSON layout (a point on one
// line, not four), and reading text into a scene or a list of problems with their JSON paths.
import { parseScene, type Scene, type SceneProblem } from "@/lib/fdtd/scene";

/** Objects and arrays whose one-line form fits in this many columns (indent included) stay on one line. */
const LINE_WIDTH = 88;
/** Numbers per line of a long numeric array (a sampled signal). */
const NUMBERS_PER_LINE = 12;

function isScalar(value: unknown): boolean {
  return value === null || typeof value !== "object";
}

/** One-line JSON with a space after each colon and comma: `{ "x": 1, "y": 2 }`. */
function inline(value: unknown): string {
  if (isScalar(value)) return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return value.length === 0 ? "[]" : `[${value.map(inline).join(", ")}]`;
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
  if (entries.length === 0) return "{}";
  return `{ ${entries.map(([k, v]) => `${JSON.stringify(k)}: ${inline(v)}`).join(", ")} }`;
}

function layout(value: unknown, indent: string, prefixLength: number): string {
  const oneLine = inline(value);
  if (isScalar(value) || indent.length + prefixLength + oneLine.length <= LINE_WIDTH) return oneLine;
  const inner = `${indent}  `;
  if (Array.isArray(value)) {
    if (value.every((v) => typeof v === "number")) {
      const rows: string[] = [];
      for (let k = 0; k < value.length; k += NUMBERS_PER_LINE) rows.push(inner + value.slice(k, k + NUMBERS_PER_LINE).map((v) => JSON.stringify(v)).join(", "));
      return `[\n${rows.join(",\n")}\n${indent}]`;
    }
    return `[\n${value.map((v) => inner + layout(v, inner, 0)).join(",\n")}\n${indent}]`;
  }
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
  const lines = entries.map(([k, v]) => {
    const key = `${JSON.stringify(k)}: `;
    return inner + key + layout(v, inner, key.length);
  });
  return `{\n${lines.join(",\n")}\n${indent}}`;
}

/** The text the code view shows for a scene; ends with a newline. */
export function formatSceneJson(scene: unknown): string {
  return `${layout(scene, "", 0)}\n`;
}

/** JSON with object keys sorted, so that two scenes compare equal whatever their key order. */
function canonical(value: unknown): string {
  if (isScalar(value)) return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(",")}}`;
}

/** Whether two scenes hold the same data (key order and layout aside). */
export function sameSceneData(a: unknown, b: unknown): boolean {
  return a === b || canonical(a) === canonical(b);
}

export type SceneTextReading =
  /** Not JSON at all: the code view's own diagnostics say where. */
  | { kind: "syntax"; message: string }
  /** JSON, but not a valid scene. */
  | { kind: "invalid"; problems: SceneProblem[] }
  | { kind: "valid"; scene: Scene };

/** Reads the code view's text: JSON first, then the scene schema with its cross-field checks. */
export function readSceneText(text: string): SceneTextReading {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    return { kind: "syntax", message: error instanceof Error ? error.message : String(error) };
  }
  const parsed = parseScene(value);
  return parsed.ok ? { kind: "valid", scene: parsed.scene } : { kind: "invalid", problems: parsed.problems };
}
