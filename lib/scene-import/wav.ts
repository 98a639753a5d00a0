// WAV recordings into a source's "sampled" signal. The header is read and checked here first (size,
// format, length) so nothing large is decoded for a file that will be refused; wavefile then decodes
// the samples. The first channel is used.
//
// Scaling: the samples are normalised to a peak of 1, like the analytic signals, so the source's
// `amplitude` keeps its meaning (the peak volume rate Q, m^2/s; lib/fdtd/README.md). The recording's
// own level is reported as `peakFullScale` (1 = digital full scale) and is not kept in the scene.
//
// Rate: the scene keeps the file's sample rate. The solver resamples a sampled signal to its time step
// with a Blackman-windowed sinc, low-passed at the lower of the two Nyquist frequencies
// (`prepareSignal` in lib/fdtd/signals.ts), so no resampling happens here.
import { WaveFile } from "wavefile";

import type { ImportResult } from "./geometry";

/** Largest file read, bytes; checked before anything is decoded. */
export const MAX_WAV_BYTES = 20 * 1024 * 1024;

/**
 * Most samples (frames) brought into a scene. Saved scenes are limited to 8 MB of JSON
 * (lib/validation/scene-limits.ts) and each sample takes about 11 bytes there, so this leaves room
 * for the rest of the scene: 10.4 s at 48 kHz.
 */
export const MAX_WAV_FRAMES = 500_000;

/** Most channels decoded; each is decoded in full before the first is taken. */
export const MAX_WAV_CHANNELS = 8;

/** Samples are kept to 7 decimal places of the peak: finer than 24-bit quantisation, and short in JSON. */
const SAMPLE_DECIMALS = 1e7;

export interface WavRecording {
  /** Ready for a source: normalised to peak 1 at the file's own sample rate. */
  signal: { kind: "sampled"; sampleRate: number; samples: number[] };
  /** Largest |sample| of the channel used, in full-scale units (1 = 0 dBFS). */
  peakFullScale: number;
  durationSeconds: number;
  /** Channels in the file; only the first is used. */
  channels: number;
  /** "16-bit PCM", "32-bit float", ... */
  encoding: string;
}

type SampleFormat = { kind: "pcm"; bits: 8 | 16 | 24 | 32 } | { kind: "float"; bits: 32 | 64 };

/** What the header says, in byte offsets into the file. */
interface WavLayout {
  littleEndian: boolean;
  format: SampleFormat;
  /** Offset of the format tag, when it is WAVE_FORMAT_EXTENSIBLE and needs rewriting for the decoder. */
  extensibleTagOffset: number | null;
  channels: number;
  sampleRate: number;
  blockAlign: number;
  frames: number;
}

const FORMAT_PCM = 0x0001;
const FORMAT_FLOAT = 0x0003;
const FORMAT_EXTENSIBLE = 0xfffe;

const COMPRESSED_FORMATS: Record<number, string> = {
  0x0002: "ADPCM",
  0x0006: "A-law",
  0x0007: "µ-law",
  0x0011: "IMA ADPCM",
  0x0055: "MP3",
};

const SUPPORTED = "PCM 8, 16, 24 or 32-bit, or float 32 or 64-bit";

function fourCharacters(bytes: Uint8Array, offset: number): string {
  return String.fromCharCode(bytes[offset] ?? 0, bytes[offset + 1] ?? 0, bytes[offset + 2] ?? 0, bytes[offset + 3] ?? 0);
}

function sampleFormat(tag: number, bits: number): ImportResult<{ format: SampleFormat }> {
  if (tag === FORMAT_PCM && (bits === 8 || bits === 16 || bits === 24 || bits === 32)) return { ok: true, format: { kind: "pcm", bits } };
  if (tag === FORMAT_FLOAT && (bits === 32 || bits === 64)) return { ok: true, format: { kind: "float", bits } };
  const compressed = COMPRESSED_FORMATS[tag];
  if (compressed) return { ok: false, message: `The recording is ${compressed}-compressed; only uncompressed ${SUPPORTED} is read. Export it uncompressed.` };
  if (tag === FORMAT_PCM || tag === FORMAT_FLOAT) {
    return { ok: false, message: `The recording is ${bits}-bit ${tag === FORMAT_PCM ? "PCM" : "float"}; only ${SUPPORTED} is read.` };
  }
  return { ok: false, message: `The recording's format (tag 0x${tag.toString(16).padStart(4, "0")}) is not supported; only ${SUPPORTED} is read.` };
}

