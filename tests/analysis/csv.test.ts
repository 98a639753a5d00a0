// CSV exports: dot decimals whatever the locale, units in the header, RFC 4180 quoting.
import Papa from "papaparse";
import { describe, expect, it } from "vitest";

import { bandLevelTable } from "@/lib/analysis/band-levels";
import { bandLevelsCsv, formatCsvFixed, formatCsvNumber, insertionLossCsv, quoteCsvField, toCsv, tracesCsv } from "@/lib/analysis/csv";
import { insertionLossTable } from "@/lib/analysis/insertion-loss";

import { gaussianNoise } from "./test-signals";

const parse = (text: string) => Papa.parse<string[]>(text.trim(), { delimiter: "," }).data;

describe("CSV number formatting", () => {
  it("writes a dot decimal mark and no thousands separators", () => {
    expect(formatCsvNumber(1234.5678)).toBe("1234.568");
    expect(formatCsvNumber(-0.000012345678)).toBe("-0.00001234568");
    expect(formatCsvNumber(0)).toBe("0");
    expect(formatCsvFixed(71.256, 2)).toBe("71.26");
    expect(formatCsvFixed(-0.001, 2)).toBe("0.00");
  });

  it("leaves NaN and infinities empty", () => {
    expect(formatCsvNumber(NaN)).toBe("");
    expect(formatCsvFixed(-Infinity, 1)).toBe("");
  });

  it("quotes fields with commas, quotes and line breaks only", () => {
    expect(quoteCsvField("plain")).toBe("plain");
    expect(quoteCsvField('Window, "first" floor')).toBe('"Window, ""first"" floor"');
    expect(toCsv([["a,b", 1.5, null]])).toBe('"a,b",1.5,\r\n');
  });
});

describe("trace CSV", () => {
  it("has a time column and one column per receiver, with units, and reads back the samples", () => {
    const text = tracesCsv(
      [
        { label: "Garden, 1.5 m", pressure: Float32Array.from([0.5, -0.25, 0.125]) },
        { label: "Window", pressure: Float32Array.from([1e-7, 2]) },
      ],
      1e-4,
    );
    const rows = parse(text);
    expect(rows[0]).toEqual(["time (s)", "Garden, 1.5 m (Pa)", "Window (Pa)"]);
    expect(rows[1]).toEqual(["0", "0.5", "1e-7"]);
    expect(rows[2]).toEqual(["0.0001", "-0.25", "2"]);
    // The shorter trace leaves an empty cell once it has ended.
    expect(rows[3]).toEqual(["0.0002", "0.125", ""]);
    expect(rows).toHaveLength(4);
  });
});

describe("band and insertion-loss CSV", () => {
  const timeStep = 1 / 16000;
  const trace = (id: string, gain: number) => ({ id, label: `Receiver ${id}`, timeStep, pressure: gaussianNoise(8192, gain, id.charCodeAt(0)) });
  const options = { bandsPerOctave: 1 as const, highestResolvedFrequency: 4000 };

  it("names each band by its nominal centre and exact edges, with the unit, and gives levels to 0.01 dB", () => {
    const table = bandLevelTable([trace("a", 0.2)], { ...options, weighting: "A" });
    const rows = parse(bandLevelsCsv(table));
    expect(rows[0]![0]).toBe("receiver");
    expect(rows[0]![1]).toBe("overall (dB(A) re 20 uPa)");
    expect(rows[0]![2]).toMatch(/^\d+(\.\d+)? Hz \[\d+(\.\d+)?-\d+(\.\d+)? Hz\] \(dB\(A\) re 20 uPa\)$/);
    expect(rows[0]).toHaveLength(2 + table.bands.length);
    expect(Number(rows[1]![2])).toBeCloseTo(table.receivers[0]!.levels[0]!, 2);
    expect(rows[1]![2]).toMatch(/^-?\d+\.\d\d$/);
  });

  it("writes replaced levels (after air absorption) and their energy sum as the overall level", () => {
    const table = bandLevelTable([trace("a", 0.2)], options);
    const lowered = table.receivers[0]!.levels.map((level) => level - 3);
    const rows = parse(bandLevelsCsv(table, { levels: [lowered], note: "air absorption over 10 m" }));
    expect(Number(rows[1]![1])).toBeCloseTo(table.receivers[0]!.overall - 3, 2);
    expect(rows.at(-1)).toEqual(["# air absorption over 10 m"]);
  });

  it("writes insertion loss per receiver and band in dB", () => {
    const reference = bandLevelTable([trace("a", 1)], options);
    const treated = bandLevelTable([{ ...trace("a", 1), pressure: trace("a", 1).pressure.map((p) => p / 10) }], options);
    const rows = parse(insertionLossCsv(insertionLossTable(reference, treated)));
    expect(rows[0]![1]).toBe("overall insertion loss (dB)");
    expect(rows[1]!.slice(1)).toEqual(Array(reference.bands.length + 1).fill("20.00"));
  });
});
