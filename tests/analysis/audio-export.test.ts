// Sound export: band-limited resampling to 48 kHz, the peak at -1 dBFS, and a 32-bit float WAV that reads
// back with the stated rate and scale.
import { WaveFile } from "wavefile";
import { describe, expect, it } from "vitest";

import { AUDIO_SAMPLE_RATE, encodeWav, resample, safeFileStem, soundFromPressure, wavFileName } from "@/lib/analysis/audio-export";

import { sineTrace } from "./test-signals";

function rms(values: ArrayLike<number>, from: number, to: number): number {
  let sum = 0;
  for (let i = from; i < to; i++) sum += (values[i] ?? 0) ** 2;
  return Math.sqrt(sum / (to - from));
}

describe("resampling", () => {
  it("reproduces a 1 kHz sine when raising the rate from 11.5 kHz (away from the ends)", () => {
    const inputRate = 11_503.7;
    const input = sineTrace(1, 1000, 1 / inputRate, 4000, 0.3);
    const output = resample(input, inputRate, AUDIO_SAMPLE_RATE);
    expect(output.length).toBe(Math.floor((3999 * AUDIO_SAMPLE_RATE) / inputRate) + 1);
    let worst = 0;
    for (let m = 200; m < output.length - 200; m++) worst = Math.max(worst, Math.abs(output[m]! - Math.sin((2 * Math.PI * 1000 * m) / AUDIO_SAMPLE_RATE + 0.3)));
    expect(worst).toBeLessThan(2e-3);
  });

  it("filters out content above the new Nyquist frequency when lowering the rate", () => {
    const inputRate = 192_000;
    const kept = resample(sineTrace(1, 1000, 1 / inputRate, 20000), inputRate, AUDIO_SAMPLE_RATE);
    const removed = resample(sineTrace(1, 30_000, 1 / inputRate, 20000), inputRate, AUDIO_SAMPLE_RATE);
    const n = kept.length;
    expect(rms(kept, 100, n - 100)).toBeCloseTo(Math.SQRT1_2, 2);
    // A 30 kHz tone would fold to 18 kHz; the filter leaves less than 1 % of it.
    expect(rms(removed, 100, n - 100)).toBeLessThan(0.01);
  });
});

describe("scaling and WAV", () => {
  const timeStep = 1 / 20_000;
  const pressure = sineTrace(0.02, 440, timeStep, 2000);

  it("puts the peak at -1 dBFS and states the pascals that full scale stands for", () => {
    const sound = soundFromPressure(pressure, timeStep);
    const peak = Math.max(...Array.from(sound.samples, Math.abs));
    expect(20 * Math.log10(peak)).toBeCloseTo(-1, 5);
    // Full scale is the (interpolated) peak raised by 1 dB: close to 0.02 Pa x 10^(1/20).
    expect(sound.pascalsPerFullScale).toBeCloseTo(0.02 * Math.pow(10, 1 / 20), 4);
  });

  it("refuses a silent trace", () => {
    expect(() => soundFromPressure(new Float32Array(100), timeStep)).toThrow(/no sound/);
  });

  it("writes a mono 32-bit float WAV at 48 kHz that reads back sample for sample", () => {
    const sound = soundFromPressure(pressure, timeStep);
    const file = new WaveFile(encodeWav(sound));
    expect(file.bitDepth).toBe("32f");
    expect((file.fmt as { sampleRate: number; numChannels: number }).sampleRate).toBe(48000);
    expect((file.fmt as { numChannels: number }).numChannels).toBe(1);
    const samples = file.getSamples(false, Float64Array) as unknown as Float64Array;
    expect(samples.length).toBe(sound.samples.length);
    expect(samples[123]).toBe(sound.samples[123]);
  });

  it("names the file with the rate, format, peak and scale", () => {
    const sound = soundFromPressure(pressure, timeStep);
    expect(wavFileName("Garden, 1.5 m / run 3", sound)).toMatch(/^Garden-1.5-m-run-3_48kHz-float32_peak-1dBFS_fullscale-0\.022\dPa\.wav$/);
    expect(safeFileStem("///")).toBe("receiver");
  });
});
