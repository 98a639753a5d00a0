// Checksums of a saved run's bytes. CRC-32 (the IEEE 802.3 polynomial, reflected, as in zip and
// PNG) covers every byte of the payload as sent, so a flipped bit anywhere is caught, even in the
// padding bits a deflate decoder ignores. Adler-32 is zlib's own check of the decompressed bytes,
// which fflate does not verify itself.

const crcTable = (() => {
  const entries = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    entries[n] = c >>> 0;
  }
  return entries;
})();

/**
 * CRC-32 of `bytes`, continuing from `previous` (the CRC of the bytes before them, 0 to start):
 * crc32(b, crc32(a)) = crc32(a followed by b). crc32("123456789") = 0xcbf43926.
 */
export function crc32(bytes: Uint8Array, previous = 0): number {
  let crc = (previous ^ 0xffffffff) >>> 0;
  for (let i = 0; i < bytes.length; i++) crc = crcTable[(crc ^ bytes[i]!) & 0xff]! ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

/** Adler-32 of `bytes` (RFC 1950): adler32("Wikipedia") = 0x11e60398. */
export function adler32(bytes: Uint8Array): number {
  const modulus = 65521;
  // Reduce every 5552 bytes (RFC 1950's NMAX): the sums stay below 2^32, cheap integers for the engine.
  const run = 5552;
  let a = 1;
  let b = 0;
  for (let start = 0; start < bytes.length; start += run) {
    const end = Math.min(bytes.length, start + run);
    for (let i = start; i < end; i++) {
      a += bytes[i]!;
      b += a;
    }
    a %= modulus;
    b %= modulus;
  }
  return ((b << 16) | a) >>> 0;
}
