// Field values -> colour-table positions on the CPU, for the two paths that cannot do it on the GPU:
// WebGL1 without float textures (values go up as normalised bytes) and the 2D-canvas fallback (RGBA
// pixels for putImageData). Both use the same mapping as the shader: t = (v - low) / (high - low), clamped
// to [0, 1], entry round(255 t) of the 256-entry table. No allocation: outputs come from the caller.

/** What one drawing of a field needs besides where to put it. */
export interface FieldColouring {
  /** Values mapped to the low end (entry 0) and high end (entry 255) of the table. */
  low: number;
  high: number;
  /** 256 RGBA entries. */
  lut: Uint8Array;
}

/** Table entry 0..255 for value v; the low end for NaN so a gap never shows as a colour it is not. */
export function colourIndex(value: number, low: number, high: number): number {
  const t = (value - low) / (high - low);
  if (!(t > 0)) return 0;
  if (t >= 1) return 255;
  return Math.round(t * 255);
}

/** Writes colourIndex of every value into `out` (same length): the normalised-byte texture of the WebGL1 path. */
export function encodeNormalisedBytes(values: Float32Array, low: number, high: number, out: Uint8Array): void {
  if (out.length !== values.length) throw new RangeError(`encodeNormalisedBytes: ${values.length} values but room for ${out.length}`);
  for (let k = 0; k < values.length; k++) out[k] = colourIndex(values[k]!, low, high);
}

/**
 * RGBA pixels of a row-major field (a fastest, row 0 at the bottom, y up) into `out`, an image whose first
 * row is the top (canvas convention): field row b becomes image row height - 1 - b.
 */
export function rasteriseField(values: Float32Array, width: number, height: number, colouring: FieldColouring, out: Uint8ClampedArray): void {
  if (values.length !== width * height) throw new RangeError(`rasteriseField: ${values.length} values for a ${width} x ${height} grid`);
  if (out.length !== 4 * width * height) throw new RangeError(`rasteriseField: room for ${out.length / 4} pixels, ${width * height} needed`);
  const { low, high, lut } = colouring;
  for (let b = 0; b < height; b++) {
    const source = b * width;
    const target = (height - 1 - b) * width * 4;
    for (let a = 0; a < width; a++) {
      const entry = 4 * colourIndex(values[source + a]!, low, high);
      const pixel = target + 4 * a;
      out[pixel] = lut[entry]!;
      out[pixel + 1] = lut[entry + 1]!;
      out[pixel + 2] = lut[entry + 2]!;
      out[pixel + 3] = lut[entry + 3]!;
    }
  }
}
