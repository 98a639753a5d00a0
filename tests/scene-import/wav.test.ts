import { describe, expect, it } from "vitest";
import { WaveFile } from "wavefile";

import { prepareSignal } from "@/lib/fdtd/signals";
import { importWav, MAX_WAV_BYTES, MAX_WAV_FRAMES, type WavRecording } from "@/lib/scene-import/wav";

import { CUT_SHORT, MONO_24_BIT, MONO_8_BIT, MONO_FLOAT_32, STEREO_16_BIT } from "../fixtures/import/wav-fixture-signals";
import { fixtureBytes } from "./fixture-files";

function recordingOf(bytes: Uint8Array): WavRecording {
  const result = importWav(bytes);
  if (!result.ok) throw new Error(result.message);
  return result.recording;
}

function messageOf(result: { ok: true } | { ok: false; message: string }): string {
  if (result.ok) throw new Error("expected a refusal");
  return result.message;
}

/**
 * The imported samples, scaled back by the reported peak, equal what was written in full-scale units:
 * within the 7-decimal rounding of the normalised samples (5e-8 of the peak).
 */
function expectWritten(recording: WavRecording, fullScale: readonly number[]): void {
  const { samples } = recording.signal;
  expect(samples).toHaveLength(fullScale.length);
  const peak = Math.max(...fullScale.map(Math.abs));
  expect(recording.peakFullScale).toBeCloseTo(peak, 15);
  expect(Math.max(...samples.map(Math.abs))).toBe(1);
  samples.forEach((value, k) => expect(Math.abs(value * recording.peakFullScale - fullScale[k]!)).toBeLessThanOrEqual(5e-8 * peak + 1e-15));
}

function wavBytes(channels: number, sampleRate: number, bitDepth: string, samples: number[] | number[][]): Uint8Array {
  const wav = new WaveFile();
  wav.fromScratch(channels, sampleRate, bitDepth, samples);
  return wav.toBuffer();
}

/** A WAVE_FORMAT_EXTENSIBLE file (40-byte format chunk) of 32-bit float mono samples, written by hand. */
function extensibleFloatBytes(sampleRate: number, samples: readonly number[]): Uint8Array {
  const dataSize = samples.length * 4;
  const bytes = new Uint8Array(12 + 8 + 40 + 8 + dataSize);
  const view = new DataView(bytes.buffer);
  const ascii = (at: number, text: string) => [...text].forEach((c, i) => (bytes[at + i] = c.charCodeAt(0)));
  ascii(0, "RIFF");
  view.setUint32(4, bytes.length - 8, true);
  ascii(8, "WAVE");
  ascii(12, "fmt ");
  view.setUint32(16, 40, true);
  view.setUint16(20, 0xfffe, true); // WAVE_FORMAT_EXTENSIBLE
  view.setUint16(22, 1, true); // channels
  view.setUint32(24, sampleRate, true);
  view.setUint32(28, sampleRate * 4, true);
  view.setUint16(32, 4, true); // block align
  view.setUint16(34, 32, true); // bits per sample
  view.setUint16(36, 22, true); // extension size
  view.setUint16(38, 32, true); // valid bits
  view.setUint32(40, 4, true); // channel mask: front centre
  view.setUint16(44, 0x0003, true); // sub-format GUID starts with the format tag: IEEE float
  bytes.set([0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71], 46);
  ascii(60, "data");
  view.setUint32(64, dataSize, true);
  samples.forEach((value, k) => view.setFloat32(68 + 4 * k, value, true));
  return bytes;
}

