/** Float64 arrays stored as little-endian BLOBs: compact and exact. */
export function toBlob(values: ArrayLike<number>): Buffer {
  const buf = Buffer.alloc(values.length * 8);
  for (let i = 0; i < values.length; i++) buf.writeDoubleLE(values[i], i * 8);
  return buf;
}

export function fromBlob(blob: Buffer | Uint8Array): Float64Array {
  if (blob.byteLength % 8 !== 0) throw new Error(`fromBlob: ${blob.byteLength} bytes is not a whole number of Float64 values`);
  const out = new Float64Array(blob.byteLength / 8);
  const view = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(i * 8, true);
  return out;
}
