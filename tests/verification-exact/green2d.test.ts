// Time-domain line-source pressure against closed forms, a frequency-domain route through the FFT,
// and cylindrical spreading.
import FFT from "fft.js";
import { describe, expect, it } from "vitest";

import { lineSourceImpulseResponse, lineSourcePressure, lineSourceTrace } from "@/lib/verification/exact/green2d";
import { hankel2 } from "@/lib/verification/exact/hankel";
import { gaussianPulse, rickerWavelet, sampledSignal, type SourceSignal } from "@/lib/verification/exact/source-signals";

const SOUND_SPEED = 343;

/**
 * p(r, t) by an independent route: FFT of the sampled Ricker wavelet times the frequency-domain Green's
 * function, inverse FFT. fft.js transforms with e^{-i omega t}, i.e. the time factor of each component is
 * e^{+i omega t}, for which the outgoing Green's function is (-i/4) H0^(2)(k r) (conjugate of (i/4) H0^(1)).
 * Sampled at 64 points per period of f0, the Ricker spectrum is below e^{-1000} at Nyquist, so the only
 * errors are wrap-around (window 512 periods; the tail decays like t^-3) and Hankel-function rounding.
 */
function pressureByFourierTransform(peakFrequency: number, distance: number, sampleRate: number, size: number): Float64Array {
  const ricker = rickerWavelet({ peakFrequency });
  const fft = new FFT(size);
  const input = new Array<number>(size);
  for (let n = 0; n < size; n++) input[n] = ricker.valueAt(n / sampleRate);
  const spectrum = fft.createComplexArray() as number[];
  fft.realTransform(spectrum, input);
  fft.completeSpectrum(spectrum);
  const product = fft.createComplexArray() as number[];
  for (let bin = 1; bin <= size / 2; bin++) {
    const omega = (2 * Math.PI * bin * sampleRate) / size;
    const h2 = hankel2(0, (omega * distance) / SOUND_SPEED);
    // G = (-i/4) H0^(2) = (-i/4)(re + i im) = (im/4) - i (re/4)
    const gRe = 0.25 * h2.im;
    const gIm = -0.25 * h2.re;
    const sRe = spectrum[2 * bin] ?? 0;
    const sIm = spectrum[2 * bin + 1] ?? 0;
    const re = sRe * gRe - sIm * gIm;
    const im = sRe * gIm + sIm * gRe;
    product[2 * bin] = re;
    product[2 * bin + 1] = bin === size / 2 ? 0 : im;
    if (bin < size / 2) {
      product[2 * (size - bin)] = re;
      product[2 * (size - bin) + 1] = -im;
    }
  }
  product[0] = 0; // the Ricker wavelet has zero mean
  product[1] = 0;
  const output = fft.createComplexArray() as number[];
  fft.inverseTransform(output, product);
  const pressure = new Float64Array(size);
  for (let n = 0; n < size; n++) pressure[n] = output[2 * n] ?? 0;
  return pressure;
}

function maxAbs(values: ArrayLike<number>): number {
  let peak = 0;
  for (let i = 0; i < values.length; i++) peak = Math.max(peak, Math.abs(values[i] ?? 0));
  return peak;
}