/** Reads the RIFF chunks up to the samples and checks everything a decode would trip over. */
function readLayout(bytes: Uint8Array): ImportResult<{ layout: WavLayout }> {
  if (bytes.length === 0) return { ok: false, message: "The file is empty." };
  if (bytes.length > MAX_WAV_BYTES) {
    return { ok: false, message: `The file is ${(bytes.length / 1048576).toFixed(1)} MB; at most ${MAX_WAV_BYTES / 1048576} MB are read. Trim the recording first.` };
  }
  const container = fourCharacters(bytes, 0);
  if (container === "RF64") return { ok: false, message: "This is an RF64 file (meant for recordings beyond 4 GB); save it as a plain WAV." };
  if (bytes.length < 12 || (container !== "RIFF" && container !== "RIFX") || fourCharacters(bytes, 8) !== "WAVE") {
    return { ok: false, message: "This is not a WAV file: it does not start with a RIFF/WAVE header." };
  }
  const littleEndian = container === "RIFF";
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let fmt: { tag: number; extensibleTagOffset: number | null; channels: number; sampleRate: number; blockAlign: number; bits: number } | null = null;
  let data: { offset: number; size: number } | null = null;
  for (let offset = 12; offset + 8 <= bytes.length && !data; ) {
    const id = fourCharacters(bytes, offset);
    const size = view.getUint32(offset + 4, littleEndian);
    const body = offset + 8;
    if (id === "fmt ") {
      if (size < 16 || body + size > bytes.length) return { ok: false, message: "The WAV file is damaged: its format chunk is cut short." };
      const storedTag = view.getUint16(body, littleEndian);
      // WAVE_FORMAT_EXTENSIBLE keeps the real format in the first two bytes of its sub-format GUID.
      const extensible = storedTag === FORMAT_EXTENSIBLE;
      if (extensible && size < 40) return { ok: false, message: "The WAV file is damaged: its extensible format chunk is cut short." };
      fmt = {
        tag: extensible ? view.getUint16(body + 24, littleEndian) : storedTag,
        extensibleTagOffset: extensible ? body : null,
        channels: view.getUint16(body + 2, littleEndian),
        sampleRate: view.getUint32(body + 4, littleEndian),
        blockAlign: view.getUint16(body + 12, littleEndian),
        bits: view.getUint16(body + 14, littleEndian),
      };
    } else if (id === "data") {
      if (body + size > bytes.length) {
        return { ok: false, message: `The WAV file is cut short: its data chunk declares ${size} bytes but only ${bytes.length - body} are present.` };
      }
      data = { offset: body, size };
    }
    // Chunks are padded to an even length.
    offset = body + size + (size % 2);
  }
  if (!fmt) return { ok: false, message: "The WAV file is damaged: it has no format chunk before its samples." };
  if (!data) return { ok: false, message: "The WAV file has no data chunk: there are no samples." };
  const format = sampleFormat(fmt.tag, fmt.bits);
  if (!format.ok) return format;
  if (fmt.channels === 0) return { ok: false, message: "The WAV file is damaged: it declares no channels." };
  if (fmt.channels > MAX_WAV_CHANNELS) return { ok: false, message: `The recording has ${fmt.channels} channels; at most ${MAX_WAV_CHANNELS} are read. Export the channel you need as a mono file.` };
  if (fmt.sampleRate === 0) return { ok: false, message: "The WAV file is damaged: its sample rate is 0." };
  if (fmt.blockAlign !== (fmt.channels * fmt.bits) / 8) return { ok: false, message: "The WAV file is damaged: its frame size does not match its channels and bit depth." };
  const frames = Math.floor(data.size / fmt.blockAlign);
  if (frames === 0) return { ok: false, message: "The recording is empty: it has no samples." };
  if (frames > MAX_WAV_FRAMES) {
    const seconds = frames / fmt.sampleRate;
    const allowed = MAX_WAV_FRAMES / fmt.sampleRate;
    return {
      ok: false,
      message: `The recording is ${seconds.toFixed(2)} s long (${frames.toLocaleString("en-GB")} samples at ${fmt.sampleRate} Hz); a scene holds at most ${MAX_WAV_FRAMES.toLocaleString("en-GB")} samples (${allowed.toFixed(2)} s at this rate). Trim it first.`,
    };
  }
  return {
    ok: true,
    layout: {
      littleEndian,
      format: format.format,
      extensibleTagOffset: fmt.extensibleTagOffset,
      channels: fmt.channels,
      sampleRate: fmt.sampleRate,
      blockAlign: fmt.blockAlign,
      frames,
    },
  };
}

