// A receiver's pressure as sound: resampled to 48 kHz (the solver's rate, 1 / dt, is rarely a whole number
// of hertz and often one a sound card does not offer), scaled so its peak sits at -1 dBFS, written as a
// 32-bit float WAV. The level is relative: the scale in pascals per full scale goes into the file name,
// and nothing about the playback level is calibrated to the real event.
import { WaveFile } from "wavefile";

/** Sample rate of every exported or played sound, Hz. */
export const AUDIO_SAMPLE_RATE = 48000;

/** Peak level of the exported sound relative to full scale, dB. */
export const AUDIO_PEAK_DBFS = -1;

/** Zero crossings of the interpolating sinc on each side (at the narrower of the two rates). */
const KERNEL_ZERO_CROSSINGS = 16;

/** Blackman window on [-1, 1]: side lobes below -58 dB, so little leaks through the stop band. */
function blackman(z: number): number {
  return 0.42 + 0.5 * Math.cos(Math.PI * z) + 0.08 * Math.cos(2 * Math.PI * z);
}

function sinc(x: number): number {
  if (x === 0) return 1;
  const a = Math.PI * x;
  return Math.sin(a) / a;
}

/**
 * Band-limited resampling by a windowed sinc: y(m / outRate) = sum_n x_n c sinc(c (u - n)) w, with
 * u = m inRate / outRate and c = min(1, outRate / inRate), so that when the rate falls the content above
 * the new Nyquist frequency is filtered out rather than folded back (J. O. Smith, "Digital Audio
 * Resampling", bandlimited interpolation; from memory). Samples beyond the ends count as zero.
 */
export function resample(signal: ArrayLike<number>, inputRate: number, outputRate: number): Float32Array {
  if (!(inputRate > 0) || !(outputRate > 0)) throw new RangeError("sample rates must be positive");
  const count = signal.length === 0 ? 0 : Math.floor(((signal.length - 1) * outputRate) / inputRate) + 1;
  const out = new Float32Array(count);
  const cutoff = Math.min(1, outputRate / inputRate);
  const halfWidth = KERNEL_ZERO_CROSSINGS / cutoff;
  for (let m = 0; m < count; m++) {
    const u = (m * inputRate) / outputRate;
    const first = Math.max(0, Math.ceil(u - halfWidth));
    const last = Math.min(signal.length - 1, Math.floor(u + halfWidth));
    let sum = 0;
    for (let n = first; n <= last; n++) {
      const offset = u - n;
      sum += (signal[n] ?? 0) * cutoff * sinc(cutoff * offset) * blackman(offset / halfWidth);
    }
    out[m] = sum;
  }
  return out;
}

export interface ScaledSound {
  /** Samples in [-1, 1], peak at AUDIO_PEAK_DBFS. */
  samples: Float32Array;
  sampleRate: number;
  /** Pascals that full scale (1.0) stands for: multiply a sample by this to get Pa. */
  pascalsPerFullScale: number;
}

/** Largest |value|. */
function peakOf(values: ArrayLike<number>): number {
  let peak = 0;
  for (let i = 0; i < values.length; i++) peak = Math.max(peak, Math.abs(values[i] ?? 0));
  return peak;
}

/**
 * The pressure trace (Pa, every `timeStep` s) as a sound at 48 kHz with its peak at -1 dBFS. The peak is
 * measured after resampling, where it may fall between the solver's samples. Throws for a silent trace.
 */
export function soundFromPressure(pressure: ArrayLike<number>, timeStep: number): ScaledSound {
  if (!(timeStep > 0)) throw new RangeError("the time step must be positive");
  if (pressure.length < 2) throw new RangeError("the trace has fewer than two samples");
  const samples = resample(pressure, 1 / timeStep, AUDIO_SAMPLE_RATE);
  const peak = peakOf(samples);
  if (!(peak > 0) || !Number.isFinite(peak)) throw new RangeError("the receiver recorded no sound (every sample is zero)");
  const gain = Math.pow(10, AUDIO_PEAK_DBFS / 20) / peak;
  for (let i = 0; i < samples.length; i++) samples[i] = samples[i]! * gain;
  return { samples, sampleRate: AUDIO_SAMPLE_RATE, pascalsPerFullScale: 1 / gain };
}

/** A mono 32-bit float WAV of the sound. */
export function encodeWav(sound: ScaledSound): Uint8Array {
  const file = new WaveFile();
  file.fromScratch(1, sound.sampleRate, "32f", sound.samples);
  return file.toBuffer();
}

/** Letters, digits, dot, dash and underscore only, so every file system takes the name. */
export function safeFileStem(text: string): string {
  const cleaned = text.normalize("NFKD").replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "");
  return cleaned.slice(0, 80) || "receiver";
}

/** File name that carries the scale: "<stem>_48kHz-float32_peak-1dBFS_fullscale-0.0123Pa.wav". */
export function wavFileName(stem: string, sound: ScaledSound): string {
  const scale = Number(sound.pascalsPerFullScale.toPrecision(3)).toString();
  return `${safeFileStem(stem)}_${sound.sampleRate / 1000}kHz-float32_peak${AUDIO_PEAK_DBFS}dBFS_fullscale-${scale}Pa.wav`;
}
