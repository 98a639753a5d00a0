import { describe, expect, it } from "vitest";

import { benchmarkScene, measureStepRate } from "@/components/scene-editor/step-rate/measure-step-rate";
import { deriveGrid } from "@/lib/fdtd/grid";

describe("step-rate measurement", () => {
  it("divides cell updates by the clock time spent stepping (a fake clock, 2 ms per batch of steps)", () => {
    let tick = 0;
    // Each read advances the fake clock by 2 ms, so every batch seems to take 2 ms.
    const now = () => (tick++) * 0.002;
    const result = measureStepRate({ minSeconds: 0.02, now });
    const cells = deriveGrid(benchmarkScene()).cellCount;
    expect(result.cells).toBe(cells);
    // 10 batches of 10 steps reach 20 ms.
    expect(result.steps).toBe(100);
    expect(result.seconds).toBeCloseTo(0.02, 12);
    expect(result.cellUpdatesPerSecond).toBeCloseTo((cells * 100) / 0.02, 3);
    expect(["wasm-simd", "typescript"]).toContain(result.kernel);
  });

  it("uses a grid of about a hundred thousand cells, big enough to leave the caches", () => {
    const grid = deriveGrid(benchmarkScene());
    expect(grid.nx).toBe(340);
    expect(grid.ny).toBe(320);
  });
});
