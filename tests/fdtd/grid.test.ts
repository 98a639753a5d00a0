// The derived grid, the rasterised geometry and the source signals.
import { describe, expect, it } from "vitest";

import { buildScene, pointReceiver, pointSource } from "@/lib/fdtd/builders";
import { cellCentreX, deriveGrid } from "@/lib/fdtd/grid";
import { impedanceFromAbsorption } from "@/lib/fdtd/materials";
import { densityOfAir, speedOfSoundInAir } from "@/lib/fdtd/medium";
import { rasteriseScene } from "@/lib/fdtd/rasterise";
import type { SceneInput } from "@/lib/fdtd/scene";
import { prepareSignal, ricker } from "@/lib/fdtd/signals";

import { allSides } from "./helpers";

function scene(parts: Partial<SceneInput> = {}) {
  return buildScene({
    domain: { width: 10, height: 4 },
    resolution: { kind: "frequency", maxFrequency: 1000, pointsPerWavelength: 10 },
    sources: [pointSource("s", 2, 1, { kind: "ricker", peakFrequency: 300 })],
    duration: { kind: "time", seconds: 0.05 },
    ...parts,
  });
}

describe("medium", () => {
  it("takes c = 331.3 sqrt(1 + T/273.15) and the ideal-gas density of air", () => {
    expect(speedOfSoundInAir(0)).toBeCloseTo(331.3, 10);
    expect(speedOfSoundInAir(20)).toBeCloseTo(343.21, 2);
    // ISO 2533 standard atmosphere at sea level, 15 C: 1.225 kg/m^3.
    expect(densityOfAir(15)).toBeCloseTo(1.225, 3);
  });
});

describe("deriveGrid", () => {
  it("derives cell size, time step and counts from the frequency and points per wavelength", () => {
    const grid = deriveGrid(scene());
    const c = speedOfSoundInAir(20);
    expect(grid.cellSize).toBeCloseTo(c / (1000 * 10), 12);
    expect(grid.timeStep).toBeCloseTo((0.6 * grid.cellSize) / c, 15);
    expect(grid.courantNumber).toBe(0.6);
    expect(grid.maxResolvedFrequency).toBeCloseTo(1000, 9);
    expect(grid.domainCells).toEqual({ nx: Math.ceil(10 / grid.cellSize), ny: Math.ceil(4 / grid.cellSize) });
    expect(grid.pmlCells).toEqual({ left: 20, right: 20, bottom: 20, top: 20 });
    expect(grid.nx).toBe(grid.domainCells.nx + 40);
    expect(grid.cellCount).toBe(grid.nx * grid.ny);
    expect(grid.steps).toBe(Math.ceil(0.05 / grid.timeStep));
    expect(grid.originX).toBeCloseTo(-20 * grid.cellSize, 12);
    expect(cellCentreX(grid, 20)).toBeCloseTo(grid.cellSize / 2, 12);
    // State of about 16 bytes per cell plus fixed overhead; the estimate includes it.
    expect(grid.memoryBytes / grid.cellCount).toBeGreaterThan(12);
    expect(grid.memoryBytes / grid.cellCount).toBeLessThan(48);
  });

  it("uses an explicit cell size and adds no PML on rigid or impedance sides", () => {
    const grid = deriveGrid(scene({ resolution: { kind: "cellSize", cellSize: 0.05, courantNumber: 0.5 }, boundary: { bottom: { kind: "rigid" }, top: { kind: "impedance", normalisedImpedance: 3 } } }));
    expect(grid.cellSize).toBe(0.05);
    expect(grid.pmlCells).toEqual({ left: 20, right: 20, bottom: 0, top: 0 });
    expect(grid.ny).toBe(80);
    expect(grid.pointsPerWavelength).toBe(10);
  });

  it("takes the time step from the fastest medium and the cell size from the slowest", () => {
    const grid = deriveGrid(scene({ mediumRegions: [{ id: "hot", label: "Hot", polygon: [{ x: 1, y: 1 }, { x: 2, y: 1 }, { x: 2, y: 2 }], medium: { kind: "fluid", soundSpeed: 500, density: 1 } }] }));
    expect(grid.maxSoundSpeed).toBe(500);
    expect(grid.timeStep).toBeCloseTo((0.6 * grid.cellSize) / 500, 15);
  });

  it("warns when a source's spectrum reaches above the resolved band", () => {
    expect(deriveGrid(scene()).warnings).toEqual([]);
    const loud = deriveGrid(scene({ sources: [pointSource("s", 2, 1, { kind: "ricker", peakFrequency: 800 })] }));
    expect(loud.warnings.map((w) => [w.code, w.path])).toEqual([["source-above-band", "sources[0].signal"]]);
    const abrupt = deriveGrid(scene({ sources: [pointSource("s", 2, 1, { kind: "sine", frequency: 100, rampCycles: 0 })] }));
    expect(abrupt.warnings[0]?.message).toMatch(/abrupt start/);
  });

  it("warns about a thin PML and about sources and receivers inside solids", () => {
    const grid = deriveGrid(
      scene({
        boundary: { left: { kind: "pml", layerCells: 6 } },
        geometry: { solids: [{ id: "box", label: "Box", polygon: [{ x: 1, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 2 }, { x: 1, y: 2 }] }] },
        receivers: [pointReceiver("r", 2.5, 0.5)],
      }),
    );
    expect(grid.warnings.map((w) => w.code).sort()).toEqual(["pml-thin", "receiver-in-solid", "source-in-solid"]);
  });
});

