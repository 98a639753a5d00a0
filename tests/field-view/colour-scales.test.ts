// Rarefact's own colour scales: symmetric, inside the sRGB gamut, in the house hues, perceptually even.
import { describe, expect, it } from "vitest";

import { cssGradient, LEVEL_DIFFERENCE_SCALE, LEVEL_SCALE, LUT_SIZE, PRESSURE_SCALE, type ColourScale } from "@/components/field-view/colour-scales";
import { hexToRgb, okLabDistance, okLabHue, okLabToSrgb, rgbToHex, srgbToOkLab, toByte } from "@/components/field-view/oklab";

const chroma = (c: readonly number[]) => Math.hypot(c[1]!, c[2]!);
const hueDistance = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);

function steps(scale: ColourScale, from: number, to: number): number[] {
  const out: number[] = [];
  for (let i = from + 1; i <= to; i++) out.push(okLabDistance(scale.okLab[i - 1]!, scale.okLab[i]!));
  return out;
}

describe.each([PRESSURE_SCALE, LEVEL_SCALE, LEVEL_DIFFERENCE_SCALE])("colour scale $id", (scale) => {
  it("is a 256-entry opaque RGBA table rounded from its OKLab entries", () => {
    expect(scale.lut.length).toBe(LUT_SIZE * 4);
    expect(scale.okLab.length).toBe(LUT_SIZE);
    for (let i = 0; i < LUT_SIZE; i++) {
      const rgb = okLabToSrgb(scale.okLab[i]!);
      expect([scale.lut[4 * i], scale.lut[4 * i + 1], scale.lut[4 * i + 2], scale.lut[4 * i + 3]]).toEqual([toByte(rgb[0]), toByte(rgb[1]), toByte(rgb[2]), 255]);
    }
  });

  it("stays inside the sRGB gamut without clipping (every channel within [0, 1] before rounding)", () => {
    for (const colour of scale.okLab) {
      for (const channel of okLabToSrgb(colour)) {
        expect(channel).toBeGreaterThanOrEqual(-1e-9);
        expect(channel).toBeLessThanOrEqual(1 + 1e-9);
      }
    }
  });

  it("gives CSS gradient stops from the low end to the high end that match the table", () => {
    const stops = scale.gradientStops;
    expect(stops[0]).toEqual({ offset: 0, colour: rgbToHex(okLabToSrgb(scale.okLab[0]!)) });
    expect(stops.at(-1)).toEqual({ offset: 1, colour: rgbToHex(okLabToSrgb(scale.okLab[LUT_SIZE - 1]!)) });
    for (let k = 1; k < stops.length; k++) expect(stops[k]!.offset).toBeGreaterThan(stops[k - 1]!.offset);
    expect(cssGradient(scale, "to top")).toMatch(/^linear-gradient\(to top, #[0-9a-f]{6} 0\.0%, .* #[0-9a-f]{6} 100\.0%\)$/);
  });
});

describe("the pressure scale (diverging)", () => {
  const lab = PRESSURE_SCALE.okLab;

  it("is symmetric in lightness about zero: entry i and entry 255 - i have the same L", () => {
    for (let i = 0; i < LUT_SIZE / 2; i++) expect(lab[i]![0]).toBeCloseTo(lab[LUT_SIZE - 1 - i]![0], 12);
  });

  it("is near-white at zero and darkens steadily towards both ends", () => {
    for (const centre of [127, 128]) {
      expect(lab[centre]![0]).toBeGreaterThan(0.96);
      expect(chroma(lab[centre]!)).toBeLessThan(0.01);
    }
    for (let i = 1; i < 128; i++) expect(lab[i]![0]).toBeGreaterThan(lab[i - 1]![0]);
    expect(lab[0]![0]).toBeLessThan(0.45);
  });

  it("draws rarefaction in the house teal and compression in the house ember (hues of tide-500 and ember-500 within 3 degrees)", () => {
    const tide = okLabHue(srgbToOkLab(hexToRgb("#1f8f8a")));
    const ember = okLabHue(srgbToOkLab(hexToRgb("#d65a2c")));
    for (let i = 0; i < LUT_SIZE; i++) {
      if (chroma(lab[i]!) < 0.02) continue;
      expect(hueDistance(okLabHue(lab[i]!), i < 128 ? tide : ember)).toBeLessThan(3);
    }
  });

  it("takes perceptually even steps: within each half, neighbouring entries differ by the same OKLab distance to within 10%", () => {
    for (const [from, to] of [
      [0, 127],
      [128, 255],
    ] as const) {
      const distances = steps(PRESSURE_SCALE, from, to);
      const mean = distances.reduce((a, b) => a + b, 0) / distances.length;
      for (const d of distances) expect(Math.abs(d - mean) / mean).toBeLessThan(0.1);
    }
  });

  it("is turned round for the level difference, so a quieter variant (positive insertion loss) reads teal", () => {
    for (let i = 0; i < LUT_SIZE; i++) expect(LEVEL_DIFFERENCE_SCALE.okLab[i]).toEqual(lab[LUT_SIZE - 1 - i]);
  });
});

describe("the level scale (sequential)", () => {
  const lab = LEVEL_SCALE.okLab;

  it("gets lighter at every step, from dark (L < 0.3) to pale (L > 0.9)", () => {
    for (let i = 1; i < LUT_SIZE; i++) expect(lab[i]![0]).toBeGreaterThan(lab[i - 1]![0]);
    expect(lab[0]![0]).toBeLessThan(0.3);
    expect(lab[LUT_SIZE - 1]![0]).toBeGreaterThan(0.9);
  });

  it("takes perceptually even steps: neighbouring entries differ by the same OKLab distance to within 5%", () => {
    const distances = steps(LEVEL_SCALE, 0, LUT_SIZE - 1);
    const mean = distances.reduce((a, b) => a + b, 0) / distances.length;
    for (const d of distances) expect(Math.abs(d - mean) / mean).toBeLessThan(0.05);
  });
});
