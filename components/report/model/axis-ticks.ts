// Round tick positions for the scene figure's axes in metres.

/** A 1, 2 or 5 times a power of ten at least `rough`. */
export function roundStep(rough: number): number {
  const power = Math.pow(10, Math.floor(Math.log10(rough)));
  for (const factor of [1, 2, 5, 10]) if (factor * power >= rough - 1e-12) return factor * power;
  return 10 * power;
}

/** Ticks on round values within [min, max], about `count` of them; the step is returned with them. */
export function axisTicks(min: number, max: number, count = 6): { step: number; ticks: number[] } {
  if (!(max > min) || count < 1) return { step: 1, ticks: [] };
  const step = roundStep((max - min) / count);
  const ticks: number[] = [];
  for (let k = Math.ceil(min / step - 1e-9); k * step <= max + 1e-9; k++) ticks.push(Number((k * step).toPrecision(12)));
  return { step, ticks };
}
