// A sweep's result as rows (one per value and receiver) for the table on screen and for CSV, and as
// uPlot's aligned arrays (one chart per receiver, one line per band).
import Papa from "papaparse";
import type { SweepDefinition, SweepResults } from "@/lib/validation/blocks";

export interface SweepTableRow {
  value: number;
  receiverId: string;
  receiverLabel: string;
  status: SweepResults["outcomes"][number]["status"];
  /** Why the case has no numbers, when it failed. */
  message?: string;
  /** One per band of the result, dB; null where there is no value. */
  insertionLoss: (number | null)[];
  overall: number | null;
}

/** Rows by receiver, then by value, so that each receiver's rows read as one series. */
export function sweepTableRows(results: SweepResults): SweepTableRow[] {
  return results.receivers.flatMap((receiver, r) =>
    results.values.map((value, k) => {
      const outcome = results.outcomes[k] ?? { status: "not-run" as const };
      return {
        value,
        receiverId: receiver.id,
        receiverLabel: receiver.label,
        status: outcome.status,
        ...(outcome.message ? { message: outcome.message } : {}),
        insertionLoss: results.bands.map((_, b) => results.insertionLoss[k]?.[r]?.[b] ?? null),
        overall: results.overall[k]?.[r] ?? null,
      };
    }),
  );
}

export function bandHeading(nominal: number): string {
  return nominal >= 1000 ? `${Number((nominal / 1000).toPrecision(3))} kHz` : `${nominal} Hz`;
}

const statusWords: Record<SweepTableRow["status"], string> = { done: "done", failed: "failed", "not-run": "not run" };

/** The result as CSV: the definition in the first lines (as "# " comments), then one row per value and receiver. */
export function sweepCsv(definition: SweepDefinition, results: SweepResults): string {
  const unit = definition.unit ? ` (${definition.unit})` : "";
  const reference = definition.reference.kind === "free-field" ? "free field" : `without ${definition.reference.removedIds.join(", ")}`;
  const comments = [
    `# Parameter sweep of "${definition.sceneName}" (scene version ${definition.sceneVersion}): ${definition.parameterLabel}`,
    `# Insertion loss = level of the reference (${reference}) minus level of the case, ${definition.bandsPerOctave === 1 ? "octave" : "one-third-octave"} bands, ${definition.weighting === "A" ? "A-weighted" : "unweighted"}, dB`,
    "# A 2D section: a coherent line source and infinitely long elements. Not a statutory noise assessment.",
  ];
  const header = [`${definition.parameterLabel}${unit}`, "receiver id", "receiver", "case", ...results.bands.map((band) => `IL ${band.nominal} Hz (dB)`), "IL overall (dB)"];
  const rows = sweepTableRows(results).map((row) => [String(row.value), row.receiverId, row.receiverLabel, statusWords[row.status], ...row.insertionLoss.map((v) => (v === null ? "" : v.toFixed(2))), row.overall === null ? "" : row.overall.toFixed(2)]);
  return `${comments.join("\r\n")}\r\n${Papa.unparse({ fields: header, data: rows }, { newline: "\r\n" })}\r\n`;
}

/** uPlot data for one receiver: [values, one array per band], nulls where a case has no number. */
export function receiverChartData(results: SweepResults, receiverIndex: number): [number[], ...(number | null)[][]] {
  return [results.values, ...results.bands.map((_, b) => results.values.map((_, k) => results.insertionLoss[k]?.[receiverIndex]?.[b] ?? null))];
}

/** A file name from the scene and the parameter, safe on every system. */
export function sweepFileName(definition: SweepDefinition): string {
  const slug = `${definition.sceneName} ${definition.parameterLabel}`
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 80);
  return `sweep-${slug || "result"}.csv`;
}
