// The WebAssembly SIMD kernel against the TypeScript reference kernel: same state layout, same
// float32 arithmetic in the same order, so the fields must agree bit for bit.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";

import { describe, expect, it } from "vitest";

import { buildScene, pointReceiver, pointSource } from "@/lib/fdtd/builders";
import * as params from "@/lib/fdtd/kernel-params";
import type { Scene } from "@/lib/fdtd/scene";
import { runScene, Simulation, splitRows, typeScriptKernelProvider } from "@/lib/fdtd/simulation";
import { KERNEL_SOURCE_SHA256 } from "@/lib/fdtd/wasm/build/kernel-base64";
import { createKernelMemory, instantiateWasmKernel, wasmKernelProvider, wasmKernelSupported } from "@/lib/fdtd/wasm/wasm-kernel";

import { allSides, everyFeatureScene, unitGridScene } from "./helpers";

function stateBytes(sim: Simulation): Uint8Array {
  return new Uint8Array(sim.buffer, 0, sim.layout.byteLength);
}

function expectSameState(a: Simulation, b: Simulation): void {
  expect(a.layout).toEqual(b.layout);
  const x = stateBytes(a);
  const y = stateBytes(b);
  let firstDifference = -1;
  for (let k = 0; k < x.length; k++) {
    if (x[k] !== y[k]) {
      firstDifference = k;
      break;
    }
  }
  expect(firstDifference).toBe(-1);
}

/** Steps both kernels `steps` times from the same scene and compares every byte of the state. */
function compareKernels(scene: Scene, steps: number, strips?: [number, number][]): Simulation {
  const reference = new Simulation(scene, { kernel: typeScriptKernelProvider() });
  const simd = new Simulation(scene, { kernel: wasmKernelProvider() });
  for (let n = 0; n < steps; n++) {
    reference.advance();
    simd.advance(strips);
  }
  expectSameState(reference, simd);
  return simd;
}

/** A free field with PML on every side and an odd width, so that the SIMD loops end in scalar tails. */
function pmlFreeField(): Scene {
  return buildScene({
    domain: { width: 1.03, height: 0.77 },
    resolution: { kind: "cellSize", cellSize: 0.01 },
    boundary: allSides({ kind: "pml", layerCells: 13 }),
    sources: [pointSource("s", 0.41, 0.33, { kind: "ricker", peakFrequency: 2000 })],
    receivers: [pointReceiver("r", 0.8, 0.5)],
    duration: { kind: "time", seconds: 0.01 },
    output: { levelMaps: false },
  });
}

/**
 * A uniform lossless scene where most rows take the SIMD kernel's fused path (velocity row j with
 * pressure row j-1 in one pass): PML on the left (7 cells, so the side span ends in scalar cells), bottom
 * and top, a rigid right edge (its outer faces must stay zero); an absorbing block in the bottom-left
 * corner that continues through both PMLs (held cells in packed side rows and in PML rows); a thin
 * rigid screen (rows with boundary faces, which take the separate row kernels); an absorbing ceiling
 * from edge to edge; level maps on.
 * 2 cm cells, 71 x 64 cells with the PML.
 */
function fusedRowsScene(): Scene {
  return buildScene({
    domain: { width: 1.28, height: 1.0 },
    resolution: { kind: "cellSize", cellSize: 0.02 },
    boundary: { left: { kind: "pml", layerCells: 7 }, bottom: { kind: "pml", layerCells: 6 }, top: { kind: "pml", layerCells: 8 }, right: { kind: "rigid" } },
    geometry: {
      solids: [
        { id: "absorber", label: "Absorber", polygon: [{ x: 0, y: 0 }, { x: 0.2, y: 0 }, { x: 0.2, y: 0.16 }, { x: 0, y: 0.16 }], surface: { kind: "absorption", absorptionCoefficient: 0.7 } },
        // The rows above its first row are solid from edge to edge: no boundary face, so they are fused,
        // and the fused pass holds the cells of that first row (behind the absorbing underside) at zero.
        { id: "ceiling", label: "Ceiling", polygon: [{ x: 0, y: 0.9 }, { x: 1.28, y: 0.9 }, { x: 1.28, y: 1.0 }, { x: 0, y: 1.0 }], surface: { kind: "absorption", absorptionCoefficient: 0.4 } },
      ],
      walls: [{ id: "screen", label: "Screen", path: [{ x: 0.9, y: 0.3 }, { x: 0.9, y: 0.62 }], thickness: 0.005 }],
    },
    sources: [pointSource("s", 0.37, 0.41, { kind: "ricker", peakFrequency: 1700 })],
    receivers: [pointReceiver("r", 1.1, 0.5)],
    duration: { kind: "time", seconds: 0.01 },
    output: { levelMaps: true },
  });
}

/** True when some value of the packed PML pressure part is non-zero: the wave has reached the PML. */
function pmlIsExcited(sim: Simulation): boolean {
  const f = new Float32Array(sim.buffer);
  const end = sim.layout.pmlColumns;
  for (let k = sim.layout.pmlPressureX; k < end; k++) if (f[k] !== 0) return true;
  return false;
}

