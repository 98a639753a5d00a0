// Coordinate tables (CSV) into a barrier path, a solid outline or a set of receivers. Columns x and y in
// metres, a header row optional, separated by commas, semicolons or tabs, with a decimal point. Every
// refusal names the row and column at fault.
import Papa from "papaparse";

import type { Point } from "@/lib/fdtd/scene";

import { describeDomain, formatLength, insideDomain, openRing, signedDoubleArea, withoutRepeatedPoints, type DomainSize, type ImportResult } from "./geometry";

export type CsvTarget = "wall" | "solid" | "receivers";

/** Largest coordinate table read, characters. */
export const MAX_CSV_CHARACTERS = 5 * 1024 * 1024;

/** Most data rows read: a barrier or a receiver grid never needs more. */
export const MAX_CSV_ROWS = 10_000;

/** Longest receiver name kept (the scene's label limit). */
const MAX_NAME_LENGTH = 200;

export interface CsvReceiver {
  position: Point;
  /** From the name column; null when there is none or the cell is empty. */
  name: string | null;
}

export type CsvImport = ImportResult<
  | { target: "wall"; path: Point[]; rows: number }
  | { target: "solid"; polygon: Point[]; rows: number }
  | { target: "receivers"; receivers: CsvReceiver[]; rows: number }
>;

/** A plain decimal number with a decimal point; a comma is refused so "1,5" cannot be misread. */
const DECIMAL = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

