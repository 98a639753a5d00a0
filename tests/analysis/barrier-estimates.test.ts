// Barrier estimates: the diffracted path by plane geometry (worked by hand below), the Fresnel number and
// Maekawa's chart (Z. Maekawa, "Noise reduction by screens", Applied Acoustics 1 (1968) 157-173), and the
// barrier attenuation D_z of ISO 9613-2:1996, clause 7.4 (clause and equation numbers from memory).
import { describe, expect, it } from "vitest";

import { barrierEstimates, doubleDiffractionFactor, fresnelNumber, isoBarrierAttenuation, maekawaAttenuation, meteorologicalCorrection, POINT_SOURCE_CAVEAT } from "@/lib/analysis/barrier-estimates";
import { diffractionPath } from "@/lib/analysis/diffraction-path";

describe("the diffracted path in a vertical section", () => {
  it("goes over a thin barrier's top: delta = 2 sqrt(10^2 + 5^2) - 20 m", () => {
    const path = diffractionPath({ x: 0, y: 1 }, { x: 20, y: 1 }, [{ x: 10, y: 6 }]);
    expect(path.zone).toBe("shadow");
    expect(path.pathDifference).toBeCloseTo(2 * Math.sqrt(125) - 20, 12); // 2.36068 m
    expect(path.signedPathDifference).toBe(path.pathDifference);
    expect([path.sourceToEdge, path.edgeToReceiver, path.directDistance, path.edgeSpacing]).toEqual([Math.sqrt(125), Math.sqrt(125), 20, 0]);
  });

  it("gives a negative signed path difference when the receiver sees the source over the top", () => {
    const path = diffractionPath({ x: 0, y: 2 }, { x: 20, y: 2 }, [{ x: 10, y: 1 }]);
    expect(path.zone).toBe("bright");
    expect(path.signedPathDifference).toBeCloseTo(-(2 * Math.sqrt(101) - 20), 12); // -0.09975 m
  });

  it("goes over both edges of a thick barrier, source side first, whichever way the section runs", () => {
    const edges = [{ x: 16, y: 4 }, { x: 14, y: 4 }];
    const forward = diffractionPath({ x: 0, y: 0 }, { x: 30, y: 0 }, edges);
    expect(forward.edges).toEqual([{ x: 14, y: 4 }, { x: 16, y: 4 }]);
    expect(forward.edgeSpacing).toBe(2);
    expect(forward.pathDifference).toBeCloseTo(2 * Math.sqrt(14 * 14 + 16) + 2 - 30, 12); // 1.12039 m
    const backward = diffractionPath({ x: 30, y: 0 }, { x: 0, y: 0 }, edges);
    expect(backward.edges).toEqual([{ x: 16, y: 4 }, { x: 14, y: 4 }]);
    expect(backward.pathDifference).toBeCloseTo(forward.pathDifference, 12);
  });

  it("skips a lower far corner that the ray clears (single diffraction over the higher edge)", () => {
    // Line from (14, 4) to (30, 0) passes x = 16 at y = 3.5, above the corner at y = 1.
    const path = diffractionPath({ x: 0, y: 0 }, { x: 30, y: 0 }, [{ x: 14, y: 4 }, { x: 16, y: 1 }]);
    expect(path.edges).toEqual([{ x: 14, y: 4 }]);
    expect(path.pathDifference).toBeCloseTo(Math.sqrt(212) + Math.sqrt(272) - 30, 12);
  });

  it("refuses edges outside the source-receiver span and more than two edges", () => {
    expect(() => diffractionPath({ x: 0, y: 0 }, { x: 10, y: 0 }, [{ x: 12, y: 3 }])).toThrow(/between the source and the receiver/);
    expect(() => diffractionPath({ x: 0, y: 0 }, { x: 10, y: 0 }, [{ x: 2, y: 3 }, { x: 4, y: 3 }, { x: 6, y: 3 }])).toThrow(/one or two/);
    expect(() => diffractionPath({ x: 0, y: 0 }, { x: 10, y: 0 }, [])).toThrow(/one or two/);
  });
});

describe("Maekawa's chart", () => {
  it("uses N = 2 delta / lambda", () => {
    expect(fresnelNumber(0.17, 0.34)).toBeCloseTo(1, 15);
    expect(fresnelNumber(-0.034, 0.34)).toBeCloseTo(-0.2, 15);
  });

  it("reads about 5 dB at grazing incidence, 13 dB at N = 1 and 23 dB at N = 10 (chart readings from memory, +-1 dB)", () => {
    expect(Math.abs(maekawaAttenuation(0) - 5)).toBeLessThan(1);
    expect(Math.abs(maekawaAttenuation(1) - 13)).toBeLessThan(1);
    expect(Math.abs(maekawaAttenuation(10) - 23)).toBeLessThan(1);
  });

  it("falls steadily through the bright zone to 0 dB, and is 0 dB from N = -0.3 on", () => {
    const fresnels = Array.from({ length: 60 }, (_, k) => -0.3 + 0.005 * k); // -0.3 .. -0.005
    const values = fresnels.map(maekawaAttenuation);
    for (let k = 1; k < values.length; k++) expect(values[k]!).toBeGreaterThanOrEqual(values[k - 1]!);
    expect(values[0]).toBe(0);
    expect(maekawaAttenuation(-0.5)).toBe(0);
    expect(maekawaAttenuation(-1e-9)).toBeCloseTo(5, 6);
    // The documented step where the two fits meet at N = 0.
    expect(maekawaAttenuation(-1e-9) - maekawaAttenuation(0)).toBeCloseTo(5 - 10 * Math.log10(3), 6);
  });
});

