import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { bandColour } from "@/components/sweeps/model/band-colours";
import { formatEstimate, formatRate } from "@/components/sweeps/model/format-duration";
import { bandHeading, receiverChartData, sweepCsv, sweepFileName, sweepTableRows } from "@/components/sweeps/model/sweep-table";
import { definition, results } from "./fixtures";

describe("sweep table and CSV", () => {
  it("gives one row per receiver and value, receiver by receiver", () => {
    const rows = sweepTableRows(results);
    expect(rows.map((r) => `${r.receiverId}@${r.value}`)).toEqual(["garden@2", "garden@2.5", "garden@3", "window@2", "window@2.5", "window@3"]);
    expect(rows[1]).toMatchObject({ status: "failed", message: "unstable", insertionLoss: [null, null], overall: null });
    expect(rows[5]).toMatchObject({ insertionLoss: [4.5, null], overall: 4.5 });
  });

  it("writes the definition as comments and the numbers with two decimals, blanks where there are none", () => {
    const csv = sweepCsv(definition, results);
    const lines = csv.split("\r\n");
    expect(lines[0]).toBe('# Parameter sweep of "Design A" (scene version 3): height of Timber barrier, 3.0 m');
    expect(lines[1]).toContain("reference (without barrier)");
    const table = Papa.parse<string[]>(lines.filter((line) => !line.startsWith("#")).join("\n").trim()).data;
    expect(table[0]).toEqual(["height of Timber barrier, 3.0 m (m)", "receiver id", "receiver", "case", "IL 125 Hz (dB)", "IL 250 Hz (dB)", "IL overall (dB)"]);
    expect(table[1]).toEqual(["2", "garden", "Garden, 1.5 m", "done", "5.10", "7.25", "6.30"]);
    expect(table[2]).toEqual(["2.5", "garden", "Garden, 1.5 m", "failed", "", "", ""]);
    expect(table[6]).toEqual(["3", "window", "Window", "done", "4.50", "", "4.50"]);
  });

  it("gives uPlot one array per band with gaps for cases without a number", () => {
    expect(receiverChartData(results, 0)).toEqual([
      [2, 2.5, 3],
      [5.1, null, 6],
      [7.25, null, 9.5],
    ]);
  });

  it("names the file after the scene and the parameter", () => {
    expect(sweepFileName(definition)).toBe("sweep-design-a-height-of-timber-barrier-3-0-m.csv");
    expect(bandHeading(2000)).toBe("2 kHz");
    expect(bandHeading(31.5)).toBe("31.5 Hz");
  });

  it("colours bands distinctly, low to high", () => {
    const colours = Array.from({ length: 10 }, (_, b) => bandColour(b, 10));
    expect(new Set(colours).size).toBe(10);
    for (const colour of colours) expect(colour).toMatch(/^#[0-9a-f]{6}$/);
  });

  it("rounds estimates to what an estimate can promise", () => {
    expect(formatEstimate(0.4)).toBe("under a second");
    expect(formatEstimate(42.4)).toBe("about 42 s");
    expect(formatEstimate(200)).toBe("about 3 min");
    expect(formatEstimate(6000)).toBe("about 1 h 40 min");
    expect(formatEstimate(Number.NaN)).toBe("unknown");
    expect(formatRate(4.1e7)).toBe("41 million cell updates per second");
  });
});
