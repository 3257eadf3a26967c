/**
 * 32-bit little-endian floats, the burst body's and the stored waveforms' encoding. Typed arrays
 * use the platform's byte order; on the little-endian machines Node runs on almost everywhere the
 * bytes are taken as they are, elsewhere each value is swapped through a DataView.
 */
const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

export class NotWholeFloatsError extends RangeError {}

/** The floats in `bytes`; a copy only when the bytes are not 4-byte aligned or the platform is big-endian. */
export function readFloat32LE(bytes: Uint8Array): Float32Array {
  if (bytes.byteLength % 4 !== 0) {
    throw new NotWholeFloatsError(`${bytes.byteLength} bytes are not a whole number of 4-byte floats.`);
  }
  const count = bytes.byteLength / 4;
  if (LITTLE_ENDIAN) {
    if (bytes.byteOffset % 4 === 0) return new Float32Array(bytes.buffer, bytes.byteOffset, count);
    return new Float32Array(bytes.slice().buffer);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Float32Array(count);
  for (let i = 0; i < count; i++) out[i] = view.getFloat32(i * 4, true);
  return out;
}

export function writeFloat32LE(values: Float32Array): Uint8Array {
  if (LITTLE_ENDIAN) return new Uint8Array(values.buffer.slice(values.byteOffset, values.byteOffset + values.byteLength));
  const out = new Uint8Array(values.length * 4);
  const view = new DataView(out.buffer);
  values.forEach((value, i) => view.setFloat32(i * 4, value, true));
  return out;
}
