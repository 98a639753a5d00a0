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