/** Full-scale units of a decoded sample: wavefile gives integers as stored (8-bit unsigned, others signed). */
function toFullScale(format: SampleFormat): (value: number) => number {
  if (format.kind === "float") return (value) => value;
  if (format.bits === 8) return (value) => (value - 128) / 128;
  const scale = 2 ** (format.bits - 1);
  return (value) => value / scale;
}

/** The first channel's samples in full-scale units. */
function decodeFirstChannel(bytes: Uint8Array, layout: WavLayout): Float64Array {
  let input = bytes;
  if (layout.extensibleTagOffset !== null) {
    // wavefile takes its sample type from the plain format tag; give it the sub-format's, on a copy.
    input = bytes.slice();
    new DataView(input.buffer).setUint16(layout.extensibleTagOffset, layout.format.kind === "float" ? FORMAT_FLOAT : FORMAT_PCM, layout.littleEndian);
  }
  const wav = new WaveFile(input);
  // The decoder reads the data chunk with its pad byte; keep whole frames only.
  const data = wav.data as { samples: Uint8Array };
  data.samples = data.samples.subarray(0, layout.frames * layout.blockAlign);
  const decoded = wav.getSamples(false, Float64Array) as unknown as Float64Array | Float64Array[];
  const first = Array.isArray(decoded) ? decoded[0]! : decoded;
  const convert = toFullScale(layout.format);
  const out = new Float64Array(layout.frames);
  for (let k = 0; k < layout.frames; k++) out[k] = convert(first[k]!);
  return out;
}

function describeFormat(format: SampleFormat): string {
  return format.kind === "pcm" ? `${format.bits}-bit PCM` : `${format.bits}-bit float`;
}

/**
 * Reads a WAV file's first channel as a sampled signal with peak 1. Refuses (with a message) anything
 * that is not an uncompressed RIFF/WAVE recording, is empty, silent, too large or too long. Never throws.
 */
export function importWav(bytes: Uint8Array): ImportResult<{ recording: WavRecording }> {
  const read = readLayout(bytes);
  if (!read.ok) return read;
  const { layout } = read;
  let fullScale: Float64Array;
  try {
    fullScale = decodeFirstChannel(bytes, layout);
  } catch (error) {
    return { ok: false, message: `The WAV file could not be decoded: ${error instanceof Error ? error.message : String(error)}.` };
  }
  let peak = 0;
  for (let k = 0; k < fullScale.length; k++) {
    const value = fullScale[k]!;
    if (!Number.isFinite(value)) return { ok: false, message: `The WAV file is damaged: sample ${k + 1} is not a finite number.` };
    peak = Math.max(peak, Math.abs(value));
  }
  if (peak === 0) return { ok: false, message: "The recording is silent: every sample of its first channel is zero." };
  const samples = new Array<number>(fullScale.length);
  // + 0 turns a rounded -0 into 0, so the JSON and comparisons stay plain.
  for (let k = 0; k < fullScale.length; k++) samples[k] = Math.round((fullScale[k]! / peak) * SAMPLE_DECIMALS) / SAMPLE_DECIMALS + 0;
  return {
    ok: true,
    recording: {
      signal: { kind: "sampled", sampleRate: layout.sampleRate, samples },
      peakFullScale: peak,
      durationSeconds: layout.frames / layout.sampleRate,
      channels: layout.channels,
      encoding: describeFormat(layout.format),
    },
  };
}