describe("ISO 9613-2 barrier attenuation", () => {
  const thin = diffractionPath({ x: 0, y: 1 }, { x: 20, y: 1 }, [{ x: 10, y: 6 }]);

  it("computes K_met = exp(-(1/2000) sqrt(d_ss d_sr d / (2 z)))", () => {
    // sqrt(125 * 20 / (2 * 2.36068)) = 23.011 m, so K_met = exp(-0.011506) = 0.98856.
    expect(meteorologicalCorrection(thin)).toBeCloseTo(0.98856, 5);
    expect(meteorologicalCorrection(diffractionPath({ x: 0, y: 2 }, { x: 20, y: 2 }, [{ x: 10, y: 1 }]))).toBe(1);
  });

  it("gives 10 log10(3 + (20 / lambda) z K_met) for one edge: 10.66 dB at 63 Hz, capped at 20 dB at 1 kHz", () => {
    // 63 Hz: lambda = 340 / 63 = 5.3968 m; 3 + 3.7059 * 2.36068 * 0.98856 = 11.648 -> 10.663 dB.
    const low = isoBarrierAttenuation(thin, 340 / 63);
    expect(low.value).toBeCloseTo(10.663, 2);
    expect(low.capped).toBe(false);
    // 1 kHz: 3 + 58.824 * 2.33367 = 140.27 -> 21.47 dB, above the 20 dB cap for single diffraction.
    const high = isoBarrierAttenuation(thin, 0.34);
    expect(high.uncapped).toBeCloseTo(21.47, 2);
    expect(high.value).toBe(20);
    expect(high.capped).toBe(true);
  });

  it("uses C3 = (1 + (5 lambda / e)^2) / (1/3 + (5 lambda / e)^2), from 1 for close edges to 3 for distant ones", () => {
    // lambda = 0.34 m, e = 2 m: (5 lambda / e)^2 = 0.7225, C3 = 1.7225 / 1.055833 = 1.631413.
    expect(doubleDiffractionFactor(0.34, 2)).toBeCloseTo(1.631413, 5);
    expect(doubleDiffractionFactor(0.34, 1e-6)).toBeCloseTo(1, 9);
    expect(doubleDiffractionFactor(0.34, 1e6)).toBeCloseTo(3, 6);
    expect(doubleDiffractionFactor(0.34, 0)).toBe(1);
  });

  it("caps double diffraction at 25 dB instead of 20", () => {
    const tall = diffractionPath({ x: 0, y: 0 }, { x: 30, y: 0 }, [{ x: 14, y: 10 }, { x: 16, y: 10 }]);
    const result = isoBarrierAttenuation(tall, 340 / 8000);
    expect(result.uncapped).toBeGreaterThan(25);
    expect(result.value).toBe(25);
  });

  it("with C2 = 40 and no K_met equals the fit 10 log10(3 + 20 N) to Maekawa's chart (ISO 9613-2 note on C2, from memory)", () => {
    for (const wavelength of [5.4, 1.36, 0.34, 0.0425]) {
      const iso = isoBarrierAttenuation(thin, wavelength, { c2: 40, meteorologicalCorrection: false });
      expect(iso.uncapped).toBeCloseTo(maekawaAttenuation(fresnelNumber(thin.signedPathDifference, wavelength)), 10);
    }
  });

  it("fades to 0 dB in the bright zone rather than going negative", () => {
    const bright = diffractionPath({ x: 0, y: 2 }, { x: 20, y: 2 }, [{ x: 10, y: 1 }]);
    expect(isoBarrierAttenuation(bright, 0.0425).value).toBe(0);
    const nearGrazing = isoBarrierAttenuation(bright, 5.4).value;
    expect(nearGrazing).toBeGreaterThan(0);
    expect(nearGrazing).toBeLessThan(10 * Math.log10(3));
  });
});

describe("barrier estimates per octave band", () => {
  it("covers the octaves 63 Hz to 8 kHz at wavelengths 340 m/s / nominal frequency, with the point-source caveat", () => {
    const estimates = barrierEstimates({ x: 0, y: 1 }, { x: 20, y: 1 }, [{ x: 10, y: 6 }]);
    expect(estimates.bands.map((b) => b.band.nominal)).toEqual([63, 125, 250, 500, 1000, 2000, 4000, 8000]);
    const at1k = estimates.bands[4]!;
    expect(at1k.wavelength).toBeCloseTo(0.34, 12);
    expect(at1k.fresnelNumber).toBeCloseTo((2 * 2.36068) / 0.34, 4);
    expect(at1k.maekawa).toBeCloseTo(10 * Math.log10(3 + 20 * at1k.fresnelNumber), 12);
    expect(estimates.bands[0]!.iso.value).toBeCloseTo(10.663, 2);
    expect(estimates.kMet).toBeCloseTo(0.98856, 5);
    expect(estimates.caveat).toBe(POINT_SOURCE_CAVEAT);
    expect(POINT_SOURCE_CAVEAT).toMatch(/point source/);
    expect(POINT_SOURCE_CAVEAT).toMatch(/line source/);
  });
});
