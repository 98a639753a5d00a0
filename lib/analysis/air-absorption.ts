// Sound absorption by the atmosphere per ISO 9613-1:1993: the pure-tone attenuation coefficient from
// temperature, humidity and pressure (classical and rotational absorption plus the vibrational relaxation
// of oxygen and nitrogen), and its use on band levels over a distance. The 2D solver itself is lossless in
// air, so this is applied afterwards.
import type { FrequencyBand } from "./bands";

export interface Atmosphere {
  temperatureCelsius: number;
  /** Relative humidity, percent. */
  relativeHumidity: number;
  /** Ambient pressure, Pa. */
  pressure: number;
}

/** Reference ambient pressure p_r, Pa, and reference temperature T0, K (ISO 9613-1). */
export const REFERENCE_AMBIENT_PRESSURE = 101325;
export const REFERENCE_TEMPERATURE = 293.15;
/** Triple-point isotherm temperature T01 of the saturation vapour pressure formula, K. */
const TRIPLE_POINT_TEMPERATURE = 273.16;

const kelvin = (atmosphere: Atmosphere) => atmosphere.temperatureCelsius + 273.15;

/** Saturation vapour pressure over liquid water, Pa: p_r 10^C with C = -6.8346 (T01 / T)^1.261 + 4.6151 (ISO 9613-1, Annex B; annex from memory). */
export function saturationVapourPressure(temperatureKelvin: number): number {
  const exponent = -6.8346 * Math.pow(TRIPLE_POINT_TEMPERATURE / temperatureKelvin, 1.261) + 4.6151;
  return REFERENCE_AMBIENT_PRESSURE * Math.pow(10, exponent);
}

/** Molar concentration of water vapour h, percent: h_r p_sat / p_a. */
export function molarConcentrationOfWaterVapour(atmosphere: Atmosphere): number {
  return (atmosphere.relativeHumidity * saturationVapourPressure(kelvin(atmosphere))) / atmosphere.pressure;
}

/** Relaxation frequencies of oxygen and nitrogen, Hz (ISO 9613-1, h in percent). */
export function relaxationFrequencies(atmosphere: Atmosphere): { oxygen: number; nitrogen: number } {
  const h = molarConcentrationOfWaterVapour(atmosphere);
  const pressureRatio = atmosphere.pressure / REFERENCE_AMBIENT_PRESSURE;
  const temperatureRatio = kelvin(atmosphere) / REFERENCE_TEMPERATURE;
  const oxygen = pressureRatio * (24 + (4.04e4 * h * (0.02 + h)) / (0.391 + h));
  const nitrogen = pressureRatio * Math.pow(temperatureRatio, -0.5) * (9 + 280 * h * Math.exp(-4.17 * (Math.pow(temperatureRatio, -1 / 3) - 1)));
  return { oxygen, nitrogen };
}

/**
 * Pure-tone attenuation coefficient alpha, dB/m, at `frequency` Hz:
 * alpha = 8.686 f^2 [1.84e-11 (p_a/p_r)^-1 (T/T0)^(1/2) + (T/T0)^(-5/2) (0.01275 e^(-2239.1/T) / (f_rO + f^2/f_rO)
 *         + 0.1068 e^(-3352.0/T) / (f_rN + f^2/f_rN))].
 * ISO 9613-1 states its accuracy (about +-10%, from memory) for h from 0.05 to 5 %, T from 253 to 323 K
 * and p_a below 200 kPa (ranges from memory).
 */
export function airAttenuationCoefficient(frequency: number, atmosphere: Atmosphere): number {
  const { oxygen, nitrogen } = relaxationFrequencies(atmosphere);
  const temperature = kelvin(atmosphere);
  const temperatureRatio = temperature / REFERENCE_TEMPERATURE;
  const f2 = frequency * frequency;
  const classical = (1.84e-11 * Math.sqrt(temperatureRatio)) / (atmosphere.pressure / REFERENCE_AMBIENT_PRESSURE);
  const oxygenTerm = (0.01275 * Math.exp(-2239.1 / temperature)) / (oxygen + f2 / oxygen);
  const nitrogenTerm = (0.1068 * Math.exp(-3352.0 / temperature)) / (nitrogen + f2 / nitrogen);
  return 8.686 * f2 * (classical + Math.pow(temperatureRatio, -2.5) * (oxygenTerm + nitrogenTerm));
}

/** Shown beside band levels that include air absorption. */
export const BAND_CENTRE_SIMPLIFICATION =
  "Air absorption is applied per band with the pure-tone coefficient at the exact midband frequency (ISO 9613-1). " +
  "Across a wide band the coefficient varies, so this is approximate where the absorption within the band is large (long distances, high frequencies).";

/** Attenuation by air over `distance` m for each band, dB, from the coefficient at its exact midband frequency. */
export function bandAirAttenuation(bands: readonly FrequencyBand[], distance: number, atmosphere: Atmosphere): Float64Array {
  return Float64Array.from(bands, (band) => airAttenuationCoefficient(band.centre, atmosphere) * distance);
}

/** Band levels lowered by air absorption over `distance` m (levels in the order of `bands`). */
export function applyAirAbsorption(levels: ArrayLike<number>, bands: readonly FrequencyBand[], distance: number, atmosphere: Atmosphere): Float64Array {
  if (levels.length !== bands.length) throw new RangeError(`${levels.length} levels for ${bands.length} bands`);
  const attenuation = bandAirAttenuation(bands, distance, atmosphere);
  return Float64Array.from(attenuation, (loss, b) => (levels[b] ?? NaN) - loss);
}
