import { describe, expect, it } from "vitest";
import { adler32, crc32 } from "@/lib/run-record/checksums";

const ascii = (text: string) => new TextEncoder().encode(text);

describe("payload checksums", () => {
  it("give the published check values", () => {
    // CRC-32/ISO-HDLC check value for "123456789"; Adler-32 of "Wikipedia" from RFC 1950's definition.
    expect(crc32(ascii("123456789"))).toBe(0xcbf43926);
    expect(adler32(ascii("Wikipedia"))).toBe(0x11e60398);
    expect(crc32(new Uint8Array(0))).toBe(0);
    expect(adler32(new Uint8Array(0))).toBe(1);
  });

  it("continue a CRC over bytes given in parts", () => {
    expect(crc32(ascii("56789"), crc32(ascii("1234")))).toBe(crc32(ascii("123456789")));
  });

  it("reduce the Adler sums often enough for long inputs", () => {
    const bytes = new Uint8Array(100_000).fill(255);
    let a = 1;
    let b = 0;
    for (const byte of bytes) {
      a = (a + byte) % 65521;
      b = (b + a) % 65521;
    }
    expect(adler32(bytes)).toBe(((b << 16) | a) >>> 0);
  });
});
