// Deliberate damage to payloads for the tests: flipped bits, and headers rewritten behind the
// encoder's back but framed again with a valid CRC, so the checks after the CRC are reached.
import { unzlibSync } from "fflate";
import { FRAME_PREAMBLE_BYTES, frameBody } from "@/lib/run-record/frame";
import { RUN_PAYLOAD_FORMAT } from "@/lib/run-record/header";

export function flipBit(bytes: Uint8Array, bit: number): Uint8Array {
  const copy = bytes.slice();
  copy[bit >> 3]! ^= 1 << (bit & 7);
  return copy;
}

/** The decompressed body of a well-formed payload. */
export function bodyOf(bytes: Uint8Array): Uint8Array {
  return unzlibSync(bytes.subarray(FRAME_PREAMBLE_BYTES));
}

/** The payload with its header JSON replaced by `mutate(header)`, the binary sections kept as they were. */
export function rewriteHeader(bytes: Uint8Array, mutate: (header: Record<string, unknown>) => void): Uint8Array {
  const body = bodyOf(bytes);
  const headerLength = new DataView(body.buffer, body.byteOffset).getUint32(0, true);
  const header = JSON.parse(new TextDecoder().decode(body.subarray(4, 4 + headerLength))) as Record<string, unknown>;
  mutate(header);
  const data = body.subarray(Math.ceil((4 + headerLength) / 4) * 4);
  const newHeader = new TextEncoder().encode(JSON.stringify(header));
  const dataStart = Math.ceil((4 + newHeader.length) / 4) * 4;
  const rewritten = new Uint8Array(dataStart + data.length);
  new DataView(rewritten.buffer).setUint32(0, newHeader.length, true);
  rewritten.set(newHeader, 4);
  rewritten.set(data, dataStart);
  return frameBody(rewritten, RUN_PAYLOAD_FORMAT);
}
