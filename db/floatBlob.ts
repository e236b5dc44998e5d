import { endianness } from "node:os";

/** Float64 arrays stored as little-endian BLOBs: compact and exact. */

// On little-endian machines (all that Node runs on today) the stored bytes are
// the array's own memory, so a block copy replaces a per-value conversion.
const NATIVE_LE = endianness() === "LE";

export function toBlob(values: ArrayLike<number>): Buffer {
  if (NATIVE_LE) {
    const floats = values instanceof Float64Array ? values : Float64Array.from(values);
    return Buffer.from(new Uint8Array(floats.buffer, floats.byteOffset, floats.byteLength));
  }
  const buf = Buffer.alloc(values.length * 8);
  for (let i = 0; i < values.length; i++) buf.writeDoubleLE(values[i], i * 8);
  return buf;
}

export function fromBlob(blob: Buffer | Uint8Array): Float64Array {
  if (blob.byteLength % 8 !== 0) throw new Error(`fromBlob: ${blob.byteLength} bytes is not a whole number of Float64 values`);
  const out = new Float64Array(blob.byteLength / 8);
  if (NATIVE_LE) {
    new Uint8Array(out.buffer).set(blob);
    return out;
  }
  const view = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(i * 8, true);
  return out;
}
