/**
 * Plane-wave reflection at a locally reacting surface of real normalised impedance z = Z / (rho0 c).
 *
 *   R(theta) = (z cos theta - 1) / (z cos theta + 1),   alpha(theta) = 1 - R(theta)^2
 *
 * theta measured from the surface normal; normal incidence theta = 0 gives R = (z - 1) / (z + 1)
 * (Kuttruff, Room Acoustics, ch. 2, reflection of plane waves by a locally reacting wall; equation numbers
 * not checked). R follows from continuity of pressure and normal velocity with p / v_n = Z on the wall.
 * For z > 1, R vanishes at cos theta = 1/z: the wall absorbs completely at that angle.
 */

function checkImpedance(z: number): void {
  if (!(z > 0)) throw new RangeError(`normalised impedance must be positive, got ${z}`);
}

/** Reflection factor at normal incidence, (z - 1) / (z + 1). z = Infinity (rigid) gives 1. */
export function normalIncidenceReflection(z: number): number {
  checkImpedance(z);
  if (z === Infinity) return 1;
  return (z - 1) / (z + 1);
}

/** Absorption coefficient at normal incidence, 1 - R^2 = 4z / (z + 1)^2. */
export function normalIncidenceAbsorption(z: number): number {
  const reflection = normalIncidenceReflection(z);
  return 1 - reflection * reflection;
}

/**
 * The impedance z >= 1 with normal-incidence absorption alpha (0 < alpha <= 1): R = sqrt(1 - alpha),
 * z = (1 + R) / (1 - R). The other root, 1/z < 1, absorbs the same; alpha = 0 gives Infinity (rigid).
 */
export function impedanceFromAbsorption(alpha: number): number {
  if (!(alpha >= 0 && alpha <= 1)) throw new RangeError(`absorption must lie in [0, 1], got ${alpha}`);
  if (alpha === 0) return Infinity;
  const reflection = Math.sqrt(1 - alpha);
  return (1 + reflection) / (1 - reflection);
}

/**
 * Reflection factor at angle of incidence theta (rad from the normal, 0 <= theta <= pi/2).
 * Grazing incidence (theta = pi/2) gives -1 for any finite z.
 */
export function obliqueIncidenceReflection(z: number, angle: number): number {
  checkImpedance(z);
  if (!(angle >= 0 && angle <= 0.5 * Math.PI)) throw new RangeError(`angle of incidence must lie in [0, pi/2], got ${angle}`);
  if (z === Infinity) return 1;
  const zc = z * Math.cos(angle);
  return (zc - 1) / (zc + 1);
}

/** Absorption coefficient at angle of incidence theta, 1 - R(theta)^2. */
export function obliqueIncidenceAbsorption(z: number, angle: number): number {
  const reflection = obliqueIncidenceReflection(z, angle);
  return 1 - reflection * reflection;
}
