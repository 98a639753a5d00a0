// Sound speed and density of the propagation medium, from the scene's description of it.
import type { Medium } from "./scene";

/** Sea-level standard pressure, Pa (ISO 2533:1975, Standard Atmosphere). */
const STANDARD_PRESSURE = 101_325;
/** Specific gas constant of dry air, J/(kg K) (ISO 2533:1975). */
const GAS_CONSTANT_DRY_AIR = 287.05287;

/** Speed of sound in air at `temperature` degrees Celsius: c = 331.3 sqrt(1 + T / 273.15) m/s. */
export function speedOfSoundInAir(temperature: number): number {
  return 331.3 * Math.sqrt(1 + temperature / 273.15);
}

/** Density of dry air at standard pressure and `temperature` degrees Celsius (ideal-gas law), kg/m^3. */
export function densityOfAir(temperature: number): number {
  return STANDARD_PRESSURE / (GAS_CONSTANT_DRY_AIR * (temperature + 273.15));
}

export interface MediumProperties {
  /** m/s */
  soundSpeed: number;
  /** kg/m^3 */
  density: number;
}

export function mediumProperties(medium: Medium): MediumProperties {
  if (medium.kind === "air") {
    return { soundSpeed: speedOfSoundInAir(medium.temperature), density: medium.density ?? densityOfAir(medium.temperature) };
  }
  return { soundSpeed: medium.soundSpeed, density: medium.density };
}