describe("WebAssembly SIMD kernel", () => {
  it("runs here (Node has WebAssembly SIMD and threads)", () => {
    expect(wasmKernelSupported()).toBe(true);
    expect(wasmKernelSupported(true)).toBe(true);
  });

  it("was built from the current AssemblyScript source", () => {
    const source = readFileSync(new URL("../../lib/fdtd/wasm/assembly/kernel.ts", import.meta.url));
    expect(createHash("sha256").update(source).digest("hex")).toBe(KERNEL_SOURCE_SHA256);
  });

  it("reads the parameter block at the same slots as the TypeScript side", () => {
    const memory = createKernelMemory(65_536);
    const exports = instantiateWasmKernel(memory);
    const expected = [
      params.P_NX, params.P_NY, params.P_STRIDE, params.P_PML_LEFT, params.P_PML_RIGHT, params.P_PML_BOTTOM, params.P_PML_TOP,
      params.P_PRESSURE, params.P_VELOCITY_X, params.P_VELOCITY_Y, params.P_PML_PRESSURE_X, params.P_PML_COLUMNS, params.P_PML_ROWS,
      params.P_CELL_GAIN, params.P_FACE_GAIN_X, params.P_FACE_GAIN_Y, params.P_PEAK_PRESSURE, params.P_PRESSURE_SQUARE_SUM,
      params.P_SPECIAL_ROW_START, params.P_SPECIAL_TARGET, params.P_SPECIAL_FLUID_CELL, params.P_SPECIAL_DECAY, params.P_SPECIAL_GAIN,
      params.P_SPECIAL_STATE, params.P_ZERO_ROW_START, params.P_ZERO_CELL, params.P_FLAGS, params.P_DECAY, params.P_VELOCITY_GAIN,
      params.P_PRESSURE_GAIN, params.P_FLUSH_PRESSURE, params.P_FLUSH_VELOCITY, params.PARAMS_BYTE_OFFSET,
      params.FLAG_HETEROGENEOUS, params.FLAG_LEVEL_MAPS, params.FLAG_PML,
    ];
    expect(expected.map((_, k) => exports.parameterSlot(k))).toEqual(expected);
  });

  it("gives fields bit-identical to the TypeScript kernel with every feature on", () => {
    compareKernels(everyFeatureScene(), 200);
  });

  it("gives fields bit-identical to the TypeScript kernel in a PML-bounded free field (vector loops and tails)", () => {
    const simd = compareKernels(pmlFreeField(), 150);
    expect(simd.acousticEnergy()).toBeGreaterThan(0);
  });

  it("gives fields bit-identical to the TypeScript kernel with attenuation (the lossy paths)", () => {
    compareKernels({ ...pmlFreeField(), attenuation: { dBPerMetre: 2 } }, 100);
  });

  it("gives fields bit-identical to the TypeScript kernel where velocity and pressure rows are fused", () => {
    const simd = compareKernels(fusedRowsScene(), 160);
    expect(pmlIsExcited(simd)).toBe(true);
  });

  it("gives fields bit-identical to the TypeScript kernel in the fused rows with attenuation (the lossy spans)", () => {
    const simd = compareKernels({ ...fusedRowsScene(), attenuation: { dBPerMetre: 3 } }, 120);
    expect(pmlIsExcited(simd)).toBe(true);
  });

  it("gives fields bit-identical to the TypeScript kernel in a rigid box without PML, lossless and lossy", () => {
    const box = buildScene({
      domain: { width: 0.5, height: 0.34 },
      resolution: { kind: "cellSize", cellSize: 0.01 },
      boundary: allSides({ kind: "rigid" }),
      sources: [pointSource("s", 0.13, 0.2, { kind: "ricker", peakFrequency: 3000 })],
      duration: { kind: "time", seconds: 0.01 },
      output: { levelMaps: false },
    });
    compareKernels(box, 120);
    compareKernels({ ...box, attenuation: { dBPerMetre: 5 } }, 60);
  });

  it("steps the fused rows by strips bit-identically (strips of one and two rows, strip edges in the PMLs)", () => {
    const scene = fusedRowsScene();
    const ny = new Simulation(scene).layout.ny;
    compareKernels(scene, 100, [[0, 1], [1, 3], [3, 7], [7, 30], [30, ny - 5], [ny - 5, ny - 4], [ny - 4, ny]]);
  });

  it("gives the hand-computed step on the 3 x 3 box", () => {
    const sim = new Simulation(unitGridScene(3, 3), { kernel: wasmKernelProvider() });
    expect(sim.kernel.name).toBe("wasm-simd");
    const { pressure, stride } = sim.fields();
    pressure[stride + 1] = 1;
    sim.advance();
    expect(pressure[stride + 1]).toBe(0);
    expect(pressure[stride]).toBe(0.25);
    expect(pressure[2 * stride + 1]).toBe(0.25);
  });

  it("steps by strips bit-identically, also over a shared memory", () => {
    const scene = everyFeatureScene();
    const probe = new Simulation(scene);
    compareKernels(scene, 80, splitRows(probe.layout.ny, 4));
    const reference = new Simulation(scene, { kernel: typeScriptKernelProvider() });
    const shared = new Simulation(scene, { kernel: wasmKernelProvider({ shared: true }) });
    expect(shared.buffer).toBeInstanceOf(SharedArrayBuffer);
    for (let n = 0; n < 80; n++) {
      reference.advance();
      shared.advance(splitRows(shared.layout.ny, 3));
    }
    expectSameState(reference, shared);
  });

  it("records the same traces bit for bit as the TypeScript kernel over a whole run", () => {
    const a = runScene(everyFeatureScene(), { kernel: typeScriptKernelProvider() });
    const b = runScene(everyFeatureScene(), { kernel: wasmKernelProvider() });
    expect(b.kernel).toBe("wasm-simd");
    for (let r = 0; r < a.receivers.length; r++) {
      expect(Buffer.from(b.receivers[r]!.pressure.buffer).equals(Buffer.from(a.receivers[r]!.pressure.buffer))).toBe(true);
    }
    expect(Buffer.from(b.levelMaps!.rms.values.buffer).equals(Buffer.from(a.levelMaps!.rms.values.buffer))).toBe(true);
  });
});
