// Sanity checks of the whole solver (not the verification suite): arrival time and spreading of a pulse,
// energy conservation in a rigid room, absorption by the PML, the impedance and attenuation mappings,
// instability detection, cancellation, progress, the decay stop and determinism.
import { describe, expect, it } from "vitest";

import { buildScene, pointReceiver, pointSource } from "@/lib/fdtd/builders";
import type { Scene } from "@/lib/fdtd/scene";
import { runScene, Simulation, SimulationInstabilityError } from "@/lib/fdtd/simulation";

import { allSides, everyFeatureScene } from "./helpers";

const C = 343.2;
const RHO = 1.2;
const medium = { kind: "fluid" as const, soundSpeed: C, density: RHO };

/** Magnitude of the discrete Fourier transform of x (sampled every dt) at frequency f. */
function spectrumAt(x: ArrayLike<number>, f: number, dt: number): number {
  let re = 0;
  let im = 0;
  for (let k = 0; k < x.length; k++) {
    re += x[k]! * Math.cos(2 * Math.PI * f * k * dt);
    im -= x[k]! * Math.sin(2 * Math.PI * f * k * dt);
  }
  return Math.hypot(re, im);
}

function peakOf(x: ArrayLike<number>): number {
  let m = 0;
  for (let k = 0; k < x.length; k++) m = Math.max(m, Math.abs(x[k]!));
  return m;
}

/** Lag (in samples, parabolic refinement) at which y best matches x. */
function lagOf(x: ArrayLike<number>, y: ArrayLike<number>, maxLag: number): number {
  const correlation = (lag: number) => {
    let s = 0;
    for (let k = 0; k + lag < y.length; k++) if (k + lag >= 0) s += x[k]! * y[k + lag]!;
    return s;
  };
  let best = -Infinity;
  let at = 0;
  for (let lag = 0; lag < maxLag; lag++) {
    const v = correlation(lag);
    if (v > best) {
      best = v;
      at = lag;
    }
  }
  const before = correlation(at - 1);
  const here = correlation(at);
  const after = correlation(at + 1);
  return at + (0.5 * (before - after)) / (before - 2 * here + after);
}

describe("free field (h = 1 cm, Ricker at 20 cells per wavelength at its peak frequency)", () => {
  const h = 0.01;
  const f0 = C / (20 * h);
  const scene = buildScene({
    domain: { width: 2.0, height: 1.2 },
    medium,
    resolution: { kind: "cellSize", cellSize: h },
    sources: [pointSource("s", 0.305, 0.605, { kind: "ricker", peakFrequency: f0 })],
    receivers: [pointReceiver("near", 0.705, 0.605), pointReceiver("far", 1.105, 0.605), pointReceiver("diagonal", 0.305 + 0.8 / Math.SQRT2, 0.605 + 0.8 / Math.SQRT2)],
    duration: { kind: "time", seconds: 0.9 / C + 3 / f0 },
    output: { levelMaps: false },
  });
  const result = runScene(scene);
  const [near, far, diagonal] = result.receivers.map((r) => r.pressure);
  const dt = result.grid.timeStep;

  it("is silent at a receiver until the wave can have arrived (causality, r/c)", () => {
    const arrivalStep = Math.floor(0.4 / C / dt);
    // Before r/c only the scheme's numerical precursor can be non-zero; it is tiny.
    expect(peakOf(near!.subarray(0, arrivalStep - 10))).toBeLessThan(1e-3 * peakOf(near!));
    expect(peakOf(near!)).toBeGreaterThan(0);
  });

  it("moves the pulse 0.4 m further in 0.4 m / c, within one time step, along the axis and the diagonal", () => {
    const expected = 0.4 / C / dt;
    expect(Math.abs(lagOf(near!, far!, 200) - expected)).toBeLessThan(1);
    expect(Math.abs(lagOf(near!, diagonal!, 200) - expected)).toBeLessThan(1);
  });

  it("loses 3 dB per doubling of distance (line source), within 0.5 dB", () => {
    // Far field of a line source: H0(kr) ~ sqrt(2 / (pi k r)) e^{i(kr - pi/4)} (Abramowitz & Stegun, Handbook of
    // Mathematical Functions, 9.2.3), so |p| ~ r^(-1/2): 10 log10(2) = 3.01 dB per doubling. At 0.4 and 0.8 m,
    // kr = 13 and 25: the next term of the expansion changes the ratio by under 0.1 dB.
    expect(Math.abs(20 * Math.log10(peakOf(far!) / peakOf(near!)) + 3.01)).toBeLessThan(0.5);
    expect(Math.abs(20 * Math.log10(peakOf(diagonal!) / peakOf(near!)) + 3.01)).toBeLessThan(0.5);
  });
});

