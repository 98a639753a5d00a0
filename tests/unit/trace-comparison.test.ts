import { describe, expect, it } from "vitest";
import { compareReceiverTraces } from "@/components/saved-run/trace-comparison";

function trace(id: string, pressure: number[], velocity: number[] = pressure.map(() => 0)) {
  return { id, label: `Receiver ${id}`, pressure: Float32Array.from(pressure), velocityX: Float32Array.from(velocity), velocityY: Float32Array.from(velocity) };
}

describe("comparing a repeated run's receiver traces with the saved ones", () => {
  it("reports identical traces as identical", () => {
    const saved = [trace("a", [0, 0.5, -0.25]), trace("b", [0, 1, 2])];
    const repeated = [trace("a", [0, 0.5, -0.25]), trace("b", [0, 1, 2])];
    expect(compareReceiverTraces(saved, repeated)).toEqual({ kind: "identical", receivers: 2, samples: 3 });
  });

  it("finds the largest difference, its receiver, quantity and sample", () => {
    const saved = [trace("a", [0, 0.5, -0.25]), trace("b", [0, 1, 2], [0, 0.001, 0])];
    const repeated = [trace("a", [0, 0.5, -0.2]), trace("b", [0, 1.25, 2], [0, 0.001, 0])];
    const comparison = compareReceiverTraces(saved, repeated);
    expect(comparison.kind).toBe("different");
    if (comparison.kind !== "different") return;
    expect(comparison.differingSamples).toBe(2);
    expect(comparison.largest).toMatchObject({ receiverId: "b", quantity: "pressure", sample: 1, saved: 1, repeated: 1.25 });
    expect(comparison.largest.difference).toBeCloseTo(0.25, 7);
    expect(comparison.largest.relativeToPeak).toBeCloseTo(0.125, 7);
  });

  it("sees a difference in the velocity traces too", () => {
    const comparison = compareReceiverTraces([trace("a", [1, 2], [0, 0])], [trace("a", [1, 2], [0, 1e-6])]);
    expect(comparison.kind).toBe("different");
    if (comparison.kind === "different") expect(comparison.largest.quantity).toBe("velocityX");
  });

  it("refuses to compare runs with other receivers or another length", () => {
    expect(compareReceiverTraces([trace("a", [1])], [])).toMatchObject({ kind: "incomparable" });
    expect(compareReceiverTraces([trace("a", [1])], [trace("b", [1])])).toMatchObject({ kind: "incomparable" });
    expect(compareReceiverTraces([trace("a", [1, 2])], [trace("a", [1])])).toMatchObject({ kind: "incomparable" });
  });
});
