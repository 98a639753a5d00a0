// Kernel tests: hand-computed steps on tiny grids, the fast paths against the general ones, the
// boundary rows, degenerate sizes, the state layout, and the strip split.
import { describe, expect, it } from "vitest";

import { flushRow, pressureSplit, pressureSplitUniformX, pressureUniform, velocityXTable, velocityXUniform } from "@/lib/fdtd/kernel";
import { planLayout, pmlPressureXLength, pmlPressureXRow, RESERVED_BYTES } from "@/lib/fdtd/layout";
import type { Scene } from "@/lib/fdtd/scene";
import { Simulation, splitRows, typeScriptKernelProvider } from "@/lib/fdtd/simulation";

import { allSides, everyFeatureScene, unitGridScene } from "./helpers";

/** These tests are about the TypeScript reference kernel (wasm.test.ts holds the SIMD kernel to it). */
function referenceSimulation(scene: Scene): Simulation {
  return new Simulation(scene, { kernel: typeScriptKernelProvider() });
}

function at(field: Float32Array, stride: number, i: number, j: number): number {
  return field[j * stride + i]!;
}

describe("one step on a 3 x 3 rigid box (c = rho = h = 1, Courant 0.5: both gains 0.5)", () => {
  it("moves a unit pressure at the centre into its four faces and neighbours as the update equations say", () => {
    const sim = referenceSimulation(unitGridScene(3, 3));
    const { pressure, velocityX, velocityY, stride } = sim.fields();
    pressure[1 * stride + 1] = 1;
    sim.advance();
    // vx[j][i] = -0.5 (p[j][i] - p[j][i-1]); vy[j][i] = -0.5 (p[j][i] - p[j-1][i])
    expect(at(velocityX, stride, 1, 1)).toBe(-0.5);
    expect(at(velocityX, stride, 2, 1)).toBe(0.5);
    expect(at(velocityY, stride, 1, 1)).toBe(-0.5);
    expect(at(velocityY, stride, 1, 2)).toBe(0.5);
    expect(at(velocityX, stride, 1, 0)).toBe(0);
    // p[1][1] = 1 - 0.5 (0.5 + 0.5 + 0.5 + 0.5) = 0; each neighbour gets -0.5 * (+-0.5) = 0.25; corners 0.
    expect(at(pressure, stride, 1, 1)).toBe(0);
    expect(at(pressure, stride, 0, 1)).toBe(0.25);
    expect(at(pressure, stride, 2, 1)).toBe(0.25);
    expect(at(pressure, stride, 1, 0)).toBe(0.25);
    expect(at(pressure, stride, 1, 2)).toBe(0.25);
    expect(at(pressure, stride, 0, 0)).toBe(0);
  });

  it("keeps the outer (rigid) faces at zero and the total pressure sum constant", () => {
    const sim = referenceSimulation(unitGridScene(3, 3));
    const { pressure, velocityX, velocityY, stride } = sim.fields();
    pressure[1 * stride + 1] = 1;
    for (let n = 0; n < 25; n++) sim.advance();
    let sum = 0;
    for (let j = 0; j < 3; j++) {
      expect(at(velocityX, stride, 0, j)).toBe(0);
      expect(at(velocityX, stride, 3, j)).toBe(0);
      for (let i = 0; i < 3; i++) sum += at(pressure, stride, i, j);
    }
    for (let i = 0; i < 3; i++) {
      expect(at(velocityY, stride, i, 0)).toBe(0);
      expect(at(velocityY, stride, i, 3)).toBe(0);
    }
    // With rigid walls no volume leaves: sum of p (times h^2 / (rho c^2)) is conserved.
    expect(sum).toBeCloseTo(1, 6);
  });

  it("steps a one-cell grid without touching anything", () => {
    const sim = referenceSimulation(unitGridScene(1, 1));
    const { pressure } = sim.fields();
    pressure[0] = 2;
    sim.advance();
    expect(pressure[0]).toBe(2);
  });
});

