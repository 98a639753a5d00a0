import { describe, expect, it } from "vitest";

import { importCsv, MAX_CSV_ROWS } from "@/lib/scene-import/csv";

import { fixtureText } from "./fixture-files";

/** The domain of the scene-editor test scene (tests/scene-editor/scene-fixtures.ts). */
const DOMAIN = { width: 20, height: 8 };

function messageOf(result: { ok: true } | { ok: false; message: string }): string {
  if (result.ok) throw new Error("expected a refusal");
  return result.message;
}

describe("coordinate tables that import", () => {
  it("reads a comma-separated barrier path with a header", () => {
    const table = importCsv(fixtureText("barrier-path.csv"), "wall", DOMAIN);
    expect(table).toEqual({ ok: true, target: "wall", rows: 3, path: [{ x: 2, y: 0 }, { x: 2, y: 3.5 }, { x: 6.25, y: 3.5 }] });
  });

  it("reads semicolon-separated receivers with names, skipping blank rows and keeping a quoted comma", () => {
    const table = importCsv(fixtureText("receivers-semicolon.csv"), "receivers", DOMAIN);
    expect(table).toEqual({
      ok: true,
      target: "receivers",
      rows: 3,
      receivers: [
        { position: { x: 15, y: 1.5 }, name: "Garden north" },
        { position: { x: 16.5, y: 1.5 }, name: "Garden south" },
        { position: { x: 18, y: 4 }, name: "Window, first floor" },
      ],
    });
  });

  it("reads a table without a header as x, y and drops the repeated first corner of an outline", () => {
    const table = importCsv(fixtureText("outline-no-header.csv"), "solid", DOMAIN);
    expect(table).toEqual({ ok: true, target: "solid", rows: 5, polygon: [{ x: 4, y: 1 }, { x: 7, y: 1 }, { x: 7, y: 2.5 }, { x: 4, y: 2.5 }] });
  });

  it("finds the columns by their header names in any order, units in brackets allowed", () => {
    const table = importCsv("label,y (m),x (m)\nA,1,2\nB,3,4\n", "receivers", DOMAIN);
    expect(table).toEqual({ ok: true, target: "receivers", rows: 2, receivers: [{ position: { x: 2, y: 1 }, name: "A" }, { position: { x: 4, y: 3 }, name: "B" }] });
  });

  it("reads tab-separated values and numbers in exponent form", () => {
    expect(importCsv("1.5e0\t2\n3\t4E-1\n", "wall", DOMAIN)).toEqual({ ok: true, target: "wall", rows: 2, path: [{ x: 1.5, y: 2 }, { x: 3, y: 0.4 }] });
  });

  it("gives receivers without a name column no name", () => {
    const table = importCsv(fixtureText("barrier-path.csv"), "receivers", DOMAIN);
    expect(table.ok && table.target === "receivers" && table.receivers.map((r) => r.name)).toEqual([null, null, null]);
  });
});

describe("refusing tables, naming the row and column", () => {
  it("names the row and column of a value that is not a number", () => {
    expect(messageOf(importCsv(fixtureText("bad-number.csv"), "wall", DOMAIN))).toBe("Row 3, column 2 (“y”): “abc” is not a number.");
  });

  it("asks for a decimal point when a value has a decimal comma", () => {
    expect(messageOf(importCsv(fixtureText("decimal-comma.csv"), "wall", DOMAIN))).toBe("Row 2, column 1 (“x”): “1,5” is not a number (use a decimal point, not a comma).");
  });

  it("says which columns a header has when none is x or y", () => {
    expect(messageOf(importCsv(fixtureText("unnamed-columns.csv"), "wall", DOMAIN))).toBe(
      "Row 1 is a header without an x column (found “east”, “north”). Name the columns x and y, or leave the header out and put x and y first.",
    );
  });

  it("names a missing value, and hints at the separator when a row has one value", () => {
    expect(messageOf(importCsv("x,y\n1,2\n3,\n", "wall", DOMAIN))).toBe("Row 3, column 2 (“y”): no value.");
    expect(messageOf(importCsv("1.5\n2.5\n", "wall", DOMAIN))).toBe("Row 1, column 2 (y): no value (only one value: separate x and y with a comma or semicolon).");
  });

  it("refuses a point outside the domain", () => {
    expect(messageOf(importCsv("x,y\n1,1\n25,3\n", "receivers", DOMAIN))).toBe("Row 3: the point (25, 3) m lies outside the domain (0 to 20 m across and 0 to 8 m up).");
  });

  it("refuses too few points for a barrier or a solid, and an outline enclosing no area", () => {
    expect(messageOf(importCsv("1,1\n1,1\n", "wall", DOMAIN))).toBe("A barrier needs at least 2 distinct points; the table has 1.");
    expect(messageOf(importCsv("1,1\n2,1\n1,1\n", "solid", DOMAIN))).toBe("A solid needs at least 3 distinct corners; the table has 2.");
    expect(messageOf(importCsv("1,1\n2,2\n3,3\n", "solid", DOMAIN))).toBe("The corners lie on one line: the outline encloses no area.");
  });

  it("refuses an empty table, a header alone and an unclosed quote", () => {
    expect(messageOf(importCsv("\n\n", "wall", DOMAIN))).toBe("The table is empty.");
    expect(messageOf(importCsv("x,y\n", "wall", DOMAIN))).toBe("The table has a header but no rows of coordinates.");
    expect(messageOf(importCsv('x,y,name\n1,1,"Gate\n', "receivers", DOMAIN))).toBe("Row 2: a quoted value is not closed.");
  });

  it("refuses a receiver name longer than a scene label may be", () => {
    expect(messageOf(importCsv(`x,y,name\n1,1,${"n".repeat(201)}\n`, "receivers", DOMAIN))).toBe("Row 2, column 3 (“name”): a name is at most 200 characters.");
  });

  it("refuses more rows than the limit", () => {
    const rows = Array.from({ length: MAX_CSV_ROWS + 1 }, () => "1,1").join("\n");
    expect(messageOf(importCsv(rows, "receivers", DOMAIN))).toBe(`The table has more than ${MAX_CSV_ROWS} rows of coordinates; at most ${MAX_CSV_ROWS} are read.`);
  });
});
