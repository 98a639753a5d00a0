// Synthetic pressure traces with known statistics for the analysis tests.

/** A sine of `amplitude` Pa at `frequency` Hz, `count` samples `timeStep` s apart. */
export function sineTrace(amplitude: number, frequency: number, timeStep: number, count: number, phase = 0.4): Float64Array {
  return Float64Array.from({ length: count }, (_, n) => amplitude * Math.sin(2 * Math.PI * frequency * n * timeStep + phase));
}

/**
 * Gaussian white noise of standard deviation `sigma`: a linear congruential generator (Numerical Recipes
 * constants) through the Box-Muller transform, so the sequence repeats from run to run.
 */
export function gaussianNoise(count: number, sigma: number, seed = 2024): Float64Array {
  let state = seed;
  const uniform = () => {
    state = (1664525 * state + 1013904223) % 4294967296;
    return (state + 0.5) / 4294967296;
  };
  const out = new Float64Array(count);
  for (let n = 0; n < count; n += 2) {
    const radius = sigma * Math.sqrt(-2 * Math.log(uniform()));
    const angle = 2 * Math.PI * uniform();
    out[n] = radius * Math.cos(angle);
    if (n + 1 < count) out[n + 1] = radius * Math.sin(angle);
  }
  return out;
}

/** Sound pressure level of a mean square, dB re 20 uPa, written out here rather than taken from the code under test. */
export const levelOf = (meanSquare: number) => 10 * Math.log10(meanSquare / 4e-10);