describe("row kernels", () => {
  it("the lossless fast path equals the general path with unit decay, bit for bit", () => {
    const stride = 40;
    const f = new Float32Array(8 * stride);
    for (let k = 0; k < f.length; k++) f[k] = Math.sin(k * 0.37) * (k % 7) * 1e-3;
    const g = f.slice();
    const decays = 4 * stride;
    const gains = 5 * stride;
    for (let i = 0; i < stride; i++) {
      g[decays + i] = 1;
      g[gains + i] = Math.fround(0.013);
    }
    // vx row at 0, p row at stride
    velocityXUniform(f, 0, stride, 1, 33, 1, Math.fround(0.013));
    velocityXTable(g, 0, stride, decays, gains, 1, 33);
    expect(Array.from(f.subarray(0, stride))).toEqual(Array.from(g.subarray(0, stride)));
  });

  it("a split PML cell with zero damping equals the plain pressure update", () => {
    const stride = 24;
    const f = new Float32Array(10 * stride);
    for (let k = 0; k < 6 * stride; k++) f[k] = Math.cos(k * 0.91) * 0.01;
    // p row 0, vx row 1, vy rows 2 and 3, px row 4 (zero: the whole pressure sits in py), tables at rows 6, 7
    const g = f.slice();
    for (let i = 0; i < stride; i++) {
      g[6 * stride + i] = 1;
      g[7 * stride + i] = Math.fround(120);
    }
    pressureUniform(f, 0, stride, 2 * stride, 3 * stride, 0, 20, 1, Math.fround(120));
    pressureSplit(g, 0, 4 * stride, stride, 2 * stride, 3 * stride, 6 * stride, 7 * stride, 0, 20, 1, Math.fround(120));
    // The split form adds the x and y parts in another order: equal to a few float32 roundings of the terms.
    for (let i = 0; i < 20; i++) {
      const terms = Math.abs(f[i]!) + 120 * (Math.abs(f[stride + i + 1]! - f[stride + i]!) + Math.abs(f[3 * stride + i]! - f[2 * stride + i]!));
      expect(Math.abs(g[i]! - f[i]!)).toBeLessThanOrEqual(4 * 2 ** -24 * terms);
    }
  });

  it("the PML-row update with scalar x coefficients equals the table form when the tables hold those scalars, bit for bit", () => {
    const stride = 24;
    const f = new Float32Array(10 * stride);
    for (let k = 0; k < 6 * stride; k++) f[k] = Math.sin(k * 1.37) * 0.02;
    // p row 0, vx row 1, vy rows 2 and 3, px row 4 (non-zero), tables at rows 6, 7
    for (let i = 0; i < stride; i++) f[4 * stride + i] = Math.cos(i) * 0.01;
    const ax = Math.fround(0.93);
    const bx = Math.fround(97.5);
    for (let i = 0; i < stride; i++) {
      f[6 * stride + i] = ax;
      f[7 * stride + i] = bx;
    }
    const g = f.slice();
    const ay = Math.fround(0.71);
    const by = Math.fround(80.25);
    pressureSplit(f, 0, 4 * stride, stride, 2 * stride, 3 * stride, 6 * stride, 7 * stride, 1, 21, ay, by);
    pressureSplitUniformX(g, 0, 4 * stride, stride, 2 * stride, 3 * stride, 1, 21, ax, bx, ay, by);
    expect(Array.from(g)).toEqual(Array.from(f));
  });

  it("flushes values below the flush quantum to zero, rounds small ones to the quantum and leaves large ones unchanged", () => {
    const f = new Float32Array([1e-30, 3e-39, 0.25, 1e-27, -2e-39]);
    // F = 1e-20 lies in [2^-67, 2^-66), so the quantum (float32 spacing at F) is 2^-90 = 8.1e-28.
    flushRow(f, 0, 5, Math.fround(1e-20));
    expect(Array.from(f)).toEqual([0, 0, 0.25, 2 ** -90, 0]);
  });

  it("flushes every field's tiny values every few steps, so no float32 subnormal survives a run", () => {
    const sim = referenceSimulation(unitGridScene(6, 5));
    const { pressure, velocityX, velocityY, stride, nx, ny } = sim.fields();
    // Every stored value, the padding at the row ends excepted.
    const entries = (field: Float32Array, rows: number, perRow: number) => {
      const at: number[] = [];
      for (let j = 0; j < rows; j++) for (let i = 0; i < perRow; i++) at.push(j * stride + i);
      return at.map((k) => ({ field, k }));
    };
    const all = [...entries(pressure, ny, nx), ...entries(velocityX, ny, nx + 1), ...entries(velocityY, ny + 1, nx)];
    for (const { field, k } of all) field[k] = k % 2 ? 1e-39 : -3e-40;
    for (let n = 0; n < 16; n++) sim.advance();
    const subnormal = (x: number) => x !== 0 && Math.abs(x) < 1.1754944e-38;
    expect(all.filter(({ field, k }) => subnormal(field[k]!))).toEqual([]);
  });
});