describe("rigid room (h = 2 cm, Ricker at 15 cells per wavelength at its peak frequency)", () => {
  const room = (walls: NonNullable<Parameters<typeof buildScene>[0]["boundary"]>["left"]) => {
    const h = 0.02;
    return buildScene({
      domain: { width: 1.0, height: 0.7 },
      medium,
      resolution: { kind: "cellSize", cellSize: h },
      boundary: allSides(walls ?? { kind: "rigid" }),
      geometry: { solids: [{ id: "pillar", label: "Pillar", polygon: [{ x: 0.5, y: 0.2 }, { x: 0.6, y: 0.2 }, { x: 0.6, y: 0.3 }] }] },
      sources: [pointSource("s", 0.31, 0.33, { kind: "ricker", peakFrequency: C / (15 * h) })],
      duration: { kind: "time", seconds: 0.2 },
      output: { levelMaps: false },
    });
  };
  /** Mean sampled energy over the first and last quarter of the time after the source has stopped. */
  const quarterMeans = (walls: Parameters<typeof room>[0]) => {
    const result = runScene(room(walls), { energyCheckInterval: 16 });
    const after = result.energy.filter((e) => e.time > 0.003).map((e) => e.joulesPerMetre);
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    const q = Math.floor(after.length / 4);
    return { first: mean(after.slice(0, q)), last: mean(after.slice(3 * q)), all: after };
  };

  it("keeps the acoustic energy constant once the source has stopped: no drift above 1% in 0.2 s", () => {
    // The sampled energy pairs p at n dt with v at (n - 1/2) dt, so it wobbles by a few percent around the
    // conserved discrete energy; its average over many periods must not drift.
    const { first, last, all } = quarterMeans({ kind: "rigid" });
    expect(all.length).toBeGreaterThan(300);
    expect(Math.abs(last / first - 1)).toBeLessThan(0.01);
    for (const e of all) expect(Math.abs(e / first - 1)).toBeLessThan(0.1);
  });

  it("loses energy when its walls absorb only 5%", () => {
    const { first, last } = quarterMeans({ kind: "absorption", absorptionCoefficient: 0.05 });
    expect(last / first).toBeLessThan(0.5);
  });
});

describe("PML", () => {
  const h = 0.01;
  const f0 = C / (15 * h);
  const sceneOfWidth = (width: number, layerCells = 20): Scene =>
    buildScene({
      domain: { width, height: 2 },
      medium,
      resolution: { kind: "cellSize", cellSize: h },
      boundary: allSides({ kind: "pml", layerCells }),
      sources: [pointSource("s", 0.305, 1.005, { kind: "ricker", peakFrequency: f0 })],
      receivers: [pointReceiver("r", 0.805, 1.005)],
      duration: { kind: "time", seconds: 0.0035 },
      output: { levelMaps: false },
    });

  it("reflects a pulse at normal incidence at least 40 dB below the incident one (20 cells, 15 cells per wavelength)", () => {
    // Reference: the same receiver with the PML pushed 2 m away, so that nothing returns within the run.
    const reference = runScene(sceneOfWidth(3.0)).receivers[0]!.pressure;
    const near = runScene(sceneOfWidth(1.0)).receivers[0]!.pressure;
    const reflected = near.map((v, k) => v - reference[k]!);
    expect(20 * Math.log10(peakOf(reflected) / peakOf(reference))).toBeLessThan(-40);
  });

  it("drains the domain: energy falls by more than 40 dB after the pulse has left", () => {
    const result = runScene(buildScene({
      domain: { width: 0.6, height: 0.6 },
      medium,
      resolution: { kind: "cellSize", cellSize: 0.01 },
      sources: [pointSource("s", 0.3, 0.3, { kind: "ricker", peakFrequency: f0 })],
      duration: { kind: "time", seconds: 0.008 },
      output: { levelMaps: false },
    }), { energyCheckInterval: 16 });
    const energies = result.energy.map((e) => e.joulesPerMetre);
    const peak = Math.max(...energies);
    expect(10 * Math.log10(energies[energies.length - 1]! / peak)).toBeLessThan(-40);
  });
});

