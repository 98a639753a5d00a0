// Pressure snapshots kept as 16-bit integers: each frame is scaled by its own largest |p|, so a
// quiet frame keeps as many significant digits as a loud one. The error this adds is bounded and
// stated here, so a reader of a saved run knows how far a replayed field may be from the computed one.

/** Largest stored integer; -32768 is never written, so the scale is symmetric. */
export const QUANTISATION_LEVELS = 32767;

/** Scale of a frame whose largest |p| is `maxAbs`: one integer step is this many pascals. */
export function quantisationScale(maxAbs: number): number {
  return maxAbs / QUANTISATION_LEVELS;
}

/**
 * Largest |decoded - original| of any value of a frame whose largest |p| is `maxAbs`: half a
 * quantisation step, maxAbs / 65534 (rounding to the nearest integer), plus the rounding of the
 * decoded value to float32, at most maxAbs * 2^-24.
 */
export function snapshotErrorBound(maxAbs: number): number {
  return maxAbs / (2 * QUANTISATION_LEVELS) + maxAbs * 2 ** -24;
}

/** Largest |value| of a frame, or NaN when it holds a value that is not finite. */
export function largestMagnitude(values: Float32Array): number {
  let largest = 0;
  for (let i = 0; i < values.length; i++) {
    const magnitude = Math.abs(values[i]!);
    if (!(magnitude <= largest)) {
      if (!Number.isFinite(magnitude)) return NaN;
      largest = magnitude;
    }
  }
  return largest;
}

/** Writes round(value / scale) of every value into `out`; a zero scale (a silent frame) writes zeros. */
export function quantiseFrame(values: Float32Array, scale: number, out: Int16Array): void {
  if (scale === 0) {
    out.fill(0);
    return;
  }
  const inverse = 1 / scale;
  for (let i = 0; i < values.length; i++) {
    // |values[i]| <= maxAbs, so the quotient lies in [-32767, 32767] up to rounding: clamp it there.
    const q = Math.round(values[i]! * inverse);
    out[i] = q > QUANTISATION_LEVELS ? QUANTISATION_LEVELS : q < -QUANTISATION_LEVELS ? -QUANTISATION_LEVELS : q;
  }
}

/** The frame back in pascals: value = integer * scale. */
export function dequantiseFrame(quantised: Int16Array, scale: number): Float32Array {
  const values = new Float32Array(quantised.length);
  for (let i = 0; i < quantised.length; i++) values[i] = quantised[i]! * scale;
  return values;
}