describe("line source in free field, time domain", () => {
  it("is zero before the arrival time r/c (causality)", () => {
    const ricker = rickerWavelet({ peakFrequency: 100 });
    const r = 5;
    expect(lineSourcePressure(ricker, r, SOUND_SPEED, r / SOUND_SPEED)).toBe(0);
    expect(lineSourcePressure(ricker, r, SOUND_SPEED, 0.5 * (r / SOUND_SPEED))).toBe(0);
    expect(lineSourceImpulseResponse(r, SOUND_SPEED, 0.9 * (r / SOUND_SPEED))).toBe(0);
  });

  it("reproduces the closed-form step and ramp responses despite the wavefront singularity", () => {
    // s = H(t): p = (1/2 pi) acosh(ct/r); s = t H(t): p = (1/2 pi)(t acosh(ct/r) - sqrt(t^2 - r^2/c^2)),
    // from d/dw acosh(w/a) = 1/sqrt(w^2 - a^2) and d/dw sqrt(w^2 - a^2) = w/sqrt(w^2 - a^2).
    const step: SourceSignal = { valueAt: (t) => (t >= 0 ? 1 : 0), start: 0, end: Infinity, resolution: 1e-3 };
    const ramp: SourceSignal = { valueAt: (t) => (t >= 0 ? t : 0), start: 0, end: Infinity, resolution: 1e-3 };
    const r = 2;
    const a = r / SOUND_SPEED;
    for (const t of [a + 1e-9, a + 1e-6, a + 1e-3, 0.02, 0.1]) {
      const stepExact = Math.acosh(t / a) / (2 * Math.PI);
      const rampExact = (t * Math.acosh(t / a) - Math.sqrt(t * t - a * a)) / (2 * Math.PI);
      expect(Math.abs(lineSourcePressure(step, r, SOUND_SPEED, t) - stepExact)).toBeLessThan(1e-10 * Math.max(1, stepExact));
      expect(Math.abs(lineSourcePressure(ramp, r, SOUND_SPEED, t) - rampExact)).toBeLessThan(1e-10 * Math.max(1e-3, rampExact));
    }
  });

  it("matches the frequency-domain Green's function (i/4) H0(kr) through an FFT for a Ricker pulse to 0.5%", () => {
    // Independent route: see pressureByFourierTransform. f0 = 100 Hz (lambda = 3.43 m); receivers at
    // 2 and 10 wavelengths; 64 samples per period, 2^15 samples. Error is the maximum over the trace
    // relative to the trace's peak.
    const f0 = 100;
    const sampleRate = 64 * f0;
    const size = 1 << 15;
    for (const wavelengths of [2, 10]) {
      const r = (wavelengths * SOUND_SPEED) / f0;
      const reference = pressureByFourierTransform(f0, r, sampleRate, size);
      // The pulse arrives at r/c + 1.5/f0; compare from 2 periods before to 8 periods after.
      const first = Math.floor((r / SOUND_SPEED) * sampleRate) - 2 * 64;
      const count = 10 * 64;
      const direct = new Float64Array(count);
      lineSourceTrace(rickerWavelet({ peakFrequency: f0 }), r, SOUND_SPEED, first / sampleRate, sampleRate, direct);
      let worst = 0;
      for (let j = 0; j < count; j++) worst = Math.max(worst, Math.abs((direct[j] ?? 0) - (reference[first + j] ?? 0)));
      const relative = worst / maxAbs(direct);
      expect(relative).toBeLessThan(0.005);
      // Measured: about 5e-9 (Hankel-function rounding); a tighter bound guards the implementation itself.
      expect(relative).toBeLessThan(1e-6);
    }
  });

  it("gives the same pressure from a sampled Ricker pulse (40 samples per period) as from the function", () => {
    // Cubic interpolation between samples: error O((pi f / fs)^4), about 3e-5 of the peak here.
    const f0 = 100;
    const sampleRate = 40 * f0;
    const ricker = rickerWavelet({ peakFrequency: f0 });
    const samples = Array.from({ length: Math.ceil(ricker.end * sampleRate) + 2 }, (_, j) => ricker.valueAt(j / sampleRate));
    const sampled = sampledSignal(samples, sampleRate);
    const r = 10;
    const times = Array.from({ length: 300 }, (_, j) => r / SOUND_SPEED + j / (4 * sampleRate));
    const exact = times.map((t) => lineSourcePressure(ricker, r, SOUND_SPEED, t));
    const fromSamples = times.map((t) => lineSourcePressure(sampled, r, SOUND_SPEED, t));
    const worst = Math.max(...exact.map((v, j) => Math.abs(v - (fromSamples[j] ?? 0))));
    expect(worst / maxAbs(exact)).toBeLessThan(1e-4);
  });

  it("falls 3 dB per doubling of distance in the far field (cylindrical spreading of a line source)", () => {
    // |H0(kr)| ~ sqrt(2/(pi k r)) (A&S 9.2.3): amplitude ~ r^{-1/2}, i.e. 10 log10(2) = 3.01 dB per
    // doubling. Peak of the Ricker response at 10, 20, 40 and 80 wavelengths (f0 = 100 Hz).
    const f0 = 100;
    const ricker = rickerWavelet({ peakFrequency: f0 });
    const peakAt = (r: number): number => {
      const trace = new Float64Array(400);
      lineSourceTrace(ricker, r, SOUND_SPEED, r / SOUND_SPEED, 100 * f0, trace);
      return maxAbs(trace);
    };
    const lambda = SOUND_SPEED / f0;
    const peaks = [10, 20, 40, 80].map((n) => peakAt(n * lambda));
    for (let i = 0; i + 1 < peaks.length; i++) {
      const dropDb = 20 * Math.log10((peaks[i] ?? 0) / (peaks[i + 1] ?? 1));
      expect(Math.abs(dropDb - 10 * Math.log10(2))).toBeLessThan(0.02);
    }
  });

  it("leaves the 2D wake p ~ (int s dt) / (2 pi t) long after a Gaussian pulse has passed", () => {
    // For t - t0 >> r/c and sigma: 1/sqrt((t - tau)^2 - r^2/c^2) -> 1/(t - t0), so p -> sigma sqrt(2 pi) /
    // (2 pi (t - t0)), with relative corrections O((r/c)^2 / (t - t0)^2) (expansion of the formula).
    const sigma = 1e-3;
    const pulse = gaussianPulse({ width: sigma });
    const r = 1;
    const t0 = 6 * sigma;
    for (const delay of [0.1, 0.3]) {
      const t = t0 + delay;
      const expected = (sigma * Math.sqrt(2 * Math.PI)) / (2 * Math.PI * delay);
      const correction = (r / SOUND_SPEED / delay) ** 2;
      expect(Math.abs(lineSourcePressure(pulse, r, SOUND_SPEED, t) / expected - 1)).toBeLessThan(correction + 1e-4);
    }
  });
});