describe("one-cell duct (rigid top and bottom: exact plane waves), h = 1 cm, 20 cells per wavelength at f0", () => {
  const h = 0.01;
  const f0 = C / (20 * h);
  const duct = (right: NonNullable<NonNullable<Parameters<typeof buildScene>[0]["boundary"]>["right"]>, length: number, dBPerMetre?: number) =>
    buildScene({
      domain: { width: length, height: h },
      medium,
      resolution: { kind: "cellSize", cellSize: h },
      boundary: { left: { kind: "pml" }, right, top: { kind: "rigid" }, bottom: { kind: "rigid" } },
      sources: [pointSource("s", 1.005, 0.005, { kind: "ricker", peakFrequency: f0 })],
      receivers: [pointReceiver("a", 2.005, 0.005), pointReceiver("b", 3.005, 0.005)],
      ...(dBPerMetre !== undefined ? { attenuation: { dBPerMetre } } : {}),
      duration: { kind: "time", seconds: 0.03 },
      output: { levelMaps: false },
    });
  const free = runScene(duct({ kind: "pml" }, 12));
  const dt = free.grid.timeStep;

  it.each([1, 2, 5, 0.5, 20])("reflects from an impedance end z = %s with R = (z - 1)/(z + 1) within 0.02 at f0", (z) => {
    // Normal-incidence reflection of a locally reacting surface: Kinsler, Frey, Coppens & Sanders, Fundamentals of Acoustics, 4th ed., ch. 6.
    const incident = free.receivers[1]!.pressure;
    const total = runScene(duct({ kind: "impedance", normalisedImpedance: z }, 6)).receivers[1]!.pressure;
    const reflected = total.map((v, k) => v - incident[k]!);
    const measured = spectrumAt(reflected, f0, dt) / spectrumAt(incident, f0, dt);
    expect(Math.abs(measured - Math.abs((z - 1) / (z + 1)))).toBeLessThan(0.02);
  });

  it("reflects fully from a rigid end", () => {
    const incident = free.receivers[1]!.pressure;
    const total = runScene(duct({ kind: "rigid" }, 6)).receivers[1]!.pressure;
    const reflected = total.map((v, k) => v - incident[k]!);
    expect(spectrumAt(reflected, f0, dt) / spectrumAt(incident, f0, dt)).toBeCloseTo(1, 2);
  });

  it("attenuates by the requested dB per metre at f0 (within 0.05 dB over 1 m)", () => {
    const lossy = runScene(duct({ kind: "pml" }, 12, 3));
    const level = (r: typeof free, k: number) => 20 * Math.log10(spectrumAt(r.receivers[k]!.pressure, f0, dt));
    const extraLoss = level(free, 1) - level(free, 0) - (level(lossy, 1) - level(lossy, 0));
    expect(Math.abs(extraLoss - 3)).toBeLessThan(0.05);
  });
});

