// One text for one value: object keys sorted, numbers normalised, nothing optional left to the
// serialiser. Two equal inputs written in any key order give the same text, hence the same hash.

/** Thrown for values that have no JSON form (NaN, Infinity, functions, typed arrays, ...). */
export class CanonicalJsonError extends TypeError {
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(path ? `${path}: ${message}` : message);
    this.name = "CanonicalJsonError";
  }
}

/**
 * Numbers: -0 becomes 0 (they compare equal, so they must hash equal); integers and fractions are
 * written by JavaScript's shortest round-trip form, which is the same on every engine (ECMA-262
 * Number::toString). 1, 1.0 and 1e0 are one double and so one text.
 */
function canonicalNumber(value: number, path: string): string {
  if (!Number.isFinite(value)) throw new CanonicalJsonError(`${value} has no JSON form`, path);
  return Object.is(value, -0) ? "0" : String(value);
}

function write(value: unknown, path: string, out: string[]): void {
  if (value === null) {
    out.push("null");
    return;
  }
  switch (typeof value) {
    case "boolean":
      out.push(value ? "true" : "false");
      return;
    case "number":
      out.push(canonicalNumber(value, path));
      return;
    case "string":
      out.push(JSON.stringify(value));
      return;
    case "object":
      break;
    default:
      throw new CanonicalJsonError(`a ${typeof value} has no JSON form`, path);
  }
  if (Array.isArray(value)) {
    out.push("[");
    value.forEach((item, index) => {
      if (index > 0) out.push(",");
      // JSON.stringify writes null for holes and undefined items; so do we.
      write(item === undefined ? null : item, `${path}[${index}]`, out);
    });
    out.push("]");
    return;
  }
  const prototype = Object.getPrototypeOf(value) as unknown;
  if (prototype !== Object.prototype && prototype !== null) throw new CanonicalJsonError("only plain objects and arrays have a canonical form", path);
  // Keys in UTF-16 code unit order (the default sort): no locale can change it.
  const keys = Object.keys(value)
    .filter((key) => (value as Record<string, unknown>)[key] !== undefined)
    .sort();
  out.push("{");
  keys.forEach((key, index) => {
    if (index > 0) out.push(",");
    out.push(JSON.stringify(key), ":");
    write((value as Record<string, unknown>)[key], path ? `${path}.${key}` : key, out);
  });
  out.push("}");
}

/** The canonical JSON text of a plain JSON value; throws CanonicalJsonError naming the path of anything else. */
export function canonicalJson(value: unknown): string {
  const out: string[] = [];
  write(value, "", out);
  return out.join("");
}
