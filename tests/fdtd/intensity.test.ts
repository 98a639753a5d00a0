import { describe, expect, it } from "vitest";
import { runScene } from "@/lib/fdtd/simulation";

// A Ricker line source in open space (PML all round), 20 cells per wavelength at the peak frequency.
const f0 = 250;
const c = 343.2; // the solver's c at 20 C: 331.3 sqrt(1 + 20/273.15)
const h = c / (f0 * 20);
const scene = {
  version: 1,
  domain: { width: 12, height: 12 },
  medium: { kind: "air", temperature: 20 },
  resolution: { kind: "cellSize", cellSize: h, courantNumber: 0.5 },
  sources: [{ id: "s", label: "line source", position: { x: 6, y: 6 }, amplitude: 0.001, signal: { kind: "ricker", peakFrequency: f0 } }],
  duration: { kind: "time", seconds: 0.03 },
  output: { levelMaps: true },
};

function at(field: { width: number; x0: number; y0: number; spacing: number; values: Float32Array }, x: number, y: number): number {
  const a = Math.round((x - field.x0) / field.spacing);
  const b = Math.round((y - field.y0) / field.spacing);
  return field.values[b * field.width + a]!;
}

describe("time-averaged intensity", () => {
  const result = runScene(scene);
  const intensity = result.intensity!;
  const rms = result.levelMaps!.rms;
  const rho = result.grid.density;
  const soundSpeed = result.grid.soundSpeed;

  it("points away from the source on every side", () => {
    expect(at(intensity.x, 9, 6)).toBeGreaterThan(0);
    expect(at(intensity.x, 3, 6)).toBeLessThan(0);
    expect(at(intensity.y, 6, 9)).toBeGreaterThan(0);
    expect(at(intensity.y, 6, 3)).toBeLessThan(0);
    // Along the axis the flow has no sideways part.
    expect(Math.abs(at(intensity.y, 9, 6))).toBeLessThan(0.02 * at(intensity.x, 9, 6));
  });

  it("equals <p^2>/(rho c) in the far field, as for a progressive wave (Pierce, Acoustics, eq. 1-11.9)", () => {
    // 3 m is 2.2 wavelengths at f0: the near-field correction of a cylindrical wave is a few per cent there (from memory).
    const radial = at(intensity.x, 9, 6);
    const expected = at(rms, 9, 6) ** 2 / (rho * soundSpeed);
    expect(Math.abs(radial / expected - 1)).toBeLessThan(0.06);
  });
});