describe("state layout", () => {
  it("packs the split pressure: whole rows in the bottom and top PMLs, only the side columns elsewhere", () => {
    // 10 rows of stride 12; PML 3 left (kept as 4 floats, so the right part starts 16-byte aligned), 2 right
    // (4 floats), 2 bottom, 1 top: rows 0, 1 whole, rows 2..8 of 8 floats, row 9 whole.
    const pml = { left: 3, right: 2, bottom: 2, top: 1 };
    const rows = Array.from({ length: 10 }, (_, j) => pmlPressureXRow(100, 10, 12, pml, j));
    expect(rows).toEqual([100, 112, 124, 132, 140, 148, 156, 164, 172, 180]);
    expect(pmlPressureXLength(10, 12, pml)).toBe(2 * 12 + 7 * 8 + 12);
  });

  it("keeps a 1024 x 1024 grid with a 20-cell PML all round near 12 bytes per cell (p, vx, vy and the PML's share)", () => {
    const layout = planLayout({
      nx: 1024,
      ny: 1024,
      hasPml: true,
      pmlCells: { left: 20, right: 20, bottom: 20, top: 20 },
      heterogeneous: false,
      levelMaps: false,
      specialFaceCount: 0,
      zeroCellCount: 0,
    });
    const bytesPerCell = (layout.byteLength - RESERVED_BYTES) / (1024 * 1024);
    expect(bytesPerCell).toBeGreaterThan(12);
    expect(bytesPerCell).toBeLessThan(12.5);
  });

  it("holds the uniform decay and gain in the PML column tables from each interface face inwards to the domain", () => {
    // The SIMD kernel updates the interface faces (left PML thickness, nx - right PML thickness) from the
    // tables of a side-PML span; the reference updates them as uniform faces. Both must give the same numbers.
    const sim = referenceSimulation(unitGridScene(30, 6, { boundary: allSides({ kind: "pml", layerCells: 5 }), attenuation: { dBPerMetre: 0.5 } }));
    const { stride, nx, pmlColumns } = sim.layout;
    const f = new Float32Array(sim.buffer);
    const { decay, velocityGain, pressureGain } = sim.setup.scalars;
    expect(decay).toBeLessThan(1);
    for (let i = 5; i <= nx - 5; i++) {
      expect(f[pmlColumns + 2 * stride + i]).toBe(decay);
      expect(f[pmlColumns + 3 * stride + i]).toBe(velocityGain);
    }
    for (let i = 5; i < nx - 5; i++) {
      expect(f[pmlColumns + i]).toBe(decay);
      expect(f[pmlColumns + stride + i]).toBe(pressureGain);
    }
    // ... and damped values inside the PML.
    expect(f[pmlColumns + 2 * stride + 2]).toBeLessThan(decay);
    expect(f[pmlColumns + 2 * stride + nx - 2]).toBeLessThan(decay);
  });
});

describe("strips", () => {
  it("splits rows into contiguous nearly equal strips", () => {
    expect(splitRows(10, 3)).toEqual([
      [0, 3],
      [3, 6],
      [6, 10],
    ]);
    expect(splitRows(2, 5)).toEqual([
      [0, 1],
      [1, 2],
    ]);
  });

  it("stepping by strips gives fields bit-identical to one strip, with every feature switched on", () => {
    const scene = everyFeatureScene();
    const whole = referenceSimulation(scene);
    const three = referenceSimulation(scene);
    const many = referenceSimulation(scene);
    const ny = whole.layout.ny;
    const threeStrips = splitRows(ny, 3);
    // Strips of one and two rows and a strip ending inside the top PML.
    const manyStrips: [number, number][] = [[0, 1], [1, 3], [3, 17], [17, ny - 4], [ny - 4, ny]];
    for (let n = 0; n < 120; n++) {
      whole.advance();
      three.advance(threeStrips);
      many.advance(manyStrips);
    }
    const bytes = (s: Simulation) => new Uint8Array(s.buffer, 0, s.layout.byteLength);
    expect(Buffer.compare(bytes(whole), bytes(three))).toBe(0);
    expect(Buffer.compare(bytes(whole), bytes(many))).toBe(0);
    // The test is not vacuous: the field has moved.
    expect(whole.acousticEnergy()).toBeGreaterThan(0);
  });

  it("lives in a caller-supplied SharedArrayBuffer", () => {
    const scene = everyFeatureScene();
    const probe = referenceSimulation(scene);
    const shared = new SharedArrayBuffer(probe.layout.byteLength);
    const sim = new Simulation(scene, { buffer: shared });
    for (let n = 0; n < 40; n++) {
      probe.advance();
      sim.advance(splitRows(sim.layout.ny, 2));
    }
    expect(sim.buffer).toBe(shared);
    expect(Buffer.compare(new Uint8Array(probe.buffer, 0, probe.layout.byteLength), new Uint8Array(shared, 0, probe.layout.byteLength))).toBe(0);
  });

  it("rejects a supplied buffer that is too small", () => {
    expect(() => new Simulation(everyFeatureScene(), { buffer: new ArrayBuffer(1024) })).toThrow(/needs/);
  });
});