function readCoordinate(cell: string): number | null {
  const text = cell.trim();
  if (!DECIMAL.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

/** Where each value lives in a row, and the names to use in messages. */
interface Columns {
  x: number;
  y: number;
  name: number | null;
  label: (index: number) => string;
}

/** A header cell's meaning: the word before any unit in brackets, "x (m)" is x. */
function headerWord(cell: string): string {
  return cell
    .replace(/[([{].*$/, "")
    .trim()
    .toLowerCase();
}

const NAME_HEADERS = new Set(["name", "label", "receiver"]);

function columnsFromHeader(header: readonly string[]): ImportResult<{ columns: Columns }> {
  const words = header.map(headerWord);
  const x = words.indexOf("x");
  const y = words.indexOf("y");
  const found = header.map((cell) => `“${cell.trim()}”`).join(", ");
  if (x < 0 || y < 0) {
    return { ok: false, message: `Row 1 is a header without ${x < 0 ? "an x" : "a y"} column (found ${found}). Name the columns x and y, or leave the header out and put x and y first.` };
  }
  const name = words.findIndex((word) => NAME_HEADERS.has(word));
  return { ok: true, columns: { x, y, name: name >= 0 ? name : null, label: (index) => `column ${index + 1} (“${header[index]!.trim()}”)` } };
}

const POSITIONAL: Columns = { x: 0, y: 1, name: 2, label: (index) => `column ${index + 1} (${["x", "y", "name"][index] ?? "extra"})` };

function isBlank(row: readonly string[]): boolean {
  return row.every((cell) => cell.trim() === "");
}

interface CsvRow {
  /** 1-based row of the table, counting the header and blank rows, for messages. */
  row: number;
  point: Point;
  name: string | null;
}

function readRows(text: string, target: CsvTarget, domain: DomainSize): ImportResult<{ rows: CsvRow[] }> {
  if (text.length > MAX_CSV_CHARACTERS) return { ok: false, message: `The table is ${(text.length / 1048576).toFixed(1)} MB; at most ${MAX_CSV_CHARACTERS / 1048576} MB are read.` };
  const body = text.replace(/^\uFEFF/, "");
  // The separator is guessed with blank lines left out (a trailing blank line would spoil the guess);
  // the table is then read with them kept, so row numbers in messages are the file's lines.
  const guess = Papa.parse<string[]>(body, { delimiter: "", delimitersToGuess: [",", ";", "\t"], skipEmptyLines: "greedy", preview: 50 });
  const parsed = Papa.parse<string[]>(body, { delimiter: guess.meta.delimiter || ",", skipEmptyLines: false });
  const quoteError = parsed.errors.find((error) => error.type === "Quotes");
  if (quoteError) return { ok: false, message: `Row ${(quoteError.row ?? 0) + 1}: a quoted value is not closed.` };

  const table = parsed.data;
  const firstIndex = table.findIndex((row) => !isBlank(row));
  if (firstIndex < 0) return { ok: false, message: "The table is empty." };
  const first = table[firstIndex]!;
  // A first row whose first two cells are both not numbers is a header; one number and one word is a bad data row.
  const isHeader = first.length >= 2 && readCoordinate(first[0]!) === null && readCoordinate(first[1]!) === null;
  let columns = POSITIONAL;
  if (isHeader) {
    const fromHeader = columnsFromHeader(first);
    if (!fromHeader.ok) return fromHeader;
    columns = fromHeader.columns;
  }

  const rows: CsvRow[] = [];
  for (let index = isHeader ? firstIndex + 1 : firstIndex; index < table.length; index++) {
    const cells = table[index]!;
    if (isBlank(cells)) continue;
    const row = index + 1;
    if (rows.length >= MAX_CSV_ROWS) return { ok: false, message: `The table has more than ${MAX_CSV_ROWS} rows of coordinates; at most ${MAX_CSV_ROWS} are read.` };
    const value = (column: number): ImportResult<{ value: number }> => {
      const cell = cells[column];
      if (cell === undefined || cell.trim() === "") {
        const separator = cells.length === 1 ? " (only one value: separate x and y with a comma or semicolon)" : "";
        return { ok: false, message: `Row ${row}, ${columns.label(column)}: no value${separator}.` };
      }
      const number = readCoordinate(cell);
      if (number === null) {
        const hint = /^\s*[-+]?\d+,\d+\s*$/.test(cell) ? " (use a decimal point, not a comma)" : "";
        return { ok: false, message: `Row ${row}, ${columns.label(column)}: “${cell.trim().slice(0, 40)}” is not a number${hint}.` };
      }
      return { ok: true, value: number };
    };
    const x = value(columns.x);
    if (!x.ok) return x;
    const y = value(columns.y);
    if (!y.ok) return y;
    const point = { x: x.value, y: y.value };
    if (!insideDomain(point, domain)) {
      return { ok: false, message: `Row ${row}: the point (${formatLength(point.x)}, ${formatLength(point.y)}) m lies outside the domain (${describeDomain(domain)}).` };
    }
    let name: string | null = null;
    if (target === "receivers" && columns.name !== null) {
      const cell = (cells[columns.name] ?? "").trim();
      if (cell.length > MAX_NAME_LENGTH) return { ok: false, message: `Row ${row}, ${columns.label(columns.name)}: a name is at most ${MAX_NAME_LENGTH} characters.` };
      name = cell === "" ? null : cell;
    }
    rows.push({ row, point, name });
  }
  if (rows.length === 0) return { ok: false, message: "The table has a header but no rows of coordinates." };
  return { ok: true, rows };
}

/**
 * Reads a coordinate table as `target`: a barrier path (at least 2 distinct points), a solid outline
 * (at least 3 corners enclosing an area; a repeated first corner at the end is dropped), or receivers
 * (one per row). Every point must lie inside the domain. Never throws.
 */
export function importCsv(text: string, target: CsvTarget, domain: DomainSize): CsvImport {
  const read = readRows(text, target, domain);
  if (!read.ok) return read;
  const points = read.rows.map((row) => row.point);
  const rows = read.rows.length;
  switch (target) {
    case "wall": {
      const path = withoutRepeatedPoints(points);
      if (path.length < 2) return { ok: false, message: `A barrier needs at least 2 distinct points; the table has ${path.length}.` };
      return { ok: true, target, path, rows };
    }
    case "solid": {
      const polygon = openRing(points);
      if (polygon.length < 3) return { ok: false, message: `A solid needs at least 3 distinct corners; the table has ${polygon.length}.` };
      if (signedDoubleArea(polygon) === 0) return { ok: false, message: "The corners lie on one line: the outline encloses no area." };
      return { ok: true, target, polygon, rows };
    }
    case "receivers":
      return { ok: true, target, receivers: read.rows.map((row) => ({ position: row.point, name: row.name })), rows };
  }
}
