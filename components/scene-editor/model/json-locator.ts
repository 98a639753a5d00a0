// Finds where a JSON path (["sources", 0, "position"]) sits in JSON text, so that a problem found on
// the parsed value can be marked on the line that holds it. A small parser that keeps offsets; it
// accepts exactly JSON (RFC 8259) and gives up (null) on anything else.

export interface JsonRange {
  /** Offsets into the text, end exclusive. */
  start: number;
  end: number;
}

type JsonNode =
  | ({ type: "object"; properties: JsonProperty[] } & JsonRange)
  | ({ type: "array"; items: JsonNode[] } & JsonRange)
  | ({ type: "value" } & JsonRange);

interface JsonProperty {
  key: string;
  keyRange: JsonRange;
  value: JsonNode;
}

class JsonSyntaxError extends Error {}

/** Parses `text` into a tree of ranges; null when it is not JSON. */
export function parseJsonRanges(text: string): JsonNode | null {
  let at = 0;
  const fail = (): never => {
    throw new JsonSyntaxError(`unexpected input at ${at}`);
  };
  const skipSpace = () => {
    while (at < text.length) {
      const c = text.charCodeAt(at);
      // space, tab, line feed, carriage return
      if (c === 32 || c === 9 || c === 10 || c === 13) at++;
      else break;
    }
  };
  const readString = (): string => {
    if (text[at] !== '"') fail();
    const start = at;
    at++;
    while (at < text.length) {
      const c = text[at]!;
      if (c === "\\") at += 2;
      else if (c === '"') {
        at++;
        return JSON.parse(text.slice(start, at)) as string;
      } else if (c < " ") fail();
      else at++;
    }
    return fail();
  };
  const literal = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?|true|false|null/y;
  const readValue = (): JsonNode => {
    skipSpace();
    const start = at;
    const c = text[at];
    if (c === "{") {
      at++;
      const properties: JsonProperty[] = [];
      skipSpace();
      if (text[at] === "}") {
        at++;
        return { type: "object", properties, start, end: at };
      }
      for (;;) {
        skipSpace();
        const keyStart = at;
        const key = readString();
        const keyRange = { start: keyStart, end: at };
        skipSpace();
        if (text[at] !== ":") fail();
        at++;
        const value = readValue();
        properties.push({ key, keyRange, value });
        skipSpace();
        if (text[at] === ",") {
          at++;
          continue;
        }
        if (text[at] === "}") {
          at++;
          return { type: "object", properties, start, end: at };
        }
        fail();
      }
    }
    if (c === "[") {
      at++;
      const items: JsonNode[] = [];
      skipSpace();
      if (text[at] === "]") {
        at++;
        return { type: "array", items, start, end: at };
      }
      for (;;) {
        items.push(readValue());
        skipSpace();
        if (text[at] === ",") {
          at++;
          continue;
        }
        if (text[at] === "]") {
          at++;
          return { type: "array", items, start, end: at };
        }
        fail();
      }
    }
    if (c === '"') {
      readString();
      return { type: "value", start, end: at };
    }
    literal.lastIndex = at;
    const match = literal.exec(text);
    if (!match) fail();
    at += match![0].length;
    return { type: "value", start, end: at };
  };
  try {
    const root = readValue();
    skipSpace();
    if (at !== text.length) fail();
    return root;
  } catch (error) {
    if (error instanceof JsonSyntaxError || error instanceof SyntaxError) return null;
    throw error;
  }
}

export interface LocatedPath extends JsonRange {
  /** True when the whole path exists; false when the range is that of the deepest part that does. */
  exact: boolean;
}

/**
 * The range of the value at `path` in `text`. When the path ends in a missing property (a required
 * field left out), the range is that of the property holding the object it belongs in, or of the object
 * itself at the root, so a marker lands where the field should be added. Null when the text is not JSON.
 */
export function locateJsonPath(text: string, path: readonly (string | number)[]): LocatedPath | null {
  const root = parseJsonRanges(text);
  if (!root) return null;
  let node: JsonNode = root;
  // The key of the property whose value `node` is: a tighter place for a marker than a whole object.
  let keyRange: JsonRange | null = null;
  for (const segment of path) {
    let next: JsonNode | undefined;
    let nextKey: JsonRange | null = null;
    if (node.type === "object") {
      const property: JsonProperty | undefined = node.properties.filter((p) => p.key === String(segment)).pop();
      if (property) {
        next = property.value;
        nextKey = property.keyRange;
      }
    } else if (node.type === "array" && typeof segment === "number") {
      next = node.items[segment];
    }
    if (!next) {
      const range = keyRange ?? { start: node.start, end: Math.min(node.end, node.start + 1) };
      return { ...range, exact: false };
    }
    node = next;
    keyRange = nextKey;
  }
  // A scalar is marked whole; an object or array by its key (when it has one) to keep the squiggle short.
  if (node.type !== "value" && keyRange) return { start: keyRange.start, end: keyRange.end, exact: true };
  return { start: node.start, end: node.end, exact: true };
}

/** 1-based line and column of an offset, as editors count them. */
export function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  const end = Math.min(offset, text.length);
  for (let k = 0; k < end; k++) {
    if (text.charCodeAt(k) === 10) {
      line++;
      lineStart = k + 1;
    }
  }
  return { line, column: end - lineStart + 1 };
}
