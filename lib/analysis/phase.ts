// Phase unwrapping for transfer functions sampled on a frequency grid.

/** Wraps an angle into (-pi, pi]. */
export function wrapPhase(angle: number): number {
  const turns = Math.round(angle / (2 * Math.PI));
  let wrapped = angle - 2 * Math.PI * turns;
  if (wrapped <= -Math.PI) wrapped += 2 * Math.PI;
  return wrapped;
}

/**
 * Unwraps a sequence of wrapped phases (rad) so that neighbours differ by less than pi; the first value is
 * moved to the branch nearest `firstNear` (e.g. a nominal k * distance at the lowest frequency).
 */
export function unwrapPhases(wrapped: ArrayLike<number>, firstNear: number): Float64Array {
  const out = new Float64Array(wrapped.length);
  if (wrapped.length === 0) return out;
  out[0] = (wrapped[0] ?? 0) + 2 * Math.PI * Math.round((firstNear - (wrapped[0] ?? 0)) / (2 * Math.PI));
  for (let k = 1; k < wrapped.length; k++) out[k] = out[k - 1]! + wrapPhase((wrapped[k] ?? 0) - (wrapped[k - 1] ?? 0));
  return out;
}