describe("rasteriseScene", () => {
  const h = 0.1;
  const base = (parts: Partial<SceneInput>) =>
    buildScene({
      domain: { width: 2, height: 2 },
      resolution: { kind: "cellSize", cellSize: h },
      boundary: allSides({ kind: "rigid" }),
      sources: [pointSource("s", 0.05, 0.05, { kind: "ricker", peakFrequency: 100 })],
      duration: { kind: "time", seconds: 0.01 },
      ...parts,
    });

  it("fills the cells whose centre lies inside a solid and gives its outline faces the solid's treatment", () => {
    const s = base({ geometry: { solids: [{ id: "sq", label: "Square", polygon: [{ x: 0.5, y: 0.5 }, { x: 1.0, y: 0.5 }, { x: 1.0, y: 1.0 }, { x: 0.5, y: 1.0 }], surface: { kind: "absorption", absorptionCoefficient: 0.75 } }] } });
    const raster = rasteriseScene(s, deriveGrid(s));
    expect(raster.solid.reduce((a, b) => a + b, 0)).toBe(25);
    // A 5 x 5 block has 20 outline faces, all with z = 3 (alpha = 0.75).
    expect(raster.boundaryFaces).toHaveLength(20);
    for (const face of raster.boundaryFaces) expect(face.impedance).toBeCloseTo(impedanceFromAbsorption(0.75), 12);
    const left = raster.boundaryFaces.find((f) => f.axis === "x" && f.i === 5 && f.j === 7)!;
    expect(left).toMatchObject({ fluidI: 4, fluidJ: 7, fluidOnLowSide: true });
  });

  it("blocks a diagonal thin wall without gaps: no fluid path crosses it", () => {
    const s = base({ geometry: { walls: [{ id: "w", label: "Wall", path: [{ x: 0, y: 0.03 }, { x: 1.97, y: 2 }], thickness: 0.01 }] } });
    const grid = deriveGrid(s);
    const raster = rasteriseScene(s, grid);
    expect(raster.solid.every((v) => v === 0)).toBe(true);
    const blocked = new Set(raster.boundaryFaces.map((f) => `${f.axis}${f.i},${f.j}`));
    // Flood fill from the lower-right corner through unblocked faces: the upper-left corner is unreachable.
    const seen = new Uint8Array(grid.nx * grid.ny);
    const stack = [[grid.nx - 1, 0]];
    while (stack.length > 0) {
      const [i, j] = stack.pop()!;
      if (seen[j! * grid.nx + i!]) continue;
      seen[j! * grid.nx + i!] = 1;
      if (i! + 1 < grid.nx && !blocked.has(`x${i! + 1},${j}`)) stack.push([i! + 1, j!]);
      if (i! > 0 && !blocked.has(`x${i},${j}`)) stack.push([i! - 1, j!]);
      if (j! + 1 < grid.ny && !blocked.has(`y${i},${j! + 1}`)) stack.push([i!, j! + 1]);
      if (j! > 0 && !blocked.has(`y${i},${j}`)) stack.push([i!, j! - 1]);
    }
    expect(seen[(grid.ny - 1) * grid.nx]).toBe(0);
    expect(seen.reduce((a, b) => a + b, 0)).toBeGreaterThan(150);
  });

  it("lines a rigid outer edge where a surface runs along it", () => {
    const s = base({ geometry: { surfaces: [{ id: "floor", label: "Carpet", path: [{ x: 0, y: 0 }, { x: 1, y: 0 }], treatment: { kind: "impedance", normalisedImpedance: 4 } }] } });
    const raster = rasteriseScene(s, deriveGrid(s));
    const lined = raster.boundaryFaces.filter((f) => f.axis === "y" && f.j === 0);
    // Faces of the bottom edge within one cell of x in [0, 1]: centres 0.05 .. 1.05.
    expect(lined.map((f) => f.i)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    for (const f of lined) expect(f.impedance).toBe(4);
  });

  it("continues a solid that meets a PML side through the PML", () => {
    const s = base({ boundary: { left: { kind: "pml", layerCells: 5 }, right: { kind: "rigid" }, bottom: { kind: "rigid" }, top: { kind: "rigid" } }, geometry: { solids: [{ id: "ground", label: "Berm", polygon: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 0.3 }, { x: 0, y: 0.3 }] }] } });
    const grid = deriveGrid(s);
    const raster = rasteriseScene(s, grid);
    for (let i = 0; i < 5; i++) for (let j = 0; j < 3; j++) expect(raster.solid[j * grid.nx + i]).toBe(1);
    expect(raster.solid[3 * grid.nx + 0]).toBe(0);
  });
});

