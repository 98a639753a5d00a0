import { describe, expect, it } from "vitest";
import { packTraces, unpackTraces } from "@/lib/sweeps/trace-pack";

// A sweep run's traces as the server keeps them until its sweep is done: exact float32, or a reason.

const traces = [
  { id: "rx", label: "Behind", timeStep: 1.7e-5, pressure: Float32Array.from([0, 1e-7, -3.25, Math.PI, 1e30]) },
  { id: "line:0", label: "Line 1", timeStep: 1.7e-5, pressure: new Float32Array(0) },
];

describe("trace packs", () => {
  it("give back every sample bit for bit, with ids, labels and time steps", () => {
    const unpacked = unpackTraces(packTraces(traces));
    if (!unpacked.ok) throw new Error(unpacked.message);
    expect(unpacked.traces.map(({ id, label, timeStep }) => ({ id, label, timeStep }))).toEqual(traces.map(({ id, label, timeStep }) => ({ id, label, timeStep })));
    unpacked.traces.forEach((trace, t) => expect(Buffer.from(Float32Array.from(trace.pressure).buffer).equals(Buffer.from(traces[t]!.pressure.buffer))).toBe(true));
  });

  it("say why damaged bytes are not a pack instead of throwing", () => {
    const bytes = packTraces(traces);
    expect(unpackTraces(bytes.subarray(0, bytes.length - 3)).ok).toBe(false);
    expect(unpackTraces(new Uint8Array([1, 2, 3])).ok).toBe(false);
  });
});
