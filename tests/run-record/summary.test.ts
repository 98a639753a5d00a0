import { describe, expect, it } from "vitest";
import { decodeRunPayload, encodeRunPayload } from "@/lib/run-record/payload";
import { summariseReceiver, summariseRun } from "@/lib/run-record/summary";
import { tinyRun } from "./fixtures";

describe("run summary figures", () => {
  it("gives the peak and the energy-equivalent level of a receiver against 20 µPa", () => {
    // A 1 Pa peak is 20 log10(1 / 20e-6) = 93.98 dB; a full sine period has mean square 1/2, 3.01 dB less.
    const sine = Float32Array.from({ length: 64 }, (_, n) => Math.sin((2 * Math.PI * n) / 64));
    const summary = summariseReceiver({ id: "r", label: "R", pressure: sine });
    expect(summary.peakPressure).toBeCloseTo(1, 6);
    expect(summary.peakLevelDb).toBeCloseTo(93.98, 2);
    expect(summary.leqDb).toBeCloseTo(93.98 - 3.01, 2);
  });

  it("gives no level for a silent receiver", () => {
    expect(summariseReceiver({ id: "r", label: "R", pressure: new Float32Array(10) })).toMatchObject({ peakPressure: 0, peakLevelDb: null, leqDb: null });
  });

  it("summarises a decoded run with the figures of the run itself", () => {
    const { scene, result } = tinyRun();
    const encoded = encodeRunPayload({ result, scene, sceneVersion: 1 });
    if (!encoded.ok) throw new Error(encoded.message);
    const decoded = decodeRunPayload(encoded.bytes);
    if (!decoded.ok) throw new Error(decoded.message);
    const summary = summariseRun(decoded.run);
    expect(summary.grid).toMatchObject({ nx: result.grid.nx, ny: result.grid.ny, cells: result.grid.cellCount, cellSize: result.grid.cellSize, timeStep: result.grid.timeStep });
    expect(summary.steps).toEqual({ planned: result.grid.steps, run: result.stepsRun });
    expect(summary.wallSeconds).toBeCloseTo(result.timings.setupSeconds + result.timings.runSeconds, 12);
    expect(summary.receivers).toEqual(result.receivers.map(summariseReceiver));
    expect(summary.receiverCount).toBe(5);
    expect(summary.loudestPeakLevelDb).toBe(Math.max(...summary.receivers.map((r) => r.peakLevelDb!)));
    expect(summary.snapshotFrames).toBe(result.snapshots.length);
    // Stored as JSON: it must survive the round trip unchanged.
    expect(JSON.parse(JSON.stringify(summary))).toEqual(summary);
  });
});
