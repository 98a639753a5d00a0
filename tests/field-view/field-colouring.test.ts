// The CPU colour mapping shared by the byte-texture path and the 2D fallback.
import { describe, expect, it } from "vitest";

import { colourIndex, encodeNormalisedBytes, rasteriseField } from "@/components/field-view/field-colouring";

describe("colour index", () => {
  it("maps low to entry 0, high to 255, the middle to 128 (round(127.5)), and clamps outside", () => {
    expect(colourIndex(-2, -2, 2)).toBe(0);
    expect(colourIndex(2, -2, 2)).toBe(255);
    expect(colourIndex(0, -2, 2)).toBe(128);
    expect(colourIndex(-1, -2, 2)).toBe(64); // t = 0.25, 63.75 -> 64
    expect(colourIndex(-9, -2, 2)).toBe(0);
    expect(colourIndex(9, -2, 2)).toBe(255);
    expect(colourIndex(Number.NaN, -2, 2)).toBe(0);
  });

  it("encodes a whole grid into normalised bytes", () => {
    const out = new Uint8Array(3);
    encodeNormalisedBytes(Float32Array.from([40, 60, 80]), 40, 80, out);
    expect(Array.from(out)).toEqual([0, 128, 255]);
    expect(() => encodeNormalisedBytes(new Float32Array(3), 0, 1, new Uint8Array(2))).toThrow(RangeError);
  });
});

describe("rasterised field", () => {
  // A table whose entry i is (i, 255 - i, 7, 255), so each pixel says which entry it took.
  const lut = new Uint8Array(256 * 4);
  for (let i = 0; i < 256; i++) lut.set([i, 255 - i, 7, 255], 4 * i);

  it("puts field row 0 (the bottom, y up) in the last image row (canvas rows run down)", () => {
    // 2 x 2 field: bottom row [0, 1], top row [2, 3]; range 0..3.
    const out = new Uint8ClampedArray(16);
    rasteriseField(Float32Array.from([0, 1, 2, 3]), 2, 2, { low: 0, high: 3, lut }, out);
    const entries = [0, 1, 2, 3].map((pixel) => out[4 * pixel]);
    // Image row 0 = field row 1 (values 2, 3 -> entries 170, 255); image row 1 = field row 0 (0, 85).
    expect(entries).toEqual([170, 255, 0, 85]);
    expect(out[1]).toBe(255 - 170);
    expect(out[3]).toBe(255);
  });

  it("refuses buffers of the wrong size", () => {
    expect(() => rasteriseField(new Float32Array(4), 2, 2, { low: 0, high: 1, lut }, new Uint8ClampedArray(12))).toThrow(RangeError);
    expect(() => rasteriseField(new Float32Array(3), 2, 2, { low: 0, high: 1, lut }, new Uint8ClampedArray(16))).toThrow(RangeError);
  });
});
