// A small table of common surfaces, each reduced to one real normalised impedance for the solver,
// and the conversion between a normal-incidence absorption coefficient and that impedance.

/**
 * Plane-wave reflection coefficient at normal incidence of a locally reacting surface with real
 * normalised impedance z = Z / (rho c): R = (z - 1) / (z + 1)
 * (Kinsler, Frey, Coppens & Sanders, Fundamentals of Acoustics, 4th ed., ch. 6).
 * z = Infinity (rigid) gives R = 1; z = 1 gives R = 0.
 */
export function reflectionFromImpedance(z: number): number {
  if (z === Infinity) return 1;
  return (z - 1) / (z + 1);
}

/** Normal-incidence absorption coefficient alpha = 1 - R^2 of a real normalised impedance z. */
export function absorptionFromImpedance(z: number): number {
  const r = reflectionFromImpedance(z);
  return 1 - r * r;
}

/**
 * Real normalised impedance with normal-incidence absorption alpha.
 * Both z and 1/z give the same alpha; this returns the root z >= 1 (R >= 0, a surface stiffer than
 * air, as porous linings on a rigid backing are at mid frequencies): R = sqrt(1 - alpha),
 * z = (1 + R) / (1 - R). alpha = 0 gives Infinity (rigid), alpha = 1 gives 1.
 */
export function impedanceFromAbsorption(alpha: number): number {
  if (!(alpha >= 0 && alpha <= 1)) throw new RangeError(`absorption coefficient ${alpha} is outside [0, 1]`);
  const r = Math.sqrt(1 - alpha);
  if (r === 1) return Infinity;
  return (1 + r) / (1 - r);
}

export interface Material {
  id: string;
  label: string;
  /** Normal-incidence absorption coefficient the solver uses (one value for all frequencies). */
  absorption: number;
  /** Where the value comes from. */
  source: string;
}

// Values are single mid-frequency (500 Hz to 1 kHz octave) absorption coefficients of the kind
// printed in room-acoustics handbook tables. They are recalled, not copied from a table at hand:
// each entry says "from memory". Handbook tables list random-incidence (Sabine) coefficients;
// using them as normal-incidence values is an approximation a user should know about.
const FROM_MEMORY = "from memory: typical handbook value near 500 Hz to 1 kHz (random incidence used as normal incidence)";

export const MATERIAL_IDS = [
  "concrete-painted",
  "brick-unglazed",
  "asphalt",
  "glass-window",
  "plasterboard-on-studs",
  "wood-panel",
  "grass-ground",
  "carpet-on-concrete",
  "heavy-curtain",
  "mineral-wool-50mm",
  "absorptive-barrier-panel",
] as const;

export type MaterialId = (typeof MATERIAL_IDS)[number];

export const MATERIALS: Readonly<Record<MaterialId, Material>> = {
  "concrete-painted": { id: "concrete-painted", label: "Concrete, painted", absorption: 0.02, source: FROM_MEMORY },
  "brick-unglazed": { id: "brick-unglazed", label: "Brick, unglazed", absorption: 0.03, source: FROM_MEMORY },
  asphalt: { id: "asphalt", label: "Asphalt road surface", absorption: 0.03, source: FROM_MEMORY },
  "glass-window": { id: "glass-window", label: "Glass window", absorption: 0.05, source: FROM_MEMORY },
  "plasterboard-on-studs": { id: "plasterboard-on-studs", label: "Plasterboard on studs", absorption: 0.06, source: FROM_MEMORY },
  "wood-panel": { id: "wood-panel", label: "Wood panelling", absorption: 0.1, source: FROM_MEMORY },
  "grass-ground": { id: "grass-ground", label: "Grass-covered ground", absorption: 0.35, source: FROM_MEMORY },
  "carpet-on-concrete": { id: "carpet-on-concrete", label: "Carpet on concrete", absorption: 0.35, source: FROM_MEMORY },
  "heavy-curtain": { id: "heavy-curtain", label: "Heavy curtain, draped", absorption: 0.55, source: FROM_MEMORY },
  "mineral-wool-50mm": { id: "mineral-wool-50mm", label: "Mineral wool 50 mm on rigid backing", absorption: 0.9, source: FROM_MEMORY },
  "absorptive-barrier-panel": {
    id: "absorptive-barrier-panel",
    label: "Absorptive noise-barrier panel",
    absorption: 0.8,
    source: FROM_MEMORY,
  },
};

/** The real normalised impedance the solver uses for a table material. */
export function materialImpedance(id: MaterialId): number {
  return impedanceFromAbsorption(MATERIALS[id].absorption);
}
