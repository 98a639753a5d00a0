// OKLab conversion against its published definition and the sRGB standard.
import { describe, expect, it } from "vitest";

import { hexToRgb, linearSrgbToOkLab, linearToSrgb, okLabHue, okLabToSrgb, rgbToHex, srgbToLinear, srgbToOkLab } from "@/components/field-view/oklab";

// IEC 61966-2-1:1999 (sRGB), the XYZ (D65) -> linear RGB matrix as printed in the standard (4 decimals).
const XYZ_TO_LINEAR_SRGB = [
  [3.2406, -1.5372, -0.4986],
  [-0.9689, 1.8758, 0.0415],
  [0.0557, -0.204, 1.057],
] as const;

function okLabOfXyz(x: number, y: number, z: number) {
  const [r, g, b] = XYZ_TO_LINEAR_SRGB.map((row) => row[0] * x + row[1] * y + row[2] * z) as [number, number, number];
  return linearSrgbToOkLab(r, g, b);
}

describe("OKLab", () => {
  // Björn Ottosson, "A perceptual color space for image processing" (2020), table of XYZ -> OKLab pairs
  // (3 decimals). Tolerance 2.5e-3: the table's rounding plus the 4-decimal sRGB matrix used to reach XYZ.
  it.each([
    { xyz: [0.95, 1, 1.089], lab: [1, 0, 0] },
    { xyz: [1, 0, 0], lab: [0.45, 1.236, -0.019] },
    { xyz: [0, 1, 0], lab: [0.922, -0.671, 0.263] },
    { xyz: [0, 0, 1], lab: [0.153, -1.415, -0.449] },
  ])("maps XYZ $xyz to Ottosson's OKLab $lab", ({ xyz, lab }) => {
    const result = okLabOfXyz(xyz[0]!, xyz[1]!, xyz[2]!);
    for (let c = 0; c < 3; c++) expect(Math.abs(result[c]! - lab[c]!)).toBeLessThan(2.5e-3);
  });

  it("puts sRGB white at L = 1 with no chroma (Ottosson 2020: the matrices are normalised to D65 white)", () => {
    const [L, a, b] = srgbToOkLab([1, 1, 1]);
    expect(L).toBeCloseTo(1, 4);
    expect(Math.hypot(a, b)).toBeLessThan(1e-4);
  });

  it("gives sRGB red and blue their OKLCh values (W3C CSS Color Module Level 4 examples, from memory: red 62.8% 0.258 29.2 deg, blue 45.2% 0.313 264.1 deg)", () => {
    const red = srgbToOkLab([1, 0, 0]);
    expect(red[0]).toBeCloseTo(0.628, 3);
    expect(Math.hypot(red[1], red[2])).toBeCloseTo(0.2577, 3);
    expect(okLabHue(red)).toBeCloseTo(29.23, 1);
    const blue = srgbToOkLab([0, 0, 1]);
    expect(blue[0]).toBeCloseTo(0.452, 3);
    expect(Math.hypot(blue[1], blue[2])).toBeCloseTo(0.3132, 3);
    expect(okLabHue(blue)).toBeCloseTo(264.05, 1);
  });

  it("inverts itself to 1e-5 over a lattice of sRGB colours (the published matrices are 10-digit inverses of each other)", () => {
    for (let r = 0; r <= 1; r += 0.25) {
      for (let g = 0; g <= 1; g += 0.25) {
        for (let b = 0; b <= 1; b += 0.25) {
          const back = okLabToSrgb(srgbToOkLab([r, g, b]));
          expect(Math.abs(back[0] - r) + Math.abs(back[1] - g) + Math.abs(back[2] - b)).toBeLessThan(1e-5);
        }
      }
    }
  });

  it("follows the IEC 61966-2-1 transfer function: 0.5 encoded is 0.21404 linear, and the linear toe below 0.04045", () => {
    // ((0.5 + 0.055) / 1.055)^2.4 = 0.214041 (hand-computed)
    expect(srgbToLinear(0.5)).toBeCloseTo(0.214041, 6);
    expect(srgbToLinear(0.04)).toBeCloseTo(0.04 / 12.92, 12);
    expect(linearToSrgb(srgbToLinear(0.73))).toBeCloseTo(0.73, 12);
  });

  it("reports colours outside the sRGB gamut as channels outside [0, 1]", () => {
    // Chroma 0.3 at a teal hue is far beyond what sRGB can show.
    const rgb = okLabToSrgb([0.6, -0.3, -0.05]);
    expect(Math.min(...rgb)).toBeLessThan(0);
  });

  it("reads and writes #rrggbb", () => {
    expect(hexToRgb("#1f8f8a")).toEqual([31 / 255, 143 / 255, 138 / 255]);
    expect(rgbToHex([31 / 255, 143 / 255, 138 / 255])).toBe("#1f8f8a");
    expect(rgbToHex([1.2, -0.1, 0.5])).toBe("#ff0080");
    expect(() => hexToRgb("teal")).toThrow(/#rrggbb/);
  });
});