describe("signals", () => {
  it("has a unit-peak Ricker wavelet centred on its delay, zero-crossings at t0 +- 1/(pi f0 sqrt 2)", () => {
    // Ricker (1940); the zero-crossings follow from 1 - 2 (pi f0 t)^2 = 0.
    expect(ricker(0.01, 100, 0.01)).toBe(1);
    expect(ricker(0.01 + 1 / (Math.PI * 100 * Math.SQRT2), 100, 0.01)).toBeCloseTo(0, 12);
    const signal = prepareSignal({ kind: "ricker", peakFrequency: 100 }, 1e-5);
    expect(signal.valueAt(0.015)).toBe(1);
    expect(Math.abs(signal.valueAt(0))).toBeLessThan(1e-7);
    // -30 dB band edge of the Ricker spectrum (f/f0)^2 exp(1 - (f/f0)^2): about 2.4 f0 (common practice quotes 2.5 f0).
    expect(signal.upperFrequency / 100).toBeGreaterThan(2.3);
    expect(signal.upperFrequency / 100).toBeLessThan(2.6);
  });

  it("ramps a continuous sine in over its ramp cycles and never ends", () => {
    const signal = prepareSignal({ kind: "sine", frequency: 50, rampCycles: 2 }, 1e-4);
    expect(signal.endTime).toBe(Infinity);
    expect(signal.valueAt(0)).toBe(0);
    expect(signal.valueAt(0.045 + 0.005)).toBeCloseTo(Math.sin(2 * Math.PI * 50 * 0.05), 12);
    expect(Math.abs(signal.valueAt(0.005))).toBeLessThan(0.1);
  });

  it("gives a tone burst its carrier frequency under a Gaussian envelope", () => {
    const signal = prepareSignal({ kind: "toneBurst", frequency: 1000, cycles: 4 }, 1e-6);
    // sigma = cycles / (4 f) = 1 ms; centre 6 sigma.
    expect(signal.valueAt(0.006 + 0.00025)).toBeCloseTo(1, 1);
    expect(Math.abs(signal.valueAt(0))).toBeLessThan(1e-7);
    expect(signal.endTime).toBeCloseTo(0.012, 12);
  });

  it("resamples a recorded signal to the time step (band-limited interpolation)", () => {
    const sampleRate = 48_000;
    const samples = Array.from({ length: 4800 }, (_, k) => Math.sin(2 * Math.PI * 1000 * (k / sampleRate)));
    const signal = prepareSignal({ kind: "sampled", sampleRate, samples }, 1 / 70_000);
    for (const t of [0.01, 0.0123457, 0.05, 0.07777]) expect(signal.valueAt(t)).toBeCloseTo(Math.sin(2 * Math.PI * 1000 * t), 3);
    expect(signal.valueAt(0.2)).toBe(0);
    // Down to a slower solver rate the recording is low-passed at the solver's Nyquist frequency.
    const slow = prepareSignal({ kind: "sampled", sampleRate, samples: Array.from({ length: 4800 }, (_, k) => Math.sin(2 * Math.PI * 15_000 * (k / sampleRate))) }, 1 / 20_000);
    expect(Math.abs(slow.valueAt(0.05))).toBeLessThan(0.02);
  });
});
