// Typed arrays in and out of a byte buffer, always little-endian whatever the machine, so a payload
// written on one platform reads the same on any other. Every platform the app runs on is
// little-endian, where this is a plain copy; the DataView path keeps the format honest elsewhere.

const platformIsLittleEndian = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

function bytesOf(array: Float32Array | Int16Array): Uint8Array {
  return new Uint8Array(array.buffer, array.byteOffset, array.byteLength);
}

/** Writes `values` at byte `offset` of `target`. */
export function writeFloat32s(target: Uint8Array, offset: number, values: Float32Array): void {
  if (platformIsLittleEndian) {
    target.set(bytesOf(values), offset);
    return;
  }
  const view = new DataView(target.buffer, target.byteOffset + offset, values.byteLength);
  for (let i = 0; i < values.length; i++) view.setFloat32(4 * i, values[i]!, true);
}

export function writeInt16s(target: Uint8Array, offset: number, values: Int16Array): void {
  if (platformIsLittleEndian) {
    target.set(bytesOf(values), offset);
    return;
  }
  const view = new DataView(target.buffer, target.byteOffset + offset, values.byteLength);
  for (let i = 0; i < values.length; i++) view.setInt16(2 * i, values[i]!, true);
}

/** `count` float32 values from byte `offset` of `source`, as a new array. */
export function readFloat32s(source: Uint8Array, offset: number, count: number): Float32Array {
  const values = new Float32Array(count);
  if (platformIsLittleEndian) {
    bytesOf(values).set(source.subarray(offset, offset + 4 * count));
    return values;
  }
  const view = new DataView(source.buffer, source.byteOffset + offset, 4 * count);
  for (let i = 0; i < count; i++) values[i] = view.getFloat32(4 * i, true);
  return values;
}

export function readInt16s(source: Uint8Array, offset: number, count: number): Int16Array {
  const values = new Int16Array(count);
  if (platformIsLittleEndian) {
    bytesOf(values).set(source.subarray(offset, offset + 2 * count));
    return values;
  }
  const view = new DataView(source.buffer, source.byteOffset + offset, 2 * count);
  for (let i = 0; i < count; i++) values[i] = view.getInt16(2 * i, true);
  return values;
}
