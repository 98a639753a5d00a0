// Writes a pressure field as a PNG in Rarefact's own diverging scale (the field view's: teal for
// rarefaction, ember for compression, near-white at zero), symmetric about zero, solids in grey.
// Image rows run top to bottom, the field's rows bottom to top (y up).
import { PNG } from "pngjs";

import { LUT_SIZE, PRESSURE_SCALE } from "@/components/field-view/colour-scales";

import type { FieldSnapshot } from "@/lib/fdtd/simulation";

const SOLID_GREY = 96;

/** Colour scale limit: the 99.5th percentile of |p| (a single hot cell at a source does not wash the image out). */
function robustLimit(values: Float32Array): number {
  const magnitudes = Float32Array.from(values, Math.abs).sort();
  const at = magnitudes[Math.min(magnitudes.length - 1, Math.floor(0.995 * magnitudes.length))] ?? 0;
  return at > 0 ? at : Math.max(magnitudes[magnitudes.length - 1] ?? 0, 1e-30);
}

/** The colour of t in [-1, 1] (clamped): the pressure scale's lookup table, -1 at entry 0. */
function divergingColour(t: number): [number, number, number] {
  const u = Math.max(-1, Math.min(1, t));
  const k = 4 * Math.round(((u + 1) / 2) * (LUT_SIZE - 1));
  const lut = PRESSURE_SCALE.lut;
  return [lut[k]!, lut[k + 1]!, lut[k + 2]!];
}

/** Coarse fields are enlarged by whole pixels per cell to about this width. */
const MIN_IMAGE_WIDTH = 800;

/** PNG bytes of a field; `solidMask` (one byte per cell, `maskWidth` cells a row, 1 = solid) is drawn grey. */
export function fieldToPng(field: FieldSnapshot, solidMask?: Uint8Array, maskWidth?: number, maskStride = 1): Buffer {
  const { width, height, values } = field;
  const scale = Math.max(1, Math.floor(MIN_IMAGE_WIDTH / width));
  const png = new PNG({ width: width * scale, height: height * scale });
  const limit = robustLimit(values);
  for (let b = 0; b < height; b++) {
    for (let a = 0; a < width; a++) {
      const solid = solidMask && maskWidth ? solidMask[b * maskStride * maskWidth + a * maskStride] === 1 : false;
      const [r, g, bl] = solid ? [SOLID_GREY, SOLID_GREY, SOLID_GREY] : divergingColour(values[b * width + a]! / limit);
      for (let dy = 0; dy < scale; dy++) {
        const row = (height - 1 - b) * scale + dy;
        for (let dx = 0; dx < scale; dx++) {
          const o = 4 * (row * width * scale + a * scale + dx);
          png.data[o] = r;
          png.data[o + 1] = g;
          png.data[o + 2] = bl;
          png.data[o + 3] = 255;
        }
      }
    }
  }
  return PNG.sync.write(png);
}