describe("run control", () => {
  const small = () =>
    buildScene({
      domain: { width: 0.5, height: 0.4 },
      resolution: { kind: "cellSize", cellSize: 0.01 },
      sources: [pointSource("s", 0.2, 0.2, { kind: "ricker", peakFrequency: 2000 })],
      receivers: [pointReceiver("r", 0.3, 0.25)],
      duration: { kind: "time", seconds: 0.004 },
    });

  it("stops with an error naming the time step when the Courant number exceeds the 2D limit", () => {
    const longer = { ...small(), duration: { kind: "time" as const, seconds: 0.01 } };
    const run = () => new Simulation(longer, { unsafeCourantNumber: 0.75 }).run();
    expect(run).toThrow(SimulationInstabilityError);
    expect(run).toThrow(/Courant number 0.75/);
  });

  it("runs stably just below the 2D limit", () => {
    const result = new Simulation(small(), { unsafeCourantNumber: 0.705 }).run();
    expect(result.stoppedBy).toBe("duration");
  });

  it("can be cancelled between chunks and reports progress that only grows", () => {
    const fractions: number[] = [];
    let polls = 0;
    const result = new Simulation(small()).run({ progressInterval: 10, onProgress: (p) => fractions.push(p.fraction), isCancelled: () => ++polls > 5 });
    expect(result.stoppedBy).toBe("cancelled");
    expect(result.stepsRun).toBe(50);
    expect(result.receivers[0]!.pressure).toHaveLength(51);
    expect(fractions).toEqual([...fractions].sort((a, b) => a - b));
    expect(fractions.length).toBe(5);
  });

  it("can be cancelled through an AbortSignal while running asynchronously", async () => {
    const controller = new AbortController();
    const sim = new Simulation(small());
    const result = await sim.runAsync({ progressInterval: 10, signal: controller.signal, onProgress: (p) => p.step >= 30 && controller.abort() });
    expect(result.stoppedBy).toBe("cancelled");
    expect(result.stepsRun).toBe(30);
  });

  it("reports progress up to the whole run", () => {
    let last = 0;
    const result = new Simulation(small()).run({ onProgress: (p) => (last = p.fraction) });
    expect(last).toBe(1);
    expect(result.stepsRun).toBe(result.grid.steps);
  });

  it("stops once the energy has decayed by the requested amount", () => {
    const scene = buildScene({
      domain: { width: 0.5, height: 0.4 },
      resolution: { kind: "cellSize", cellSize: 0.01 },
      boundary: allSides({ kind: "absorption", absorptionCoefficient: 0.5 }),
      sources: [pointSource("s", 0.2, 0.2, { kind: "ricker", peakFrequency: 2000 })],
      duration: { kind: "decay", decayDb: 30, maxSeconds: 1 },
    });
    const result = runScene(scene, { energyCheckInterval: 8 });
    expect(result.stoppedBy).toBe("decay");
    expect(result.simulatedSeconds).toBeLessThan(0.5);
    const last = result.energy[result.energy.length - 1]!.joulesPerMetre;
    const peak = Math.max(...result.energy.map((e) => e.joulesPerMetre));
    expect(10 * Math.log10(last / peak)).toBeLessThanOrEqual(-30);
  });

  it("gives the same traces bit for bit on every run", () => {
    const a = runScene(everyFeatureScene());
    const b = runScene(everyFeatureScene());
    expect(a.receivers.length).toBe(6);
    for (let r = 0; r < a.receivers.length; r++) {
      expect(Buffer.from(a.receivers[r]!.pressure.buffer).equals(Buffer.from(b.receivers[r]!.pressure.buffer))).toBe(true);
      expect(Buffer.from(a.receivers[r]!.velocityX.buffer).equals(Buffer.from(b.receivers[r]!.velocityX.buffer))).toBe(true);
    }
    expect(peakOf(a.receivers[0]!.pressure)).toBeGreaterThan(0);
  });

  it("records snapshots, level maps and the solid mask over the domain", () => {
    const result = runScene(everyFeatureScene());
    const { domainCells } = result.grid;
    expect(result.snapshots.length).toBe(Math.floor(result.stepsRun / 50));
    expect(result.snapshots[0]!.width).toBe(Math.ceil(domainCells.nx / 2));
    expect(result.finalPressure.values.length).toBe(domainCells.nx * domainCells.ny);
    expect(result.levelMaps?.samples).toBe(result.stepsRun);
    const rms = result.levelMaps!.rms.values;
    const peak = result.levelMaps!.peak.values;
    for (let k = 0; k < rms.length; k++) expect(rms[k]!).toBeLessThanOrEqual(peak[k]! * (1 + 1e-6));
    expect(result.solidMask.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
  });

  it("stays stable for a long run with every feature on", () => {
    const scene = { ...everyFeatureScene(), duration: { kind: "time" as const, seconds: 0.1 } };
    const result = runScene(scene);
    expect(result.stoppedBy).toBe("duration");
    const energies = result.energy.map((e) => e.joulesPerMetre);
    expect(energies[energies.length - 1]!).toBeLessThan(Math.max(...energies));
  });
});
