// The outer frame of a saved run's payload: a fixed 20-byte preamble, then the zlib-compressed body.
//
//   bytes 0-3    "RFRN" (magic)
//   bytes 4-7    format version, u32 little-endian
//   bytes 8-11   body length once decompressed, u32 LE
//   bytes 12-15  compressed length, u32 LE (= total length - 20)
//   bytes 16-19  CRC-32 of bytes 0-15 followed by the compressed body, u32 LE
//   bytes 20-    the body, zlib (RFC 1950) with its Adler-32 of the decompressed body
//
// The lengths catch truncation and trailing bytes, the CRC any changed bit, and the declared
// length bounds decompression: a body that inflates to more than it claims is refused mid-stream.
import { Unzlib, zlibSync } from "fflate";
import { adler32, crc32 } from "./checksums";
import { MAX_RUN_PAYLOAD_BYTES, MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES } from "./limits";

export const RUN_PAYLOAD_MAGIC = "RFRN";
export const FRAME_PREAMBLE_BYTES = 20;

/** Compressed bytes handed to the inflater at a time: bounds what one step can expand to. */
const INFLATE_CHUNK_BYTES = 16 * 1024;

/**
 * Level 4 of 9: solver output gains little from the slower levels (on a small run's 2.7 MB body,
 * levels 4 to 9 came within 0.2% of one another in size, level 9 taking over twice as long), and
 * the browser encodes while the user waits.
 */
const COMPRESSION_LEVEL = 4;

export function frameBody(body: Uint8Array, format: number): Uint8Array<ArrayBuffer> {
  const compressed = zlibSync(body, { level: COMPRESSION_LEVEL });
  const framed = new Uint8Array(FRAME_PREAMBLE_BYTES + compressed.length);
  const view = new DataView(framed.buffer);
  for (let i = 0; i < 4; i++) framed[i] = RUN_PAYLOAD_MAGIC.charCodeAt(i);
  view.setUint32(4, format, true);
  view.setUint32(8, body.length, true);
  view.setUint32(12, compressed.length, true);
  framed.set(compressed, FRAME_PREAMBLE_BYTES);
  view.setUint32(16, crc32(compressed, crc32(framed.subarray(0, 16))), true);
  return framed;
}

export type UnframeOutcome = { ok: true; body: Uint8Array } | { ok: false; path: string; message: string };

class InflatedTooMuch extends Error {}

/** Inflates exactly `expected` bytes, or says why not; never allocates more than `expected`. */
function inflateExactly(compressed: Uint8Array, expected: number): Uint8Array | string {
  const out = new Uint8Array(expected);
  let written = 0;
  const stream = new Unzlib((chunk) => {
    if (written + chunk.length > expected) throw new InflatedTooMuch();
    out.set(chunk, written);
    written += chunk.length;
  });
  try {
    for (let start = 0; start < compressed.length; start += INFLATE_CHUNK_BYTES) {
      const end = Math.min(compressed.length, start + INFLATE_CHUNK_BYTES);
      stream.push(compressed.subarray(start, end), end === compressed.length);
    }
  } catch (error) {
    if (error instanceof InflatedTooMuch) return `the body inflates to more than the ${expected} bytes declared`;
    return `the compressed body is damaged (${error instanceof Error ? error.message : "inflate failed"})`;
  }
  if (written !== expected) return `the body inflates to ${written} bytes, not the ${expected} declared`;
  const trailer = compressed.subarray(compressed.length - 4);
  const declaredAdler = ((trailer[0]! << 24) | (trailer[1]! << 16) | (trailer[2]! << 8) | trailer[3]!) >>> 0;
  if (adler32(out) !== declaredAdler) return "the decompressed body does not match its Adler-32 checksum";
  return out;
}

/** Checks the preamble and the CRC, then decompresses; refuses anything beyond the caps before allocating. */
export function unframeBody(bytes: Uint8Array, expectedFormat: number): UnframeOutcome {
  const fail = (path: string, message: string): UnframeOutcome => ({ ok: false, path, message });
  if (bytes.length < FRAME_PREAMBLE_BYTES) return fail("payload", `the payload is ${bytes.length} bytes, shorter than its ${FRAME_PREAMBLE_BYTES}-byte preamble`);
  if (bytes.length > MAX_RUN_PAYLOAD_BYTES + FRAME_PREAMBLE_BYTES) return fail("payload", `the payload is ${bytes.length} bytes; at most ${MAX_RUN_PAYLOAD_BYTES} are accepted`);
  for (let i = 0; i < 4; i++) {
    if (bytes[i] !== RUN_PAYLOAD_MAGIC.charCodeAt(i)) return fail("payload.magic", `this is not a Rarefact run payload (it does not start with "${RUN_PAYLOAD_MAGIC}")`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const format = view.getUint32(4, true);
  const bodyLength = view.getUint32(8, true);
  const compressedLength = view.getUint32(12, true);
  const declaredCrc = view.getUint32(16, true);
  if (format !== expectedFormat) return fail("payload.format", `payload format ${format} is not the format ${expectedFormat} this version of Rarefact reads`);
  const present = bytes.length - FRAME_PREAMBLE_BYTES;
  if (compressedLength > present) return fail("payload.length", `the payload is truncated: ${compressedLength} compressed bytes declared, ${present} present`);
  if (compressedLength < present) return fail("payload.length", `the payload has ${present - compressedLength} bytes after its declared end`);
  const compressed = bytes.subarray(FRAME_PREAMBLE_BYTES);
  if (crc32(compressed, crc32(bytes.subarray(0, 16))) !== declaredCrc) return fail("payload.crc", "the payload does not match its CRC-32: it was damaged in transit or on disk");
  if (bodyLength > MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES) return fail("payload.length", `the body would be ${bodyLength} bytes decompressed; at most ${MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES} are accepted`);
  if (compressedLength < 6) return fail("payload.length", "the compressed body is too short to be zlib data");
  const body = inflateExactly(compressed, bodyLength);
  if (typeof body === "string") return fail("payload.body", body);
  return { ok: true, body };
}
