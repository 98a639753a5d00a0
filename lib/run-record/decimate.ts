// Thinning a run's fields to the size a saved run may have: snapshots in time (every k-th frame)
// and in space (every s-th cell), level and intensity maps by blocks of cells that keep their meaning
// (the peak of a block is the largest peak in it, its RMS the RMS over it, its intensity the mean).
import type { FieldSnapshot } from "@/lib/fdtd/simulation";

/** k such that keeping every k-th of `count` frames leaves at most `limit`. */
export function frameStrideForLimit(count: number, limit: number): number {
  return Math.max(1, Math.ceil(count / limit));
}

/**
 * Frames k-1, 2k-1, 3k-1, ...: with snapshots every N steps, those at steps kN, 2kN, ..., as if the
 * scene had asked for a snapshot every kN steps.
 */
export function everyKthFrame<T>(frames: readonly T[], k: number): T[] {
  return frames.filter((_, index) => (index + 1) % k === 0);
}

/** Values along one axis of `length` cells when every `stride`-th is kept (the first always). */
export function thinnedLength(length: number, stride: number): number {
  return Math.ceil(length / stride);
}

/** Smallest s such that a width x height field thinned to every s-th cell has at most `limit` values. */
export function cellStrideForLimit(width: number, height: number, limit: number): number {
  let stride = Math.max(1, Math.floor(Math.sqrt((width * height) / limit)));
  while (thinnedLength(width, stride) * thinnedLength(height, stride) > limit) stride++;
  return stride;
}

/** Every `stride`-th cell in x and y; the first value keeps its position, the spacing grows. */
export function thinField(field: FieldSnapshot, stride: number): FieldSnapshot {
  if (stride === 1) return field;
  const width = thinnedLength(field.width, stride);
  const height = thinnedLength(field.height, stride);
  const values = new Float32Array(width * height);
  for (let b = 0; b < height; b++) {
    const row = b * stride * field.width;
    for (let a = 0; a < width; a++) values[b * width + a] = field.values[row + a * stride]!;
  }
  return { ...field, width, height, spacing: field.spacing * stride, values };
}

export type BlockRule = "max" | "rms" | "mean";

/**
 * Blocks of `block` x `block` cells become one value by `rule`. The value sits at the centre of a
 * full block; blocks cut short at the right and top edges combine the cells they have.
 */
export function coarsenField(field: FieldSnapshot, block: number, rule: BlockRule): FieldSnapshot {
  if (block === 1) return field;
  const width = thinnedLength(field.width, block);
  const height = thinnedLength(field.height, block);
  const values = new Float32Array(width * height);
  for (let b = 0; b < height; b++) {
    const rowEnd = Math.min(field.height, (b + 1) * block);
    for (let a = 0; a < width; a++) {
      const columnEnd = Math.min(field.width, (a + 1) * block);
      let accumulated = 0;
      let cells = 0;
      for (let j = b * block; j < rowEnd; j++) {
        for (let i = a * block; i < columnEnd; i++) {
          const value = field.values[j * field.width + i]!;
          if (rule === "max") accumulated = Math.max(accumulated, value);
          else accumulated += rule === "rms" ? value * value : value;
          cells++;
        }
      }
      values[b * width + a] = rule === "max" ? accumulated : rule === "rms" ? Math.sqrt(accumulated / cells) : accumulated / cells;
    }
  }
  const shift = ((block - 1) / 2) * field.spacing;
  return { ...field, width, height, x0: field.x0 + shift, y0: field.y0 + shift, spacing: field.spacing * block, values };
}
