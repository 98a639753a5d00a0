import { afterEach, describe, expect, it } from "vitest";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { Simulation } from "@/lib/fdtd/simulation";
import { typeScriptKernelProvider } from "@/lib/fdtd/kernel-provider";
import { nodeParallelKernel, type NodeParallelKernel } from "@/scripts/fdtd-parallel-node";
import designA from "@/db/seed/scenes/design-a-3m-reflective.json";

// A short, coarse version of the demo barrier scene: PML on three sides, a rigid ground, a wall,
// a treated surface and a solid, so every kind of boundary crosses strip edges.
const scene = parseSceneOrThrow({ ...designA, resolution: { kind: "frequency", maxFrequency: 150, pointsPerWavelength: 10, courantNumber: 0.6 }, duration: { kind: "time", seconds: 0.03 } });

let pool: NodeParallelKernel | null = null;
afterEach(async () => {
  await pool?.close();
  pool = null;
});

function expectSameFields(a: Simulation, b: Simulation) {
  const fa = a.fields();
  const fb = b.fields();
  expect(Buffer.from(fb.pressure.buffer, fb.pressure.byteOffset, fb.pressure.byteLength).equals(Buffer.from(fa.pressure.buffer, fa.pressure.byteOffset, fa.pressure.byteLength))).toBe(true);
  expect(Buffer.from(fb.velocityX.buffer, fb.velocityX.byteOffset, fb.velocityX.byteLength).equals(Buffer.from(fa.velocityX.buffer, fa.velocityX.byteOffset, fa.velocityX.byteLength))).toBe(true);
  expect(Buffer.from(fb.velocityY.buffer, fb.velocityY.byteOffset, fb.velocityY.byteLength).equals(Buffer.from(fa.velocityY.buffer, fa.velocityY.byteOffset, fa.velocityY.byteLength))).toBe(true);
}

describe("stepping one simulation on several threads", () => {
  for (const kernelKind of ["wasm-simd", "typescript"] as const) {
    it(`gives the same fields and traces bit for bit as one thread (${kernelKind}, 3 threads)`, async () => {
      const single = new Simulation(scene, kernelKind === "typescript" ? { kernel: typeScriptKernelProvider() } : {});
      const singleResult = single.run();
      pool = nodeParallelKernel({ threads: 3, rows: deriveGrid(scene).ny, kernelKind });
      const parallel = new Simulation(scene, { kernel: pool.provider });
      const parallelResult = parallel.run();
      expect(parallel.kernel.name).toContain("x3");
      expect(parallelResult.stepsRun).toBe(singleResult.stepsRun);
      expectSameFields(single, parallel);
      for (const [r, trace] of singleResult.receivers.entries()) {
        expect(Array.from(parallelResult.receivers[r]!.pressure)).toEqual(Array.from(trace.pressure));
      }
    });
  }

  it("releases its helper threads when the run is cancelled", async () => {
    pool = nodeParallelKernel({ threads: 2, rows: deriveGrid(scene).ny });
    const simulation = new Simulation(scene, { kernel: pool.provider });
    let calls = 0;
    const result = simulation.run({ progressInterval: 5, isCancelled: () => ++calls > 3 });
    expect(result.stoppedBy).toBe("cancelled");
    await pool.close();
    pool = null;
  });
});
