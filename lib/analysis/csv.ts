// CSV text for the analysis exports: RFC 4180 quoting, a dot as the decimal mark whatever the browser's
// locale, and units in the header row, so a spreadsheet or a script reads the numbers back unchanged.
import type { BandLevelTable, ExcludedBand } from "./band-levels";
import type { FrequencyBand } from "./bands";
import type { InsertionLossTable } from "./insertion-loss";

export type CsvCell = string | number | null;

/** Quotes a field when it holds a comma, a quote or a line break (quotes doubled inside). */
export function quoteCsvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * A number with `significant` digits and a dot decimal mark (Number's own formatting never uses the
 * locale); empty for NaN and infinities, which no spreadsheet reads as a number.
 */
export function formatCsvNumber(value: number, significant = 7): string {
  if (!Number.isFinite(value)) return "";
  if (value === 0) return "0";
  // toPrecision then Number drops trailing zeros; String gives exponents only for very small or large values.
  return String(Number(value.toPrecision(significant)));
}

/** A number with a fixed count of decimals (levels in dB), dot decimal mark; empty when not finite. */
export function formatCsvFixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return "";
  const text = value.toFixed(decimals);
  // "-0.00" says nothing a reader needs.
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Rows of cells to CSV text with CRLF line ends (RFC 4180). Numbers use formatCsvNumber. */
export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map((row) => row.map((cell) => (cell === null ? "" : typeof cell === "number" ? formatCsvNumber(cell) : quoteCsvField(cell))).join(",")).join("\r\n") + "\r\n";
}

export interface CsvTrace {
  label: string;
  /** Pa, sampled every timeStep s from t = 0. */
  pressure: ArrayLike<number>;
}

/**
 * Pressure traces side by side: "time (s)" then one "label (Pa)" column per trace. Traces of different
 * lengths leave empty cells where they have ended. All traces share `timeStep`.
 */
export function tracesCsv(traces: readonly CsvTrace[], timeStep: number): string {
  if (!(timeStep > 0)) throw new RangeError("the time step must be positive");
  const length = Math.max(0, ...traces.map((trace) => trace.pressure.length));
  const rows: CsvCell[][] = [["time (s)", ...traces.map((trace) => `${trace.label} (Pa)`)]];
  for (let n = 0; n < length; n++) {
    const row: CsvCell[] = [formatCsvNumber(n * timeStep, 9)];
    for (const trace of traces) row.push(n < trace.pressure.length ? (trace.pressure[n] ?? null) : null);
    rows.push(row);
  }
  return toCsv(rows);
}

/** Column heading of a band: nominal centre with its exact edges, so the column is unambiguous. */
export function bandColumnHeading(band: FrequencyBand): string {
  return `${band.nominal} Hz [${formatCsvNumber(band.lower, 5)}-${formatCsvNumber(band.upper, 5)} Hz]`;
}

const weightingUnit = (weighting: BandLevelTable["weighting"]) => (weighting === "Z" ? "dB re 20 uPa" : `dB(${weighting}) re 20 uPa`);

/**
 * Band levels, one row per receiver: "receiver", "overall (unit)", then one column per band
 * ("63 Hz [44.7-89.1 Hz] (dB re 20 uPa)"). Levels with two decimals. `levels` may replace the table's
 * own (e.g. after air absorption), one Float64Array per receiver in the table's order.
 */
export function bandLevelsCsv(table: BandLevelTable, options: { levels?: readonly ArrayLike<number>[]; note?: string } = {}): string {
  const unit = weightingUnit(table.weighting);
  const rows: CsvCell[][] = [];
  rows.push(["receiver", `overall (${unit})`, ...table.bands.map((band) => `${bandColumnHeading(band)} (${unit})`)]);
  table.receivers.forEach((receiver, r) => {
    const levels = options.levels?.[r] ?? receiver.levels;
    let sum = 0;
    for (let b = 0; b < levels.length; b++) sum += Math.pow(10, (levels[b] ?? NaN) / 10);
    const overall = options.levels ? 10 * Math.log10(sum) : receiver.overall;
    rows.push([receiver.label || receiver.receiverId, formatCsvFixed(overall, 2), ...Array.from(levels, (level) => formatCsvFixed(level, 2))]);
  });
  return toCsv(rows) + csvCommentLines([...unresolvedBandLines(table.excluded), ...(options.note ? [options.note] : [])]);
}

/**
 * Comment lines ("# " and the text) after the table, written as they are, never quoted: readers that
 * skip comments (a "#" first on the line) then skip them however many commas they hold.
 */
export function csvCommentLines(lines: readonly string[]): string {
  return lines.map((line) => `# ${line.replace(/[\r\n]+/g, " ")}\r\n`).join("");
}

/** One comment per band left out of the columns, with the reason, so a reader of the file knows the gap is deliberate. */
export function unresolvedBandLines(excluded: readonly ExcludedBand[]): string[] {
  return excluded.map((entry) => `not resolved, left out: ${entry.band.nominal} Hz band (${entry.message})`);
}

/** Insertion loss, one row per receiver: "receiver", "overall (dB)", one "(dB)" column per band; positive lowers the level. */
export function insertionLossCsv(table: InsertionLossTable, excluded: readonly ExcludedBand[] = []): string {
  const rows: CsvCell[][] = [["receiver", "overall insertion loss (dB)", ...table.bands.map((band) => `${bandColumnHeading(band)} insertion loss (dB)`)]];
  for (const receiver of table.receivers) {
    rows.push([receiver.label || receiver.receiverId, formatCsvFixed(receiver.overall, 2), ...Array.from(receiver.insertionLoss, (value) => formatCsvFixed(value, 2))]);
  }
  return toCsv(rows) + csvCommentLines(unresolvedBandLines(excluded));
}
