// Writes a pressure field as a PNG: a diverging blue-white-red colour map, symmetric about zero, with
// solid cells in grey. Image rows run top to bottom, the field's rows bottom to top (y up).
import { PNG } from "pngjs";

import type { FieldSnapshot } from "@/lib/fdtd/simulation";

const SOLID_GREY = 96;

/** Colour scale limit: the 99.5th percentile of |p| (a single hot cell at a source does not wash the image out). */
function robustLimit(values: Float32Array): number {
  const magnitudes = Float32Array.from(values, Math.abs).sort();
  const at = magnitudes[Math.min(magnitudes.length - 1, Math.floor(0.995 * magnitudes.length))] ?? 0;
  return at > 0 ? at : Math.max(magnitudes[magnitudes.length - 1] ?? 0, 1e-30);
}

/** Blue (-1) through white (0) to red (+1). */
function divergingColour(t: number): [number, number, number] {
  const u = Math.max(-1, Math.min(1, t));
  if (u >= 0) return [255, Math.round(255 * (1 - u)), Math.round(255 * (1 - u))];
  return [Math.round(255 * (1 + u)), Math.round(255 * (1 + u)), 255];
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
