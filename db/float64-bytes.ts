// Samples are stored as little-endian Float64 arrays (bytea); DataView pins the byte order
// whatever the machine's own is.

export function float64ToBytes(values: Float64Array): Uint8Array {
  const bytes = new Uint8Array(values.length * 8);
  const view = new DataView(bytes.buffer);
  for (let k = 0; k < values.length; k++) view.setFloat64(k * 8, values[k]!, true);
  return bytes;
}

export function bytesToFloat64(bytes: Uint8Array): Float64Array {
  if (bytes.byteLength % 8 !== 0)
    throw new Error(`stored samples are ${bytes.byteLength} bytes, not a whole number of Float64 values`);
  const n = bytes.byteLength / 8;
  const out = new Float64Array(n);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let k = 0; k < n; k++) out[k] = view.getFloat64(k * 8, true);
  return out;
}