describe("recordings that import", () => {
  it("reads the first channel of 16-bit PCM stereo in full-scale units, normalised to peak 1", () => {
    const recording = recordingOf(fixtureBytes(STEREO_16_BIT.file));
    expect(recording).toMatchObject({ channels: 2, encoding: "16-bit PCM", durationSeconds: 400 / 8000 });
    expect(recording.signal).toMatchObject({ kind: "sampled", sampleRate: 8000 });
    expectWritten(recording, STEREO_16_BIT.left.map((v) => v / 32768));
  });

  it("reads 32-bit float mono", () => {
    const recording = recordingOf(fixtureBytes(MONO_FLOAT_32.file));
    expect(recording).toMatchObject({ channels: 1, encoding: "32-bit float", signal: { sampleRate: 16000 } });
    expectWritten(recording, MONO_FLOAT_32.samples);
  });

  it("reads unsigned 8-bit PCM with an odd number of samples and no extra one from the end of the chunk", () => {
    const recording = recordingOf(fixtureBytes(MONO_8_BIT.file));
    expect(recording).toMatchObject({ encoding: "8-bit PCM", signal: { sampleRate: 11025 } });
    expectWritten(recording, MONO_8_BIT.samples.map((v) => (v - 128) / 128));
  });

  it("reads 24-bit PCM whose odd-sized data chunk is padded and followed by a LIST chunk", () => {
    const recording = recordingOf(fixtureBytes(MONO_24_BIT.file));
    expect(recording).toMatchObject({ encoding: "24-bit PCM", signal: { sampleRate: 48000 } });
    expectWritten(recording, MONO_24_BIT.samples.map((v) => v / 8388608));
  });

  it("reads 32-bit PCM and 64-bit float written by wavefile", () => {
    const integers = [0, 1_000_000_000, -2_000_000_000, 7];
    expectWritten(recordingOf(wavBytes(1, 44100, "32", integers)), integers.map((v) => v / 2147483648));
    const doubles = [0.125, -0.5, 0.3333333333333333];
    expect(recordingOf(wavBytes(1, 44100, "64", doubles)).encoding).toBe("64-bit float");
    expectWritten(recordingOf(wavBytes(1, 44100, "64", doubles)), doubles);
  });

  it("reads the real sample type of a WAVE_FORMAT_EXTENSIBLE float file", () => {
    const samples = [0, 0.25, -0.75, 0.5].map(Math.fround);
    const recording = recordingOf(extensibleFloatBytes(22050, samples));
    expect(recording.encoding).toBe("32-bit float");
    expectWritten(recording, samples);
  });

  it("gives a signal the scene and the solver take: the solver's resampler returns the samples at their own instants", () => {
    const { signal } = recordingOf(fixtureBytes(MONO_8_BIT.file));
    // A solver time step shorter than the recording's sample period: the windowed sinc is cut off at the
    // recording's Nyquist frequency and passes each sample through unchanged at t = k / sampleRate.
    const evaluator = prepareSignal(signal, 1 / (4 * signal.sampleRate));
    for (const k of [0, 40, 50, 60, 100]) expect(evaluator.valueAt(k / signal.sampleRate)).toBeCloseTo(signal.samples[k]!, 12);
    expect(evaluator.upperFrequency).toBe(signal.sampleRate / 2);
  });
});

describe("refusing files that are not usable recordings", () => {
  it("refuses an empty file and one that is not RIFF/WAVE", () => {
    expect(messageOf(importWav(new Uint8Array(0)))).toBe("The file is empty.");
    expect(messageOf(importWav(new TextEncoder().encode("0\nSECTION\n2\nENTITIES\n")))).toBe("This is not a WAV file: it does not start with a RIFF/WAVE header.");
  });

  it("refuses a file cut short inside its samples", () => {
    expect(messageOf(importWav(fixtureBytes(CUT_SHORT.file)))).toBe("The WAV file is cut short: its data chunk declares 1600 bytes but only 800 are present.");
  });

  it("refuses compressed and unusual sample formats, naming them", () => {
    expect(messageOf(importWav(wavBytes(1, 8000, "8m", [0, 10, 20])))).toMatch(/^The recording is µ-law-compressed; only uncompressed PCM 8, 16, 24 or 32-bit, or float 32 or 64-bit is read/);
    // A plain PCM header claiming 12 bits per sample (wavefile itself writes 12-bit in a 16-bit container, which reads fine).
    const twelveBit = wavBytes(1, 8000, "16", [0, 10, 20]);
    new DataView(twelveBit.buffer, twelveBit.byteOffset).setUint16(34, 12, true);
    expect(messageOf(importWav(twelveBit))).toBe("The recording is 12-bit PCM; only PCM 8, 16, 24 or 32-bit, or float 32 or 64-bit is read.");
    expect(recordingOf(wavBytes(1, 8000, "12", [0, 1000, -2048])).encoding).toBe("16-bit PCM");
  });

  it("refuses a silent recording: it has no peak to scale to", () => {
    expect(messageOf(importWav(wavBytes(2, 8000, "16", [[0, 0, 0], [5, 5, 5]])))).toBe("The recording is silent: every sample of its first channel is zero.");
  });

  it("refuses a recording longer than a scene holds, from its header", () => {
    const bytes = wavBytes(1, 48000, "8", new Array<number>(MAX_WAV_FRAMES + 1).fill(128));
    expect(messageOf(importWav(bytes))).toBe("The recording is 10.42 s long (500,001 samples at 48000 Hz); a scene holds at most 500,000 samples (10.42 s at this rate). Trim it first.");
  });

  it("refuses a file larger than the limit before reading it", () => {
    const bytes = new Uint8Array(MAX_WAV_BYTES + 1);
    expect(messageOf(importWav(bytes))).toBe("The file is 20.0 MB; at most 20 MB are read. Trim the recording first.");
  });
});
