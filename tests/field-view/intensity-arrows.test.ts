// Decimated intensity arrows: block means, directions, log-scaled lengths.
import { describe, expect, it } from "vitest";

import { cellsPerArrowFor, intensityArrows } from "@/components/field-view/intensity-arrows";
import type { FieldSnapshot } from "@/lib/fdtd/simulation";

function field(width: number, height: number, value: (a: number, b: number) => number): FieldSnapshot {
  const values = new Float32Array(width * height);
  for (let b = 0; b < height; b++) for (let a = 0; a < width; a++) values[b * width + a] = value(a, b);
  return { step: 0, time: 0, width, height, x0: 0.05, y0: 0.05, spacing: 0.1, values };
}

describe("intensity arrows", () => {
  it("puts one full-length arrow per block of a uniform flow, at the block centre, along the flow", () => {
    // 10 x 10 cells of 0.1 m, I = (3, 4) W/m^2 everywhere, 5 x 5 cells per arrow.
    const result = intensityArrows(
      field(10, 10, () => 3),
      field(10, 10, () => 4),
      5,
    );
    expect(result.arrows).toHaveLength(4);
    expect(result.maxMagnitude).toBeCloseTo(5, 6);
    expect(result.arrowSpacing).toBeCloseTo(0.5, 12);
    const first = result.arrows[0]!;
    // Cells 0..4 have centres 0.05 .. 0.45: the block centre is 0.25 m.
    expect(first.x).toBeCloseTo(0.25, 12);
    expect(first.y).toBeCloseTo(0.25, 12);
    expect(first.directionX).toBeCloseTo(0.6, 6);
    expect(first.directionY).toBeCloseTo(0.8, 6);
    expect(first.lengthFraction).toBeCloseTo(1, 6);
  });

  it("scales length with level: 10 dB weaker is a third shorter over a 30 dB range; 40 dB weaker has no arrow", () => {
    // Three blocks of 2 x 1 cells along x: |I| = 1, 0.1 and 1e-4 W/m^2.
    const magnitudes = [1, 0.1, 1e-4];
    const result = intensityArrows(
      field(6, 1, (a) => magnitudes[Math.floor(a / 2)]!),
      field(6, 1, () => 0),
      2,
      30,
    );
    expect(result.arrows).toHaveLength(2);
    expect(result.arrows[0]!.lengthFraction).toBeCloseTo(1, 6);
    expect(result.arrows[1]!.lengthFraction).toBeCloseTo(1 - 10 / 30, 6);
  });

  it("averages the flow over each block, so opposite flows cancel and a partial block at the edge is averaged over its own cells", () => {
    // 7 cells, blocks of 3: [+1, -1, +1] -> mean 1/3; [-1, +1, -1] -> -1/3; [2] -> 2.
    const result = intensityArrows(
      field(7, 1, (a) => (a === 6 ? 2 : a % 2 ? -1 : 1)),
      field(7, 1, () => 0),
      3,
    );
    expect(result.arrows.map((arrow) => Number((arrow.magnitude * arrow.directionX).toFixed(6)))).toEqual([0.333333, -0.333333, 2]);
    expect(result.arrows[2]!.x).toBeCloseTo(0.05 + 6 * 0.1, 12);
  });

  it("leaves out blocks with no flow, and refuses components on different grids", () => {
    const result = intensityArrows(
      field(4, 1, (a) => (a < 2 ? 0 : 1)),
      field(4, 1, () => 0),
      2,
    );
    expect(result.arrows).toHaveLength(1);
    expect(() => intensityArrows(field(4, 1, () => 1), field(2, 2, () => 1), 2)).toThrow(/one grid/);
  });

  it("chooses the block size that puts arrows about the wanted distance apart on screen", () => {
    // Cells of 0.1 m drawn at 40 px/m are 4 px: 9 cells (36 px) per arrow.
    expect(cellsPerArrowFor(0.1, 40, 36)).toBe(9);
    expect(cellsPerArrowFor(0.1, 1000, 36)).toBe(1);
  });
});
