// Air absorption per ISO 9613-1:1993 against published values.
//
// The attenuation coefficients come from ISO 9613-2:1996, Table 2 (octave bands, 101.325 kPa), which that
// standard computes with ISO 9613-1 at the exact midband frequencies. The entries are from memory, and so is
// the statement of how they were computed; ISO 9613-1's own Table 1 was not at hand to check. Because of
// that, each entry is allowed one unit of its last printed digit (twice the rounding) rather than half.
import { describe, expect, it } from "vitest";

import { airAttenuationCoefficient, applyAirAbsorption, type Atmosphere, bandAirAttenuation, molarConcentrationOfWaterVapour, relaxationFrequencies, saturationVapourPressure } from "@/lib/analysis/air-absorption";
import { bandsBetween } from "@/lib/analysis/bands";

const atmosphere = (temperatureCelsius: number, relativeHumidity: number, pressure = 101325): Atmosphere => ({ temperatureCelsius, relativeHumidity, pressure });

/** Octave bands 63 Hz .. 8 kHz (exact midband frequencies 1000 * 10^(0.3 x) Hz, x = -4 .. 3). */
const OCTAVES = bandsBetween(63, 8000, 1);

/** ISO 9613-2:1996 Table 2, dB/km (from memory), per atmosphere, 63 Hz .. 8 kHz. */
const TABLE_2: { temperature: number; humidity: number; values: number[]; lastDigit: number[] }[] = [
  { temperature: 10, humidity: 70, values: [0.1, 0.4, 1.0, 1.9, 3.7, 9.7, 32.8, 117], lastDigit: [0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 1] },
  { temperature: 20, humidity: 70, values: [0.1, 0.3, 1.1, 2.8, 5.0, 9.0, 22.9, 76.6], lastDigit: [0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1] },
  { temperature: 30, humidity: 70, values: [0.1, 0.3, 1.0, 3.1, 7.4, 12.7, 23.1, 59.3], lastDigit: [0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1] },
  { temperature: 15, humidity: 20, values: [0.3, 0.6, 1.2, 2.7, 8.2, 28.2, 88.8, 202], lastDigit: [0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 1] },
  { temperature: 15, humidity: 50, values: [0.1, 0.5, 1.2, 2.2, 4.2, 10.8, 36.2, 129], lastDigit: [0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 1] },
  { temperature: 15, humidity: 80, values: [0.1, 0.3, 1.1, 2.4, 4.1, 8.3, 23.7, 82.8], lastDigit: [0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1] },
];

describe("atmospheric absorption coefficient (ISO 9613-1:1993)", () => {
  for (const row of TABLE_2) {
    it(`matches ISO 9613-2 Table 2 at ${row.temperature} degC and ${row.humidity} % relative humidity, 63 Hz to 8 kHz`, () => {
      OCTAVES.forEach((band, b) => {
        const dbPerKm = 1000 * airAttenuationCoefficient(band.centre, atmosphere(row.temperature, row.humidity));
        expect(Math.abs(dbPerKm - row.values[b]!), `${band.nominal} Hz: ${dbPerKm.toFixed(3)} dB/km`).toBeLessThanOrEqual(row.lastDigit[b]! + 1e-9);
      });
    });
  }

  it("puts the saturation vapour pressure of water within 0.1% of 611.657 Pa at the triple point and 0.5% of 2.339 kPa at 20 degC (IAPWS values and steam tables, from memory)", () => {
    expect(Math.abs(saturationVapourPressure(273.16) / 611.657 - 1)).toBeLessThan(1e-3);
    expect(Math.abs(saturationVapourPressure(293.15) / 2339 - 1)).toBeLessThan(5e-3);
  });

  it("derives the molar concentration of water vapour from relative humidity and pressure", () => {
    // At 20 degC and 100 % the vapour pressure is the saturation pressure, 2.339 kPa: h = 100 * 2.339 / 101.325 = 2.308 %.
    expect(molarConcentrationOfWaterVapour(atmosphere(20, 100))).toBeCloseTo(2.308, 2);
    // Halving the ambient pressure doubles h for the same relative humidity.
    expect(molarConcentrationOfWaterVapour(atmosphere(20, 50, 50662.5)) / molarConcentrationOfWaterVapour(atmosphere(20, 50))).toBeCloseTo(2, 12);
  });

  it("moves the oxygen relaxation frequency up with humidity (water vapour catalyses the relaxation)", () => {
    const dry = relaxationFrequencies(atmosphere(20, 10));
    const humid = relaxationFrequencies(atmosphere(20, 90));
    expect(humid.oxygen).toBeGreaterThan(dry.oxygen);
    expect(humid.nitrogen).toBeGreaterThan(dry.nitrogen);
  });
});

describe("air absorption on band levels", () => {
  const air = atmosphere(20, 70);

  it("lowers each band level by the midband coefficient times the distance", () => {
    const levels = [80, 80, 80, 80, 80, 80, 80, 80];
    const after = applyAirAbsorption(levels, OCTAVES, 500, air);
    // 8 kHz at 20 degC, 70 %: 76.6 dB/km (ISO 9613-2 Table 2, from memory) over 500 m: 38.3 dB.
    expect(Math.abs(80 - after[7]! - 38.3)).toBeLessThan(0.1);
    OCTAVES.forEach((band, b) => expect(80 - after[b]!).toBeCloseTo(airAttenuationCoefficient(band.centre, air) * 500, 12));
    expect(bandAirAttenuation(OCTAVES, 0, air).every((loss) => loss === 0)).toBe(true);
  });

  it("refuses levels that do not match the bands", () => {
    expect(() => applyAirAbsorption([1, 2], OCTAVES, 10, air)).toThrow(/2 levels for 8 bands/);
  });
});
